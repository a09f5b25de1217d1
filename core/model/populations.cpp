#include "core/model/populations.h"

#include <cmath>

#include "core/units/constants.h"

namespace finestra {

VectorXr levelPopulations(const VectorXr& e, double temperatureK, PopulationModel model) {
  const Eigen::Index n = e.size();
  if (n == 0) return e;
  if (model == PopulationModel::Equal) return VectorXr::Constant(n, 1.0 / static_cast<double>(n));
  const double emin = e.minCoeff();
  VectorXr w(n);
  for (Eigen::Index i = 0; i < n; ++i) {
    const double gap = e[i] - emin;
    if (temperatureK <= 0.0) w[i] = gap < 1e-9 ? 1.0 : 0.0;
    else w[i] = std::exp(-gap * constants::kKelvinPerGHz / temperatureK);
  }
  return w / w.sum();
}

}  // namespace finestra
