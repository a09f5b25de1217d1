#pragma once
// finestra-cli `fit-spectrum`: the model fitted directly to raw spectra, one per measurement set.
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "app/cli/commands.h"

namespace finestra::cli {

struct SpectrumFitCommandOptions {
  std::vector<std::string> spectra;  ///< "SET NAME=FILE.csv", one per spectrum
  std::string kind = "PL";           ///< PL (emission) or PLE (excitation)
  std::string free;                  ///< comma-separated names overriding fit.free
};

void addSpectrumFitOptions(CLI::App* command, SpectrumFitCommandOptions& options);
int runSpectrumFit(const CommonOptions& common, const SpectrumFitCommandOptions& options);

}  // namespace finestra::cli
