// The Hungarian (Jonker–Volgenant form) assignment solver against brute force on random small
// cost matrices, with and without the option of leaving rows unmatched.
#include <gtest/gtest.h>

#include <algorithm>
#include <functional>
#include <numeric>
#include <random>

#include "core/common/errors.h"
#include "core/fit/assignment.h"

namespace finestra {
namespace {

double bruteForce(const Eigen::MatrixXd& cost, double unmatched, bool allowUnmatched) {
  const int n = static_cast<int>(cost.rows()), m = static_cast<int>(cost.cols());
  double best = std::numeric_limits<double>::infinity();
  std::vector<char> used(static_cast<std::size_t>(m), 0);
  std::function<void(int, double)> recurse = [&](int row, double sum) {
    if (row == n) {
      best = std::min(best, sum);
      return;
    }
    if (allowUnmatched) recurse(row + 1, sum + unmatched);
    for (int c = 0; c < m; ++c) {
      if (used[static_cast<std::size_t>(c)]) continue;
      used[static_cast<std::size_t>(c)] = 1;
      recurse(row + 1, sum + cost(row, c));
      used[static_cast<std::size_t>(c)] = 0;
    }
  };
  recurse(0, 0.0);
  return best;
}

TEST(FitAssignment, MatchesBruteForceOnRandomMatrices) {
  std::mt19937_64 rng(42);
  std::uniform_real_distribution<double> u(0.0, 10.0);
  std::uniform_int_distribution<int> size(1, 6);
  for (int trial = 0; trial < 400; ++trial) {
    const int n = size(rng);
    const int m = n + size(rng) - 1;
    Eigen::MatrixXd cost(n, m);
    for (int i = 0; i < n; ++i)
      for (int j = 0; j < m; ++j) cost(i, j) = trial % 3 == 0 ? std::round(u(rng)) : u(rng);  // ties too
    const std::vector<int> columns = solveAssignment(cost);
    std::vector<int> sorted = columns;
    std::sort(sorted.begin(), sorted.end());
    EXPECT_TRUE(std::adjacent_find(sorted.begin(), sorted.end()) == sorted.end()) << "column used twice";
    double total = 0;
    for (int i = 0; i < n; ++i) total += cost(i, columns[static_cast<std::size_t>(i)]);
    EXPECT_NEAR(total, bruteForce(cost, 0, false), 1e-9) << "trial " << trial;
  }
}

TEST(FitAssignment, OutlierOptionMatchesBruteForceForAnyShape) {
  std::mt19937_64 rng(7);
  std::uniform_real_distribution<double> u(0.0, 10.0);
  std::uniform_int_distribution<int> size(1, 6);
  for (int trial = 0; trial < 300; ++trial) {
    const int n = size(rng), m = size(rng);
    Eigen::MatrixXd cost(n, m);
    for (int i = 0; i < n; ++i)
      for (int j = 0; j < m; ++j) cost(i, j) = u(rng);
    const double unmatched = 4.0;
    const auto chosen = solveAssignmentWithOutliers(cost, unmatched);
    EXPECT_NEAR(assignmentCost(cost, chosen, unmatched), bruteForce(cost, unmatched, true), 1e-9) << "trial " << trial;
  }
}

TEST(FitAssignment, RejectsBadInput) {
  Eigen::MatrixXd tall(3, 2);
  tall.setZero();
  EXPECT_THROW(solveAssignment(tall), InputError);
  Eigen::MatrixXd nan = Eigen::MatrixXd::Constant(2, 2, std::nan(""));
  EXPECT_THROW(solveAssignment(nan), InputError);
}

}  // namespace
}  // namespace finestra
