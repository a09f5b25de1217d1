#include "core/strain/zero_field_strain.h"

#include <cmath>
#include <limits>

#include <Eigen/Dense>

#include "core/common/errors.h"

namespace finestra {
namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

Reading reading(double value, double variance) { return {value, std::sqrt(variance), value}; }

// |ε| = √(Δ² − λ²)/2 with dε/dΔ = Δ/(4|ε|). At or below λ the value is 0 with a 2σ upper limit.
Reading egMagnitude(const Reading& delta, double lambda, double* derivative) {
  const double excess = delta.value * delta.value - lambda * lambda;
  const double bound = delta.value + 2.0 * delta.standardError;
  const double limit = bound > lambda ? std::sqrt(bound * bound - lambda * lambda) / 2.0 : 0.0;
  if (excess <= 0) {
    *derivative = kNaN;
    return {0.0, kNaN, limit};
  }
  const double value = std::sqrt(excess) / 2.0;
  *derivative = delta.value / (4.0 * value);
  return {value, std::abs(*derivative) * delta.standardError, value};
}

// Best linear combination of two correlated estimates of one quantity.
Reading combine(const Reading& a, const Reading& b, double covariance) {
  if (!std::isfinite(a.standardError)) return b;
  if (!std::isfinite(b.standardError)) return a;
  Eigen::Matrix2d s;
  s << a.standardError * a.standardError, covariance, covariance, b.standardError * b.standardError;
  const Eigen::Matrix2d w = s.inverse();
  const Eigen::Vector2d ones(1, 1), y(a.value, b.value);
  const double total = ones.dot(w * ones);
  const double value = ones.dot(w * y) / total;
  return {value, std::sqrt(1.0 / total), value};
}

StrainReading readAssuming(const Reading& eg, const Reading& eu, double covGU, double couplingG, double couplingU,
                           const Reading& ratio) {
  StrainReading r;
  auto scaled = [](const Reading& e, double coupling) {
    const double c = std::abs(coupling);
    if (c == 0) return Reading{kNaN, kNaN, kNaN};
    return Reading{e.value / c, e.standardError / c, e.upperLimit / c};
  };
  r.fromGround = scaled(eg, couplingG);
  r.fromExcited = scaled(eu, couplingU);
  const double cov = covGU / (std::abs(couplingG) * std::abs(couplingU));
  r.combined = combine(r.fromGround, r.fromExcited, cov);
  r.ratioExpected = couplingG != 0 ? std::abs(couplingU / couplingG) : kNaN;
  r.ratioPull = (ratio.value - r.ratioExpected) / ratio.standardError;
  return r;
}

}  // namespace

ZeroFieldStrainEstimate estimateZeroFieldStrain(const ZeroFieldLines& lines, const ManifoldModel& ground,
                                                const ManifoldModel& excited, double zplReferenceGHz) {
  static const char* letters = "ABCD";
  for (int k = 0; k < 4; ++k) {
    if (!std::isfinite(lines.frequencyGHz[static_cast<std::size_t>(k)]))
      throw InputError(std::string("line ") + letters[k], "position is not finite");
    if (!(lines.sigmaGHz[static_cast<std::size_t>(k)] > 0) || !std::isfinite(lines.sigmaGHz[static_cast<std::size_t>(k)]))
      throw InputError(std::string("line ") + letters[k], "uncertainty must be positive");
  }
  const double A = lines.frequencyGHz[0], B = lines.frequencyGHz[1], C = lines.frequencyGHz[2], D = lines.frequencyGHz[3];
  Eigen::Vector4d var;
  for (int k = 0; k < 4; ++k) var[k] = lines.sigmaGHz[static_cast<std::size_t>(k)] * lines.sigmaGHz[static_cast<std::size_t>(k)];

  // Columns: c, Δg, Δu. Frequencies are taken relative to A to keep the normal equations well scaled.
  Eigen::Matrix<double, 4, 3> design;
  design << 1, 0.5, 0.5, 1, -0.5, 0.5, 1, 0.5, -0.5, 1, -0.5, -0.5;
  const Eigen::Vector4d y(0.0, B - A, C - A, D - A);
  const Eigen::Matrix4d weight = var.cwiseInverse().asDiagonal();
  const Eigen::Matrix3d covariance = (design.transpose() * weight * design).inverse();
  const Eigen::Vector3d solution = covariance * design.transpose() * weight * y;

  ZeroFieldStrainEstimate e;
  e.centroidGHz = reading(A + solution[0], covariance(0, 0));
  e.deltaG = reading(solution[1], covariance(1, 1));
  e.deltaU = reading(solution[2], covariance(2, 2));
  e.deltaCorrelation = covariance(1, 2) / std::sqrt(covariance(1, 1) * covariance(2, 2));
  e.deltaGFromAB = reading(A - B, var[0] + var[1]);
  e.deltaGFromCD = reading(C - D, var[2] + var[3]);
  e.deltaUFromAC = reading(A - C, var[0] + var[2]);
  e.deltaUFromBD = reading(B - D, var[1] + var[3]);
  e.mismatchGHz = reading(A - B - C + D, var.sum());
  e.mismatchPull = e.mismatchGHz.value / e.mismatchGHz.standardError;

  double dg = 0, du = 0;
  e.egGroundGHz = egMagnitude(e.deltaG, ground.lambda, &dg);
  e.egExcitedGHz = egMagnitude(e.deltaU, excited.lambda, &du);
  const double covEg = std::isfinite(dg) && std::isfinite(du) ? dg * du * covariance(1, 2) : 0.0;
  if (e.egGroundGHz.value > 0 && std::isfinite(e.egExcitedGHz.standardError)) {
    const double r = e.egExcitedGHz.value / e.egGroundGHz.value;
    const double relVar = std::pow(e.egExcitedGHz.standardError / e.egExcitedGHz.value, 2) +
                          std::pow(e.egGroundGHz.standardError / e.egGroundGHz.value, 2) -
                          2.0 * covEg / (e.egExcitedGHz.value * e.egGroundGHz.value);
    e.ratioExcitedToGround = reading(r, r * r * std::max(relVar, 0.0));
  } else {
    e.ratioExcitedToGround = {kNaN, kNaN, kNaN};
  }
  e.pureD = readAssuming(e.egGroundGHz, e.egExcitedGHz, covEg, ground.d, excited.d, e.ratioExcitedToGround);
  e.pureF = readAssuming(e.egGroundGHz, e.egExcitedGHz, covEg, ground.f, excited.f, e.ratioExcitedToGround);

  e.zplShiftGHz = reading(e.centroidGHz.value - zplReferenceGHz, covariance(0, 0));
  auto a1g = [&](double coupling) {
    if (coupling == 0) return Reading{kNaN, kNaN, kNaN};
    const double v = e.zplShiftGHz.value / coupling;
    return Reading{v, e.zplShiftGHz.standardError / std::abs(coupling), v};
  };
  e.a1gPerpendicular = a1g(excited.tPerp - ground.tPerp);
  e.a1gParallel = a1g(excited.tPar - ground.tPar);
  return e;
}

}  // namespace finestra
