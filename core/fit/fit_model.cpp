#include "core/fit/fit_model.h"

namespace finestra {

Eigen::VectorXd FitModel::derivativeSteps(const Eigen::VectorXd& x) const {
  return (1e-5 * x.cwiseAbs().cwiseMax(1.0)).eval();
}

void FitModel::jacobian(const Eigen::VectorXd& x, Eigen::MatrixXd& out) const {
  out = centralDifferenceJacobian(*this, x, derivativeSteps(x));
}

Eigen::MatrixXd centralDifferenceJacobian(const FitModel& model, const Eigen::VectorXd& x, const Eigen::VectorXd& steps) {
  Eigen::MatrixXd jac(model.residualCount(), model.parameterCount());
  Eigen::VectorXd plus(model.residualCount()), minus(model.residualCount());
  Eigen::VectorXd probe = x;
  for (int j = 0; j < model.parameterCount(); ++j) {
    const double h = steps[j];
    probe[j] = x[j] + h;
    model.residuals(probe, plus);
    probe[j] = x[j] - h;
    model.residuals(probe, minus);
    probe[j] = x[j];
    jac.col(j) = (plus - minus) / (2.0 * h);
  }
  return jac;
}

}  // namespace finestra
