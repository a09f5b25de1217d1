#pragma once
// Robust noise and baseline of a sampled spectrum, insensitive to the peaks riding on it.
#include <vector>

#include "core/common/robust_statistics.h"

namespace finestra {

/// Point-to-point noise σ from the median absolute deviation of second differences
/// Δ²y_i = y_{i+1} − 2y_i + y_{i−1}: for white noise Δ²y has standard deviation σ√6, and
/// 1.4826 · MAD is the standard deviation of a normal sample (Hampel, JASA 69, 383 (1974)), so
/// σ = 1.4826 · MAD(Δ²y)/√6. Second differences cancel baselines and slopes and shrink smooth
/// features (peaks a few samples wide or more), hence the robustness. Needs ≥ 3 samples.
double estimateNoise(const std::vector<double>& signal);

struct LinearBaseline {
  double offset = 0, slope = 0, origin = 0;  ///< b(x) = offset + slope · (x − origin)
  double at(double x) const { return offset + slope * (x - origin); }
};

/// Straight baseline fitted to the samples that are not on a peak: start from the lower half of
/// the signal, then repeatedly refit to the samples within 2.5 σ above the line (σ: `noise`).
LinearBaseline estimateBaseline(const std::vector<double>& position, const std::vector<double>& signal, double noise);

}  // namespace finestra
