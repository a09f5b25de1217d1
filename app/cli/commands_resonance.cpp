#include "app/cli/commands_resonance.h"

#include <CLI/CLI.hpp>
#include <algorithm>
#include <iostream>
#include <optional>

#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/project/field_semantics.h"
#include "core/project/model_setup.h"
#include "core/project/evaluate.h"
#include "core/report/resonance_reports.h"

namespace finestra::cli {
namespace {

void print(const nlohmann::ordered_json& json, const std::vector<Table>& tables, OutputFormat format) {
  switch (format) {
    case OutputFormat::Json: std::cout << json.dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << tables.front().toCsv(); break;
    case OutputFormat::Table:
      for (std::size_t k = 0; k < tables.size(); ++k) std::cout << (k ? "\n" : "") << tables[k].toText();
      break;
  }
}

struct Loaded {
  Project project;
  std::optional<CentreModel> model;
};

Loaded load(const std::string& path) {
  Loaded l{readProjectFile(path), std::nullopt};
  try {
    l.model.emplace(makeModelSetup(l.project));
  } catch (const InputError& e) {
    throw InputError(path + ": " + e.where(), std::string(e.what()).substr(e.where().empty() ? 0 : e.where().size() + 2));
  }
  return l;
}

Manifold parseManifold(const std::string& text) {
  if (text == "ground") return Manifold::Ground;
  if (text == "excited") return Manifold::Excited;
  throw InputError("--manifold", "expected ground or excited, got '" + text + "'");
}

}  // namespace

void addMicrowaveOptions(CLI::App* cmd, MicrowaveOptions& o) {
  cmd->add_option("--drive-lab", o.driveLab, "microwave magnetic-field direction in the lab frame, x,y,z (default 1,0,0)")
      ->delimiter(',')
      ->expected(3);
  cmd->add_option("--manifold", o.manifold, "ground (default) or excited");
  cmd->add_flag("--details", o.details, "JSON: add spin, orbital and nuclear parts, projections and populations");
  cmd->add_flag("--spectrum", o.spectrum, "print the simulated absorption spectrum (CSV, or JSON with --format json)");
  cmd->add_option("--linewidth-MHz", o.linewidthMHz, "spectrum: Lorentzian FWHM of every resonance (MHz, default 1)");
  cmd->add_option("--from-GHz", o.fromGHz, "spectrum: start of the range (default: automatic)");
  cmd->add_option("--to-GHz", o.toGHz, "spectrum: end of the range (default: automatic)");
  cmd->add_option("--points", o.points, "spectrum: number of points (2 to 1000000, default 2001)");
}

void addLambdaOptions(CLI::App* cmd, LambdaOptions& o) {
  cmd->add_option("--rank-by", o.rankBy, "product (default), balance, branching or two_photon");
  cmd->add_flag("--details", o.details, "JSON: add product, balance, branching and the ground levels' spin");
  cmd->add_option("--pump-line", o.pumpLine, "pumped line EXCITED,GROUND (level indices): list the CPT dips of a PLE scan")
      ->delimiter(',')
      ->expected(2);
  cmd->add_option("--pump-class", o.pumpClass, "class of the pumped line (default: the project's first class)");
}

int runMicrowave(const CommonOptions& common, const MicrowaveOptions& o) {
  const Loaded l = load(common.project);
  MicrowaveSettings settings;
  if (o.driveLab.size() != 3) throw InputError("--drive-lab", "expected three comma-separated numbers x,y,z");
  settings.driveLab = Vec3(o.driveLab[0], o.driveLab[1], o.driveLab[2]);
  settings.manifold = parseManifold(o.manifold);
  const Vec3 field = projectFieldCrystal(l.project, l.model->setup().lab);
  const auto classes = microwaveTransitions(*l.model, l.project.classes, field, settings);
  if (!o.spectrum) {
    print(microwaveJson(classes, o.details), {microwaveTable(classes)}, common.format);
    return 0;
  }
  ResonanceSpectrumRequest request;
  request.fwhmGHz = o.linewidthMHz * 1e-3;
  request.fromGHz = o.fromGHz;
  request.toGHz = o.toGHz;
  request.points = o.points;
  const ResonanceSpectrum spectrum = resonanceSpectrum(classes, request);
  const nlohmann::ordered_json json{{"signal", "absorption"}, {"linewidth_MHz", o.linewidthMHz},
                                    {"frequency_GHz", spectrum.frequencyGHz}, {"absorption", spectrum.signal}};
  print(json, {resonanceSpectrumTable(spectrum)}, common.format == OutputFormat::Json ? OutputFormat::Json : OutputFormat::Csv);
  return 0;
}

int runLambdaSystems(const CommonOptions& common, const LambdaOptions& o) {
  const Loaded l = load(common.project);
  const LambdaRanking ranking = parseLambdaRanking(o.rankBy, "--rank-by");
  const auto solutions = solveProjectClasses(*l.model, l.project);
  const int nuclearDim = l.model->manifold(Manifold::Ground).nuclearDim;
  std::vector<ClassLambda> lambdas;
  for (const ClassSolution& s : solutions) lambdas.push_back(lambdaSystems(s, nuclearDim, ranking));
  nlohmann::ordered_json json = lambdaJson(lambdas, o.details);
  std::vector<Table> tables{lambdaTable(lambdas)};
  if (!o.pumpLine.empty()) {
    if (o.pumpLine.size() != 2) throw InputError("--pump-line", "expected EXCITED,GROUND");
    const int cls = o.pumpClass >= 0 ? o.pumpClass : (l.project.classes.empty() ? 0 : l.project.classes.front());
    const auto it = std::find(l.project.classes.begin(), l.project.classes.end(), cls);
    if (it == l.project.classes.end())
      throw InputError("--pump-class", "class " + std::to_string(cls) + " is not among the project's classes");
    const auto index = static_cast<std::size_t>(it - l.project.classes.begin());
    const auto dips = cptDips(solutions[index], lambdas[index], o.pumpLine[0], o.pumpLine[1]);
    json["cpt_dips"] = cptDipsJson(cls, o.pumpLine[0], o.pumpLine[1], dips);
    tables.push_back(cptDipsTable(cls, dips));
  }
  print(json, tables, common.format);
  return 0;
}

}  // namespace finestra::cli
