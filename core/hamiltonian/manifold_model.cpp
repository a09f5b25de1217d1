#include "core/hamiltonian/manifold_model.h"

#include <cmath>

#include "core/units/constants.h"

namespace finestra {

ManifoldModel manifoldModel(const CentreParameters& p, Manifold m) {
  const bool g = m == Manifold::Ground;
  auto pick = [&](Param ground, Param excited) { return p.get(g ? ground : excited); };
  ManifoldModel out;
  out.lambda = pick(Param::LambdaG, Param::LambdaU);
  out.orbitalZeeman = pick(Param::QG, Param::QU) * constants::kBohrGHzPerT;
  out.spinZeeman = p.get(Param::GSpin) * constants::kBohrGHzPerT;
  out.jtX = pick(Param::JtXG, Param::JtXU);
  out.jtY = pick(Param::JtYG, Param::JtYU);
  out.tPerp = pick(Param::TperpG, Param::TperpU) * constants::kGHzPerPHz;
  out.tPar = pick(Param::TparG, Param::TparU) * constants::kGHzPerPHz;
  out.d = pick(Param::DG, Param::DU) * constants::kGHzPerPHz;
  out.f = pick(Param::FG, Param::FU) * constants::kGHzPerPHz;
  out.nuclearDim = p.nuclearDimension();
  if (out.nuclearDim > 1) {
    out.aPar = pick(Param::AParG, Param::AParU) * 1e-3;
    out.aPerp = pick(Param::APerpG, Param::APerpU) * 1e-3;
    out.gammaN = p.get(Param::GammaN) * 1e-3;
  }
  return out;
}

double StrainTerms::egMagnitude() const { return std::hypot(egx, egy); }

StrainTerms strainTerms(const ManifoldModel& m, const Mat3& e) {
  StrainTerms s;
  s.a1g = m.tPerp * (e(0, 0) + e(1, 1)) + m.tPar * e(2, 2);
  s.egx = m.d * (e(0, 0) - e(1, 1)) + m.f * e(2, 0);
  s.egy = -2.0 * m.d * e(0, 1) + m.f * e(1, 2);
  return s;
}

double zeroFieldSplitting(const ManifoldModel& m, const StrainTerms& s) {
  // The σ_z coefficient is Υx − ε_Egx and the σ_x coefficient Υy + ε_Egy (docs/physics.md, Strain).
  const double cz = m.jtX - s.egx;
  const double cx = m.jtY + s.egy;
  return std::sqrt(m.lambda * m.lambda + 4.0 * (cz * cz + cx * cx));
}

}  // namespace finestra
