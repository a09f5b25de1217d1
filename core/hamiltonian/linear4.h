#pragma once
// Closed forms for the 4×4 electronic Hamiltonian of one manifold and one orientation class.
//
// The 4×4 Hamiltonian of a manifold is linear in B (docs/physics.md, Diagonalisation), so it is sampled once per class
// through the public electronicHamiltonian() and then rebuilt at any field as a fixed-size linear
// combination. The anticrossing scan over 0..|B| needs only eigenvalues; for it the Hamiltonian is
// written in Pauli components, H = e0 + o·σ⊗1 + 1⊗b·s + c σ_y⊗s_z, whose characteristic polynomial
// is the depressed quartic (x−e0)⁴ − 2S(x−e0)² − 8c o_y b_z (x−e0) + S² − 4P with
// S = |o|² + |b|² + c², P = |o|²|b|² + c²(o_y² + b_z²) (derived in the comment of quarticLevels;
// checked against the self-adjoint solver in tests/core/planner_kernel_test.cpp).
#include <array>

#include "core/common/types.h"
#include "core/hamiltonian/hamiltonian.h"
#include "core/hamiltonian/manifold_model.h"

namespace finestra {

/// H(B) = constant + Σ_c B_c perTesla[c] with B in crystal axes (exact for the electronic 4×4).
struct LinearHamiltonian4 {
  Matrix4c constant = Matrix4c::Zero();
  std::array<Matrix4c, 3> perTesla{Matrix4c::Zero(), Matrix4c::Zero(), Matrix4c::Zero()};

  static LinearHamiltonian4 sample(const ManifoldModel& m, const StrainTerms& s, const Mat3& defectFrame);
  void at(const Vec3& fieldCrystal, Matrix4c& out) const;
};

/// Pauli components of a LinearHamiltonian4: each of e0, o (σ_x, σ_y, σ_z), b (s_x, s_y, s_z), c
/// is value + gradient·B. `closedForm` is false when any other component is present; the quartic
/// then does not apply and the kernel falls back to the numerical solver.
struct PauliForm4 {
  bool closedForm = false;
  std::array<double, 8> value{};   ///< e0, ox, oy, oz, bx, by, bz, c at B = 0
  std::array<Vec3, 8> gradient{};  ///< d(component)/dB_crystal

  static PauliForm4 fromLinear(const LinearHamiltonian4& h);
};

/// Ascending eigenvalues from the closed-form quartic, to rounding of the manifold's energy scale
/// (the small resolvent roots come from Vieta's relations, so Kramers-pair splittings keep their digits).
Vector4r quarticLevels(const PauliForm4& form, const Vec3& fieldCrystal);
/// E2 − E1 (the gap between the lower and the upper pair of levels) from the same quartic.
double quarticMiddleGap(const PauliForm4& form, const Vec3& fieldCrystal);

/// Eigen-decomposition of a PauliForm4 Hamiltonian (closedForm must be true) without an iterative
/// solver: the quartic's roots polished by a Newton step; eigenvectors by eliminating one orbital
/// half (a 2×2 null vector), or as spectral-projector columns where that elimination is
/// ill-conditioned; Rayleigh refinement where the roots' rounding would show in the vectors.
/// Returns false when two levels lie closer than `relativeGap` × the manifold's scale (degenerate
/// or nearly so, e.g. Kramers pairs at zero field); the caller then uses the self-adjoint solver.
bool closedFormEigen4(const PauliForm4& form, const Vec3& fieldCrystal, ManifoldEigen4& out,
                      double relativeGap = 1e-7);

/// Eigenpairs of h at a crystal-frame field: closedFormEigen4 where `form` allows it, the
/// self-adjoint solver otherwise (degenerate levels, terms outside the Pauli form).
void eigen4(const PauliForm4& form, const LinearHamiltonian4& h, const Vec3& fieldCrystal, ManifoldEigen4& out);

}  // namespace finestra
