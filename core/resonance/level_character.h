#pragma once
// Character of one eigenvector of a manifold: its electron-spin and nuclear-spin projections on
// the defect axis. Basis order orbital ⊗ spin ⊗ nuclear (nuclear fastest), as in
// core/hamiltonian/hamiltonian.h; nuclear index k carries m_I = I − k.
#include "core/common/types.h"

namespace finestra {

/// Expectation ⟨S_z⟩ (units of ħ, between −½ and +½) of `state` along the defect axis.
double electronSpinProjection(const Eigen::Ref<const Eigen::VectorXcd>& state, int nuclearDim);

/// The nuclear projection m_I carrying the largest weight in `state`, and that weight (its purity,
/// 1 for a pure m_I state). Without a nucleus (nuclearDim 1) the projection is 0 and purity 1.
struct NuclearCharacter {
  double projection = 0;
  double purity = 1;
};
NuclearCharacter nuclearCharacter(const Eigen::Ref<const Eigen::VectorXcd>& state, int nuclearDim);

}  // namespace finestra
