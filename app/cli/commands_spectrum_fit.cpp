#include "app/cli/commands_spectrum_fit.h"

#include <iostream>
#include <sstream>

#include "core/common/errors.h"
#include "core/peaks/spectrum_fit_report.h"
#include "core/io/project_file.h"
#include "core/project/model_setup.h"
#include "core/io/spectrum_csv.h"

namespace finestra::cli {
namespace {

SpectrumData loadSpectrum(const Project& project, const std::string& argument, SpectrumKind kind, double zplGHz) {
  const auto eq = argument.find('=');
  if (eq == std::string::npos || eq == 0 || eq + 1 == argument.size())
    throw InputError("--spectrum", "expected SET=FILE.csv (a measurement set name of the project, then the spectrum file), got '" + argument + "'");
  const std::string setName = argument.substr(0, eq), path = argument.substr(eq + 1);
  SpectrumData d;
  d.kind = kind;
  d.set = -1;
  for (std::size_t i = 0; i < project.measurements.size(); ++i)
    if (project.measurements[i].name == setName) d.set = static_cast<int>(i);
  if (d.set < 0) throw InputError("--spectrum", "the project has no measurement set named '" + setName + "'");
  const MeasuredSpectrum m = readSpectrumCsv(path);
  d.name = m.name;
  for (std::size_t i = 0; i < m.position.size(); ++i) {
    d.frequencyGHz.push_back(toAbsoluteGHz(m.position[i], m.unit, zplGHz));
    d.signal.push_back(m.signal[i]);
  }
  return d;
}

}  // namespace

void addSpectrumFitOptions(CLI::App* command, SpectrumFitCommandOptions& o) {
  command->add_option("--spectrum", o.spectra, "SET=FILE.csv: a measured spectrum taken at the field of measurement set SET (repeat for more)")
      ->required();
  command->add_option("--kind", o.kind, "PL (emission, default) or PLE (excitation)");
  command->add_option("--free", o.free, "comma-separated parameters to vary (default: fit.free of the project)");
}

int runSpectrumFit(const CommonOptions& c, const SpectrumFitCommandOptions& o) {
  const Project project = readProjectFile(c.project);
  if (o.kind != "PL" && o.kind != "PLE") throw InputError("--kind", "use PL or PLE, not '" + o.kind + "'");
  const SpectrumKind kind = o.kind == "PL" ? SpectrumKind::Emission : SpectrumKind::Excitation;
  const double zpl = CentreModel(makeModelSetup(project)).zplGHz();
  std::vector<SpectrumData> spectra;
  for (const std::string& a : o.spectra) spectra.push_back(loadSpectrum(project, a, kind, zpl));
  SpectrumFitOptions options;
  if (!o.free.empty()) {
    std::vector<std::string> names;
    std::stringstream in(o.free);
    std::string item;
    while (std::getline(in, item, ','))
      if (!item.empty()) names.push_back(item);
    options.free = names;
  }
  const SpectrumFitResult r = fitSpectra(project, spectra, options);
  switch (c.format) {
    case OutputFormat::Json: std::cout << spectrumFitJson(project, spectra, r).dump(2) << '\n'; break;
    case OutputFormat::Csv: std::cout << spectrumFitTable(r).toCsv(); break;
    case OutputFormat::Table:
      std::cout << r.status << "\nchi2/dof = " << fixed(r.chi2PerDof, 3) << " (chi2 " << fixed(r.chi2, 1) << ", dof " << r.dof << ")\n"
                << r.errorNote << "\n\n"
                << spectrumFitTable(r).toText();
      if (!r.undeterminedCombinations.empty()) {
        std::cout << "\nThe data cannot determine these combinations:";
        for (const auto& combination : r.undeterminedCombinations) std::cout << "\n  " << combination;
        std::cout << '\n';
      }
      break;
  }
  return r.converged ? 0 : 4;
}

}  // namespace finestra::cli
