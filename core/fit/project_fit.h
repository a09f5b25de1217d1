#pragma once
// Fitting a project to its measurements: alternate assignment and least squares until the
// assignment is stable, from several starts; report values, standard errors (formal, and scaled
// by √(χ²/dof) when χ²/dof > 1), correlations, χ²/dof, the residual of every peak and the parameters the data leave
// undetermined (docs/physics.md, What line positions tell about strain).
#include <optional>
#include <string>
#include <vector>

#include "core/common/progress.h"
#include "core/fit/least_squares.h"
#include "core/fit/peak_assignment.h"

namespace finestra {

struct FitOptions {
  std::optional<int> starts;  ///< default: project.fit.starts
  std::optional<std::vector<std::string>> free;  ///< default: project.fit.free
  unsigned seed = 1;          ///< random starts are reproducible for a given seed
  int maxRounds = 60;         ///< assignment/fit alternations per start
  int roundsPerTau = 3;       ///< alternations at one model allowance τ before it is lowered
  double annealFactor = 0.5;  ///< τ is multiplied by this when lowered
  int threads = 0;            ///< 0: all cores
  AssignmentOptions assignment;
  LeastSquaresOptions solver;
  /// Polled between assignment/fit rounds: a set cancel flag makes fitProject throw Cancelled.
  /// `report` receives the fraction of starts finished (from the computing threads).
  ProgressControl progress;
};

struct FittedParameter {
  std::string name, unit;
  double value = 0;
  double standardError = 0;  ///< the reported one (see errorsScaled); NaN when fixed or undetermined
  double formalError = 0;    ///< from the peaks' σ alone
  double scaledError = 0;    ///< formal · √(χ²/dof)
  double startValue = 0;
  bool free = false;
  bool determined = true;
};

struct FittedPeak {
  int measurement = 0, peak = 0;
  std::optional<LineRef> line;  ///< none: outlier (left unassigned)
  bool pinned = false;
  std::string label;            ///< e.g. "C2", "" when unassigned
  double measuredGHz = 0, sigmaGHz = 0;
  double predictedGHz = 0, residualGHz = 0;  ///< NaN when unassigned
  // Trust in the assignment (core/fit/assignment_trust.h).
  std::string secondLabel;      ///< second-best line, "" when none
  double costMargin = 0;        ///< cost of the second-best minus the best line; NaN without one
  bool ambiguous = false;
  std::string nearestLabel;     ///< nearest predicted line (where an outlier really sits)
  double nearestResidualGHz = 0;///< predicted(nearest) − measured, finite also for outliers
};

struct FitResult {
  bool converged = false;
  std::string status;         ///< human-readable convergence status
  double chi2 = 0;
  int dof = 0;
  double chi2PerDof = 0;      ///< NaN when dof ≤ 0
  std::vector<FittedParameter> parameters;  ///< free ones first, then fixed fit-specific ones
  Eigen::MatrixXd correlation;              ///< between the free parameters (NaN: undetermined)
  std::vector<FittedPeak> peaks;
  std::vector<std::string> undetermined;     ///< names of free parameters the data cannot fix
  std::vector<std::string> undeterminedCombinations;  ///< e.g. "0.71 strain_xx - 0.71 strain_yy"
  int startsRun = 0, bestStart = 0, rounds = 0;
  int assignedCount = 0, outlierCount = 0, ambiguousCount = 0;
  bool errorsScaled = false;  ///< standard errors scaled by √(χ²/dof) (only when χ²/dof > 1)
  std::string errorNote;      ///< one sentence saying which errors are reported and why
  std::string unitCheck;      ///< plausibility of the peaks' unit when nearly all are outliers; "" otherwise
  double conditionNumber = 0;
  FitState state;             ///< the fitted state
};

/// Throws InputError (naming the key) for bad input, Cancelled when options.progress asks to stop;
/// never for a fit that fails to converge, which is reported in the result.
FitResult fitProject(const Project& project, const FitOptions& options = {});

/// A direction in parameter space as text, e.g. "0.71 strain_xx - 0.71 strain_yy" (|c| ≥ 0.1).
std::string describeDirection(const Eigen::VectorXd& direction, const std::vector<FitParameterSpec>& free);

/// Writes the fitted centre parameters, strain and E-strain into a copy of the project (ZPL offset
/// folded into zpl_THz). The magnet calibration has no place in the project and is not written.
Project applyFitToProject(const Project& project, const FitResult& result);

}  // namespace finestra
