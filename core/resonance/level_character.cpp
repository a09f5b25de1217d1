#include "core/resonance/level_character.h"

#include <vector>

namespace finestra {

double electronSpinProjection(const Eigen::Ref<const Eigen::VectorXcd>& state, int nuclearDim) {
  // Index = (2·orbital + spin)·N + k with spin 0 = ↑ (S_z = +½), 1 = ↓.
  double sz = 0;
  for (Eigen::Index i = 0; i < state.size(); ++i) {
    const bool up = (i / nuclearDim) % 2 == 0;
    sz += (up ? 0.5 : -0.5) * std::norm(state[i]);
  }
  return sz / state.squaredNorm();
}

NuclearCharacter nuclearCharacter(const Eigen::Ref<const Eigen::VectorXcd>& state, int nuclearDim) {
  if (nuclearDim <= 1) return {};
  std::vector<double> weight(static_cast<std::size_t>(nuclearDim), 0.0);
  for (Eigen::Index i = 0; i < state.size(); ++i) weight[static_cast<std::size_t>(i % nuclearDim)] += std::norm(state[i]);
  const double total = state.squaredNorm();
  std::size_t best = 0;
  for (std::size_t k = 1; k < weight.size(); ++k)
    if (weight[k] > weight[best]) best = k;
  const double spin = 0.5 * (nuclearDim - 1);
  return {spin - static_cast<double>(best), weight[best] / total};
}

}  // namespace finestra
