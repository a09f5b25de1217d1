#pragma once
// Sweeps: levels and lines of each selected class along a path in field or strain space, with
// every level followed by eigenvector overlap so that it keeps its identity through crossings.
#include <vector>

#include "core/common/progress.h"
#include "core/project/project.h"

namespace finestra {

/// One class along a sweep. Level columns are tracked identities: column k is the level that was
/// k-th lowest at the first point. Lines use tracked identities in `upper`/`lower` and carry the
/// label (parent letter and sub-index) valid at their point.
struct ClassSweep {
  int cls = 0;
  Eigen::MatrixXd groundLevels;   ///< points × levels (GHz)
  Eigen::MatrixXd excitedLevels;  ///< points × levels (GHz)
  std::vector<std::vector<OpticalLine>> lines;  ///< per point
  /// Temperature sweeps only: homogeneous FWHM (GHz) of each line at each point, parallel to `lines`.
  std::vector<std::vector<double>> lineFwhmGHz;
};

struct SweepResult {
  std::vector<double> x;  ///< sweep parameter: T, degrees, or strain fraction
  std::vector<ClassSweep> classes;
};

/// Parameter values of a sweep (evenly spaced, `points` values from..to).
std::vector<double> sweepAxis(const SweepSpec& sweep);

/// Runs a sweep for the project's selected classes. Classes run in parallel; `control` may cancel
/// (throws Cancelled) and receives progress in [0, 1].
SweepResult runSweep(const CentreModel& model, const Project& project, const SweepSpec& sweep,
                     const ProgressControl& control = {});

}  // namespace finestra
