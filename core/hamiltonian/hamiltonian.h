#pragma once
// Hamiltonian of one manifold and its diagonalisation (docs/physics.md, Hamiltonian of one manifold).
// Basis: orbital {x, y} ⊗ spin {↑, ↓} ⊗ nuclear {m_I = I, I−1, …, −I}; without an isotope the
// nuclear factor is absent and the basis is |x↑⟩, |x↓⟩, |y↑⟩, |y↓⟩.
#include "core/common/types.h"
#include "core/hamiltonian/manifold_model.h"

namespace finestra {

/// Eigenpairs of one manifold, energies ascending (GHz), eigenvectors in columns.
struct ManifoldEigen {
  VectorXr energies;
  MatrixXc vectors;
};

/// Fixed-size eigenpairs for the 4-state manifold (no isotope): no heap allocation.
struct ManifoldEigen4 {
  Vector4r energies;
  Matrix4c vectors;
};

/// The 4×4 electronic Hamiltonian (spin-orbit, Jahn-Teller, strain, orbital and spin Zeeman).
/// `fieldDefect` is B in the defect frame (T).
Matrix4c electronicHamiltonian(const ManifoldModel& m, const StrainTerms& s, const Vec3& fieldDefect);

/// Full Hamiltonian including hyperfine and nuclear Zeeman, dimension 4(2I+1).
MatrixXc fullHamiltonian(const ManifoldModel& m, const StrainTerms& s, const Vec3& fieldDefect);

/// Diagonalises with a self-adjoint solver: fixed 4×4 path without isotope, dynamic otherwise.
ManifoldEigen diagonalise(const ManifoldModel& m, const StrainTerms& s, const Vec3& fieldDefect);
ManifoldEigen4 diagonalise4(const ManifoldModel& m, const StrainTerms& s, const Vec3& fieldDefect);

/// Nuclear spin matrices I_x, I_y, I_z for dimension 2I+1 (basis m_I = I … −I).
struct SpinMatrices {
  MatrixXc x, y, z;
};
SpinMatrices spinMatrices(int dimension);

}  // namespace finestra
