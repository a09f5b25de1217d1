#include "app/cli/commands_thermal.h"

#include <CLI/CLI.hpp>
#include <iostream>

#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/report/thermal_report.h"

namespace finestra::cli {

void addThermalOptions(CLI::App* cmd, ThermalOptions& o) {
  cmd->add_option("--temperatures-K", o.temperaturesK, "comma-separated temperatures in K (default: the project's)")
      ->delimiter(',');
}

int runThermal(const CommonOptions& common, const ThermalOptions& o) {
  const Project project = readProjectFile(common.project);
  std::vector<double> temperatures = o.temperaturesK;
  if (temperatures.empty()) temperatures.push_back(project.conditions.temperatureK);
  validateTemperatures(temperatures, "--temperatures-K");
  ThermalScan scan;
  try {
    const CentreModel model(makeModelSetup(project));
    scan = thermalScan(model, project, temperatures);
  } catch (const InputError& e) {
    throw InputError(common.project + ": " + e.where(),
                     std::string(e.what()).substr(e.where().empty() ? 0 : e.where().size() + 2));
  }
  switch (common.format) {
    case OutputFormat::Json: std::cout << thermalJson(scan).dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << thermalLinesTable(scan).toCsv(); break;
    case OutputFormat::Table: std::cout << thermalTable(scan).toText(); break;
  }
  return 0;
}

}  // namespace finestra::cli
