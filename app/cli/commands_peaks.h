#pragma once
// finestra-cli `peaks`: find and fit the peaks of a measured spectrum CSV.
#include <optional>
#include <string>

#include <CLI/CLI.hpp>

#include "app/cli/commands.h"

namespace finestra::cli {

struct PeaksCommandOptions {
  std::string spectrum;       ///< spectrum CSV (position, signal)
  std::string unit;           ///< unit of the position column when the header names none
  std::string shape = "lorentzian";
  double minSnr = 5.0;
  int maxPeaks = 50;
  OutputFormat format = OutputFormat::Table;
};

void addPeaksOptions(CLI::App* command, PeaksCommandOptions& options);
int runPeaks(const PeaksCommandOptions& options);

}  // namespace finestra::cli
