#include "core/fit/project_fit.h"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <cstdio>
#include <limits>
#include <memory>
#include <random>

#include "core/common/errors.h"
#include "core/common/parallel.h"
#include "core/fit/assignment_trust.h"

namespace finestra {
namespace {

struct StartOutcome {
  FitState state;
  Eigen::VectorXd x;
  std::vector<std::optional<LineRef>> assignment;
  LeastSquaresResult solver;
  double cost = std::numeric_limits<double>::infinity();
  bool stable = false;
  int rounds = 0;
};

// Start 0 is the project as given; the others scatter the free parameters over a plausible range
// and flip strain signs, because line positions fix E-strain only up to such symmetries.
FitState startState(const FitProblem& problem, int index, unsigned seed) {
  FitState s = problem.start;
  if (index == 0) {
    // Lines depend on E-strain through its magnitude, so at zero strain (and the azimuth at zero
    // tilt) the first derivative vanishes by symmetry: start just off those points.
    for (const FitParameterSpec& spec : problem.free) {
      if (fitValue(s, spec) != 0) continue;
      if (spec.kind == FitParamKind::EgMagnitude) setFitValue(s, spec, 5.0);
      if (spec.kind == FitParamKind::TiltAngle) setFitValue(s, spec, 0.5);
      if (spec.kind == FitParamKind::StrainComponent) setFitValue(s, spec, 2.0 * spec.scale);
    }
    return s;
  }
  std::mt19937_64 rng(static_cast<std::uint64_t>(seed) * 1000003ULL + static_cast<std::uint64_t>(index));
  std::uniform_real_distribution<double> unit(-1.0, 1.0), fraction(0.0, 1.0);
  for (const FitParameterSpec& spec : problem.free) {
    const double base = fitValue(problem.start, spec);
    double v = base;
    switch (spec.kind) {
      case FitParamKind::StrainComponent: v = (fraction(rng) < 0.5 ? -base : base) + 10.0 * spec.scale * unit(rng); break;
      case FitParamKind::FieldScale: v = base * (1.0 + 0.01 * unit(rng)); break;
      case FitParamKind::TiltAngle: v = 3.0 * fraction(rng); break;
      case FitParamKind::TiltAzimuth: v = 360.0 * fraction(rng); break;
      case FitParamKind::ZplOffset: v = base + 3.0 * unit(rng); break;
      case FitParamKind::EgMagnitude: v = base > 0 ? base * (1.0 + 0.1 * unit(rng)) : 30.0 * fraction(rng); break;
      case FitParamKind::EgAngle: v = 360.0 * fraction(rng); break;
      case FitParamKind::Centre: v = base + (base != 0 ? 0.03 * std::abs(base) : spec.scale) * unit(rng); break;
    }
    setFitValue(s, spec, v);
  }
  return s;
}

StartOutcome runStart(const std::shared_ptr<const FitProblem>& problem, FitState state, const FitOptions& o) {
  double minSigma = std::numeric_limits<double>::infinity();
  for (const auto& p : problem->peaks) minSigma = std::min(minSigma, p.sigmaGHz);
  // τ starts at the typical distance between peaks and predicted lines and shrinks fourfold per
  // round: early rounds pair peaks with lines by overall pattern, late rounds by σ.
  double tau = 2.0 * medianNearestDistance(*problem, state);
  if (tau < 0.5 * minSigma) tau = 0;
  StartOutcome out;
  out.x = variablesFromState(*problem, state);
  std::optional<std::vector<std::optional<LineRef>>> previous;
  int roundsAtTau = 0;
  for (int round = 0; round < o.maxRounds; ++round) {
    o.progress.throwIfCancelled();
    const PeakAssignments assigned = assignPeaks(*problem, state, tau, o.assignment);
    const bool same = previous && *previous == assigned.lines;
    if (same && tau == 0) {
      out.stable = true;
      out.cost = assigned.cost;
      break;
    }
    // At each τ the assignment is iterated until it settles (or a few rounds pass), then τ halves.
    if (same || roundsAtTau >= o.roundsPerTau) {
      tau = tau * o.annealFactor < 0.5 * minSigma ? 0.0 : tau * o.annealFactor;
      roundsAtTau = 0;
      if (same) continue;
    }
    const PeakFitModel model(problem, assigned.lines);
    out.solver = minimiseLeastSquares(model, out.x, o.solver);
    out.x = out.solver.x;
    state = stateFromVariables(*problem, out.x);
    previous = assigned.lines;
    out.rounds = round + 1;
    ++roundsAtTau;
  }
  if (!out.stable) out.cost = assignPeaks(*problem, state, 0, o.assignment).cost;
  out.state = state;
  out.assignment = previous ? *previous : std::vector<std::optional<LineRef>>(problem->peaks.size());
  return out;
}

std::string formatCoefficient(double c) {
  char buffer[32];
  std::snprintf(buffer, sizeof buffer, "%.2f", c);
  return buffer;
}

}  // namespace

std::string describeDirection(const Eigen::VectorXd& direction, const std::vector<FitParameterSpec>& free) {
  std::string text;
  for (Eigen::Index k = 0; k < direction.size(); ++k) {
    const double c = direction[k];
    if (std::abs(c) < 0.1) continue;
    if (!text.empty()) text += c < 0 ? " - " : " + ";
    else if (c < 0) text += "-";
    text += formatCoefficient(std::abs(c)) + " " + free[static_cast<std::size_t>(k)].name;
  }
  return text;
}

namespace {

std::string lineLabel(const CentreModel& model, const FitProblem& problem, const FitState& state, int set, const LineRef& ref) {
  const ClassSolution solution = model.solve(ref.cls, setFieldCrystal(problem, state, set));
  for (const auto& line : solution.lines)
    if (line.upper == ref.upper && line.lower == ref.lower) return line.label();
  return "";
}

const std::vector<std::string>& fitSpecificNames() {
  static const std::vector<std::string> names{"strain_xx", "strain_yy", "strain_zz", "strain_yz", "strain_zx", "strain_xy",
                                              "field_scale", "magnet_tilt_deg", "magnet_tilt_azimuth_deg", "zpl_offset_GHz",
                                              "eg_strain_g_GHz", "eg_strain_u_GHz", "eg_angle_g_deg", "eg_angle_u_deg"};
  return names;
}

}  // namespace

FitResult fitProject(const Project& project, const FitOptions& o) {
  const auto problem = std::make_shared<const FitProblem>(prepareFitProblem(project, o.free));
  const int starts = o.starts.value_or(project.fit.starts);
  if (starts < 1) throw InputError("starts", "at least one start is needed");

  std::vector<StartOutcome> outcomes(static_cast<std::size_t>(starts));
  std::atomic<int> finished{0};
  parallelChunks(starts, [&](long begin, long end) {
    for (long k = begin; k < end; ++k) {
      outcomes[static_cast<std::size_t>(k)] = runStart(problem, startState(*problem, static_cast<int>(k), o.seed), o);
      o.progress.progress(static_cast<double>(++finished) / starts);
    }
  }, o.threads);
  o.progress.throwIfCancelled();
  std::size_t best = 0;
  for (std::size_t k = 1; k < outcomes.size(); ++k)
    if (outcomes[k].cost < outcomes[best].cost - 1e-9) best = k;
  const StartOutcome& winner = outcomes[best];

  FitResult result;
  result.startsRun = starts;
  result.bestStart = static_cast<int>(best);
  result.rounds = winner.rounds;
  const PeakFitModel model(problem, winner.assignment);
  Eigen::VectorXd residuals(model.residualCount());
  model.residuals(winner.x, residuals);
  Eigen::MatrixXd jacobian;
  model.jacobian(winner.x, jacobian);
  result.chi2 = residuals.squaredNorm();
  const UncertaintyAnalysis analysis = analyseUncertainty(jacobian, result.chi2);
  result.dof = analysis.dof;
  result.chi2PerDof = analysis.chi2PerDof;
  result.conditionNumber = analysis.conditionNumber;

  FitState state = winner.state;
  const std::vector<double> sign = canonicaliseFitState(state, problem->free);
  result.state = state;
  const std::size_t n = problem->free.size();
  for (std::size_t k = 0; k < n; ++k) {
    const FitParameterSpec& spec = problem->free[k];
    const auto kk = static_cast<Eigen::Index>(k);
    FittedParameter p{spec.name, spec.unit, fitValue(state, spec), analysis.standardErrors[kk] * spec.scale,
                      analysis.formalErrors[kk] * spec.scale, analysis.scaledErrors[kk] * spec.scale,
                      fitValue(problem->start, spec), true, true};
    if (!std::isfinite(p.standardError)) p.determined = false;
    if (!p.determined) result.undetermined.push_back(spec.name);
    result.parameters.push_back(p);
  }
  result.correlation = analysis.correlation;
  for (std::size_t a = 0; a < n; ++a)
    for (std::size_t b = 0; b < n; ++b) result.correlation(static_cast<Eigen::Index>(a), static_cast<Eigen::Index>(b)) *= sign[a] * sign[b];
  for (const auto& direction : analysis.nullDirections) result.undeterminedCombinations.push_back(describeDirection(direction, problem->free));
  for (const std::string& name : fitSpecificNames()) {
    const bool isFree = std::any_of(problem->free.begin(), problem->free.end(), [&](const auto& s) { return s.name == name; });
    if (isFree) continue;
    const FitParameterSpec spec = *findFitParameter(name);
    const double nan = std::numeric_limits<double>::quiet_NaN();
    result.parameters.push_back({name, spec.unit, fitValue(state, spec), nan, nan, nan, fitValue(problem->start, spec), false, true});
  }

  const CentreModel fitted(fitStateSetup(winner.state, problem->baseSetup));
  const Eigen::VectorXd predicted = model.predictions(winner.x);
  std::vector<double> predictedOf(problem->peaks.size(), std::numeric_limits<double>::quiet_NaN());
  for (std::size_t k = 0; k < model.assignedPeaks().size(); ++k)
    predictedOf[static_cast<std::size_t>(model.assignedPeaks()[k])] = predicted[static_cast<Eigen::Index>(k)];
  const std::vector<PeakAlternatives> alternatives = rankPeakAlternatives(*problem, winner.state, winner.assignment, o.assignment);
  for (std::size_t i = 0; i < problem->peaks.size(); ++i) {
    const PreparedPeak& peak = problem->peaks[i];
    FittedPeak fp;
    fp.secondLabel = alternatives[i].secondLabel;
    fp.costMargin = alternatives[i].costMargin;
    fp.ambiguous = alternatives[i].ambiguous;
    fp.nearestLabel = alternatives[i].nearestLabel;
    fp.nearestResidualGHz = alternatives[i].nearestResidualGHz;
    if (fp.ambiguous) ++result.ambiguousCount;
    fp.measurement = peak.set;
    fp.peak = peak.peak;
    fp.line = winner.assignment[i];
    fp.pinned = peak.pinned.has_value();
    fp.measuredGHz = peak.frequencyGHz;
    fp.sigmaGHz = peak.sigmaGHz;
    fp.predictedGHz = predictedOf[i];
    fp.residualGHz = fp.predictedGHz - fp.measuredGHz;  // NaN for an outlier
    if (fp.line) {
      fp.label = lineLabel(fitted, *problem, winner.state, peak.set, *fp.line);
      ++result.assignedCount;
    } else {
      ++result.outlierCount;
    }
    result.peaks.push_back(fp);
  }

  const bool solverOk = winner.solver.status == LeastSquaresStatus::Converged || n == 0;
  result.converged = winner.stable && solverOk;
  if (result.converged) {
    result.status = "converged: assignment stable after " + std::to_string(winner.rounds) + " rounds; " + winner.solver.detail;
  } else if (!winner.stable) {
    result.status = "not converged: the assignment still changed after " + std::to_string(o.maxRounds) + " rounds";
  } else {
    result.status = "not converged: " + leastSquaresStatusText(winner.solver.status) + " (" + winner.solver.detail + ")";
  }
  if (result.dof <= 0) result.status += "; no degrees of freedom left, uncertainties not scaled";
  result.errorsScaled = analysis.errorsScaled;
  char note[200];
  if (result.dof <= 0) std::snprintf(note, sizeof note, "no degrees of freedom left: formal errors from the peaks' sigma only");
  else if (result.errorsScaled)
    std::snprintf(note, sizeof note, "chi2/dof = %.3g > 1: standard errors scaled by sqrt(chi2/dof) = %.3g", result.chi2PerDof,
                  std::sqrt(result.chi2PerDof));
  else
    std::snprintf(note, sizeof note, "chi2/dof = %.3g <= 1: formal standard errors from the peaks' sigma, not scaled down", result.chi2PerDof);
  result.errorNote = note;
  result.unitCheck = checkPeakUnits(project, *problem, winner.state, result.outlierCount);
  return result;
}

Project applyFitToProject(const Project& project, const FitResult& result) {
  Project out = project;
  for (const FittedParameter& p : result.parameters) {
    if (!p.free) continue;
    const auto spec = findFitParameter(p.name);
    if (!spec) continue;
    if (spec->kind == FitParamKind::Centre) out.centre.overrides[p.name] = p.value;
  }
  out.strain = result.state.strain;
  out.magnet = {result.state.fieldScale, result.state.tiltDeg, result.state.tiltAzimuthDeg};
  if (result.state.zplOffsetGHz != 0) {
    const double zpl = result.state.centre.parameters.get(Param::ZplTHz) + result.state.zplOffsetGHz * 1e-3;
    out.centre.overrides["zpl_THz"] = zpl;
  }
  return out;
}

}  // namespace finestra
