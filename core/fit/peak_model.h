#pragma once
// The measured peaks of a project prepared for fitting, the lines the model predicts for each
// measurement set, and the FitModel whose residuals are (predicted − measured)/σ of the peaks
// under one fixed assignment.
#include <memory>
#include <optional>
#include <vector>

#include "core/fit/fit_model.h"
#include "core/fit/fit_parameters.h"

namespace finestra {

/// One optical line of one class at one field: level indices into the ascending eigenvalues.
struct LineRef {
  int cls = 0, upper = 0, lower = 0;
  friend bool operator==(const LineRef&, const LineRef&) = default;
};

struct PreparedPeak {
  int set = 0, peak = 0;      ///< indices into project.measurements and its peaks
  double frequencyGHz = 0;    ///< absolute
  double sigmaGHz = 0;
  std::optional<Vec3> analyserCrystal;
  std::optional<LineRef> pinned;
};

struct PreparedSet {
  Vec3 nominalFieldLab = Vec3::Zero();
  std::vector<int> peaks;  ///< indices into FitProblem::peaks
};

/// Everything a fit needs, validated once. Errors name the measurement/peak key at fault.
struct FitProblem {
  ModelSetup baseSetup;
  FitState start;
  std::vector<FitParameterSpec> free;
  std::vector<int> classes;
  std::vector<PreparedSet> sets;
  std::vector<PreparedPeak> peaks;
  int levelsPerManifold = 4;
};

/// `freeNames` replaces project.fit.free when given. `peaksRequired`: InputError when the project
/// has no measured peaks (a spectrum fit needs the sets' fields but not their peaks).
FitProblem prepareFitProblem(const Project& project, const std::optional<std::vector<std::string>>& freeNames = std::nullopt,
                             bool peaksRequired = true);

/// Internal fit variables: x_k = (value_k − start value_k)/scale_k.
FitState stateFromVariables(const FitProblem& problem, const Eigen::VectorXd& x);
Eigen::VectorXd variablesFromState(const FitProblem& problem, const FitState& state);

struct PredictedLine {
  LineRef ref;
  double frequencyGHz = 0;
  double intensity = 0;  ///< for the project's detection geometry
  CVec3 amplitudeCrystal = CVec3::Zero();
};

/// Every line of every selected class for measurement set `set` in `state`.
std::vector<PredictedLine> predictSetLines(const FitProblem& problem, const CentreModel& model, const FitState& state, int set);
/// Crystal-frame true field of a set in a state.
Vec3 setFieldCrystal(const FitProblem& problem, const FitState& state, int set);

/// Residuals of the assigned peaks, in the order of `assignment` (unassigned peaks skipped).
class PeakFitModel : public FitModel {
public:
  PeakFitModel(std::shared_ptr<const FitProblem> problem, std::vector<std::optional<LineRef>> assignment);

  int parameterCount() const override { return static_cast<int>(problem_->free.size()); }
  int residualCount() const override { return static_cast<int>(assigned_.size()); }
  void residuals(const Eigen::VectorXd& x, Eigen::VectorXd& out) const override;
  /// Analytic in the eigenproblem (core/fit/peak_jacobian.cpp): level derivatives from the
  /// Hellmann–Feynman theorem with the eigenvectors at x; central differences where the model
  /// cannot be evaluated at x or at a probe.
  void jacobian(const Eigen::VectorXd& x, Eigen::MatrixXd& out) const override;
  Eigen::VectorXd derivativeSteps(const Eigen::VectorXd& x) const override;
  std::unique_ptr<FitModel> clone() const override { return std::make_unique<PeakFitModel>(*this); }

  /// Predicted absolute frequency (GHz) of each assigned peak, same order as the residuals.
  Eigen::VectorXd predictions(const Eigen::VectorXd& x) const;
  const std::vector<int>& assignedPeaks() const { return assigned_; }

private:
  std::shared_ptr<const FitProblem> problem_;
  std::vector<std::optional<LineRef>> assignment_;
  std::vector<int> assigned_;  ///< peak indices with a line
};

}  // namespace finestra
