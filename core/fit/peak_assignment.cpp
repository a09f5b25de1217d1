#include "core/fit/peak_assignment.h"

#include <algorithm>
#include <cmath>
#include <limits>

#include "core/fit/assignment.h"

namespace finestra {
namespace {

double analysedFraction(const PredictedLine& line, const Vec3& analyser) {
  const double total = line.amplitudeCrystal.squaredNorm();
  if (total <= 0) return 0;
  const cplx projected = analyser.cast<cplx>().dot(line.amplitudeCrystal);
  return std::norm(projected) / total;
}

double linePenalty(const PredictedLine& line, double maxIntensity, const PreparedPeak& peak, const AssignmentOptions& o) {
  const double relative = maxIntensity > 0 ? line.intensity / maxIntensity : 1.0;
  double penalty = -std::log(std::max(relative, o.weakFloor));
  if (peak.analyserCrystal) penalty += -std::log(std::max(analysedFraction(line, *peak.analyserCrystal), o.analyserFloor));
  return o.intensityWeight * penalty;
}

}  // namespace

double assignmentLineCost(const PredictedLine& line, double maxIntensity, const PreparedPeak& peak, double tauGHz,
                          const AssignmentOptions& o) {
  const double z = (line.frequencyGHz - peak.frequencyGHz) / std::hypot(peak.sigmaGHz, tauGHz);
  // Capped so that the matrix stays finite; anything above the outlier cost is never chosen.
  return std::min(z * z, 1e6) + linePenalty(line, maxIntensity, peak, o);
}

PeakAssignments assignPeaks(const FitProblem& problem, const FitState& state, double tauGHz, const AssignmentOptions& o) {
  PeakAssignments out;
  out.lines.assign(problem.peaks.size(), std::nullopt);
  const CentreModel model(fitStateSetup(state, problem.baseSetup));
  for (int s = 0; s < static_cast<int>(problem.sets.size()); ++s) {
    const PreparedSet& set = problem.sets[static_cast<std::size_t>(s)];
    if (set.peaks.empty()) continue;
    const std::vector<PredictedLine> lines = predictSetLines(problem, model, state, s);
    double maxIntensity = 0;
    for (const auto& l : lines) maxIntensity = std::max(maxIntensity, l.intensity);
    std::vector<char> lineTaken(lines.size(), 0);
    std::vector<int> freePeaks;
    for (int p : set.peaks) {
      const PreparedPeak& peak = problem.peaks[static_cast<std::size_t>(p)];
      if (!peak.pinned) {
        freePeaks.push_back(p);
        continue;
      }
      out.lines[static_cast<std::size_t>(p)] = peak.pinned;
      for (std::size_t l = 0; l < lines.size(); ++l) {
        if (!(lines[l].ref == *peak.pinned)) continue;
        lineTaken[l] = 1;
        const double z = (lines[l].frequencyGHz - peak.frequencyGHz) / std::hypot(peak.sigmaGHz, tauGHz);
        out.cost += z * z;
      }
    }
    std::vector<int> openLines;
    for (std::size_t l = 0; l < lines.size(); ++l)
      if (!lineTaken[l]) openLines.push_back(static_cast<int>(l));
    Eigen::MatrixXd cost(static_cast<Eigen::Index>(freePeaks.size()), static_cast<Eigen::Index>(openLines.size()));
    for (std::size_t r = 0; r < freePeaks.size(); ++r) {
      const PreparedPeak& peak = problem.peaks[static_cast<std::size_t>(freePeaks[r])];
      for (std::size_t c = 0; c < openLines.size(); ++c)
        cost(static_cast<Eigen::Index>(r), static_cast<Eigen::Index>(c)) =
            assignmentLineCost(lines[static_cast<std::size_t>(openLines[c])], maxIntensity, peak, tauGHz, o);
    }
    const auto chosen = solveAssignmentWithOutliers(cost, o.outlierCost);
    out.cost += assignmentCost(cost, chosen, o.outlierCost);
    for (std::size_t r = 0; r < freePeaks.size(); ++r)
      if (chosen[r]) out.lines[static_cast<std::size_t>(freePeaks[r])] = lines[static_cast<std::size_t>(openLines[static_cast<std::size_t>(*chosen[r])])].ref;
  }
  return out;
}

double medianNearestDistance(const FitProblem& problem, const FitState& state) {
  const CentreModel model(fitStateSetup(state, problem.baseSetup));
  std::vector<double> distances;
  for (int s = 0; s < static_cast<int>(problem.sets.size()); ++s) {
    const PreparedSet& set = problem.sets[static_cast<std::size_t>(s)];
    if (set.peaks.empty()) continue;
    const std::vector<PredictedLine> lines = predictSetLines(problem, model, state, s);
    for (int p : set.peaks) {
      double best = std::numeric_limits<double>::infinity();
      for (const auto& l : lines) best = std::min(best, std::abs(l.frequencyGHz - problem.peaks[static_cast<std::size_t>(p)].frequencyGHz));
      distances.push_back(best);
    }
  }
  if (distances.empty()) return 0;
  std::nth_element(distances.begin(), distances.begin() + static_cast<long>(distances.size() / 2), distances.end());
  return distances[distances.size() / 2];
}

}  // namespace finestra
