#include "app/cli/commands_fit.h"

#include <cmath>
#include <iostream>
#include <sstream>

#include "core/common/errors.h"
#include "core/fit/fit_report.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"

namespace finestra::cli {
namespace {

// Errors from core name a key; prefix the project file so the user knows where to look.
template <typename Body>
auto inProject(const std::string& path, Body body) {
  try {
    return body();
  } catch (const InputError& e) {
    const std::string what = e.what();
    throw InputError(path + ": " + e.where(), what.substr(e.where().empty() ? 0 : e.where().size() + 2));
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
  command->add_option("--starts", o.starts, "number of starts (default: fit.starts of the project)")->check(CLI::Range(1, 1000));
  command->add_option("--seed", o.seed, "seed of the random starts (results are reproducible per seed)");
  command->add_option("--free", o.free, "comma-separated parameters to vary (default: fit.free of the project)");
  command->add_option("--write-project", o.writeProject, "write a copy of the project with the fitted values applied");
}

void addStrainOptions(CLI::App* command, StrainCommandOptions& o) {
  command->add_option("--measurement", o.measurement, "name of the zero-field measurement set (default: the first at zero field)");
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
                << " left as outliers\n\n"
                << fitParameterTable(result).toText() << '\n';
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
  if (!f.writeProject.empty()) writeProjectFile(applyFitToProject(project, result), f.writeProject);
  return result.converged ? 0 : 4;
}

int runStrain(const CommonOptions& o, const StrainCommandOptions& s) {
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
      case OutputFormat::Table: std::cout << strainTable(e).toText(); break;
    }
    return 0;
  });
  return 0;
}

}  // namespace finestra::cli
