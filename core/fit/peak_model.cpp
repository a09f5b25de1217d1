#include "core/fit/peak_model.h"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>

#include "core/common/errors.h"
#include "core/crystal/frames.h"
#include "core/hamiltonian/hamiltonian.h"
#include "core/project/model_setup.h"

namespace finestra {
namespace {

std::optional<LineRef> readPin(const MeasuredPeak& p, const std::vector<int>& classes, int levels, const std::string& where) {
  if (!p.assign) return std::nullopt;
  const PinnedAssignment& a = *p.assign;
  if (std::find(classes.begin(), classes.end(), a.cls) == classes.end())
    throw InputError(where + ".assign.class", "class " + std::to_string(a.cls) + " is not among the project's classes");
  if (a.upper >= levels) throw InputError(where + ".assign.upper", "level index must be below " + std::to_string(levels));
  if (a.lower >= levels) throw InputError(where + ".assign.lower", "level index must be below " + std::to_string(levels));
  return LineRef{a.cls, a.upper, a.lower};
}

}  // namespace

FitProblem prepareFitProblem(const Project& project, const std::optional<std::vector<std::string>>& freeNames, bool peaksRequired) {
  FitProblem problem;
  problem.baseSetup = makeModelSetup(project);
  const CentreModel probe(problem.baseSetup);  // validates the centre before any fit work
  problem.start = initialFitState(project);
  problem.free = fitParameterSpecs(freeNames ? *freeNames : project.fit.free, freeNames ? "free" : "fit.free");
  problem.classes = project.classes;
  if (problem.classes.empty()) throw InputError("classes", "no orientation class selected");
  problem.levelsPerManifold = 4 * problem.baseSetup.centre.parameters.nuclearDimension();
  const double referenceGHz = probe.zplGHz();
  const LabFrame& lab = problem.baseSetup.lab;
  for (std::size_t i = 0; i < project.measurements.size(); ++i) {
    const MeasurementSet& m = project.measurements[i];
    const std::string setKey = "measurements[" + std::to_string(i) + "]";
    PreparedSet set;
    set.nominalFieldLab = m.field.labVector(lab);
    if (!set.nominalFieldLab.allFinite()) throw InputError(setKey + ".field", "field is not finite");
    for (std::size_t j = 0; j < m.peaks.size(); ++j) {
      const MeasuredPeak& p = m.peaks[j];
      const std::string key = setKey + ".peaks[" + std::to_string(j) + "]";
      PreparedPeak prepared;
      prepared.set = static_cast<int>(i);
      prepared.peak = static_cast<int>(j);
      try {
        prepared.frequencyGHz = toAbsoluteGHz(p.position, p.unit, referenceGHz);
        prepared.sigmaGHz = p.sigma / std::abs(unitPerGHz(prepared.frequencyGHz, p.unit, referenceGHz));
      } catch (const InputError& e) {
        throw InputError(key + ".position", e.message());
      }
      if (!(prepared.sigmaGHz > 0) || !std::isfinite(prepared.sigmaGHz))
        throw InputError(key + ".sigma", "uncertainty must be positive and finite");
      if (p.analyserLab) prepared.analyserCrystal = lab.toCrystal(p.analyserLab->normalized());
      prepared.pinned = readPin(p, problem.classes, problem.levelsPerManifold, key);
      set.peaks.push_back(static_cast<int>(problem.peaks.size()));
      problem.peaks.push_back(prepared);
    }
    problem.sets.push_back(set);
  }
  if (problem.peaks.empty() && peaksRequired) throw InputError("measurements", "the project has no measured peaks to fit");
  return problem;
}

FitState stateFromVariables(const FitProblem& problem, const Eigen::VectorXd& x) {
  FitState s = problem.start;
  for (std::size_t k = 0; k < problem.free.size(); ++k) {
    const FitParameterSpec& spec = problem.free[k];
    setFitValue(s, spec, fitValue(problem.start, spec) + x[static_cast<Eigen::Index>(k)] * spec.scale);
  }
  return s;
}

Eigen::VectorXd variablesFromState(const FitProblem& problem, const FitState& state) {
  Eigen::VectorXd x(static_cast<Eigen::Index>(problem.free.size()));
  for (std::size_t k = 0; k < problem.free.size(); ++k) {
    const FitParameterSpec& spec = problem.free[k];
    x[static_cast<Eigen::Index>(k)] = (fitValue(state, spec) - fitValue(problem.start, spec)) / spec.scale;
  }
  return x;
}

Vec3 setFieldCrystal(const FitProblem& problem, const FitState& state, int set) {
  return problem.baseSetup.lab.toCrystal(trueFieldLab(state, problem.sets[static_cast<std::size_t>(set)].nominalFieldLab));
}

namespace {

// Ground and excited energies of class `cls` (what the residuals use): eigenvalues only, with
// CentreModel::levels's checks and messages where its path would report bad input.
std::pair<VectorXr, VectorXr> classEnergies(const CentreModel& model, int cls, const Vec3& fieldCrystal) {
  const Vec3 fieldDefect = defectFrame(cls) * fieldCrystal;
  if (fieldCrystal.norm() <= 1000.0) {
    VectorXr ground = levelEnergies(model.manifold(Manifold::Ground), model.strainFor(Manifold::Ground, cls), fieldDefect);
    VectorXr excited = levelEnergies(model.manifold(Manifold::Excited), model.strainFor(Manifold::Excited, cls), fieldDefect);
    if (ground.allFinite() && excited.allFinite()) return {std::move(ground), std::move(excited)};
  }
  return {model.levels(Manifold::Ground, cls, fieldCrystal).energies, model.levels(Manifold::Excited, cls, fieldCrystal).energies};
}

}  // namespace

std::vector<PredictedLine> predictSetLines(const FitProblem& problem, const CentreModel& model, const FitState& state, int set) {
  const Vec3 field = setFieldCrystal(problem, state, set);
  std::vector<PredictedLine> out;
  for (int cls : problem.classes) {
    const ManifoldEigen g = model.levels(Manifold::Ground, cls, field);
    const ManifoldEigen u = model.levels(Manifold::Excited, cls, field);
    for (const OpticalLine& line : model.lines(cls, g, u))
      out.push_back({LineRef{cls, line.upper, line.lower}, line.frequencyGHz, line.intensity, line.amplitudeCrystal});
  }
  return out;
}

PeakFitModel::PeakFitModel(std::shared_ptr<const FitProblem> problem, std::vector<std::optional<LineRef>> assignment)
    : problem_(std::move(problem)), assignment_(std::move(assignment)) {
  if (assignment_.size() != problem_->peaks.size()) throw InputError("fit", "assignment does not cover every peak");
  for (std::size_t i = 0; i < assignment_.size(); ++i)
    if (assignment_[i]) assigned_.push_back(static_cast<int>(i));
}

Eigen::VectorXd PeakFitModel::derivativeSteps(const Eigen::VectorXd& x) const {
  // Variables are already in units of each parameter's typical change.
  return Eigen::VectorXd::Constant(x.size(), 1e-4);
}

Eigen::VectorXd PeakFitModel::predictions(const Eigen::VectorXd& x) const {
  Eigen::VectorXd out(static_cast<Eigen::Index>(assigned_.size()));
  const FitState state = stateFromVariables(*problem_, x);
  std::optional<CentreModel> model;
  try {
    model.emplace(fitStateSetup(state, problem_->baseSetup));
  } catch (const InputError&) {
    // A trial step left the physical range (e.g. a negative λ): no prediction.
    out.setConstant(std::numeric_limits<double>::quiet_NaN());
    return out;
  }
  const double zpl = model->zplGHz();
  int currentSet = -1;
  Vec3 field = Vec3::Zero();
  std::array<std::optional<std::pair<VectorXr, VectorXr>>, kClassCount> levels;  // ground, excited energies
  for (std::size_t k = 0; k < assigned_.size(); ++k) {
    const PreparedPeak& peak = problem_->peaks[static_cast<std::size_t>(assigned_[k])];
    if (peak.set != currentSet) {
      currentSet = peak.set;
      field = setFieldCrystal(*problem_, state, currentSet);
      for (auto& l : levels) l.reset();
    }
    const LineRef& ref = *assignment_[static_cast<std::size_t>(assigned_[k])];
    auto& cached = levels[static_cast<std::size_t>(ref.cls)];
    if (!cached)
      cached.emplace(classEnergies(*model, ref.cls, field));
    out[static_cast<Eigen::Index>(k)] = zpl + cached->second[ref.upper] - cached->first[ref.lower];
  }
  return out;
}

void PeakFitModel::residuals(const Eigen::VectorXd& x, Eigen::VectorXd& out) const {
  const Eigen::VectorXd predicted = predictions(x);
  out.resize(predicted.size());
  for (Eigen::Index k = 0; k < predicted.size(); ++k) {
    const PreparedPeak& peak = problem_->peaks[static_cast<std::size_t>(assigned_[static_cast<std::size_t>(k)])];
    // Outside the physical range the residual is made large so the solver backs off.
    out[k] = std::isfinite(predicted[k]) ? (predicted[k] - peak.frequencyGHz) / peak.sigmaGHz : 1e8;
  }
}

}  // namespace finestra
