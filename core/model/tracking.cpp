#include "core/model/tracking.h"

#include <algorithm>
#include <numeric>

namespace finestra {

std::vector<int> matchStates(const MatrixXc& previous, const MatrixXc& current) {
  const Eigen::Index n = current.cols();
  const Eigen::MatrixXd overlap = (previous.adjoint() * current).cwiseAbs2();
  struct Entry {
    double weight;
    int prev, cur;
  };
  std::vector<Entry> entries;
  entries.reserve(static_cast<std::size_t>(n * n));
  for (int p = 0; p < n; ++p)
    for (int c = 0; c < n; ++c) entries.push_back({overlap(p, c), p, c});
  std::sort(entries.begin(), entries.end(), [](const Entry& a, const Entry& b) { return a.weight > b.weight; });
  std::vector<int> from(static_cast<std::size_t>(n), -1);
  std::vector<bool> prevUsed(static_cast<std::size_t>(n), false);
  Eigen::Index assigned = 0;
  for (const Entry& e : entries) {
    if (assigned == n) break;
    if (prevUsed[e.prev] || from[e.cur] >= 0) continue;
    from[e.cur] = e.prev;
    prevUsed[e.prev] = true;
    ++assigned;
  }
  return from;
}

std::vector<int> zeroFieldBranches(Eigen::Index levelCount) {
  std::vector<int> branch(static_cast<std::size_t>(levelCount));
  for (Eigen::Index i = 0; i < levelCount; ++i) branch[i] = i < levelCount / 2 ? 0 : 1;
  return branch;
}

}  // namespace finestra
