#pragma once
// Which predicted line each measured peak is: a linear assignment per measurement set. The cost of
// peak p on line l is z² + w·(penalty for a weak line + penalty for an analyser mismatch), with
// z = (ν_l − ν_p)/√(σ_p² + τ²); τ is a model-uncertainty allowance the fit lowers to zero as it
// converges. A peak whose best cost exceeds `outlierCost` stays unassigned (an outlier); lines
// may stay unobserved. Pinned peaks keep their line.
#include <optional>
#include <vector>

#include "core/fit/peak_model.h"

namespace finestra {

struct AssignmentOptions {
  double outlierCost = 25;        ///< a peak farther than 5σ from every line is an outlier
  /// A peak is ambiguous when its second-best line costs less than this more than its best
  /// (a cost is a squared pull plus penalties, so 1 means "within about 1σ of each other").
  double ambiguityMargin = 1.0;
  double intensityWeight = 0.5;   ///< weight of −ln(relative intensity)
  double weakFloor = 1e-4;        ///< relative intensities below this count as this
  double analyserFloor = 1e-3;    ///< analysed fractions below this count as this
};

struct PeakAssignments {
  std::vector<std::optional<LineRef>> lines;  ///< one per FitProblem peak
  double cost = 0;                            ///< summed cost incl. outliers
};

/// Cost of pairing `peak` with `line` at model allowance τ: z² (capped at 1e6) + weak-line and
/// analyser penalties; `maxIntensity` is the strongest line of the set.
double assignmentLineCost(const PredictedLine& line, double maxIntensity, const PreparedPeak& peak, double tauGHz,
                          const AssignmentOptions& options);

/// Assignment of every peak of the problem for a model state.
PeakAssignments assignPeaks(const FitProblem& problem, const FitState& state, double tauGHz,
                            const AssignmentOptions& options = {});

/// Median distance (GHz) from each peak to its nearest predicted line: a first guess of τ.
double medianNearestDistance(const FitProblem& problem, const FitState& state);

}  // namespace finestra
