#include "core/hamiltonian/hamiltonian.h"

#include <Eigen/Eigenvalues>
#include <cmath>

namespace finestra {
namespace {
constexpr cplx I1{0.0, 1.0};

// Orbital 2×2 coefficients (a·1 + z·σ_z + x·σ_x + y·σ_y) times spin 2×2 (b·1 + sx·s_x + sy·s_y + sz·s_z)
// are assembled directly into the 4×4 with index 2·orbital + spin.
using Mat2 = Eigen::Matrix<cplx, 2, 2>;

Mat2 pauliX() { Mat2 m; m << 0, 1, 1, 0; return m; }
Mat2 pauliY() { Mat2 m; m << 0, -I1, I1, 0; return m; }
Mat2 pauliZ() { Mat2 m; m << 1, 0, 0, -1; return m; }

Matrix4c kron2(const Mat2& a, const Mat2& b) {
  Matrix4c out;
  for (int i = 0; i < 2; ++i)
    for (int j = 0; j < 2; ++j) out.block<2, 2>(2 * i, 2 * j) = a(i, j) * b;
  return out;
}

MatrixXc kron(const MatrixXc& a, const MatrixXc& b) {
  MatrixXc out(a.rows() * b.rows(), a.cols() * b.cols());
  for (Eigen::Index i = 0; i < a.rows(); ++i)
    for (Eigen::Index j = 0; j < a.cols(); ++j)
      out.block(i * b.rows(), j * b.cols(), b.rows(), b.cols()) = a(i, j) * b;
  return out;
}
}  // namespace

Matrix4c electronicHamiltonian(const ManifoldModel& m, const StrainTerms& s, const Vec3& B) {
  const Mat2 one = Mat2::Identity();
  const Mat2 sx = pauliX(), sy = pauliY(), sz = pauliZ();
  // Orbital part: spin-orbit couples L_z = σ_y to s_z; strain and static JT act on σ_z, σ_x;
  // only B_z couples to the orbit (L_x, L_y vanish within an E doublet).
  const Mat2 orbital = (s.a1g * one) + ((m.jtX - s.egx) * sz) + ((m.jtY + s.egy) * sx) +
                       (m.orbitalZeeman * B.z()) * sy;
  const Mat2 spin = 0.5 * m.spinZeeman * (B.x() * sx + B.y() * sy + B.z() * sz);
  return kron2(-0.5 * m.lambda * sy, sz) + kron2(orbital, one) + kron2(one, spin);
}

SpinMatrices spinMatrices(int dim) {
  const double spin = 0.5 * (dim - 1);
  SpinMatrices out{MatrixXc::Zero(dim, dim), MatrixXc::Zero(dim, dim), MatrixXc::Zero(dim, dim)};
  for (int k = 0; k < dim; ++k) {
    const double mk = spin - k;
    out.z(k, k) = mk;
    if (k + 1 < dim) {
      // ⟨m+1| I_+ |m⟩ = √(I(I+1) − m(m+1)) with m = m_{k+1}
      const double ml = spin - (k + 1);
      const double plus = std::sqrt(spin * (spin + 1) - ml * (ml + 1));
      out.x(k, k + 1) = out.x(k + 1, k) = 0.5 * plus;
      out.y(k, k + 1) = -0.5 * I1 * plus;
      out.y(k + 1, k) = 0.5 * I1 * plus;
    }
  }
  return out;
}

MatrixXc fullHamiltonian(const ManifoldModel& m, const StrainTerms& s, const Vec3& B) {
  const Matrix4c electronic = electronicHamiltonian(m, s, B);
  const int n = m.nuclearDim;
  if (n == 1) return electronic;
  const SpinMatrices nuc = spinMatrices(n);
  const SpinMatrices el = spinMatrices(2);  // S = s/2
  const MatrixXc one2 = MatrixXc::Identity(2, 2);
  const MatrixXc oneN = MatrixXc::Identity(n, n);
  // H_hf = A⊥(SxIx + SyIy) + A∥ SzIz − γ_n B·I on spin ⊗ nucleus; orbital identity.
  const MatrixXc spinNuclear = m.aPerp * (kron(el.x, nuc.x) + kron(el.y, nuc.y)) + m.aPar * kron(el.z, nuc.z) -
                               m.gammaN * kron(one2, B.x() * nuc.x + B.y() * nuc.y + B.z() * nuc.z);
  return kron(MatrixXc(electronic), oneN) + kron(one2, spinNuclear);
}

ManifoldEigen4 diagonalise4(const ManifoldModel& m, const StrainTerms& s, const Vec3& B) {
  Eigen::SelfAdjointEigenSolver<Matrix4c> solver(electronicHamiltonian(m, s, B));
  return {solver.eigenvalues(), solver.eigenvectors()};
}

VectorXr levelEnergies(const ManifoldModel& m, const StrainTerms& s, const Vec3& B) {
  if (m.nuclearDim == 1)
    return Eigen::SelfAdjointEigenSolver<Matrix4c>(electronicHamiltonian(m, s, B), Eigen::EigenvaluesOnly).eigenvalues();
  return Eigen::SelfAdjointEigenSolver<MatrixXc>(fullHamiltonian(m, s, B), Eigen::EigenvaluesOnly).eigenvalues();
}

ManifoldEigen diagonalise(const ManifoldModel& m, const StrainTerms& s, const Vec3& B) {
  if (m.nuclearDim == 1) {
    ManifoldEigen4 e = diagonalise4(m, s, B);
    return {e.energies, e.vectors};
  }
  Eigen::SelfAdjointEigenSolver<MatrixXc> solver(fullHamiltonian(m, s, B));
  return {solver.eigenvalues(), solver.eigenvectors()};
}

}  // namespace finestra
