#include "core/strain/emitter_lines_csv.h"

#include <array>
#include <cmath>
#include <map>
#include <sstream>

#include "core/common/errors.h"
#include "core/io/csv_line.h"
#include "core/io/text_file.h"

namespace finestra {
namespace {

const std::array<const char*, 10> kRequired{"emitter", "unit", "A", "A_sigma", "B", "B_sigma", "C", "C_sigma", "D", "D_sigma"};
const std::array<const char*, 2> kOptional{"x_um", "y_um"};

std::map<std::string, std::size_t> readHeader(const std::vector<std::string>& cells, const std::string& where) {
  std::map<std::string, std::size_t> columns;
  for (std::size_t i = 0; i < cells.size(); ++i) {
    bool known = false;
    for (const char* k : kRequired) known = known || cells[i] == k;
    for (const char* k : kOptional) known = known || cells[i] == k;
    if (!known)
      throw InputError(where, "unknown column '" + cells[i] +
                                  "' (expected emitter, unit, A, A_sigma, B, B_sigma, C, C_sigma, D, D_sigma, and optionally x_um, y_um)");
    if (!columns.emplace(cells[i], i).second) throw InputError(where, "column '" + cells[i] + "' appears twice");
  }
  for (const char* k : kRequired)
    if (!columns.count(k)) throw InputError(where, std::string("missing column '") + k + "'");
  return columns;
}

}  // namespace

std::vector<EmitterLines> parseEmitterLinesCsv(const std::string& text, const std::string& origin, double zplGHz) {
  std::vector<EmitterLines> out;
  std::istringstream in(text);
  std::string line;
  int lineNumber = 0;
  std::optional<std::map<std::string, std::size_t>> columns;
  while (std::getline(in, line)) {
    ++lineNumber;
    const std::string where = origin + ":" + std::to_string(lineNumber);
    if (isCsvCommentOrBlank(line)) continue;
    const auto cells = splitCsvLine(line, where);
    if (!columns) {
      columns = readHeader(cells, where);
      continue;
    }
    if (out.size() >= kMaxEmitters) throw InputError(where, "at most " + std::to_string(kMaxEmitters) + " emitters per file");
    auto cell = [&](const std::string& key) -> std::string {
      const std::size_t i = columns->at(key);
      return i < cells.size() ? cells[i] : std::string();
    };
    auto number = [&](const std::string& key) {
      const auto v = parseCsvNumber(cell(key));
      if (!v) throw InputError(where, key + ": '" + cell(key) + "' is not a number");
      return *v;
    };
    EmitterLines e;
    e.line = lineNumber;
    e.name = cell("emitter");
    if (e.name.empty()) throw InputError(where, "emitter: the name is empty");
    const SpectralUnit unit = parseSpectralUnit(cell("unit"), where + ": unit");
    for (const char* k : kOptional)
      if (columns->count(k) && !cell(k).empty()) (std::string(k) == "x_um" ? e.xUm : e.yUm) = number(k);
    for (int k = 0; k < 4; ++k) {
      const std::string letter(1, "ABCD"[k]);
      const double position = number(letter), sigma = number(letter + "_sigma");
      if (!(sigma > 0)) throw InputError(where, letter + "_sigma: must be positive");
      double frequency = 0;
      try {
        frequency = toAbsoluteGHz(position, unit, zplGHz);
      } catch (const InputError& err) {
        throw InputError(where, letter + ": " + err.what());
      }
      e.lines.frequencyGHz[static_cast<std::size_t>(k)] = frequency;
      e.lines.sigmaGHz[static_cast<std::size_t>(k)] = sigma / std::abs(unitPerGHz(frequency, unit, zplGHz));
    }
    out.push_back(e);
  }
  if (!columns) throw InputError(origin, "no header row (emitter, unit, A, A_sigma, ...)");
  if (out.empty()) throw InputError(origin, "no emitter rows");
  return out;
}

std::vector<EmitterLines> readEmitterLinesCsv(const std::string& path, double zplGHz) {
  return parseEmitterLinesCsv(readTextFile(path), path, zplGHz);
}

}  // namespace finestra
