#include "core/io/spectrum_csv.h"

#include <sstream>

#include "core/common/errors.h"
#include "core/io/csv_line.h"
#include "core/io/measured_validity.h"
#include "core/io/text_file.h"

namespace finestra {
namespace {

std::optional<SpectralUnit> unitFromKey(const std::string& key) {
  for (SpectralUnit u : allSpectralUnits())
    if (spectralUnitKey(u) == key) return u;
  return std::nullopt;
}

std::string baseName(const std::string& path) {
  const auto slash = path.find_last_of("/\\");
  return slash == std::string::npos ? path : path.substr(slash + 1);
}

}  // namespace

MeasuredSpectrum parseSpectrumCsv(const std::string& text, const std::string& origin,
                                  std::optional<SpectralUnit> chosenUnit) {
  MeasuredSpectrum out;
  out.name = baseName(origin);
  std::optional<SpectralUnit> unit = chosenUnit;
  std::istringstream in(std::string(csvTextWithoutByteOrderMark(text, origin)));
  std::string line;
  int lineNumber = 0;
  bool firstContentLine = true;
  while (std::getline(in, line)) {
    ++lineNumber;
    const std::string where = origin + ":" + std::to_string(lineNumber);
    requireUtf8Row(line, where);
    if (isCsvCommentOrBlank(line)) continue;
    const auto cells = splitCsvLine(line, where);
    if (cells.size() != 2)
      throw InputError(where, "expected two columns (position, signal), found " + std::to_string(cells.size()));
    const auto x = parseCsvNumber(cells[0]);
    const auto y = parseCsvNumber(cells[1]);
    if (firstContentLine && !x) {
      firstContentLine = false;
      const auto headerUnit = unitFromKey(cells[0]);
      if (headerUnit && chosenUnit && *headerUnit != *chosenUnit)
        throw InputError(where, "header unit '" + cells[0] + "' differs from the unit chosen on import ('" +
                                    std::string(spectralUnitKey(*chosenUnit)) + "')");
      if (headerUnit) unit = headerUnit;
      if (!unit)
        throw SpectrumUnitMissingError(where, "header '" + cells[0] +
                                    "' names no spectral unit (use GHz, GHz_detuning, THz, nm_vac, nm_air, meV or "
                                    "cm-1) and no unit was chosen on import");
      continue;
    }
    firstContentLine = false;
    if (!x) throw InputError(where, "position '" + cells[0] + "' is not a number");
    if (!y) throw InputError(where, "signal '" + cells[1] + "' is not a number");
    if (!unit) throw SpectrumUnitMissingError(where, "the file has no header naming the unit and no unit was chosen on import");
    if (*unit != SpectralUnit::GHzDetuning && *x <= 0)
      throw InputError(where, "position must be positive on " + std::string(spectralUnitKey(*unit)));
    checkMeasuredPosition(*x, *unit, where + ": position");
    out.position.push_back(*x);
    out.signal.push_back(*y);
  }
  if (out.position.size() < 2) throw InputError(origin, "a spectrum needs at least two data rows");
  out.unit = *unit;
  return out;
}

MeasuredSpectrum readSpectrumCsv(const std::string& path, std::optional<SpectralUnit> chosenUnit) {
  return parseSpectrumCsv(readTextFile(path), path, chosenUnit);
}

}  // namespace finestra
