#pragma once
// A measured spectrum from a two-column CSV file: position, signal. The unit of the position
// column comes from the header row (first cell a spectral unit key such as "nm_air" or "THz"), or
// is chosen on import when the file has no header or its header names no unit. Extra columns are
// an error; lines starting with '#' are comments.
#include <optional>
#include <string>

#include "core/project/measured_spectrum.h"

namespace finestra {

/// Parses CSV text. `chosenUnit` is used when the header names no unit (and must agree with the
/// header when both are given). Errors "origin:line: ..." as InputError.
MeasuredSpectrum parseSpectrumCsv(const std::string& text, const std::string& origin,
                                  std::optional<SpectralUnit> chosenUnit = std::nullopt);
MeasuredSpectrum readSpectrumCsv(const std::string& path, std::optional<SpectralUnit> chosenUnit = std::nullopt);

}  // namespace finestra
