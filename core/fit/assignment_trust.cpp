#include "core/fit/assignment_trust.h"

#include <algorithm>
#include <cmath>
#include <limits>
#include <cstdio>
#include <map>
#include <tuple>

#include "core/common/errors.h"

namespace finestra {
namespace {

std::map<std::tuple<int, int, int>, std::string> lineLabels(const CentreModel& model, const FitProblem& problem, const FitState& state,
                                                            int set) {
  std::map<std::tuple<int, int, int>, std::string> labels;
  for (int cls : problem.classes) {
    const ClassSolution solution = model.solve(cls, setFieldCrystal(problem, state, set));
    for (const auto& line : solution.lines) labels[{cls, line.upper, line.lower}] = line.label();
  }
  return labels;
}

double nearestDistanceGHz(const std::vector<PredictedLine>& lines, double frequencyGHz) {
  double best = std::numeric_limits<double>::infinity();
  for (const auto& l : lines) best = std::min(best, std::abs(l.frequencyGHz - frequencyGHz));
  return best;
}

}  // namespace

std::vector<PeakAlternatives> rankPeakAlternatives(const FitProblem& problem, const FitState& state,
                                                   const std::vector<std::optional<LineRef>>& assignment, const AssignmentOptions& o) {
  std::vector<PeakAlternatives> out(problem.peaks.size());
  const CentreModel model(fitStateSetup(state, problem.baseSetup));
  for (int s = 0; s < static_cast<int>(problem.sets.size()); ++s) {
    const PreparedSet& set = problem.sets[static_cast<std::size_t>(s)];
    if (set.peaks.empty()) continue;
    const std::vector<PredictedLine> lines = predictSetLines(problem, model, state, s);
    if (lines.empty()) continue;
    const auto labels = lineLabels(model, problem, state, s);
    auto labelOf = [&](const LineRef& r) {
      const auto it = labels.find({r.cls, r.upper, r.lower});
      // The class is named too: the same letter occurs once per orientation class.
      return (it == labels.end() ? std::string("?") : it->second) + " (class " + std::to_string(r.cls) + ")";
    };
    double maxIntensity = 0;
    for (const auto& l : lines) maxIntensity = std::max(maxIntensity, l.intensity);
    for (int p : set.peaks) {
      const PreparedPeak& peak = problem.peaks[static_cast<std::size_t>(p)];
      PeakAlternatives& a = out[static_cast<std::size_t>(p)];
      std::vector<double> cost(lines.size());
      std::size_t best = 0, nearest = 0;
      for (std::size_t l = 0; l < lines.size(); ++l) {
        cost[l] = assignmentLineCost(lines[l], maxIntensity, peak, 0.0, o);
        if (cost[l] < cost[best]) best = l;
        if (std::abs(lines[l].frequencyGHz - peak.frequencyGHz) < std::abs(lines[nearest].frequencyGHz - peak.frequencyGHz)) nearest = l;
      }
      const auto& assigned = assignment[static_cast<std::size_t>(p)];
      if (assigned)
        for (std::size_t l = 0; l < lines.size(); ++l)
          if (lines[l].ref == *assigned) best = l;
      a.nearestLabel = labelOf(lines[nearest].ref);
      a.nearestResidualGHz = lines[nearest].frequencyGHz - peak.frequencyGHz;
      std::optional<std::size_t> second;
      for (std::size_t l = 0; l < lines.size(); ++l) {
        if (l == best || std::abs(lines[l].frequencyGHz - lines[best].frequencyGHz) < 1e-6) continue;
        if (!second || cost[l] < cost[*second]) second = l;
      }
      if (!second) {
        a.costMargin = std::numeric_limits<double>::quiet_NaN();
        continue;
      }
      a.second = lines[*second].ref;
      a.secondLabel = labelOf(lines[*second].ref);
      a.costMargin = cost[*second] - cost[best];
      a.ambiguous = a.costMargin < o.ambiguityMargin;
    }
  }
  return out;
}

std::string checkPeakUnits(const Project& project, const FitProblem& problem, const FitState& state, int outlierCount) {
  const int total = static_cast<int>(problem.peaks.size());
  if (total < 3 || outlierCount < 0.8 * total) return "";
  const CentreModel model(fitStateSetup(state, problem.baseSetup));
  std::vector<std::vector<PredictedLine>> lines(problem.sets.size());
  for (int s = 0; s < static_cast<int>(problem.sets.size()); ++s) lines[static_cast<std::size_t>(s)] = predictSetLines(problem, model, state, s);
  // Median distance (GHz) of the peaks from their nearest line when read in `unit`.
  auto medianDistance = [&](std::optional<SpectralUnit> unit) {
    std::vector<double> d;
    for (const PreparedPeak& peak : problem.peaks) {
      double f = peak.frequencyGHz;
      if (unit) {
        const MeasuredPeak& raw = project.measurements[static_cast<std::size_t>(peak.set)].peaks[static_cast<std::size_t>(peak.peak)];
        if (raw.unit == *unit) return std::numeric_limits<double>::infinity();
        try {
          f = toAbsoluteGHz(raw.position, *unit, model.zplGHz());
        } catch (const InputError&) {
          return std::numeric_limits<double>::infinity();
        }
      }
      d.push_back(nearestDistanceGHz(lines[static_cast<std::size_t>(peak.set)], f));
    }
    std::nth_element(d.begin(), d.begin() + static_cast<long>(d.size() / 2), d.end());
    return d[d.size() / 2];
  };
  const double asGiven = medianDistance(std::nullopt);
  std::optional<SpectralUnit> bestUnit;
  double bestDistance = std::numeric_limits<double>::infinity();
  for (SpectralUnit u : allSpectralUnits()) {
    const double d = medianDistance(u);
    if (d < bestDistance) {
      bestDistance = d;
      bestUnit = u;
    }
  }
  const std::string given(spectralUnitKey(project.measurements[static_cast<std::size_t>(problem.peaks.front().set)]
                                              .peaks[static_cast<std::size_t>(problem.peaks.front().peak)]
                                              .unit));
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, "%.3g", asGiven);
  std::string text = std::to_string(outlierCount) + " of " + std::to_string(total) +
                     " peaks are outliers (median distance to the nearest line " + buffer + " GHz): ";
  // A reading counts as fitting when it brings the peaks 100 times closer and within 100 GHz.
  if (bestUnit && bestDistance < 100.0 && bestDistance < 0.01 * asGiven) {
    std::snprintf(buffer, sizeof buffer, "%.3g", bestDistance);
    return text + "the positions look like " + std::string(spectralUnitKey(*bestUnit)) + " labelled " + given +
           " (read as " + std::string(spectralUnitKey(*bestUnit)) + " they lie a median " + buffer + " GHz from the lines)";
  }
  return text + "no other unit would bring them near the predicted lines; check the centre, the field and the peaks";
}

}  // namespace finestra
