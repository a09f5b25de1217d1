#include "core/fit/fit_report.h"

#include <cmath>
#include <cstdio>

#include "core/strain/strain_verdict.h"

namespace finestra {
namespace {

using ordered = nlohmann::ordered_json;

ordered number(double v) { return std::isfinite(v) ? ordered(v) : ordered(nullptr); }

ordered readingJson(const Reading& r) {
  ordered o{{"value", number(r.value)}, {"stderr", number(r.standardError)}};
  if (!std::isfinite(r.standardError)) o["upper_limit"] = number(r.upperLimit);
  return o;
}

std::string withError(double value, double error, int decimals) {
  if (!std::isfinite(error)) return fixed(value, decimals) + " (undetermined/fixed)";
  return fixed(value, decimals) + " +- " + fixed(error, decimals);
}

std::string sig(double v) {
  if (!std::isfinite(v)) return "-";
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.6g", v);
  return buffer;
}

}  // namespace

ordered fitJson(const Project& project, const FitResult& r) {
  ordered doc;
  doc["converged"] = r.converged;
  doc["chi2_per_dof"] = number(r.chi2PerDof);
  if (!std::isfinite(r.chi2PerDof))
    doc["chi2_per_dof_undefined_reason"] = r.dof <= 0 ? "no degrees of freedom: as many free parameters as assigned peaks"
                                                      : "chi2 is not finite";
  ordered parameters = ordered::array();
  for (const auto& p : r.parameters)
    parameters.push_back(ordered{{"name", p.name}, {"value", p.value}, {"stderr", number(p.standardError)}, {"free", p.free},
                                 {"stderr_formal", number(p.formalError)}, {"stderr_scaled", number(p.scaledError)}});
  doc["parameters"] = parameters;
  ordered assignments = ordered::array();
  for (const auto& pk : r.peaks) {
    ordered a{{"measurement", project.measurements[static_cast<std::size_t>(pk.measurement)].name}, {"peak", pk.peak}};
    a["class"] = pk.line ? ordered(pk.line->cls) : ordered(nullptr);
    a["upper"] = pk.line ? ordered(pk.line->upper) : ordered(nullptr);
    a["lower"] = pk.line ? ordered(pk.line->lower) : ordered(nullptr);
    // An outlier's residual is its distance to the nearest line (where it really sits), not 0.
    a["residual_GHz"] = number(pk.line ? pk.residualGHz : pk.nearestResidualGHz);
    a["label"] = pk.line ? ordered(pk.label) : ordered(nullptr);
    a["pinned"] = pk.pinned;
    a["outlier"] = !pk.line;
    a["nearest_label"] = pk.nearestLabel;
    a["second_label"] = pk.secondLabel.empty() ? ordered(nullptr) : ordered(pk.secondLabel);
    a["cost_margin"] = number(pk.costMargin);
    if (!std::isfinite(pk.costMargin)) a["undefined_reason"] = "no second line in this measurement set";
    a["ambiguous"] = pk.ambiguous;
    assignments.push_back(a);
  }
  doc["assignments"] = assignments;
  doc["unidentifiable"] = r.undetermined;
  doc["unidentifiable_combinations"] = r.undeterminedCombinations;
  doc["status"] = r.status;
  doc["chi2"] = r.chi2;
  doc["dof"] = r.dof;
  doc["outliers"] = r.outlierCount;
  doc["starts"] = r.startsRun;
  doc["errors_scaled"] = r.errorsScaled;
  doc["error_note"] = r.errorNote;
  doc["ambiguous"] = r.ambiguousCount;
  doc["unit_check"] = r.unitCheck.empty() ? ordered(nullptr) : ordered(r.unitCheck);
  ordered names = ordered::array(), rows = ordered::array();
  for (const auto& p : r.parameters)
    if (p.free) names.push_back(p.name);
  for (Eigen::Index a = 0; a < r.correlation.rows(); ++a) {
    ordered row = ordered::array();
    for (Eigen::Index b = 0; b < r.correlation.cols(); ++b) row.push_back(number(r.correlation(a, b)));
    rows.push_back(row);
  }
  doc["correlations"] = ordered{{"names", names}, {"matrix", rows}};
  return doc;
}

Table fitParameterTable(const FitResult& r) {
  Table t;
  t.headers = {"parameter", "value", "stderr", "formal", "scaled", "start", "free"};
  for (const auto& p : r.parameters)
    t.rows.push_back({p.name + (p.unit.empty() ? "" : " (" + p.unit + ")"), sig(p.value), sig(p.standardError), sig(p.formalError),
                      sig(p.scaledError), sig(p.startValue), p.free ? (p.determined ? "free" : "free, UNDETERMINED") : "fixed"});
  return t;
}

Table fitAssignmentTable(const Project& project, const FitResult& r) {
  Table t;
  t.headers = {"measurement", "peak", "measured (GHz)", "sigma (GHz)", "class", "line", "upper", "lower", "residual (GHz)", "pull",
               "2nd line", "margin", "trust"};
  for (const auto& pk : r.peaks) {
    const std::string name = project.measurements[static_cast<std::size_t>(pk.measurement)].name;
    const std::string margin = std::isfinite(pk.costMargin) ? fixed(pk.costMargin, 2) : "—";
    const std::string second = pk.secondLabel.empty() ? "—" : pk.secondLabel;
    const std::string trust = pk.ambiguous ? "AMBIGUOUS" : "ok";
    if (!pk.line) {
      // Outliers show where they really sit: the residual to the nearest line, not 0.
      t.rows.push_back({name, std::to_string(pk.peak), fixed(pk.measuredGHz, 4), fixed(pk.sigmaGHz, 4), "-",
                        "outlier (nearest " + pk.nearestLabel + ")", "-", "-", fixed(pk.nearestResidualGHz, 4),
                        fixed(pk.nearestResidualGHz / pk.sigmaGHz, 2), second, margin, "outlier"});
      continue;
    }
    t.rows.push_back({name, std::to_string(pk.peak), fixed(pk.measuredGHz, 4), fixed(pk.sigmaGHz, 4), std::to_string(pk.line->cls),
                      pk.label + (pk.pinned ? " (pinned)" : ""), std::to_string(pk.line->upper), std::to_string(pk.line->lower),
                      fixed(pk.residualGHz, 4), fixed(pk.residualGHz / pk.sigmaGHz, 2), second, margin, trust});
  }
  return t;
}

ordered strainJson(const Project& project, const ZeroFieldSelection& s, const ZeroFieldStrainEstimate& e) {
  ordered doc;
  ordered lines = ordered::object();
  for (int k = 0; k < 4; ++k)
    lines[std::string(1, "ABCD"[k])] = ordered{{"peak", s.peak[static_cast<std::size_t>(k)]},
                                              {"frequency_GHz", s.lines.frequencyGHz[static_cast<std::size_t>(k)]},
                                              {"sigma_GHz", s.lines.sigmaGHz[static_cast<std::size_t>(k)]},
                                              {"pinned", s.pinned[static_cast<std::size_t>(k)]}};
  doc["measurement"] = project.measurements[static_cast<std::size_t>(s.measurement)].name;
  doc["lines"] = lines;
  doc["delta_g_GHz"] = readingJson(e.deltaG);
  doc["delta_u_GHz"] = readingJson(e.deltaU);
  doc["delta_correlation"] = number(e.deltaCorrelation);
  doc["delta_g_from_A_minus_B_GHz"] = readingJson(e.deltaGFromAB);
  doc["delta_g_from_C_minus_D_GHz"] = readingJson(e.deltaGFromCD);
  doc["delta_u_from_A_minus_C_GHz"] = readingJson(e.deltaUFromAC);
  doc["delta_u_from_B_minus_D_GHz"] = readingJson(e.deltaUFromBD);
  doc["mismatch_GHz"] = readingJson(e.mismatchGHz);
  doc["mismatch_in_sigma"] = number(e.mismatchPull);
  doc["eg_strain_g_GHz"] = readingJson(e.egGroundGHz);
  doc["eg_strain_u_GHz"] = readingJson(e.egExcitedGHz);
  doc["ratio_u_to_g"] = readingJson(e.ratioExcitedToGround);
  auto assumption = [&](const StrainReading& r) {
    return ordered{{"strain_from_ground", readingJson(r.fromGround)}, {"strain_from_excited", readingJson(r.fromExcited)},
                   {"strain_combined", readingJson(r.combined)}, {"ratio_expected", number(r.ratioExpected)},
                   {"ratio_pull", number(r.ratioPull)}};
  };
  doc["pure_d"] = assumption(e.pureD);
  doc["pure_f"] = assumption(e.pureF);
  doc["zpl_shift_GHz"] = readingJson(e.zplShiftGHz);
  doc["a1g_perpendicular_strain"] = readingJson(e.a1gPerpendicular);
  doc["a1g_parallel_strain"] = readingJson(e.a1gParallel);
  const StrainVerdict v = strainVerdict(e);
  doc["units"] = v.units;
  doc["readings"] = v.readings;
  doc["readings_agree"] = v.readingsAgree;
  doc["pure_d_verdict"] = v.pureD;
  doc["pure_f_verdict"] = v.pureF;
  doc["verdict"] = v.overall;
  doc["cannot_determine"] = v.cannotDetermine;
  return doc;
}

Table strainTable(const ZeroFieldStrainEstimate& e) {
  Table t;
  t.headers = {"quantity", "value"};
  auto add = [&](const std::string& name, const Reading& r, int decimals) {
    std::string text = withError(r.value, r.standardError, decimals);
    if (!std::isfinite(r.standardError)) text = fixed(r.value, decimals) + " (upper limit " + fixed(r.upperLimit, decimals) + ")";
    t.rows.push_back({name, text});
  };
  auto addStrain = [&](const std::string& name, const Reading& r) {
    t.rows.push_back({name, std::isfinite(r.standardError) ? sig(r.value) + " +- " + sig(r.standardError)
                                                          : sig(r.value) + " (upper limit " + sig(r.upperLimit) + ")"});
  };
  add("Delta_g (GHz)", e.deltaG, 3);
  add("Delta_u (GHz)", e.deltaU, 3);
  add("A-B (GHz)", e.deltaGFromAB, 3);
  add("C-D (GHz)", e.deltaGFromCD, 3);
  add("A-C (GHz)", e.deltaUFromAC, 3);
  add("B-D (GHz)", e.deltaUFromBD, 3);
  add("mismatch A-B-C+D (GHz)", e.mismatchGHz, 3);
  t.rows.push_back({"mismatch / sigma", fixed(e.mismatchPull, 2)});
  add("|eps_Eg,g| (GHz)", e.egGroundGHz, 3);
  add("|eps_Eg,u| (GHz)", e.egExcitedGHz, 3);
  add("ratio u/g", e.ratioExcitedToGround, 3);
  addStrain("pure d: strain (1, defect frame)", e.pureD.combined);
  t.rows.push_back({"pure d: ratio expected / pull", fixed(e.pureD.ratioExpected, 3) + " / " + fixed(e.pureD.ratioPull, 2)});
  addStrain("pure f: strain (1, defect frame)", e.pureF.combined);
  t.rows.push_back({"pure f: ratio expected / pull", fixed(e.pureF.ratioExpected, 3) + " / " + fixed(e.pureF.ratioPull, 2)});
  add("ZPL shift (GHz)", e.zplShiftGHz, 3);
  addStrain("A1g: eps_xx+eps_yy if all t_perp", e.a1gPerpendicular);
  addStrain("A1g: eps_zz if all t_par", e.a1gParallel);
  return t;
}

std::string strainVerdictText(const ZeroFieldStrainEstimate& e) {
  const StrainVerdict v = strainVerdict(e);
  return "Units: " + v.units + ".\n" + v.readings + ".\n" + v.pureD + "; " + v.pureF + ".\nVerdict: " + v.overall +
         ".\nNote: " + v.cannotDetermine + ".\n";
}

}  // namespace finestra
