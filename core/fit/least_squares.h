#pragma once
// Nonlinear least squares with Eigen's Levenberg–Marquardt (MINPACK lmder port, unsupported
// module), and the uncertainty analysis of the solution: covariance from the Jacobian (formal
// errors), the same scaled by the reduced χ², correlations, and the directions the data cannot
// determine.
#include <string>
#include <vector>

#include "core/fit/fit_model.h"

namespace finestra {

enum class LeastSquaresStatus {
  Converged,       ///< a tolerance on the step, the χ² reduction or the gradient was met
  EvaluationLimit, ///< stopped after the allowed number of evaluations
  TooFewData,      ///< fewer residuals than parameters
  Failed,          ///< the solver rejected the problem
};

std::string leastSquaresStatusText(LeastSquaresStatus status);

struct LeastSquaresOptions {
  int maxEvaluations = 400;
  double tolerance = 1e-10;  ///< relative tolerance on the step and on the χ² reduction
  /// Initial bound of the scaled step (MINPACK "factor"); small values keep the first steps,
  /// taken while the assignment may still be wrong, from leaping to a distant minimum.
  double stepBound = 1.0;
};

struct LeastSquaresResult {
  Eigen::VectorXd x;
  double chi2 = 0;  ///< Σ residual² at x
  int iterations = 0;
  LeastSquaresStatus status = LeastSquaresStatus::Failed;
  std::string detail;  ///< the solver's own reason for stopping
};

LeastSquaresResult minimiseLeastSquares(const FitModel& model, const Eigen::VectorXd& start,
                                        const LeastSquaresOptions& options = {});

struct UncertaintyAnalysis {
  int dof = 0;                    ///< residuals − parameters
  double chi2PerDof = 0;          ///< NaN when dof ≤ 0
  Eigen::VectorXd formalErrors;   ///< √C_kk from the stated σ alone; NaN when undetermined
  Eigen::VectorXd scaledErrors;   ///< formal · √(χ²/dof) (= formal when dof ≤ 0)
  /// The reported errors: scaled when χ²/dof > 1 (the σ understate the scatter), formal otherwise
  /// — a small χ²/dof from few data is no evidence the σ are too large (common practice in least
  /// squares). NaN for parameters in an undetermined direction.
  Eigen::VectorXd standardErrors;
  bool errorsScaled = false;      ///< standardErrors are the scaled ones
  Eigen::MatrixXd correlation;    ///< NaN rows/columns for those parameters
  std::vector<int> undetermined;  ///< indices of parameters taking part in a null direction
  std::vector<Eigen::VectorXd> nullDirections;  ///< unit vectors in parameter space (column-normalised)
  double conditionNumber = 0;     ///< of the column-normalised Jacobian, identifiable part
};

/// `jacobian` of the residuals (in σ units) at the solution, `chi2` there. A direction counts as
/// undetermined when its singular value of the column-normalised Jacobian falls below
/// `relativeThreshold` · the largest one, or when a column is numerically zero. Formal errors are
/// √C_kk with C the pseudo-inverse of JᵀJ on the determined subspace; see standardErrors for
/// when they are scaled by √(χ²/dof).
UncertaintyAnalysis analyseUncertainty(const Eigen::MatrixXd& jacobian, double chi2, double relativeThreshold = 1e-6);

}  // namespace finestra
