#include "app/cli/commands.h"

#include <iostream>

#include "core/common/error_location.h"
#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/project/evaluate.h"
#include "core/report/reports.h"

namespace finestra::cli {
namespace {

// Builds only what `format` prints: the JSON document or the table (for a long sweep, building
// the one not printed costs as much as the computation).
template <class MakeJson, class MakeTable>
void print(OutputFormat format, MakeJson&& makeJson, MakeTable&& makeTable) {
  switch (format) {
    case OutputFormat::Json: std::cout << makeJson().dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << makeTable().toCsv(); break;
    case OutputFormat::Table: std::cout << makeTable().toText(); break;
  }
}

struct Loaded {
  Project project;
  CentreModel model;
};

Loaded load(const std::string& path) {
  Project project = readProjectFile(path);
  try {
    return {project, CentreModel(makeModelSetup(project))};
  } catch (const InputError& e) {
    throw locatedIn(e, path);
  }
}

}  // namespace

int runPresets(OutputFormat format) {
  print(format, [] { return presetsJson(builtinPresets()); }, [] { return presetsTable(builtinPresets()); });
  return 0;
}

int runLevels(const CommonOptions& o) {
  const Loaded l = load(o.project);
  const auto classes = solveProjectClasses(l.model, l.project);
  print(o.format, [&] { return levelsJson(classes); }, [&] { return levelsTable(classes); });
  return 0;
}

int runLines(const CommonOptions& o, const LinesOptions& options) {
  std::optional<SpectralUnit> unit;
  if (!options.unit.empty()) unit = parseSpectralUnit(options.unit, "--unit");  // before the work: fail fast
  const Loaded l = load(o.project);
  const auto classes = solveProjectClasses(l.model, l.project);
  print(o.format, [&] { return linesJson(l.model, classes, unit); }, [&] { return linesTable(l.model, classes, unit); });
  return 0;
}

int runSpectrum(const CommonOptions& o, const SpectrumOptions& s) {
  const Loaded l = load(o.project);
  const SpectralUnit unit = parseSpectralUnit(s.unit, "--unit");
  SpectrumKind kind;
  if (s.kind == "PL" || s.kind == "pl") kind = SpectrumKind::Emission;
  else if (s.kind == "PLE" || s.kind == "ple") kind = SpectrumKind::Excitation;
  else throw InputError("--kind", "expected PL or PLE");
  const auto classes = solveProjectClasses(l.model, l.project);
  const auto weighted = weightLines(l.model, classes, kind);
  std::array<double, 2> range{s.from, s.to};
  if (s.from == s.to) range = autoRange(l.model, weighted, unit);
  const SpectrumCurve curve = computeSpectrum(l.model, weighted, unit, range[0], range[1], s.points);
  print(o.format == OutputFormat::Table ? OutputFormat::Csv : o.format, [&] { return spectrumJson(curve, unit, kind); },
        [&] { return spectrumTable(curve, unit); });
  return 0;
}

int runSweep(const CommonOptions& o, const SweepOptions& s) {
  const Loaded l = load(o.project);
  if (l.project.sweeps.empty()) throw InputError(o.project + ": sweeps", "the project defines no sweep");
  const SweepSpec* spec = &l.project.sweeps.front();
  if (!s.name.empty()) {
    spec = nullptr;
    for (const auto& candidate : l.project.sweeps)
      if (candidate.name == s.name) spec = &candidate;
    if (!spec) throw InputError("--name", "no sweep named '" + s.name + "' in " + o.project);
  }
  const SweepResult result = finestra::runSweep(l.model, l.project, *spec);
  print(o.format, [&] { return sweepJson(*spec, result); }, [&] { return sweepLinesTable(*spec, result); });
  return 0;
}

}  // namespace finestra::cli
