#include "core/report/resonance_reports.h"

#include <cmath>
#include <sstream>

namespace finestra {
using ordered = nlohmann::ordered_json;

namespace {

constexpr const char* kDegenerateReason = "degenerate levels: the transition strength depends on the basis chosen";
constexpr const char* kNoNucleusReason = "no isotope with nuclear spin in the model";
constexpr const char* kUndefinedCell = "—";

ordered numberOrNull(double x) { return std::isfinite(x) ? ordered(x) : ordered(nullptr); }

// Strengths span many decades (allowed ~1, forbidden ~1e-12): three significant digits.
std::string cell(double x) {
  if (!std::isfinite(x)) return kUndefinedCell;
  std::ostringstream out;
  out.precision(3);
  out << x;
  return out.str();
}

std::string projection(double m) {
  // Half-integer projections as fractions: −1/2, 3/2, ...
  const long twice = std::lround(2 * m);
  if (twice % 2 == 0) return std::to_string(twice / 2);
  return std::to_string(twice) + "/2";
}

std::string pair(const std::array<double, 2>& x, int decimals) { return fixed(x[0], decimals) + " / " + fixed(x[1], decimals); }

}  // namespace

ordered microwaveJson(const std::vector<ClassMicrowave>& classes, bool details) {
  ordered out{{"classes", ordered::array()}};
  for (const ClassMicrowave& c : classes) {
    ordered transitions = ordered::array();
    for (const MicrowaveTransition& t : c.transitions) {
      const bool nucleus = t.nuclearChange != NuclearChange::NoNucleus;
      ordered row{{"lower", t.lower},
                  {"upper", t.upper},
                  {"frequency_GHz", t.frequencyGHz},
                  {"strength", numberOrNull(t.strength)},
                  {"nuclear_change", nuclearChangeName(t.nuclearChange)},
                  {"nuclear_purity", nucleus ? ordered(t.nuclearPurity) : ordered(nullptr)}};
      if (!std::isfinite(t.strength)) row["undefined_reason"] = kDegenerateReason;
      else if (!nucleus) row["undefined_reason"] = kNoNucleusReason;
      if (details) {
        row["spin_part"] = numberOrNull(t.spinPart);
        row["orbital_part"] = numberOrNull(t.orbitalPart);
        row["nuclear_part"] = numberOrNull(t.nuclearPart);
        row["spin_Sz"] = {t.spinProjectionLower, t.spinProjectionUpper};
        if (nucleus) row["nuclear_mI"] = {t.nuclearProjectionLower, t.nuclearProjectionUpper};
        row["population"] = {t.populationLower, t.populationUpper};
      }
      transitions.push_back(row);
    }
    out["classes"].push_back(ordered{{"class", c.cls}, {"transitions", transitions}});
  }
  return out;
}

Table microwaveTable(const std::vector<ClassMicrowave>& classes) {
  Table t{{"class", "lower", "upper", "frequency (GHz)", "strength", "spin part", "orbital part", "nuclear part",
           "Sz lower/upper", "mI lower/upper", "nuclear change", "purity", "population lower/upper"},
          {}};
  for (const ClassMicrowave& c : classes)
    for (const MicrowaveTransition& x : c.transitions) {
      const bool nucleus = x.nuclearChange != NuclearChange::NoNucleus;
      t.rows.push_back({std::to_string(c.cls), std::to_string(x.lower), std::to_string(x.upper), fixed(x.frequencyGHz, 6),
                        cell(x.strength), cell(x.spinPart), cell(x.orbitalPart), cell(x.nuclearPart),
                        pair({x.spinProjectionLower, x.spinProjectionUpper}, 3),
                        nucleus ? projection(x.nuclearProjectionLower) + " / " + projection(x.nuclearProjectionUpper)
                                : kUndefinedCell,
                        nuclearChangeName(x.nuclearChange), nucleus ? fixed(x.nuclearPurity, 4) : kUndefinedCell,
                        pair({x.populationLower, x.populationUpper}, 4)});
    }
  return t;
}

ordered lambdaJson(const std::vector<ClassLambda>& classes, bool details) {
  ordered out{{"classes", ordered::array()}};
  for (const ClassLambda& c : classes) {
    ordered systems = ordered::array();
    for (const LambdaSystem& s : c.systems) {
      ordered row{{"excited", s.excited},
                  {"ground", s.ground},
                  {"line_GHz", s.lineGHz},
                  {"two_photon_GHz", s.twoPhotonGHz},
                  {"strength", s.strength}};
      if (details) {
        row["product"] = s.product;
        row["balance"] = s.balance;
        row["branching"] = s.branching;
        row["ground_Sz"] = s.spinProjection;
      }
      systems.push_back(row);
    }
    out["classes"].push_back(ordered{{"class", c.cls}, {"systems", systems}});
  }
  return out;
}

Table lambdaTable(const std::vector<ClassLambda>& classes) {
  Table t{{"class", "excited", "ground j,k", "line j (GHz)", "line k (GHz)", "two-photon (GHz)", "strength j",
           "strength k", "product", "balance", "branching j", "branching k", "Sz j/k"},
          {}};
  for (const ClassLambda& c : classes)
    for (const LambdaSystem& s : c.systems)
      t.rows.push_back({std::to_string(c.cls), std::to_string(s.excited),
                        std::to_string(s.ground[0]) + "," + std::to_string(s.ground[1]), fixed(s.lineGHz[0], 4),
                        fixed(s.lineGHz[1], 4), fixed(s.twoPhotonGHz, 6), cell(s.strength[0]), cell(s.strength[1]), cell(s.product), fixed(s.balance, 4), fixed(s.branching[0], 4), fixed(s.branching[1], 4),
                        pair(s.spinProjection, 3)});
  return t;
}

ordered cptDipsJson(int cls, int excited, int pumpGround, const std::vector<CptDip>& dips) {
  ordered list = ordered::array();
  for (const CptDip& d : dips)
    list.push_back(ordered{{"ground", d.ground}, {"probe_GHz", d.probeGHz}, {"two_photon_GHz", d.twoPhotonGHz}});
  return ordered{{"class", cls}, {"pump", {excited, pumpGround}}, {"dips", list}};
}

Table cptDipsTable(int cls, const std::vector<CptDip>& dips) {
  Table t{{"class", "pump excited,ground", "dip ground", "probe (GHz)", "two-photon (GHz)"}, {}};
  for (const CptDip& d : dips)
    t.rows.push_back({std::to_string(cls), std::to_string(d.excited) + "," + std::to_string(d.pumpGround),
                      std::to_string(d.ground), fixed(d.probeGHz, 4), fixed(d.twoPhotonGHz, 6)});
  return t;
}

namespace {
std::string spinArrow(double sz) { return sz > 0.25 ? "↑" : (sz < -0.25 ? "↓" : "~"); }
}  // namespace

std::string microwaveLabel(const MicrowaveTransition& t) {
  std::string text = spinArrow(t.spinProjectionLower) + "→" + spinArrow(t.spinProjectionUpper);
  if (t.nuclearChange == NuclearChange::Preserving) text += " mI " + projection(t.nuclearProjectionLower);
  if (t.nuclearChange == NuclearChange::Flipping)
    text += " mI " + projection(t.nuclearProjectionLower) + "→" + projection(t.nuclearProjectionUpper);
  return text;
}

std::string describeMicrowaveTransition(int cls, const MicrowaveTransition& t) {
  std::ostringstream out;
  out << "class " << cls << ", levels " << t.lower << " → " << t.upper << "\n"
      << "frequency " << fixed(t.frequencyGHz, 6) << " GHz\n"
      << "strength " << cell(t.strength) << " (spin " << cell(t.spinPart) << ", orbital " << cell(t.orbitalPart)
      << ", nuclear " << cell(t.nuclearPart) << ")\n"
      << "Sz " << fixed(t.spinProjectionLower, 3) << " → " << fixed(t.spinProjectionUpper, 3);
  if (t.nuclearChange != NuclearChange::NoNucleus)
    out << "\nmI " << projection(t.nuclearProjectionLower) << " → " << projection(t.nuclearProjectionUpper) << " ("
        << nuclearChangeName(t.nuclearChange) << ", purity " << fixed(t.nuclearPurity, 4) << ")";
  out << "\npopulations " << fixed(t.populationLower, 4) << " / " << fixed(t.populationUpper, 4);
  return out.str();
}

Table resonanceSpectrumTable(const ResonanceSpectrum& s) {
  Table t{{"frequency_GHz", "absorption"}, {}};
  for (std::size_t k = 0; k < s.frequencyGHz.size(); ++k) t.rows.push_back({exact(s.frequencyGHz[k]), exact(s.signal[k])});
  return t;
}

}  // namespace finestra
