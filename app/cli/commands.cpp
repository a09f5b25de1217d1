#include "app/cli/commands.h"

#include <iostream>

#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/project/evaluate.h"
#include "core/report/reports.h"

namespace finestra::cli {
namespace {

void print(const nlohmann::ordered_json& json, const Table& table, OutputFormat format) {
  switch (format) {
    case OutputFormat::Json: std::cout << json.dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << table.toCsv(); break;
    case OutputFormat::Table: std::cout << table.toText(); break;
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
    throw InputError(path + ": " + e.where(), std::string(e.what()).substr(e.where().empty() ? 0 : e.where().size() + 2));
  }
}

}  // namespace

int runPresets(OutputFormat format) {
  print(presetsJson(builtinPresets()), presetsTable(builtinPresets()), format);
  return 0;
}

int runLevels(const CommonOptions& o) {
  const Loaded l = load(o.project);
  const auto classes = solveProjectClasses(l.model, l.project);
  print(levelsJson(classes), levelsTable(classes), o.format);
  return 0;
}

int runLines(const CommonOptions& o) {
  const Loaded l = load(o.project);
  const auto classes = solveProjectClasses(l.model, l.project);
  print(linesJson(l.model, classes), linesTable(l.model, classes), o.format);
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
  print(spectrumJson(curve, unit, kind), spectrumTable(curve, unit), o.format == OutputFormat::Table ? OutputFormat::Csv : o.format);
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
  print(sweepJson(*spec, result), sweepLinesTable(*spec, result), o.format);
  return 0;
}

}  // namespace finestra::cli
