#pragma once
// How far to trust an assignment: for every peak the best and the second-best line with the cost
// margin between them (a near-tie is flagged ambiguous), the nearest line of an outlier with its
// real residual, and a plausibility check of the peaks' unit when nearly every peak is an outlier.
#include <optional>
#include <string>
#include <vector>

#include "core/fit/peak_assignment.h"

namespace finestra {

struct PeakAlternatives {
  std::optional<LineRef> second;        ///< the best line other than the assigned (or nearest) one
  std::string secondLabel;              ///< "" when there is none
  double costMargin = 0;                ///< cost(second) − cost(best); NaN without a second line
  bool ambiguous = false;               ///< costMargin < AssignmentOptions::ambiguityMargin
  std::string nearestLabel;             ///< nearest line (for outliers: where the peak really sits)
  double nearestResidualGHz = 0;        ///< predicted(nearest line) − measured
};

/// One entry per FitProblem peak. `assignment` is the final assignment (none: outlier); the best
/// line of an assigned peak is its assigned line, of an outlier its cheapest line. Lines exactly
/// degenerate with the best (same frequency to 1 kHz, e.g. equivalent classes at zero field) are
/// not counted as alternatives: no measurement of position can separate them.
std::vector<PeakAlternatives> rankPeakAlternatives(const FitProblem& problem, const FitState& state,
                                                   const std::vector<std::optional<LineRef>>& assignment,
                                                   const AssignmentOptions& options = {});

/// When at least 80 % of at least three peaks are outliers, reinterprets the peaks' numbers in
/// every other spectral unit and returns a sentence naming the unit that would put them near the
/// predicted lines (e.g. "the positions look like THz labelled GHz"), or saying none would.
/// Empty when the check does not apply.
std::string checkPeakUnits(const Project& project, const FitProblem& problem, const FitState& state, int outlierCount);

}  // namespace finestra
