#pragma once
// The interface between a least-squares solver and whatever is being fitted: residuals of a
// parameter vector, their Jacobian (central differences unless a model knows better) and a deep
// copy for use on another thread.
#include <memory>

#include <Eigen/Dense>

namespace finestra {

class FitModel {
public:
  virtual ~FitModel() = default;

  virtual int parameterCount() const = 0;
  virtual int residualCount() const = 0;
  /// Residuals in units of their uncertainty, (model − data)/σ; `out` has residualCount() rows.
  virtual void residuals(const Eigen::VectorXd& x, Eigen::VectorXd& out) const = 0;
  /// ∂residual_i/∂x_j. Default: central differences with steps from derivativeSteps().
  virtual void jacobian(const Eigen::VectorXd& x, Eigen::MatrixXd& out) const;
  /// Step of the numerical derivative for each parameter (default 1e-5 · max(1, |x_j|)).
  virtual Eigen::VectorXd derivativeSteps(const Eigen::VectorXd& x) const;
  virtual std::unique_ptr<FitModel> clone() const = 0;
};

/// Central-difference Jacobian of any model (used by the default and by tests of analytic ones).
Eigen::MatrixXd centralDifferenceJacobian(const FitModel& model, const Eigen::VectorXd& x, const Eigen::VectorXd& steps);

}  // namespace finestra
