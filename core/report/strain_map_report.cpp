#include "core/report/strain_map_report.h"

#include <cmath>
#include <cstdio>

namespace finestra {
namespace {

using ordered = nlohmann::ordered_json;

ordered number(double v) { return std::isfinite(v) ? ordered(v) : ordered(nullptr); }

ordered readingJson(const Reading& r, const char* reason) {
  ordered o{{"value", number(r.value)}, {"sigma", number(r.standardError)}};
  if (!std::isfinite(r.standardError)) {
    o["upper_limit"] = number(r.upperLimit);
    o["undefined_reason"] = reason;
  }
  return o;
}

const char* kAtBound = "the splitting does not exceed the spin-orbit splitting: the value sits at its bound 0";

std::string cell(double v) {
  if (!std::isfinite(v)) return "";
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.8g", v);
  return buffer;
}

std::string limitCell(const Reading& r) { return std::isfinite(r.standardError) ? "" : cell(r.upperLimit); }

}  // namespace

ordered strainMapJson(const StrainMap& map) {
  ordered emitters = ordered::array();
  for (const auto& e : map.emitters) {
    const auto& s = e.estimate;
    ordered o{{"emitter", e.input.name}, {"x_um", number(e.input.xUm.value_or(NAN))}, {"y_um", number(e.input.yUm.value_or(NAN))}};
    o["delta_g_GHz"] = readingJson(s.deltaG, kAtBound);
    o["delta_u_GHz"] = readingJson(s.deltaU, kAtBound);
    o["mismatch_in_sigma"] = number(s.mismatchPull);
    o["readings"] = e.verdict.readings;
    o["eg_strain_g_GHz"] = readingJson(s.egGroundGHz, kAtBound);
    o["eg_strain_u_GHz"] = readingJson(s.egExcitedGHz, kAtBound);
    o["strain_pure_d"] = readingJson(s.pureD.combined, kAtBound);
    o["strain_pure_f"] = readingJson(s.pureF.combined, kAtBound);
    o["pure_d"] = e.verdict.pureD;
    o["pure_f"] = e.verdict.pureF;
    o["verdict"] = e.verdict.overall;
    o["zpl_shift_GHz"] = readingJson(s.zplShiftGHz, kAtBound);
    emitters.push_back(o);
  }
  ordered summary = ordered::array();
  for (const auto& s : map.summary)
    summary.push_back(ordered{{"figure", s.name}, {"unit", s.unit}, {"count", s.count}, {"median", number(s.count ? s.median : NAN)},
                              {"spread", number(s.count ? s.spread : NAN)}, {"min", number(s.count ? s.min : NAN)},
                              {"max", number(s.count ? s.max : NAN)}});
  const StrainVerdict any = map.emitters.empty() ? StrainVerdict{} : map.emitters.front().verdict;
  return ordered{{"units", any.units},
                 {"cannot_determine", any.cannotDetermine},
                 {"emitters", emitters},
                 {"summary", summary},
                 {"counts",
                  {{"emitters", map.emitters.size()}, {"readings_disagree", map.readingsDisagree}, {"pure_d_fits", map.pureDFits},
                   {"pure_f_fits", map.pureFFits}, {"neither_fits", map.neitherFits}}}};
}

Table strainMapTable(const StrainMap& map) {
  Table t;
  t.headers = {"emitter", "x_um", "y_um", "delta_g_GHz", "delta_g_sigma_GHz", "delta_u_GHz", "delta_u_sigma_GHz",
               "mismatch_sigma", "eg_g_GHz", "eg_g_sigma_GHz", "eg_g_upper_limit_GHz", "eg_u_GHz", "eg_u_sigma_GHz",
               "eg_u_upper_limit_GHz", "strain_d", "strain_d_sigma", "strain_f", "strain_f_sigma", "zpl_shift_GHz",
               "zpl_shift_sigma_GHz", "readings_agree", "pure_d_fits", "pure_f_fits"};
  for (const auto& e : map.emitters) {
    const auto& s = e.estimate;
    t.rows.push_back({e.input.name, cell(e.input.xUm.value_or(NAN)), cell(e.input.yUm.value_or(NAN)), cell(s.deltaG.value),
                      cell(s.deltaG.standardError), cell(s.deltaU.value), cell(s.deltaU.standardError), cell(s.mismatchPull),
                      cell(s.egGroundGHz.value), cell(s.egGroundGHz.standardError), limitCell(s.egGroundGHz), cell(s.egExcitedGHz.value),
                      cell(s.egExcitedGHz.standardError), limitCell(s.egExcitedGHz), cell(s.pureD.combined.value),
                      cell(s.pureD.combined.standardError), cell(s.pureF.combined.value), cell(s.pureF.combined.standardError),
                      cell(s.zplShiftGHz.value), cell(s.zplShiftGHz.standardError), e.verdict.readingsAgree ? "yes" : "no",
                      e.verdict.pureDFits ? "yes" : "no", e.verdict.pureFFits ? "yes" : "no"});
  }
  return t;
}

Table strainSummaryTable(const StrainMap& map) {
  Table t;
  t.headers = {"figure", "unit", "count", "median", "spread", "min", "max"};
  for (const auto& s : map.summary) {
    auto v = [&](double x) { return s.count ? cell(x) : std::string("—"); };
    t.rows.push_back({s.name, s.unit, std::to_string(s.count), v(s.median), v(s.spread), v(s.min), v(s.max)});
  }
  return t;
}

std::string strainMapNotes(const StrainMap& map) {
  if (map.emitters.empty()) return "no emitters\n";
  const StrainVerdict& v = map.emitters.front().verdict;
  std::string text = std::to_string(map.emitters.size()) + " emitters; " + v.units + ".\n";
  text += "readings disagree (>3σ) for " + std::to_string(map.readingsDisagree) + "; pure d-type fits " + std::to_string(map.pureDFits) +
          ", pure f-type fits " + std::to_string(map.pureFFits) + ", neither fits " + std::to_string(map.neitherFits) + ".\n";
  text += "Spread = 1.4826 x median absolute deviation. Note: " + v.cannotDetermine + ".\n";
  return text;
}

}  // namespace finestra
