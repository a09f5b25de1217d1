#include "app/cli/commands_fit.h"

#include <cmath>
#include <iostream>
#include <sstream>

#include "core/centre/parameter_table.h"
#include "core/common/error_location.h"
#include "core/common/errors.h"
#include "core/fit/fit_report.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/report/strain_map_report.h"

namespace finestra::cli {
namespace {

// Errors from core name a key; prefix the project file so the user knows where to look.
template <typename Body>
auto inProject(const std::string& path, Body body) {
  try {
    return body();
  } catch (const InputError& e) {
    throw locatedIn(e, path);
  }
}

std::vector<std::string> splitNames(const std::string& text) {
  std::vector<std::string> names;
  std::stringstream in(text);
  std::string item;
  while (std::getline(in, item, ','))
    if (!item.empty()) names.push_back(item);
  return names;
}

}  // namespace

void addFitOptions(CLI::App* command, FitCommandOptions& o) {
  command->add_option("--starts", o.starts, "number of starts (default: fit.starts of the project)")
      ->check(CLI::Range(quantity("fit.starts").minimum, quantity("fit.starts").maximum));
  command->add_option("--seed", o.seed, "seed of the random starts (results are reproducible per seed)");
  command->add_option("--free", o.free, "comma-separated parameters to vary (default: fit.free of the project)");
  command->add_option("--write-project", o.writeProject, "write a copy of the project with the fitted values applied");
}

void addStrainOptions(CLI::App* command, StrainCommandOptions& o) {
  command->add_option("--measurement", o.measurement, "name of the zero-field measurement set (default: the first at zero field)");
  command->add_option("--centre", o.centre, "centre preset (SiV-, GeV-, SnV-, PbV-) when no project file is given");
  command->add_option("--peaks", o.peaks, "CSV of zero-field lines, one row per emitter: emitter, unit, A, A_sigma, ..., D, D_sigma[, x_um, y_um]");
  command->add_option("--lines", o.lines, "four zero-field lines A,B,C,D (unit of --unit)")->delimiter(',')->expected(4);
  command->add_option("--sigma", o.sigma, "uncertainty of each typed line (unit of --unit)");
  command->add_option("--unit", o.unit, "unit of --lines and --sigma: GHz (default), GHz_detuning, THz, nm_vac, nm_air, meV, cm-1");
}

int runFit(const CommonOptions& o, const FitCommandOptions& f) {
  const Project project = readProjectFile(o.project);
  FitOptions options;
  options.starts = f.starts;
  options.seed = f.seed;
  if (!f.free.empty()) options.free = splitNames(f.free);
  const FitResult result = inProject(o.project, [&] { return fitProject(project, options); });
  switch (o.format) {
    case OutputFormat::Json: std::cout << fitJson(project, result).dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << fitAssignmentTable(project, result).toCsv(); break;
    case OutputFormat::Table:
      std::cout << result.status << "\nchi2/dof = "
                << (std::isfinite(result.chi2PerDof) ? fixed(result.chi2PerDof, 3) : "— (undefined: no degrees of freedom)")
                << " (chi2 " << fixed(result.chi2, 2)
                << ", dof " << result.dof << "), " << result.assignedCount << " peaks assigned, " << result.outlierCount
                << " left as outliers, " << result.ambiguousCount << " ambiguous (second-best line within cost margin 1)\n"
                << result.errorNote << "\n";
      if (!result.unitCheck.empty()) std::cout << "Unit check: " << result.unitCheck << '\n';
      std::cout << '\n' << fitParameterTable(result).toText() << '\n';
      if (!result.undetermined.empty()) {
        std::cout << "The data cannot determine:";
        for (const auto& name : result.undetermined) std::cout << ' ' << name;
        std::cout << "\nFree combinations:";
        for (const auto& c : result.undeterminedCombinations) std::cout << "\n  " << c;
        std::cout << "\n\n";
      }
      std::cout << fitAssignmentTable(project, result).toText();
      break;
  }
  if (!result.unitCheck.empty() && o.format != OutputFormat::Table) std::cerr << "finestra-cli: warning: " << result.unitCheck << '\n';
  if (!f.writeProject.empty()) writeProjectFile(applyFitToProject(project, result), f.writeProject);
  return result.converged ? 0 : 4;
}

namespace {

ModelSetup strainModelSetup(const CommonOptions& o, const StrainCommandOptions& s) {
  if (!o.project.empty()) return inProject(o.project, [&] { return makeModelSetup(readProjectFile(o.project)); });
  if (s.centre.empty()) throw InputError("strain", "give a project file or --centre PRESET");
  try {
    return ModelSetup{resolveCentre(s.centre, std::nullopt, {}), LabFrame(Vec3(0, 0, 1), Vec3(1, 0, 0)), {}, {}};
  } catch (const InputError& e) {
    const std::string what = e.what();
    throw InputError("--centre", what.substr(e.where().empty() ? 0 : e.where().size() + 2));
  }
}

int printStrainMap(const CommonOptions& o, const CentreModel& model, const std::vector<EmitterLines>& emitters) {
  const StrainMap map = estimateStrainMap(emitters, model.manifold(Manifold::Ground), model.manifold(Manifold::Excited), model.zplGHz());
  switch (o.format) {
    case OutputFormat::Json: std::cout << strainMapJson(map).dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << strainMapTable(map).toCsv(); break;
    case OutputFormat::Table:
      std::cout << strainMapNotes(map) << '\n' << strainSummaryTable(map).toText() << '\n' << strainMapTable(map).toText();
      break;
  }
  return 0;
}

// Four typed lines become one emitter named "typed".
EmitterLines typedLines(const StrainCommandOptions& s, double zplGHz) {
  if (s.lines.size() != 4) throw InputError("--lines", "give exactly four lines A,B,C,D");
  if (!(s.sigma > 0)) throw InputError("--sigma", "give the lines' uncertainty (positive) with --lines");
  const SpectralUnit unit = parseSpectralUnit(s.unit, "--unit");
  EmitterLines e;
  e.name = "typed";
  for (std::size_t k = 0; k < 4; ++k) {
    e.lines.frequencyGHz[k] = toAbsoluteGHz(s.lines[k], unit, zplGHz);
    e.lines.sigmaGHz[k] = s.sigma / std::abs(unitPerGHz(e.lines.frequencyGHz[k], unit, zplGHz));
  }
  return e;
}

}  // namespace

int runStrain(const CommonOptions& o, const StrainCommandOptions& s) {
  if (!s.peaks.empty() || !s.lines.empty()) {
    const CentreModel model(strainModelSetup(o, s));
    if (!s.peaks.empty()) return printStrainMap(o, model, readEmitterLinesCsv(s.peaks, model.zplGHz()));
    return printStrainMap(o, model, {typedLines(s, model.zplGHz())});
  }
  if (o.project.empty()) throw InputError("strain", "give a project file (its zero-field set), --peaks FILE or --lines A,B,C,D");
  const Project project = readProjectFile(o.project);
  inProject(o.project, [&] {
    const CentreModel model(makeModelSetup(project));
    const std::optional<std::string> name = s.measurement.empty() ? std::nullopt : std::optional<std::string>(s.measurement);
    const ZeroFieldSelection selection = selectZeroFieldLines(project, model, name);
    const ZeroFieldStrainEstimate e = estimateZeroFieldStrain(selection.lines, model.manifold(Manifold::Ground),
                                                              model.manifold(Manifold::Excited), model.zplGHz());
    switch (o.format) {
      case OutputFormat::Json: std::cout << strainJson(project, selection, e).dump(2) << '\n'; break;
      case OutputFormat::Csv: std::cout << strainTable(e).toCsv(); break;
      case OutputFormat::Table: std::cout << strainTable(e).toText() << '\n' << strainVerdictText(e); break;
    }
    return 0;
  });
  return 0;
}

}  // namespace finestra::cli
