#pragma once
// First derivatives of the ascending levels of a Hermitian matrix along a change dH of the matrix
// (Hellmann–Feynman theorem: dE_n = ⟨v_n|dH|v_n⟩; Feynman, Phys. Rev. 56, 340 (1939)).
#include "core/common/types.h"
#include "core/hamiltonian/hamiltonian.h"

namespace finestra {

/// dE_n for every level of `eigen` (energies ascending, orthonormal eigenvectors in columns of the
/// matrix H) along the Hermitian change `dH`. Levels closer than `relativeGap` × the spectrum's
/// scale form a degenerate cluster; there the eigenvectors are an arbitrary basis of the cluster,
/// so the derivatives come from degenerate perturbation theory: the eigenvalues μ_0 ≤ … ≤ μ_{k−1}
/// of the cluster block V†·dH·V. The ascending levels are not differentiable at an exact crossing
/// (their one-sided derivatives are μ_j forward and μ_{k−1−j} backward); level j of the cluster
/// gets the mean (μ_j + μ_{k−1−j})/2, the value central differences converge to.
VectorXr levelDerivatives(const ManifoldEigen& eigen, const MatrixXc& dH, double relativeGap = 1e-8);

}  // namespace finestra
