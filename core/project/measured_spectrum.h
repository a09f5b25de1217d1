#pragma once
// A measured spectrum as the project keeps it: positions on one spectral unit and the signal there.
// Read from CSV by core/io/spectrum_csv.h.
#include <string>
#include <vector>

#include "core/units/spectral_units.h"

namespace finestra {

struct MeasuredSpectrum {
  std::string name;  ///< file name without folders, for legends
  SpectralUnit unit = SpectralUnit::THz;
  std::vector<double> position;  ///< on `unit`
  std::vector<double> signal;

  bool operator==(const MeasuredSpectrum&) const = default;
};

}  // namespace finestra
