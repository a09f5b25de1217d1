#include "app/cli/commands_peaks.h"

#include <iostream>
#include <map>

#include "core/common/errors.h"
#include "core/io/spectrum_csv.h"
#include "core/peaks/peak_report.h"

namespace finestra::cli {

void addPeaksOptions(CLI::App* command, PeaksCommandOptions& o) {
  command->add_option("spectrum", o.spectrum, "spectrum CSV: position, signal (header row may name the unit)")->required();
  command->add_option("--unit", o.unit, "unit of the position column when the header names none: GHz, GHz_detuning, THz, nm_vac, nm_air, meV, cm-1");
  command->add_option("--shape", o.shape, "line shape: lorentzian (default), gaussian or voigt");
  command->add_option("--min-snr", o.minSnr, "least peak height above the baseline in noise sigma (2 to 1e6, default 5)");
  command->add_option("--max-peaks", o.maxPeaks, "most peaks fitted together (1 to 200, default 50)");
  command->add_option("--format", o.format, "output: table (default), json or csv")
      ->transform(CLI::CheckedTransformer(std::map<std::string, OutputFormat>{{"table", OutputFormat::Table},
                                                                               {"json", OutputFormat::Json},
                                                                               {"csv", OutputFormat::Csv}},
                                          CLI::ignore_case));
}

int runPeaks(const PeaksCommandOptions& o) {
  std::optional<SpectralUnit> unit;
  if (!o.unit.empty()) unit = parseSpectralUnit(o.unit, "--unit");
  const MeasuredSpectrum spectrum = readSpectrumCsv(o.spectrum, unit);
  PeakFinderOptions options;
  options.shape = parseLineShape(o.shape, "--shape");
  options.minSnr = o.minSnr;
  options.maxPeaks = o.maxPeaks;
  PeakFinderResult result;
  try {
    result = findPeaks(spectrum.position, spectrum.signal, options, o.spectrum);
  } catch (const InputError& e) {
    // Option errors name the option key; say it the way it is typed on the command line.
    if (e.where() == "min_snr" || e.where() == "max_peaks") {
      const std::string what = e.what();
      throw InputError(e.where() == "min_snr" ? "--min-snr" : "--max-peaks", what.substr(e.where().size() + 2));
    }
    throw;
  }
  switch (o.format) {
    case OutputFormat::Json: std::cout << peaksJson(result, spectrum.unit).dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << peaksTable(result).toCsv(); break;
    case OutputFormat::Table: std::cout << peaksSummary(result, spectrum.unit) << '\n' << peaksTable(result).toText(); break;
  }
  return result.converged ? 0 : 4;
}

}  // namespace finestra::cli
