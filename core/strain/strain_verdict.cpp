#include "core/strain/strain_verdict.h"

#include <cmath>
#include <cstdio>

namespace finestra {
namespace {

constexpr double kAgreementSigma = 3.0;

std::string oneDecimal(double v) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.1f", v);
  return buffer;
}

// Verdict on one coupling assumption from the pull of the measured ratio against its prediction.
std::string assumptionText(const char* name, const StrainReading& r, bool* fits) {
  *fits = false;
  if (!std::isfinite(r.ratioExpected)) return std::string(name) + ": cannot be tested (its coupling constant is zero or unknown)";
  if (!std::isfinite(r.ratioPull))
    return std::string(name) + ": cannot be tested (|eps_Eg| of a manifold is zero within its error, so the ratio is undefined)";
  *fits = std::abs(r.ratioPull) <= kAgreementSigma;
  return std::string(name) + (*fits ? ": fits" : ": does not fit") + " (measured ratio u/g is " + oneDecimal(std::abs(r.ratioPull)) +
         "σ from the expected " + oneDecimal(r.ratioExpected) + ")";
}

}  // namespace

StrainVerdict strainVerdict(const ZeroFieldStrainEstimate& e) {
  StrainVerdict v;
  v.units = "strain is dimensionless (unit 1) in the defect frame: z along the emitter's <111> symmetry axis, x in a "
            "mirror plane; |eps_Eg| in GHz is the E-type strain energy of each manifold";
  const double pull = std::abs(e.mismatchPull);
  v.readingsAgree = std::isfinite(pull) && pull <= kAgreementSigma;
  if (!std::isfinite(pull)) v.readings = "readings cannot be compared (undefined mismatch)";
  else if (v.readingsAgree) v.readings = "readings agree within " + oneDecimal(pull) + "σ (A−B vs C−D and A−C vs B−D)";
  else
    v.readings = "readings DISAGREE by " + oneDecimal(pull) +
                 "σ: the four lines are not A, B, C, D of one emitter in this order, or their σ are too small";
  v.pureD = assumptionText("pure d-type coupling", e.pureD, &v.pureDFits);
  v.pureF = assumptionText("pure f-type coupling", e.pureF, &v.pureFFits);
  if (v.pureDFits && v.pureFFits) v.overall = "both coupling assumptions fit: the lines cannot tell d- from f-type strain";
  else if (v.pureDFits) v.overall = "only pure d-type coupling fits: use the d-type strain";
  else if (v.pureFFits) v.overall = "only pure f-type coupling fits: use the f-type strain";
  else if (!std::isfinite(e.pureD.ratioPull) && !std::isfinite(e.pureF.ratioPull))
    v.overall = "neither assumption can be tested; the strain values are upper limits per manifold";
  else
    v.overall = "NEITHER assumption fits: the strain is a mixture of d- and f-type coupling (or the centre's constants are off); "
                "the per-assumption strains are not to be trusted";
  v.cannotDetermine = "four zero-field lines cannot determine the E-strain angle (only |eps_Eg| per manifold), the orientation "
                      "class of the emitter, or the A1g part without a measured unstrained ZPL reference (the A1g values here "
                      "take the preset ZPL as that reference)";
  return v;
}

}  // namespace finestra
