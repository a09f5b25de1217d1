#pragma once
// Electric-dipole transition amplitudes between excited and ground eigenstates (docs/physics.md,
// Optical transitions).
// Orbital operators in the defect frame: d_x = r·σ_z, d_y = −r·σ_x, d_z = 1 (r = d⊥/d∥), identity
// on spin and nucleus. The orbital factor is the slowest index of a basis vector, so σ_z negates
// the lower half of a vector and σ_x swaps its halves.
#include <array>

#include "core/common/types.h"

namespace finestra {

/// Amplitudes A_k(j, i) = ⟨g_j| d_k |u_i⟩ for k = x, y, z (defect frame). G and U hold the
/// eigenvectors in columns; works for fixed 4×4 and dynamic matrices alike.
template <typename Mat>
std::array<Mat, 3> dipoleAmplitudesDefect(const Mat& G, const Mat& U, double ratioPerpPar) {
  const Eigen::Index half = U.rows() / 2;
  Mat sigmaZU = U;
  sigmaZU.bottomRows(half) *= -1.0;
  Mat sigmaXU(U.rows(), U.cols());
  sigmaXU.topRows(half) = U.bottomRows(half);
  sigmaXU.bottomRows(half) = U.topRows(half);
  const Mat Gh = G.adjoint();
  return {Mat(ratioPerpPar * (Gh * sigmaZU)), Mat(-ratioPerpPar * (Gh * sigmaXU)), Mat(Gh * U)};
}

/// Crystal-frame amplitude of one line: a_c = Σ_k F(k, c) A_k (F rows = defect axes).
template <typename Mat>
CVec3 crystalAmplitude(const std::array<Mat, 3>& defectAmps, const Mat3& frame, Eigen::Index lower,
                       Eigen::Index upper) {
  const Eigen::Vector3cd a(defectAmps[0](lower, upper), defectAmps[1](lower, upper), defectAmps[2](lower, upper));
  return frame.transpose().cast<cplx>() * a;
}

/// |ê·a|² summed over a set of real analyser unit vectors (crystal frame).
double analysedIntensity(const CVec3& amplitudeCrystal, const std::array<Vec3, 2>& analysers, int count);

}  // namespace finestra
