#include "core/planner/fast_kernel.h"

#include <Eigen/Eigenvalues>
#include <algorithm>
#include <cmath>
#include <limits>
#include <numbers>

#include "core/common/errors.h"
#include "core/thermal/planning_width.h"
#include "core/units/linewidth.h"

namespace finestra {
namespace {

constexpr double kUndefined = std::numeric_limits<double>::quiet_NaN();

double middleGapOf(const Matrix4c& h) {
  const Vector4r e = Eigen::SelfAdjointEigenSolver<Matrix4c>(h, Eigen::EigenvaluesOnly).eigenvalues();
  return e[2] - e[1];
}

}  // namespace

PlannerKernel::PlannerKernel(const CentreModel& model, const PlannerSettings& settings) : settings_(settings) {
  if (!(settings.magnitudeT >= 0) || !std::isfinite(settings.magnitudeT))
    throw InputError("plan.magnitude_T", "must be a finite, non-negative number");
  if (!settings.driveLab.allFinite() || settings.driveLab.norm() < 1e-12)
    throw InputError("plan.drive_lab", "must be a non-zero finite vector");
  if (settings.gapScanSamples < 2 || settings.gapRefineSteps < 0)
    throw InputError("plan.gap_scan", "needs at least 2 samples and a non-negative number of refinement steps");
  ManifoldModel ground = model.manifold(Manifold::Ground), excited = model.manifold(Manifold::Excited);
  ground.nuclearDim = excited.nuclearDim = 1;  // the planner's figures are electronic
  const Vec3 driveCrystal = model.setup().lab.toCrystal(settings.driveLab.normalized());
  for (int cls : settings.classes) {
    if (cls < 0 || cls >= kClassCount) throw InputError("classes", "orientation class must be 0..3");
    ClassData& d = classes_[static_cast<std::size_t>(cls)];
    d.selected = true;
    const Mat3& frame = defectFrame(cls);
    d.ground = LinearHamiltonian4::sample(ground, model.strainFor(Manifold::Ground, cls), frame);
    d.excited = LinearHamiltonian4::sample(excited, model.strainFor(Manifold::Excited, cls), frame);
    d.groundForm = PauliForm4::fromLinear(d.ground);
    d.excitedForm = PauliForm4::fromLinear(d.excited);
    d.groundGapAtZero = middleGapOf(d.ground.constant);
    d.excitedGapAtZero = middleGapOf(d.excited.constant);
    // ∂H/∂B·b̂: the Hamiltonian is linear in B, so the magnetic moment operator along b̂ is exactly
    // the field-proportional part evaluated at B = b̂ (γ_S S·b̂ + q γ_L L_z b̂_z).
    d.driveOperator = driveCrystal.x() * d.ground.perTesla[0] + driveCrystal.y() * d.ground.perTesla[1] +
                      driveCrystal.z() * d.ground.perTesla[2];
    const auto axis = classAxisIndices(cls);
    d.axisCrystal = Vec3(axis[0], axis[1], axis[2]).normalized();
  }
  dipoleRatio_ = model.setup().centre.parameters.get(Param::DipoleRatio);
  linewidthGHz_ = separationLinewidthGHz(model);
  freeElectronDrive_ = 0.5 * ground.spinZeeman;
}

PlannerKernel::GapResult PlannerKernel::smallestMiddleGap(const LinearHamiltonian4& h, const PauliForm4& form,
                                                          const Vec3& direction, double magnitudeT,
                                                          double gapAtStart, double gapAtEnd) const {
  auto gapAt = [&](double t) {
    const Vec3 b = (t * magnitudeT) * direction;
    if (form.closedForm) return quarticMiddleGap(form, b);
    Matrix4c m;
    h.at(b, m);
    Eigen::SelfAdjointEigenSolver<Matrix4c> solver(m, Eigen::EigenvaluesOnly);
    return solver.eigenvalues()[2] - solver.eigenvalues()[1];
  };
  const int n = settings_.gapScanSamples;
  GapResult best{gapAtEnd, magnitudeT};
  int bestIndex = n;
  for (int k = 0; k < n; ++k) {
    const double t = static_cast<double>(k) / n;
    const double g = k == 0 ? gapAtStart : gapAt(t);
    if (g < best.gapGHz) best = {g, t * magnitudeT}, bestIndex = k;
  }
  // Usual case below the anticrossing field: the gap still shrinks at |B|. One probe just inside
  // the end confirms it, and the bracket's minimum (assumed unimodal, like the search) is the end.
  if (bestIndex == n && gapAt(1.0 - 1e-3 / n) > gapAtEnd) return best;
  // Golden-section search in the bracket around the coarse minimum.
  double lo = std::max(bestIndex - 1, 0) / static_cast<double>(n);
  double hi = std::min(bestIndex + 1, n) / static_cast<double>(n);
  constexpr double golden = 0.6180339887498949;
  double t1 = hi - golden * (hi - lo), t2 = lo + golden * (hi - lo);
  double g1 = gapAt(t1), g2 = gapAt(t2);
  for (int step = 0; step < settings_.gapRefineSteps; ++step) {
    if (g1 < g2) {
      hi = t2, t2 = t1, g2 = g1;
      t1 = hi - golden * (hi - lo), g1 = gapAt(t1);
    } else {
      lo = t1, t1 = t2, g1 = g2;
      t2 = lo + golden * (hi - lo), g2 = gapAt(t2);
    }
  }
  if (g1 < best.gapGHz) best = {g1, t1 * magnitudeT};
  if (g2 < best.gapGHz) best = {g2, t2 * magnitudeT};
  return best;
}

void PlannerKernel::evaluate(const Vec3& direction, double magnitudeT, std::array<ClassFigures, kClassCount>& out) const {
  struct Lines {
    std::array<double, 2> chosen;
    std::array<double, 16> all;
  };
  std::array<Lines, kClassCount> lines{};
  const Vec3 field = magnitudeT * direction;
  const int firstExcited = settings_.family == LineFamily::C ? 0 : 2;
  ManifoldEigen4 groundEigen, excitedEigen;
  for (int cls = 0; cls < kClassCount; ++cls) {
    const ClassData& d = classes_[static_cast<std::size_t>(cls)];
    if (!d.selected) continue;
    ClassFigures& f = out[static_cast<std::size_t>(cls)];
    eigen4(d.groundForm, d.ground, field, groundEigen);
    eigen4(d.excitedForm, d.excited, field, excitedEigen);
    const Vector4r& eg = groundEigen.energies;
    const Vector4r& eu = excitedEigen.energies;
    const Matrix4c& vg = groundEigen.vectors;
    const Matrix4c& vu = excitedEigen.vectors;

    f.qubitGHz = eg[1] - eg[0];
    f.driveGHzPerT = std::abs(vg.col(0).dot(d.driveOperator * vg.col(1)));
    f.driveFraction = f.driveGHzPerT / freeElectronDrive_;

    // Decay strength |d|² summed over the three polarisations, d_x = rσ_z, d_y = −rσ_x, d_z = 1.
    auto strength = [&](int upper, int lower) {
      const auto u = vu.col(upper);
      const auto g = vg.col(lower);
      const cplx z = g.dot(u);
      const cplx x = g.head<2>().dot(u.head<2>()) - g.tail<2>().dot(u.tail<2>());
      const cplx y = g.head<2>().dot(u.tail<2>()) + g.tail<2>().dot(u.head<2>());
      return std::norm(z) + dipoleRatio_ * dipoleRatio_ * (std::norm(x) + std::norm(y));
    };
    double worst = kCyclicityCap;
    Lines& l = lines[static_cast<std::size_t>(cls)];
    for (int k = 0; k < 2; ++k) {
      const int upper = firstExcited + k;
      const double w0 = strength(upper, 0), w1 = strength(upper, 1);
      const double conserving = std::max(w0, w1), flipping = std::min(w0, w1);
      const double ratio = flipping > conserving / kCyclicityCap ? conserving / flipping : kCyclicityCap;
      worst = std::min(worst, ratio);
      l.chosen[static_cast<std::size_t>(k)] = eu[upper] - eg[w0 >= w1 ? 0 : 1];
    }
    f.cyclicity = worst;
    // A degenerate pair has no defined eigenvectors (e.g. B ⟂ axis without strain, where the two
    // L_z sectors are degenerate): the drive and the branching between them are then undefined.
    if (!(f.qubitGHz > kDegenerateGHz)) f.driveGHzPerT = f.driveFraction = f.cyclicity = kUndefined;
    if (!(eu[firstExcited + 1] - eu[firstExcited] > kDegenerateGHz)) f.cyclicity = kUndefined;
    for (int i = 0; i < 4; ++i)
      for (int j = 0; j < 4; ++j) l.all[static_cast<std::size_t>(4 * i + j)] = eu[i] - eg[j];

    const GapResult gg = smallestMiddleGap(d.ground, d.groundForm, direction, magnitudeT, d.groundGapAtZero, eg[2] - eg[1]);
    const GapResult gu =
        smallestMiddleGap(d.excited, d.excitedForm, direction, magnitudeT, d.excitedGapAtZero, eu[2] - eu[1]);
    f.groundGapGHz = gg.gapGHz, f.groundGapFieldT = gg.atT;
    f.excitedGapGHz = gu.gapGHz, f.excitedGapFieldT = gu.atT;
    f.axisAngleDeg = std::acos(std::clamp(direction.dot(d.axisCrystal), -1.0, 1.0)) * 180.0 / std::numbers::pi;
  }
  for (int cls = 0; cls < kClassCount; ++cls) {
    if (!classes_[static_cast<std::size_t>(cls)].selected) continue;
    double gap = std::numeric_limits<double>::infinity();
    for (int other = 0; other < kClassCount; ++other) {
      if (other == cls || !classes_[static_cast<std::size_t>(other)].selected) continue;
      for (double chosen : lines[static_cast<std::size_t>(cls)].chosen)
        for (double any : lines[static_cast<std::size_t>(other)].all) gap = std::min(gap, std::abs(chosen - any));
    }
    out[static_cast<std::size_t>(cls)].separationLinewidths = gap / linewidthGHz_;
  }
}

}  // namespace finestra
