// finestra-cli: batch access to the Finestra engine. Wiring only: parse the command line, call
// the command, report errors on stderr with a non-zero exit code.
#include <CLI/CLI.hpp>
#include <iostream>
#include <map>

#include "app/cli/commands.h"
#include "app/cli/commands_fit.h"
#include "app/cli/commands_peaks.h"
#include "app/cli/commands_plan.h"
#include "app/cli/commands_spectrum_fit.h"
#include "app/cli/commands_thermal.h"
#include "app/cli/commands_resonance.h"
#include "core/centre/parameter_table.h"
#include "core/common/errors.h"
#include "core/common/version.h"

using namespace finestra::cli;

namespace {
void addProjectOptions(CLI::App* cmd, CommonOptions& options) {
  cmd->add_option("project", options.project, "project file (JSON)")->required();
  cmd->add_option("--format", options.format, "output: table (default), json or csv")
      ->transform(CLI::CheckedTransformer(
          std::map<std::string, OutputFormat>{{"table", OutputFormat::Table}, {"json", OutputFormat::Json},
                                              {"csv", OutputFormat::Csv}},
          CLI::ignore_case));
}
}  // namespace

int main(int argc, char** argv) {
  CLI::App app{"finestra-cli: fine structure of group-IV vacancy centres in diamond"};
  app.set_version_flag("--version", std::string(finestra::kVersion), "print the Finestra version and exit");
  app.require_subcommand(1);
  CommonOptions common;
  OutputFormat presetFormat = OutputFormat::Table;
  SpectrumOptions spectrum;
  SweepOptions sweep;

  auto* presets = app.add_subcommand("presets", "list the built-in centre presets with sources");
  presets->add_option("--format", presetFormat, "output: table, json or csv")
      ->transform(CLI::CheckedTransformer(
          std::map<std::string, OutputFormat>{{"table", OutputFormat::Table}, {"json", OutputFormat::Json},
                                              {"csv", OutputFormat::Csv}},
          CLI::ignore_case));
  auto* levels = app.add_subcommand("levels", "energy levels of both manifolds for every selected class");
  addProjectOptions(levels, common);
  auto* lines = app.add_subcommand("lines", "optical lines with labels, frequencies and intensities");
  addProjectOptions(lines, common);
  LinesOptions linesOptions;
  lines->add_option("--unit", linesOptions.unit, "also give each line's position in GHz_detuning, GHz, THz, nm_vac, nm_air, meV or cm-1");
  auto* spec = app.add_subcommand("spectrum", "simulated PL or PLE spectrum (CSV unless --format json)");
  addProjectOptions(spec, common);
  spec->add_option("--unit", spectrum.unit, "GHz_detuning, GHz, THz, nm_vac, nm_air, meV or cm-1");
  spec->add_option("--kind", spectrum.kind, "PL (emission) or PLE (excitation)");
  spec->add_option("--from", spectrum.from, "start of the range (unit of --unit)");
  spec->add_option("--to", spectrum.to, "end of the range (unit of --unit)");
  spec->add_option("--points", spectrum.points, "number of points")->check(CLI::Range(finestra::quantity("spectrum.points").minimum, finestra::quantity("spectrum.points").maximum));
  auto* sw = app.add_subcommand("sweep", "levels and lines along a sweep defined in the project");
  addProjectOptions(sw, common);
  sw->add_option("--name", sweep.name, "sweep name (default: the first)");
  PlanOptions plan;
  auto* planCmd = app.add_subcommand("plan", "magnet planner: figures of merit over field directions, feasible region, best settings");
  addProjectOptions(planCmd, common);
  addPlanOptions(planCmd, plan);
  FitCommandOptions fitOptions;
  auto* fitCmd = app.add_subcommand("fit", "assign measured peaks to lines and fit the chosen parameters (exit 4: not converged)");
  addProjectOptions(fitCmd, common);
  addFitOptions(fitCmd, fitOptions);
  StrainCommandOptions strainOptions;
  auto* strainCmd = app.add_subcommand("strain", "closed-form strain from four zero-field lines: a project's zero-field set, typed lines or a CSV of many emitters");
  addProjectOptions(strainCmd, common);
  strainCmd->get_option("project")->required(false);
  addStrainOptions(strainCmd, strainOptions);
  MicrowaveOptions microwaveOptions;
  auto* microwaveCmd = app.add_subcommand("microwave", "magnetic-dipole (microwave) transitions with the nuclear spin, or their spectrum");
  addProjectOptions(microwaveCmd, common);
  addMicrowaveOptions(microwaveCmd, microwaveOptions);
  LambdaOptions lambdaOptions;
  auto* lambdaCmd = app.add_subcommand("lambda-systems", "Lambda systems: excited levels linked to two ground levels by allowed lines");
  addProjectOptions(lambdaCmd, common);
  addLambdaOptions(lambdaCmd, lambdaOptions);

  ThermalOptions thermalOptions;
  auto* thermalCmd = app.add_subcommand("thermal", "phonon rates, line widths and spin coherence limit against temperature");
  addProjectOptions(thermalCmd, common);
  addThermalOptions(thermalCmd, thermalOptions);

  PeaksCommandOptions peaksOptions;
  auto* peaksCmd = app.add_subcommand("peaks", "find and fit the peaks of a measured spectrum CSV (exit 4: fit not converged)");
  addPeaksOptions(peaksCmd, peaksOptions);
  SpectrumFitCommandOptions spectrumFitOptions;
  auto* spectrumFitCmd = app.add_subcommand("fit-spectrum", "fit the model directly to raw spectra, one per measurement set (exit 4: not converged)");
  addProjectOptions(spectrumFitCmd, common);
  addSpectrumFitOptions(spectrumFitCmd, spectrumFitOptions);

  try {
    app.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    return app.exit(e);
  }
  try {
    if (*presets) return runPresets(presetFormat);
    if (*levels) return runLevels(common);
    if (*lines) return runLines(common, linesOptions);
    if (*spec) return runSpectrum(common, spectrum);
    if (*sw) return runSweep(common, sweep);
    if (*planCmd) return runPlan(common, plan);
    if (*fitCmd) return runFit(common, fitOptions);
    if (*strainCmd) return runStrain(common, strainOptions);
    if (*thermalCmd) return runThermal(common, thermalOptions);
    if (*microwaveCmd) return runMicrowave(common, microwaveOptions);
    if (*lambdaCmd) return runLambdaSystems(common, lambdaOptions);
    if (*peaksCmd) return runPeaks(peaksOptions);
    if (*spectrumFitCmd) return runSpectrumFit(common, spectrumFitOptions);
  } catch (const finestra::InputError& e) {
    std::cerr << "finestra-cli: error: " << e.what() << '\n';
    return 2;
  } catch (const std::exception& e) {
    std::cerr << "finestra-cli: error: " << e.what() << '\n';
    return 3;
  }
  return 1;
}
