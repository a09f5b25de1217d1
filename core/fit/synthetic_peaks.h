#pragma once
// Synthetic measurements made by the model itself, for tests, benchmarks and demo projects:
// the strongest resolved lines of a "true" state at each magnet setting, with Gaussian noise.
#include <random>
#include <string>
#include <vector>

#include "core/fit/peak_model.h"

namespace finestra {

struct SyntheticSetSpec {
  std::string name;
  FieldSetting field;           ///< nominal magnet setting (the truth state applies scale and tilt)
  double sigmaGHz = 0.05;       ///< noise and quoted uncertainty
  int maxPeaks = 10;            ///< the strongest resolved lines are kept
  double minRelativeIntensity = 0.02;
  double resolutionGHz = 1.0;   ///< a kept line has no other visible line closer than this
};

struct SyntheticSet {
  MeasurementSet measurement;   ///< peaks in absolute GHz, sorted by frequency
  std::vector<LineRef> truth;   ///< the line behind each peak
};

/// Lines are computed for `truth` with the project's centre/lab/detection and classes.
std::vector<SyntheticSet> makeSyntheticSets(const Project& project, const FitState& truth,
                                            const std::vector<SyntheticSetSpec>& specs, std::mt19937_64& rng);

}  // namespace finestra
