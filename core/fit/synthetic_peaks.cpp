#include "core/fit/synthetic_peaks.h"
#include "core/project/model_setup.h"

#include <algorithm>
#include <cmath>

namespace finestra {

std::vector<SyntheticSet> makeSyntheticSets(const Project& project, const FitState& truth,
                                            const std::vector<SyntheticSetSpec>& specs, std::mt19937_64& rng) {
  Project shell = project;
  shell.measurements.clear();
  for (const auto& spec : specs) shell.measurements.push_back({spec.name, 4.0, spec.field, {}});
  // A problem with no peaks cannot be prepared; build the parts needed directly.
  FitProblem problem;
  problem.baseSetup = makeModelSetup(shell);
  problem.classes = shell.classes;
  for (const auto& spec : specs) problem.sets.push_back({spec.field.labVector(problem.baseSetup.lab), {}});
  const CentreModel model(fitStateSetup(truth, problem.baseSetup));

  std::vector<SyntheticSet> out;
  for (std::size_t s = 0; s < specs.size(); ++s) {
    const SyntheticSetSpec& spec = specs[s];
    const std::vector<PredictedLine> lines = predictSetLines(problem, model, truth, static_cast<int>(s));
    double maxIntensity = 0;
    for (const auto& l : lines) maxIntensity = std::max(maxIntensity, l.intensity);
    std::vector<const PredictedLine*> visible;
    for (const auto& l : lines)
      if (l.intensity >= spec.minRelativeIntensity * maxIntensity) visible.push_back(&l);
    std::vector<const PredictedLine*> resolved;
    for (const PredictedLine* l : visible) {
      bool alone = true;
      for (const PredictedLine* other : visible)
        if (other != l && std::abs(other->frequencyGHz - l->frequencyGHz) < spec.resolutionGHz) alone = false;
      if (alone) resolved.push_back(l);
    }
    std::sort(resolved.begin(), resolved.end(), [](const auto* a, const auto* b) { return a->intensity > b->intensity; });
    if (static_cast<int>(resolved.size()) > spec.maxPeaks) resolved.resize(static_cast<std::size_t>(spec.maxPeaks));
    std::sort(resolved.begin(), resolved.end(), [](const auto* a, const auto* b) { return a->frequencyGHz < b->frequencyGHz; });
    std::normal_distribution<double> noise(0.0, spec.sigmaGHz);
    SyntheticSet set;
    set.measurement = {spec.name, 4.0, spec.field, {}};
    for (const PredictedLine* l : resolved) {
      MeasuredPeak peak;
      peak.position = l->frequencyGHz + noise(rng);
      peak.unit = SpectralUnit::GHzAbsolute;
      peak.sigma = spec.sigmaGHz;
      set.measurement.peaks.push_back(peak);
      set.truth.push_back(l->ref);
    }
    out.push_back(std::move(set));
  }
  return out;
}

}  // namespace finestra
