#pragma once
// finestra-cli `fit` (assignment and least squares against the project's measurements) and
// `strain` (closed-form estimate from the four zero-field lines).
#include <optional>
#include <string>

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
};

void addFitOptions(CLI::App* command, FitCommandOptions& options);
void addStrainOptions(CLI::App* command, StrainCommandOptions& options);
int runFit(const CommonOptions& options, const FitCommandOptions& fit);
int runStrain(const CommonOptions& options, const StrainCommandOptions& strain);

}  // namespace finestra::cli
