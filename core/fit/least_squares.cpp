#include "core/fit/least_squares.h"

#include <cmath>
#include <limits>
#include <unsupported/Eigen/LevenbergMarquardt>

namespace finestra {
namespace {

// Adapter from FitModel to the functor interface of Eigen::LevenbergMarquardt.
struct LmFunctor : Eigen::DenseFunctor<double> {
  explicit LmFunctor(const FitModel& m) : Eigen::DenseFunctor<double>(m.parameterCount(), m.residualCount()), model(m) {}
  int operator()(const Eigen::VectorXd& x, Eigen::VectorXd& fvec) const {
    model.residuals(x, fvec);
    return fvec.allFinite() ? 0 : -1;
  }
  int df(const Eigen::VectorXd& x, Eigen::MatrixXd& fjac) const {
    model.jacobian(x, fjac);
    return 0;
  }
  const FitModel& model;
};

std::string lmDetail(Eigen::LevenbergMarquardtSpace::Status s) {
  using namespace Eigen::LevenbergMarquardtSpace;
  switch (s) {
    case RelativeReductionTooSmall: return "relative reduction of chi2 below tolerance";
    case RelativeErrorTooSmall: return "relative step below tolerance";
    case RelativeErrorAndReductionTooSmall: return "relative step and chi2 reduction below tolerance";
    case CosinusTooSmall: return "residuals orthogonal to the Jacobian (gradient zero)";
    case TooManyFunctionEvaluation: return "evaluation limit reached";
    case FtolTooSmall: return "no further reduction of chi2 possible";
    case XtolTooSmall: return "no further improvement of the parameters possible";
    case GtolTooSmall: return "gradient orthogonality at machine precision";
    case ImproperInputParameters: return "improper input";
    case UserAsked: return "a residual was not finite";
    default: return "stopped";
  }
}

}  // namespace

std::string leastSquaresStatusText(LeastSquaresStatus status) {
  switch (status) {
    case LeastSquaresStatus::Converged: return "converged";
    case LeastSquaresStatus::EvaluationLimit: return "evaluation limit reached";
    case LeastSquaresStatus::TooFewData: return "fewer assigned peaks than free parameters";
    case LeastSquaresStatus::Failed: return "failed";
  }
  return "failed";
}

LeastSquaresResult minimiseLeastSquares(const FitModel& model, const Eigen::VectorXd& start, const LeastSquaresOptions& options) {
  LeastSquaresResult out;
  out.x = start;
  Eigen::VectorXd r(model.residualCount());
  if (model.residualCount() < model.parameterCount()) {
    model.residuals(start, r);
    out.chi2 = r.squaredNorm();
    out.status = LeastSquaresStatus::TooFewData;
    out.detail = leastSquaresStatusText(out.status);
    return out;
  }
  if (model.parameterCount() == 0) {
    model.residuals(start, r);
    out.chi2 = r.squaredNorm();
    out.status = LeastSquaresStatus::Converged;
    out.detail = "nothing to vary";
    return out;
  }
  LmFunctor functor(model);
  Eigen::LevenbergMarquardt<LmFunctor> lm(functor);
  lm.setMaxfev(options.maxEvaluations);
  lm.setXtol(options.tolerance);
  lm.setFtol(options.tolerance);
  lm.setGtol(0.0);
  lm.setFactor(options.stepBound);
  Eigen::VectorXd x = start;
  const auto status = lm.minimize(x);
  model.residuals(x, r);
  if (!r.allFinite()) {
    x = start;
    model.residuals(x, r);
  }
  out.x = x;
  out.chi2 = r.squaredNorm();
  out.iterations = static_cast<int>(lm.iterations());
  out.detail = lmDetail(status);
  using namespace Eigen::LevenbergMarquardtSpace;
  switch (status) {
    case RelativeReductionTooSmall: case RelativeErrorTooSmall: case RelativeErrorAndReductionTooSmall:
    case CosinusTooSmall: case FtolTooSmall: case XtolTooSmall: case GtolTooSmall:
      out.status = LeastSquaresStatus::Converged;
      break;
    case TooManyFunctionEvaluation: out.status = LeastSquaresStatus::EvaluationLimit; break;
    default: out.status = LeastSquaresStatus::Failed; break;
  }
  return out;
}

UncertaintyAnalysis analyseUncertainty(const Eigen::MatrixXd& jac, double chi2, double relativeThreshold) {
  const Eigen::Index n = jac.cols();
  UncertaintyAnalysis out;
  out.dof = static_cast<int>(jac.rows() - n);
  out.chi2PerDof = out.dof > 0 ? chi2 / out.dof : std::numeric_limits<double>::quiet_NaN();
  const double nan = std::numeric_limits<double>::quiet_NaN();
  out.standardErrors = Eigen::VectorXd::Constant(n, nan);
  out.formalErrors = out.standardErrors;
  out.scaledErrors = out.standardErrors;
  out.correlation = Eigen::MatrixXd::Constant(n, n, nan);
  if (n == 0) return out;
  // A Jacobian that overflowed (weights of absurdly small uncertainties) determines nothing; the
  // SVD below must never see a non-finite matrix.
  if (!jac.allFinite() || !std::isfinite(chi2)) {
    for (Eigen::Index k = 0; k < n; ++k) out.undetermined.push_back(static_cast<int>(k));
    out.conditionNumber = std::numeric_limits<double>::infinity();
    return out;
  }

  // Normalise columns so that the threshold compares directions, not units.
  Eigen::VectorXd norms = jac.colwise().norm().transpose();
  const double largest = norms.maxCoeff();
  std::vector<char> undetermined(static_cast<std::size_t>(n), 0);
  Eigen::VectorXd inverseNorm(n);
  for (Eigen::Index k = 0; k < n; ++k) {
    const bool zero = !(norms[k] > 1e-9 * std::max(largest, 1e-300)) || norms[k] < 1e-12;
    if (zero) {
      undetermined[static_cast<std::size_t>(k)] = 1;
      Eigen::VectorXd direction = Eigen::VectorXd::Zero(n);
      direction[k] = 1;
      out.nullDirections.push_back(direction);
    }
    inverseNorm[k] = zero ? 0.0 : 1.0 / norms[k];
  }
  const Eigen::MatrixXd normalised = jac * inverseNorm.asDiagonal();
  Eigen::JacobiSVD<Eigen::MatrixXd> svd(normalised, Eigen::ComputeThinV);
  const Eigen::VectorXd& s = svd.singularValues();
  const Eigen::MatrixXd& v = svd.matrixV();
  const double sMax = s.size() ? s[0] : 0.0;
  Eigen::MatrixXd covarianceNormalised = Eigen::MatrixXd::Zero(n, n);
  double sMinKept = sMax;
  for (Eigen::Index i = 0; i < s.size(); ++i) {
    const Eigen::VectorXd direction = v.col(i);
    // Directions of zero columns are already listed; they have singular value 0 here too.
    bool onlyZeroColumns = true;
    for (Eigen::Index k = 0; k < n; ++k)
      if (std::abs(direction[k]) > 1e-9 && !undetermined[static_cast<std::size_t>(k)]) onlyZeroColumns = false;
    if (s[i] > relativeThreshold * sMax && sMax > 0) {
      covarianceNormalised += direction * direction.transpose() / (s[i] * s[i]);
      sMinKept = std::min(sMinKept, s[i]);
      continue;
    }
    if (onlyZeroColumns) continue;
    out.nullDirections.push_back(direction);
    for (Eigen::Index k = 0; k < n; ++k)
      if (std::abs(direction[k]) > 0.1) undetermined[static_cast<std::size_t>(k)] = 1;
  }
  out.conditionNumber = sMinKept > 0 ? sMax / sMinKept : std::numeric_limits<double>::infinity();
  const double scale = out.dof > 0 ? out.chi2PerDof : 1.0;
  out.errorsScaled = scale > 1.0;
  const Eigen::MatrixXd covariance = inverseNorm.asDiagonal() * covarianceNormalised * inverseNorm.asDiagonal();
  for (Eigen::Index k = 0; k < n; ++k) {
    if (undetermined[static_cast<std::size_t>(k)]) {
      out.undetermined.push_back(static_cast<int>(k));
      continue;
    }
    out.formalErrors[k] = std::sqrt(covariance(k, k));
    out.scaledErrors[k] = out.formalErrors[k] * std::sqrt(scale);
    out.standardErrors[k] = out.errorsScaled ? out.scaledErrors[k] : out.formalErrors[k];
  }
  for (Eigen::Index a = 0; a < n; ++a)
    for (Eigen::Index b = 0; b < n; ++b)
      if (!undetermined[static_cast<std::size_t>(a)] && !undetermined[static_cast<std::size_t>(b)])
        out.correlation(a, b) = covariance(a, b) / std::sqrt(covariance(a, a) * covariance(b, b));
  return out;
}

}  // namespace finestra
