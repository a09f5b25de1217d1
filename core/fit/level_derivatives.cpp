#include "core/fit/level_derivatives.h"

#include <algorithm>
#include <cmath>

#include <Eigen/Eigenvalues>

namespace finestra {

VectorXr levelDerivatives(const ManifoldEigen& eigen, const MatrixXc& dH, double relativeGap) {
  const VectorXr& energies = eigen.energies;
  const Eigen::Index n = energies.size();
  VectorXr out(n);
  if (n == 0) return out;
  const double scale = std::max(energies.cwiseAbs().maxCoeff(), 1.0);
  Eigen::Index start = 0;
  while (start < n) {
    Eigen::Index end = start + 1;  // cluster [start, end)
    while (end < n && energies[end] - energies[end - 1] <= relativeGap * scale) ++end;
    const Eigen::Index size = end - start;
    const MatrixXc basis = eigen.vectors.middleCols(start, size);
    if (size == 1) {
      out[start] = (basis.col(0).adjoint() * dH * basis.col(0)).value().real();
    } else {
      const MatrixXc block = basis.adjoint() * dH * basis;
      const VectorXr mu = Eigen::SelfAdjointEigenSolver<MatrixXc>(block, Eigen::EigenvaluesOnly).eigenvalues();
      for (Eigen::Index j = 0; j < size; ++j) out[start + j] = 0.5 * (mu[j] + mu[size - 1 - j]);
    }
    start = end;
  }
  return out;
}

}  // namespace finestra
