#pragma once
// Plain-language reading of a zero-field strain estimate (docs/physics.md, Strain): the unit and
// frame of the numbers, whether the two readings of each splitting agree, which coupling
// assumption fits the ratio |ε_Eg,u|/|ε_Eg,g|, and what four lines cannot determine.
#include <string>

#include "core/strain/zero_field_strain.h"

namespace finestra {

struct StrainVerdict {
  std::string units;            ///< unit and tensor frame of every strain number
  std::string readings;         ///< e.g. "readings agree within 1.1σ"
  bool readingsAgree = true;    ///< |A − B − C + D| ≤ 3σ
  std::string pureD, pureF;     ///< whether each coupling assumption fits
  bool pureDFits = false, pureFFits = false;
  std::string overall;          ///< which assumption to use, or that neither fits
  std::string cannotDetermine;  ///< what the four lines leave open
};

/// A test "fits" when its pull is within 3σ (common practice for a consistency check).
StrainVerdict strainVerdict(const ZeroFieldStrainEstimate& estimate);

}  // namespace finestra
