#include "core/peaks/spectrum_fit_report.h"

#include <cmath>
#include <cstdio>

namespace finestra {
namespace {

using ordered = nlohmann::ordered_json;

ordered number(double v) { return std::isfinite(v) ? ordered(v) : ordered(nullptr); }

std::string sig(double v) {
  if (!std::isfinite(v)) return "—";
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.6g", v);
  return buffer;
}

}  // namespace

ordered spectrumFitJson(const Project& project, const std::vector<SpectrumData>& spectra, const SpectrumFitResult& r) {
  ordered parameters = ordered::array();
  for (const auto& p : r.parameters)
    parameters.push_back(ordered{{"name", p.name}, {"value", number(p.value)}, {"stderr", number(p.standardError)},
                                 {"stderr_formal", number(p.formalError)}, {"stderr_scaled", number(p.scaledError)}, {"free", p.free}});
  ordered list = ordered::array();
  for (std::size_t s = 0; s < spectra.size(); ++s)
    list.push_back(ordered{{"name", spectra[s].name},
                           {"measurement", project.measurements[static_cast<std::size_t>(spectra[s].set)].name},
                           {"noise", number(s < r.noise.size() ? r.noise[s] : NAN)}});
  return ordered{{"converged", r.converged},
                 {"status", r.status},
                 {"chi2", number(r.chi2)},
                 {"dof", r.dof},
                 {"chi2_per_dof", number(r.chi2PerDof)},
                 {"errors_scaled", r.errorsScaled},
                 {"error_note", r.errorNote},
                 {"parameters", parameters},
                 {"unidentifiable", r.undetermined},
                 {"unidentifiable_combinations", r.undeterminedCombinations},
                 {"spectra", list}};
}

Table spectrumFitTable(const SpectrumFitResult& r) {
  Table t;
  t.headers = {"parameter", "value", "stderr", "formal", "scaled", "start"};
  for (const auto& p : r.parameters)
    t.rows.push_back({p.name + (p.unit.empty() ? "" : " (" + p.unit + ")") + (p.determined ? "" : " UNDETERMINED"), sig(p.value),
                      sig(p.standardError), sig(p.formalError), sig(p.scaledError), sig(p.startValue)});
  return t;
}

}  // namespace finestra
