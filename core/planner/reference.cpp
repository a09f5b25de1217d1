#include "core/planner/reference.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <numbers>

#include "core/model/dipole.h"
#include "core/thermal/planning_width.h"

namespace finestra {
namespace {

ManifoldModel electronic(const CentreModel& model, Manifold m) {
  ManifoldModel mm = model.manifold(m);
  mm.nuclearDim = 1;
  return mm;
}

ManifoldEigen electronicLevels(const CentreModel& model, Manifold m, int cls, const Vec3& fieldCrystal) {
  return diagonalise(electronic(model, m), model.strainFor(m, cls), defectFrame(cls) * fieldCrystal);
}

// (γ_S S + q γ_L L_z ẑ)·b̂ in the electronic basis: the field-proportional part of H at B = b̂.
Matrix4c electronicDriveOperator(const CentreModel& model, int cls, const Vec3& driveCrystal) {
  const ManifoldModel g = electronic(model, Manifold::Ground);
  const StrainTerms s = model.strainFor(Manifold::Ground, cls);
  return electronicHamiltonian(g, s, defectFrame(cls) * driveCrystal) - electronicHamiltonian(g, s, Vec3::Zero());
}

std::pair<double, double> scanMiddleGap(const CentreModel& model, Manifold m, int cls, const Vec3& direction,
                                        double magnitudeT, int steps) {
  std::pair<double, double> best{std::numeric_limits<double>::infinity(), 0.0};
  for (int k = 0; k <= steps; ++k) {
    const double b = magnitudeT * k / steps;
    const ManifoldEigen e = electronicLevels(model, m, cls, b * direction);
    if (e.energies[2] - e.energies[1] < best.first) best = {e.energies[2] - e.energies[1], b};
  }
  return best;
}

}  // namespace

std::array<ClassFigures, kClassCount> referenceFigures(const CentreModel& model, const PlannerSettings& settings,
                                                       const Vec3& direction, double magnitudeT, int gapSteps) {
  const double linewidthGHz = separationLinewidthGHz(model);
  std::array<ClassFigures, kClassCount> out{};
  std::array<std::vector<double>, kClassCount> chosen, all;
  const Vec3 field = magnitudeT * direction;
  const Vec3 driveCrystal = model.setup().lab.toCrystal(settings.driveLab.normalized());
  const double ratio = model.setup().centre.parameters.get(Param::DipoleRatio);
  const double freeElectron = 0.5 * model.manifold(Manifold::Ground).spinZeeman;
  const int firstExcited = settings.family == LineFamily::C ? 0 : 2;
  for (int cls : settings.classes) {
    ClassFigures& f = out[static_cast<std::size_t>(cls)];
    const ManifoldEigen g = electronicLevels(model, Manifold::Ground, cls, field);
    const ManifoldEigen u = electronicLevels(model, Manifold::Excited, cls, field);
    f.qubitGHz = g.energies[1] - g.energies[0];
    const MatrixXc drive = electronicDriveOperator(model, cls, driveCrystal);
    f.driveGHzPerT = std::abs((g.vectors.col(0).adjoint() * drive * g.vectors.col(1))(0, 0));
    f.driveFraction = f.driveGHzPerT / freeElectron;
    const auto amps = dipoleAmplitudesDefect<MatrixXc>(g.vectors, u.vectors, ratio);
    auto strength = [&](int upper, int lower) {
      double s = 0;
      for (const auto& a : amps) s += std::norm(a(lower, upper));
      return s;
    };
    f.cyclicity = kCyclicityCap;
    for (int upper = firstExcited; upper < firstExcited + 2; ++upper) {
      const double w0 = strength(upper, 0), w1 = strength(upper, 1);
      const double flip = std::min(w0, w1), keep = std::max(w0, w1);
      f.cyclicity = std::min(f.cyclicity, flip > keep / kCyclicityCap ? keep / flip : kCyclicityCap);
      chosen[static_cast<std::size_t>(cls)].push_back(u.energies[upper] - g.energies[w0 >= w1 ? 0 : 1]);
    }
    if (!(f.qubitGHz > kDegenerateGHz)) f.driveGHzPerT = f.driveFraction = f.cyclicity = std::nan("");
    if (!(u.energies[firstExcited + 1] - u.energies[firstExcited] > kDegenerateGHz)) f.cyclicity = std::nan("");
    for (Eigen::Index i = 0; i < 4; ++i)
      for (Eigen::Index j = 0; j < 4; ++j) all[static_cast<std::size_t>(cls)].push_back(u.energies[i] - g.energies[j]);
    std::tie(f.groundGapGHz, f.groundGapFieldT) = scanMiddleGap(model, Manifold::Ground, cls, direction, magnitudeT, gapSteps);
    std::tie(f.excitedGapGHz, f.excitedGapFieldT) = scanMiddleGap(model, Manifold::Excited, cls, direction, magnitudeT, gapSteps);
    const auto axis = classAxisIndices(cls);
    f.axisAngleDeg = std::acos(std::clamp(direction.dot(Vec3(axis[0], axis[1], axis[2]).normalized()), -1.0, 1.0)) *
                     180.0 / std::numbers::pi;
  }
  for (int cls : settings.classes) {
    double gap = std::numeric_limits<double>::infinity();
    for (int other : settings.classes)
      if (other != cls)
        for (double c : chosen[static_cast<std::size_t>(cls)])
          for (double a : all[static_cast<std::size_t>(other)]) gap = std::min(gap, std::abs(c - a));
    out[static_cast<std::size_t>(cls)].separationLinewidths = gap / linewidthGHz;
  }
  return out;
}

std::vector<SpinTransition> hyperfineSpinTransitions(const CentreModel& model, const PlannerSettings& settings,
                                                     int cls, const Vec3& fieldCrystal, double relativeThreshold) {
  const ManifoldEigen g = model.levels(Manifold::Ground, cls, fieldCrystal);
  const int nuclear = model.manifold(Manifold::Ground).nuclearDim;
  const Vec3 driveCrystal = model.setup().lab.toCrystal(settings.driveLab.normalized());
  // Basis order orbital ⊗ spin ⊗ nuclear (nuclear fastest): the electronic operator times 1_N.
  const Matrix4c electronicDrive = electronicDriveOperator(model, cls, driveCrystal);
  MatrixXc drive = MatrixXc::Zero(4 * nuclear, 4 * nuclear);
  for (int r = 0; r < 4; ++r)
    for (int c = 0; c < 4; ++c)
      drive.block(r * nuclear, c * nuclear, nuclear, nuclear) = electronicDrive(r, c) * MatrixXc::Identity(nuclear, nuclear);
  const int lowerBranch = 2 * nuclear;
  std::vector<SpinTransition> out;
  double strongest = 0;
  for (int a = 0; a < lowerBranch; ++a)
    for (int b = a + 1; b < lowerBranch; ++b) {
      const double m = std::abs((g.vectors.col(a).adjoint() * drive * g.vectors.col(b))(0, 0));
      strongest = std::max(strongest, m);
      out.push_back({a, b, g.energies[b] - g.energies[a], m});
    }
  std::erase_if(out, [&](const SpinTransition& t) { return t.driveGHzPerT < relativeThreshold * strongest || strongest == 0; });
  std::sort(out.begin(), out.end(), [](const auto& x, const auto& y) { return x.frequencyGHz < y.frequencyGHz; });
  return out;
}

}  // namespace finestra
