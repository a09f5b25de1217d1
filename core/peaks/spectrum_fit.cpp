#include "core/peaks/spectrum_fit.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <memory>

#include "core/common/errors.h"
#include "core/common/robust_statistics.h"
#include "core/peaks/noise_baseline.h"

namespace finestra {
namespace {

constexpr int kPerSpectrum = 3;  // ln scale, baseline, ln FWHM

// Sum over classes of the weighted lines' Lorentzians (unit scale, no baseline) at every sample.
std::vector<double> lineSum(const FitProblem& problem, const CentreModel& model, const FitState& state, const SpectrumData& d,
                            double fwhmGHz) {
  std::vector<ClassSolution> solutions;
  const Vec3 field = setFieldCrystal(problem, state, d.set);
  for (int cls : problem.classes) solutions.push_back(model.solve(cls, field));
  const std::vector<WeightedLine> lines = weightLines(model, solutions, d.kind);
  std::vector<double> out(d.frequencyGHz.size(), 0.0);
  for (std::size_t i = 0; i < out.size(); ++i)
    for (const WeightedLine& w : lines) out[i] += w.weight * lorentzian(d.frequencyGHz[i] - w.line->frequencyGHz, fwhmGHz);
  return out;
}

class SpectrumFitModel : public FitModel {
public:
  SpectrumFitModel(std::shared_ptr<const FitProblem> problem, std::shared_ptr<const std::vector<SpectrumData>> spectra)
      : problem_(std::move(problem)), spectra_(std::move(spectra)) {
    for (const auto& s : *spectra_) samples_ += static_cast<int>(s.signal.size());
  }
  int modelParameters() const { return static_cast<int>(problem_->free.size()); }
  int parameterCount() const override { return modelParameters() + kPerSpectrum * static_cast<int>(spectra_->size()); }
  int residualCount() const override { return samples_; }
  void residuals(const Eigen::VectorXd& x, Eigen::VectorXd& out) const override {
    out.resize(samples_);
    const FitState state = stateFromVariables(*problem_, x.head(modelParameters()));
    const CentreModel model(fitStateSetup(state, problem_->baseSetup));
    Eigen::Index row = 0;
    for (std::size_t s = 0; s < spectra_->size(); ++s) {
      const SpectrumData& d = (*spectra_)[s];
      const Eigen::Index o = modelParameters() + kPerSpectrum * static_cast<Eigen::Index>(s);
      const std::vector<double> sum = lineSum(*problem_, model, state, d, std::exp(x[o + 2]));
      const double scale = std::exp(x[o]), baseline = x[o + 1];
      for (std::size_t i = 0; i < sum.size(); ++i) out[row++] = (baseline + scale * sum[i] - d.signal[i]) / d.noise;
    }
  }
  Eigen::VectorXd derivativeSteps(const Eigen::VectorXd& x) const override {
    Eigen::VectorXd h = Eigen::VectorXd::Constant(x.size(), 1e-5);
    for (std::size_t s = 0; s < spectra_->size(); ++s) {
      const Eigen::Index o = modelParameters() + kPerSpectrum * static_cast<Eigen::Index>(s);
      h[o + 1] = 1e-5 * std::max(1.0, std::abs(x[o + 1]));
    }
    return h;
  }
  std::unique_ptr<FitModel> clone() const override { return std::make_unique<SpectrumFitModel>(*this); }

private:
  std::shared_ptr<const FitProblem> problem_;
  std::shared_ptr<const std::vector<SpectrumData>> spectra_;
  int samples_ = 0;
};

std::vector<SpectrumData> validated(const Project& project, std::vector<SpectrumData> spectra) {
  if (spectra.empty()) throw InputError("spectra", "no spectrum to fit");
  std::size_t total = 0;
  for (std::size_t s = 0; s < spectra.size(); ++s) {
    SpectrumData& d = spectra[s];
    const std::string where = d.name.empty() ? "spectra[" + std::to_string(s) + "]" : d.name;
    if (d.set < 0 || d.set >= static_cast<int>(project.measurements.size()))
      throw InputError(where, "measurement set " + std::to_string(d.set) + " does not exist (the project has " +
                                  std::to_string(project.measurements.size()) + ")");
    if (d.frequencyGHz.size() != d.signal.size() || d.signal.size() < 8) throw InputError(where, "needs at least 8 samples (position, signal)");
    for (std::size_t i = 0; i < d.signal.size(); ++i)
      if (!std::isfinite(d.signal[i]) || !std::isfinite(d.frequencyGHz[i])) throw InputError(where, "sample " + std::to_string(i) + " is not finite");
    total += d.signal.size();
    if (total > SpectrumFitOptions::kMaxSamplesTotal)
      throw InputError(where, "at most " + std::to_string(SpectrumFitOptions::kMaxSamplesTotal) + " samples in all spectra together");
    if (d.noise <= 0) {
      d.noise = estimateNoise(d.signal);
      if (!(d.noise > 0)) throw InputError(where, "the spectrum shows no noise; give its noise σ");
    }
  }
  return spectra;
}

}  // namespace

SpectrumFitResult fitSpectra(const Project& project, const std::vector<SpectrumData>& input, const SpectrumFitOptions& o) {
  auto problem = std::make_shared<FitProblem>(prepareFitProblem(project, o.free, false));
  if (o.start) problem->start = *o.start;
  const auto spectra = std::make_shared<const std::vector<SpectrumData>>(validated(project, input));
  const SpectrumFitModel model(problem, spectra);
  const int m = model.modelParameters();

  // Start: model at its start values, common width = the model's linewidth, scale and baseline
  // from the data (baseline = median of the signal, scale matching the tallest feature).
  Eigen::VectorXd x = Eigen::VectorXd::Zero(model.parameterCount());
  const CentreModel startModel(fitStateSetup(problem->start, problem->baseSetup));
  for (std::size_t s = 0; s < spectra->size(); ++s) {
    const SpectrumData& d = (*spectra)[s];
    const Eigen::Index o0 = m + kPerSpectrum * static_cast<Eigen::Index>(s);
    const double width = startModel.linewidthGHz();
    const std::vector<double> sum = lineSum(*problem, startModel, problem->start, d, width);
    const double baseline = median(d.signal);
    const double top = *std::max_element(d.signal.begin(), d.signal.end()) - baseline;
    const double modelTop = *std::max_element(sum.begin(), sum.end());
    x[o0] = std::log(modelTop > 0 && top > 0 ? top / modelTop : 1.0);
    x[o0 + 1] = baseline;
    x[o0 + 2] = std::log(width);
  }
  const LeastSquaresResult solved = minimiseLeastSquares(model, x, o.solver);
  Eigen::MatrixXd jac;
  model.jacobian(solved.x, jac);
  const UncertaintyAnalysis u = analyseUncertainty(jac, solved.chi2);

  SpectrumFitResult r;
  r.converged = solved.status == LeastSquaresStatus::Converged;
  r.status = (r.converged ? "converged: " : "not converged: ") + solved.detail;
  r.chi2 = solved.chi2;
  r.dof = u.dof;
  r.chi2PerDof = u.chi2PerDof;
  r.errorsScaled = u.errorsScaled;
  char note[160];
  std::snprintf(note, sizeof note,
                r.errorsScaled ? "chi2/dof = %.3g > 1: standard errors scaled by sqrt(chi2/dof)"
                               : "chi2/dof = %.3g <= 1: formal standard errors, not scaled",
                r.chi2PerDof);
  r.errorNote = note;
  r.correlation = u.correlation;
  for (const SpectrumData& d : *spectra) r.noise.push_back(d.noise);
  r.state = stateFromVariables(*problem, solved.x.head(m));
  std::vector<FitParameterSpec> specs = problem->free;
  for (int k = 0; k < m; ++k) {
    const FitParameterSpec& spec = problem->free[static_cast<std::size_t>(k)];
    FittedParameter p{spec.name, spec.unit, fitValue(r.state, spec), u.standardErrors[k] * spec.scale, u.formalErrors[k] * spec.scale,
                      u.scaledErrors[k] * spec.scale, fitValue(problem->start, spec), true, std::isfinite(u.standardErrors[k])};
    r.parameters.push_back(p);
  }
  // Per-spectrum parameters reported in their natural form (scale and width from their logarithms).
  for (std::size_t s = 0; s < spectra->size(); ++s) {
    const Eigen::Index o0 = m + kPerSpectrum * static_cast<Eigen::Index>(s);
    const std::string i = "[" + std::to_string(s) + "]";
    const double scale = std::exp(solved.x[o0]), width = std::exp(solved.x[o0 + 2]);
    r.parameters.push_back({"scale" + i, "", scale, scale * u.standardErrors[o0], scale * u.formalErrors[o0], scale * u.scaledErrors[o0],
                            std::exp(x[o0]), true, std::isfinite(u.standardErrors[o0])});
    r.parameters.push_back({"baseline" + i, "", solved.x[o0 + 1], u.standardErrors[o0 + 1], u.formalErrors[o0 + 1],
                            u.scaledErrors[o0 + 1], x[o0 + 1], true, std::isfinite(u.standardErrors[o0 + 1])});
    r.parameters.push_back({"fwhm_GHz" + i, "GHz", width, width * u.standardErrors[o0 + 2], width * u.formalErrors[o0 + 2],
                            width * u.scaledErrors[o0 + 2], std::exp(x[o0 + 2]), true, std::isfinite(u.standardErrors[o0 + 2])});
    // Names only: these specs serve describeDirection.
    for (const char* name : {"scale", "baseline", "fwhm_GHz"}) specs.push_back({name + i, FitParamKind::Centre, 0, "", 1.0});
  }
  for (const auto& p : r.parameters)
    if (!p.determined) r.undetermined.push_back(p.name);
  for (const auto& direction : u.nullDirections) r.undeterminedCombinations.push_back(describeDirection(direction, specs));
  return r;
}

std::vector<double> spectrumFitCurve(const Project& project, const SpectrumData& d, const SpectrumFitResult& r, int index) {
  const FitProblem problem = prepareFitProblem(project, std::vector<std::string>{}, false);
  const CentreModel model(fitStateSetup(r.state, problem.baseSetup));
  std::size_t first = 0;
  while (first < r.parameters.size() && r.parameters[first].name != "scale[" + std::to_string(index) + "]") ++first;
  if (first + 2 >= r.parameters.size()) throw InputError("spectrum", "no fitted spectrum " + std::to_string(index));
  const double scale = r.parameters[first].value, baseline = r.parameters[first + 1].value, width = r.parameters[first + 2].value;
  std::vector<double> curve = lineSum(problem, model, r.state, d, width);
  for (double& v : curve) v = baseline + scale * v;
  return curve;
}

}  // namespace finestra
