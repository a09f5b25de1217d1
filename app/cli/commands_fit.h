#pragma once
// finestra-cli `fit` (assignment and least squares against the project's measurements) and
// `strain` (closed-form estimate from the four zero-field lines).
#include <optional>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "app/cli/commands.h"

namespace finestra::cli {

struct FitCommandOptions {
  std::optional<int> starts;   ///< overrides fit.starts
  unsigned seed = 1;
  std::string free;            ///< comma-separated names overriding fit.free
  std::string writeProject;    ///< write the project with the fitted values applied
};

struct StrainCommandOptions {
  std::string measurement;     ///< name of the zero-field set (default: first set at zero field)
  std::string centre;          ///< preset key when no project is given
  std::string peaks;           ///< CSV of zero-field lines, one row per emitter (a sample map)
  std::vector<double> lines;   ///< four typed lines A, B, C, D
  double sigma = 0;            ///< their common uncertainty (unit of --unit)
  std::string unit = "GHz";    ///< unit of --lines and --sigma
};

void addFitOptions(CLI::App* command, FitCommandOptions& options);
void addStrainOptions(CLI::App* command, StrainCommandOptions& options);
int runFit(const CommonOptions& options, const FitCommandOptions& fit);
int runStrain(const CommonOptions& options, const StrainCommandOptions& strain);

}  // namespace finestra::cli
