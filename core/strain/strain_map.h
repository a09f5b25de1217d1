#pragma once
// Strain of many emitters at once (a sample map): the zero-field estimate and verdict of each,
// and a robust summary of the sample (median and spread of every strain figure).
#include <string>
#include <vector>

#include "core/strain/emitter_lines_csv.h"
#include "core/strain/strain_verdict.h"

namespace finestra {

struct EmitterStrain {
  EmitterLines input;
  ZeroFieldStrainEstimate estimate;
  StrainVerdict verdict;
};

/// Median and spread of one figure over the emitters where it is defined.
struct SampleSummary {
  std::string name, unit;
  int count = 0;          ///< emitters with a defined value
  double median = 0;
  double spread = 0;      ///< 1.4826 · median absolute deviation (σ for a normal sample)
  double min = 0, max = 0;
};

struct StrainMap {
  std::vector<EmitterStrain> emitters;
  std::vector<SampleSummary> summary;  ///< |eps_Eg,g|, |eps_Eg,u|, d- and f-type strain, ZPL shift, mismatch
  int readingsDisagree = 0, pureDFits = 0, pureFFits = 0, neitherFits = 0;
};

StrainMap estimateStrainMap(const std::vector<EmitterLines>& emitters, const ManifoldModel& ground, const ManifoldModel& excited,
                            double zplReferenceGHz);

}  // namespace finestra
