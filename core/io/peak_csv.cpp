#include "core/io/peak_csv.h"

#include <array>
#include <cmath>
#include <map>
#include <numbers>
#include <optional>
#include <sstream>

#include "core/centre/parameter_table.h"
#include "core/common/errors.h"
#include "core/common/limits.h"
#include "core/io/csv_line.h"
#include "core/io/measured_validity.h"
#include "core/io/text_file.h"

namespace finestra {
namespace {

enum Column { Name, Field, Polar, Azimuth, Position, Unit, Sigma, Analyser, Temperature, ColumnCount };

const std::array<const char*, ColumnCount> kColumnKeys{"measurement", "field_T",  "polar_deg",
                                                       "azimuth_deg", "position", "unit",
                                                       "sigma",       "analyser_deg", "temperature_K"};
constexpr int kRequiredColumns = Sigma + 1;

using ColumnMap = std::array<std::optional<std::size_t>, ColumnCount>;

ColumnMap readHeader(const std::vector<std::string>& cells, const std::string& where) {
  ColumnMap map;
  for (std::size_t i = 0; i < cells.size(); ++i) {
    bool known = false;
    for (int c = 0; c < ColumnCount; ++c) {
      if (cells[i] != kColumnKeys[static_cast<std::size_t>(c)]) continue;
      if (map[static_cast<std::size_t>(c)]) throw InputError(where, "column '" + cells[i] + "' appears twice");
      map[static_cast<std::size_t>(c)] = i;
      known = true;
    }
    if (!known)
      throw InputError(where, "unknown column '" + cells[i] +
                                  "' (expected measurement, field_T, polar_deg, azimuth_deg, position, unit, "
                                  "sigma, and optionally analyser_deg, temperature_K)");
  }
  for (int c = 0; c < kRequiredColumns; ++c)
    if (!map[static_cast<std::size_t>(c)])
      throw InputError(where, std::string("missing column '") + kColumnKeys[static_cast<std::size_t>(c)] + "'");
  return map;
}

struct RowReader {
  const std::vector<std::string>& cells;
  const ColumnMap& map;
  const std::string& where;

  std::string text(Column c) const {
    const auto& index = map[static_cast<std::size_t>(c)];
    if (!index || *index >= cells.size()) return {};
    return cells[*index];
  }
  std::optional<double> optionalNumber(Column c) const {
    const std::string cell = text(c);
    if (cell.empty()) return std::nullopt;
    const auto v = parseCsvNumber(cell);
    if (!v) throw InputError(where, std::string(kColumnKeys[static_cast<std::size_t>(c)]) + ": '" + cell + "' is not a number");
    return v;
  }
  double number(Column c) const {
    const auto v = optionalNumber(c);
    if (!v) throw InputError(where, std::string(kColumnKeys[static_cast<std::size_t>(c)]) + ": value missing");
    return *v;
  }
};

bool sameSetting(const MeasurementSet& a, const MeasurementSet& b) {
  return a.field.magnitudeT == b.field.magnitudeT && a.field.polarDeg == b.field.polarDeg &&
         a.field.azimuthDeg == b.field.azimuthDeg && a.temperatureK == b.temperatureK;
}

}  // namespace

std::vector<MeasurementSet> parsePeakCsv(const std::string& text, const std::string& origin) {
  std::istringstream in(std::string(csvTextWithoutByteOrderMark(text, origin)));
  std::string line;
  int lineNumber = 0;
  std::size_t headerCells = 0, peakRows = 0;
  std::optional<ColumnMap> header;
  std::vector<MeasurementSet> sets;
  std::map<std::string, std::size_t> setIndex;
  while (std::getline(in, line)) {
    ++lineNumber;
    const std::string where = origin + ":" + std::to_string(lineNumber);
    requireUtf8Row(line, where);
    if (isCsvCommentOrBlank(line)) continue;
    const auto cells = splitCsvLine(line, where);
    if (!header) {
      header = readHeader(cells, where);
      headerCells = cells.size();
      continue;
    }
    // Empty trailing cells (a spreadsheet's trailing commas) carry nothing; a value there would be lost.
    for (std::size_t extra = headerCells; extra < cells.size(); ++extra)
      if (!cells[extra].empty())
        throw InputError(where, std::to_string(cells.size()) + " cells, but the header has " + std::to_string(headerCells) +
                                    " columns (a stray comma or an unquoted comma inside a name?)");
    if (++peakRows > limits::kMaxPeakRows)
      throw InputError(where, "more than " + std::to_string(limits::kMaxPeakRows) + " peak rows (the limit of a peaks file)");
    const RowReader row{cells, *header, where};
    MeasurementSet setting;
    setting.name = row.text(Name);
    if (setting.name.empty()) throw InputError(where, "measurement: name missing");
    if (setting.name.size() > limits::kMaxNameBytes)
      throw InputError(where, "measurement: name longer than " + std::to_string(limits::kMaxNameBytes) + " bytes");
    // The project reader's ranges (core/centre/parameter_table.h): what is imported can be saved
    // and opened again.
    const double field = row.number(Field);
    requireInRange(quantity("field.magnitude_T"), field, where + ": field_T");
    const double polar = row.number(Polar), azimuth = row.number(Azimuth);
    requireInRange(quantity("field.polar_deg"), polar, where + ": polar_deg");
    requireInRange(quantity("field.azimuth_deg"), azimuth, where + ": azimuth_deg");
    setting.field = FieldSetting::fromAngles(field, polar, azimuth);
    setting.temperatureK = row.optionalNumber(Temperature).value_or(4.0);
    requireInRange(quantity("conditions.temperature_K"), setting.temperatureK, where + ": temperature_K");

    MeasuredPeak peak;
    peak.position = row.number(Position);
    peak.unit = parseSpectralUnit(row.text(Unit), where + ": unit");
    peak.sigma = row.number(Sigma);
    if (!(peak.sigma > 0)) throw InputError(where, "sigma: must be positive");
    try {
      checkMeasuredPosition(peak.position, peak.unit, "");
    } catch (const InputError& e) {
      throw InputError(where, "position: " + e.message());
    }
    checkPeakSigma(peak.sigma, peak.position, peak.unit, where + ": sigma");
    if (const auto angle = row.optionalNumber(Analyser)) {
      const double a = *angle * std::numbers::pi / 180.0;
      peak.analyserLab = Vec3(std::cos(a), std::sin(a), 0.0);
    }

    const auto found = setIndex.find(setting.name);
    if (found == setIndex.end()) {
      setIndex.emplace(setting.name, sets.size());
      setting.peaks.push_back(peak);
      sets.push_back(std::move(setting));
    } else {
      MeasurementSet& existing = sets[found->second];
      if (!sameSetting(existing, setting))
        throw InputError(where, "measurement '" + setting.name +
                                    "' was given with another field setting or temperature on an earlier line");
      existing.peaks.push_back(peak);
    }
  }
  if (!header) throw InputError(origin, "no header row (expected measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma)");
  if (sets.empty()) throw InputError(origin, "no peak rows after the header");
  return sets;
}

std::vector<MeasurementSet> readPeakCsv(const std::string& path) { return parsePeakCsv(readTextFile(path), path); }

}  // namespace finestra
