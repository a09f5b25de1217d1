#pragma once
// One function per finestra-cli command. Each prints its result to stdout and returns the exit
// code; errors are thrown (main prints them to stderr with a non-zero exit).
#include <string>

namespace finestra::cli {

enum class OutputFormat { Table, Json, Csv };

struct CommonOptions {
  std::string project;
  OutputFormat format = OutputFormat::Table;
};

struct SpectrumOptions {
  std::string unit = "GHz_detuning";
  std::string kind = "PL";
  double from = 0, to = 0;  ///< equal: automatic range
  int points = 2001;
};

struct LinesOptions {
  std::string unit;  ///< empty: no position column; otherwise a spectral unit key as for spectrum --unit
};

struct SweepOptions {
  std::string name;  ///< empty: the first sweep of the project
};

int runPresets(OutputFormat format);
int runLevels(const CommonOptions& options);
int runLines(const CommonOptions& options, const LinesOptions& lines = {});
int runSpectrum(const CommonOptions& options, const SpectrumOptions& spectrum);
int runSweep(const CommonOptions& options, const SweepOptions& sweep);

}  // namespace finestra::cli
