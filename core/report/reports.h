#pragma once
// Machine (JSON) and human (table/CSV) forms of the engine's results. The JSON of lines has the
// exact layout of docs/architecture.md, Machine-readable output: outside tooling reads it.
#include <nlohmann/json.hpp>
#include <optional>
#include <vector>

#include "core/centre/presets.h"
#include "core/optics/spectrum.h"
#include "core/report/table.h"
#include "core/sweep/sweep.h"

namespace finestra {

/// With `unit`, the JSON also names the unit ("unit") and gives each line its "position" on it,
/// and the table gains a position column after "lower"; detuning is from the model's ZPL.
nlohmann::ordered_json linesJson(const CentreModel& model, const std::vector<ClassSolution>& classes,
                                 std::optional<SpectralUnit> unit = std::nullopt);
Table linesTable(const CentreModel& model, const std::vector<ClassSolution>& classes,
                 std::optional<SpectralUnit> unit = std::nullopt);

nlohmann::ordered_json levelsJson(const std::vector<ClassSolution>& classes);
Table levelsTable(const std::vector<ClassSolution>& classes);

nlohmann::ordered_json spectrumJson(const SpectrumCurve& curve, SpectralUnit unit, SpectrumKind kind);
Table spectrumTable(const SpectrumCurve& curve, SpectralUnit unit);

nlohmann::ordered_json sweepJson(const SweepSpec& spec, const SweepResult& result);
/// Long form: one row per point, class and line.
Table sweepLinesTable(const SweepSpec& spec, const SweepResult& result);

nlohmann::ordered_json presetsJson(const std::vector<Preset>& presets);
Table presetsTable(const std::vector<Preset>& presets);

/// Column label of a sweep parameter, e.g. "field (T)".
std::string sweepAxisLabel(SweepKind kind);

}  // namespace finestra
