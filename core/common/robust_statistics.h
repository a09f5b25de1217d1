#pragma once
// Order statistics shared by the peak finder and the strain map summary.
#include <algorithm>
#include <cmath>
#include <vector>

namespace finestra {

/// Median of a copy of `values` (mean of the two middle ones for an even count); 0 when empty.
inline double median(std::vector<double> values) {
  if (values.empty()) return 0;
  const std::size_t mid = values.size() / 2;
  std::nth_element(values.begin(), values.begin() + static_cast<long>(mid), values.end());
  const double upper = values[mid];
  if (values.size() % 2) return upper;
  return 0.5 * (upper + *std::max_element(values.begin(), values.begin() + static_cast<long>(mid)));
}

/// 1.4826 · median absolute deviation from the median: the standard deviation for a normal sample,
/// insensitive to a minority of outliers (Hampel, JASA 69, 383 (1974)).
inline double robustSpread(const std::vector<double>& values) {
  const double centre = median(values);
  std::vector<double> deviations;
  deviations.reserve(values.size());
  for (double v : values) deviations.push_back(std::abs(v - centre));
  return 1.4826 * median(deviations);
}

}  // namespace finestra
