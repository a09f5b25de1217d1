#include "core/peaks/noise_baseline.h"

#include <algorithm>
#include <cmath>

namespace finestra {
namespace {

// Least-squares line through the selected samples; keeps `previous` when fewer than two.
LinearBaseline fitLine(const std::vector<double>& x, const std::vector<double>& y, const std::vector<char>& use,
                       const LinearBaseline& previous) {
  double n = 0, sx = 0, sy = 0;
  for (std::size_t i = 0; i < x.size(); ++i)
    if (use[i]) {
      n += 1;
      sx += x[i] - previous.origin;
      sy += y[i];
    }
  if (n < 2) return previous;
  const double mx = sx / n, my = sy / n;
  double sxx = 0, sxy = 0;
  for (std::size_t i = 0; i < x.size(); ++i)
    if (use[i]) {
      const double dx = x[i] - previous.origin - mx;
      sxx += dx * dx;
      sxy += dx * (y[i] - my);
    }
  LinearBaseline out = previous;
  out.slope = sxx > 0 ? sxy / sxx : 0.0;
  out.offset = my - out.slope * mx;
  return out;
}

}  // namespace

double estimateNoise(const std::vector<double>& signal) {
  if (signal.size() < 3) return 0;
  std::vector<double> differences(signal.size() - 2);
  for (std::size_t i = 1; i + 1 < signal.size(); ++i) differences[i - 1] = signal[i + 1] - 2.0 * signal[i] + signal[i - 1];
  return robustSpread(differences) / std::sqrt(6.0);
}

LinearBaseline estimateBaseline(const std::vector<double>& x, const std::vector<double>& y, double noise) {
  LinearBaseline line;
  if (x.empty()) return line;
  line.origin = 0.5 * (x.front() + x.back());
  const double middle = median(y);
  std::vector<char> use(x.size());
  for (std::size_t i = 0; i < x.size(); ++i) use[i] = y[i] <= middle;
  line.offset = middle;
  line = fitLine(x, y, use, line);
  for (int round = 0; round < 20; ++round) {
    bool changed = false;
    for (std::size_t i = 0; i < x.size(); ++i) {
      const char keep = y[i] - line.at(x[i]) <= 2.5 * noise;
      changed = changed || keep != use[i];
      use[i] = keep;
    }
    line = fitLine(x, y, use, line);
    if (!changed) break;
  }
  return line;
}

}  // namespace finestra
