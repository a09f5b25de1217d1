#pragma once
// The numbers that enter one manifold's Hamiltonian (docs/physics.md, Hamiltonian of one manifold),
// in GHz and tesla.
#include "core/centre/parameters.h"
#include "core/common/types.h"

namespace finestra {

struct ManifoldModel {
  double lambda = 0;       ///< effective spin-orbit splitting λ_m (GHz)
  double orbitalZeeman = 0;///< q_m γ_L (GHz/T)
  double spinZeeman = 0;   ///< γ_S = g_s μ_B / h (GHz/T)
  double jtX = 0, jtY = 0; ///< static Jahn-Teller Υx, Υy (GHz)
  double tPerp = 0, tPar = 0, d = 0, f = 0;  ///< strain couplings (GHz per unit strain)
  double aPar = 0, aPerp = 0;  ///< hyperfine (GHz)
  double gammaN = 0;           ///< signed nuclear gyromagnetic ratio (GHz/T)
  int nuclearDim = 1;          ///< 2I+1
  int dimension() const { return 4 * nuclearDim; }
};

/// Extracts manifold m from validated centre parameters (call validateForComputation first).
ManifoldModel manifoldModel(const CentreParameters& p, Manifold m);

/// Orbital strain terms of one manifold, GHz: the coefficients of 1, σ_z and σ_x
/// (a1g·1 − egx·σ_z + egy·σ_x, docs/physics.md, Strain).
struct StrainTerms {
  double a1g = 0, egx = 0, egy = 0;
  double egMagnitude() const;
};

/// Strain terms from a defect-frame strain tensor (Meesala et al., PRB 97, 205444 (2018) form):
/// A1g = t⊥(εxx+εyy) + t∥εzz, Egx = d(εxx−εyy) + fεzx, Egy = −2dεxy + fεyz.
StrainTerms strainTerms(const ManifoldModel& m, const Mat3& strainDefect);

/// Zero-field splitting Δ = √(λ² + 4|ε_Eg|²), with the static Jahn-Teller term folded into ε_Eg.
double zeroFieldSplitting(const ManifoldModel& m, const StrainTerms& s);

}  // namespace finestra
