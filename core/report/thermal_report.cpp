#include "core/report/thermal_report.h"

#include <algorithm>
#include <cstdio>

namespace finestra {
namespace {

using ordered = nlohmann::ordered_json;

constexpr const char* kNoPhononDephasing =
    "no phonon limit: the upward ground rate is zero at this temperature (T = 0 without a higher-order term)";

ordered branchJson(const BranchRates& r) {
  return ordered{{"splitting_GHz", r.splittingGHz}, {"up_per_s", r.upPerS}, {"down_per_s", r.downPerS}};
}

std::string sci(double x) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.4g", x);
  return buffer;
}

std::string coherenceText(const std::optional<double>& t) { return t ? sci(*t) : "—"; }

}  // namespace

ordered thermalJson(const ThermalScan& scan) {
  ordered classes = ordered::array();
  for (const ThermalScanClass& c : scan.classes) {
    ordered rows = ordered::array();
    for (std::size_t k = 0; k < c.rows.size(); ++k) {
      const ClassThermal& t = c.rows[k];
      ordered row{{"temperature_K", scan.temperaturesK[k]},
                  {"ground", branchJson(t.ground.rates)},
                  {"excited", branchJson(t.excited.rates)},
                  {"spin_coherence_limit_s", t.spinCoherenceLimitS ? ordered(*t.spinCoherenceLimitS) : ordered(nullptr)}};
      if (!t.spinCoherenceLimitS) row["undefined_reason"] = kNoPhononDephasing;
      if (scan.bathT2StarS) {
        row["bath_t2star_s"] = *scan.bathT2StarS;
        row["spin_coherence_s"] = *governingCoherenceS(t.spinCoherenceLimitS, scan.bathT2StarS);
      }
      ordered lines = ordered::array();
      for (std::size_t i = 0; i < c.solution.lines.size(); ++i) {
        const OpticalLine& l = c.solution.lines[i];
        lines.push_back(ordered{{"upper", l.upper}, {"lower", l.lower}, {"label", l.label()}, {"fwhm_GHz", t.lineFwhmGHz[i]}});
      }
      row["lines"] = lines;
      rows.push_back(row);
    }
    classes.push_back(ordered{{"class", c.solution.cls}, {"rows", rows}});
  }
  return ordered{{"classes", classes}};
}

Table thermalTable(const ThermalScan& scan) {
  Table t{{"class", "T (K)", "split g (GHz)", "g up (1/s)", "g down (1/s)", "split u (GHz)", "u up (1/s)", "u down (1/s)",
           "T2 phonon limit (s)", "narrowest line (GHz)", "broadest line (GHz)"},
          {}};
  if (scan.bathT2StarS) {
    t.headers.push_back("bath T2* (s)");
    t.headers.push_back("governing T2 (s)");
  }
  for (const ThermalScanClass& c : scan.classes)
    for (std::size_t k = 0; k < c.rows.size(); ++k) {
      const ClassThermal& r = c.rows[k];
      const auto [lo, hi] = std::minmax_element(r.lineFwhmGHz.begin(), r.lineFwhmGHz.end());
      t.rows.push_back({std::to_string(c.solution.cls), sci(scan.temperaturesK[k]), sci(r.ground.rates.splittingGHz),
                        sci(r.ground.rates.upPerS), sci(r.ground.rates.downPerS), sci(r.excited.rates.splittingGHz),
                        sci(r.excited.rates.upPerS), sci(r.excited.rates.downPerS), coherenceText(r.spinCoherenceLimitS),
                        lo == r.lineFwhmGHz.end() ? "—" : sci(*lo), hi == r.lineFwhmGHz.end() ? "—" : sci(*hi)});
      if (scan.bathT2StarS) {
        t.rows.back().push_back(sci(*scan.bathT2StarS));
        t.rows.back().push_back(coherenceText(governingCoherenceS(r.spinCoherenceLimitS, scan.bathT2StarS)));
      }
    }
  return t;
}

Table thermalLinesTable(const ThermalScan& scan) {
  Table t{{"class", "temperature_K", "upper", "lower", "label", "fwhm_GHz"}, {}};
  for (const ThermalScanClass& c : scan.classes)
    for (std::size_t k = 0; k < c.rows.size(); ++k)
      for (std::size_t i = 0; i < c.solution.lines.size(); ++i) {
        const OpticalLine& l = c.solution.lines[i];
        t.rows.push_back({std::to_string(c.solution.cls), sci(scan.temperaturesK[k]), std::to_string(l.upper),
                          std::to_string(l.lower), l.label(), sci(c.rows[k].lineFwhmGHz[i])});
      }
  return t;
}

}  // namespace finestra
