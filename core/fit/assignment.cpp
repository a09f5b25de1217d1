#include "core/fit/assignment.h"

#include <cmath>
#include <limits>
#include <string>

#include "core/common/errors.h"

namespace finestra {

std::vector<int> solveAssignment(const Eigen::MatrixXd& cost) {
  const int n = static_cast<int>(cost.rows());
  const int m = static_cast<int>(cost.cols());
  if (n > m) throw InputError("assignment", "more rows (" + std::to_string(n) + ") than columns (" + std::to_string(m) + ")");
  if (!cost.allFinite()) throw InputError("assignment", "cost matrix has a non-finite entry");
  if (n == 0) return {};
  const double inf = std::numeric_limits<double>::infinity();
  // 1-based arrays; column 0 is the virtual start of each augmenting path.
  std::vector<double> rowPotential(static_cast<std::size_t>(n) + 1, 0.0), colPotential(static_cast<std::size_t>(m) + 1, 0.0);
  std::vector<int> rowOfCol(static_cast<std::size_t>(m) + 1, 0), way(static_cast<std::size_t>(m) + 1, 0);
  for (int row = 1; row <= n; ++row) {
    rowOfCol[0] = row;
    int col0 = 0;
    std::vector<double> minSlack(static_cast<std::size_t>(m) + 1, inf);
    std::vector<char> used(static_cast<std::size_t>(m) + 1, 0);
    // Dijkstra-like growth of the alternating tree on reduced costs until a free column is reached.
    do {
      used[static_cast<std::size_t>(col0)] = 1;
      const int row0 = rowOfCol[static_cast<std::size_t>(col0)];
      double delta = inf;
      int col1 = 0;
      for (int j = 1; j <= m; ++j) {
        if (used[static_cast<std::size_t>(j)]) continue;
        const double reduced = cost(row0 - 1, j - 1) - rowPotential[static_cast<std::size_t>(row0)] - colPotential[static_cast<std::size_t>(j)];
        if (reduced < minSlack[static_cast<std::size_t>(j)]) {
          minSlack[static_cast<std::size_t>(j)] = reduced;
          way[static_cast<std::size_t>(j)] = col0;
        }
        if (minSlack[static_cast<std::size_t>(j)] < delta) {
          delta = minSlack[static_cast<std::size_t>(j)];
          col1 = j;
        }
      }
      for (int j = 0; j <= m; ++j) {
        if (used[static_cast<std::size_t>(j)]) {
          rowPotential[static_cast<std::size_t>(rowOfCol[static_cast<std::size_t>(j)])] += delta;
          colPotential[static_cast<std::size_t>(j)] -= delta;
        } else {
          minSlack[static_cast<std::size_t>(j)] -= delta;
        }
      }
      col0 = col1;
    } while (rowOfCol[static_cast<std::size_t>(col0)] != 0);
    // Flip the augmenting path.
    do {
      const int col1 = way[static_cast<std::size_t>(col0)];
      rowOfCol[static_cast<std::size_t>(col0)] = rowOfCol[static_cast<std::size_t>(col1)];
      col0 = col1;
    } while (col0 != 0);
  }
  std::vector<int> columnOfRow(static_cast<std::size_t>(n), -1);
  for (int j = 1; j <= m; ++j)
    if (rowOfCol[static_cast<std::size_t>(j)] != 0) columnOfRow[static_cast<std::size_t>(rowOfCol[static_cast<std::size_t>(j)] - 1)] = j - 1;
  return columnOfRow;
}

std::vector<std::optional<int>> solveAssignmentWithOutliers(const Eigen::MatrixXd& cost, double unmatchedCost) {
  const Eigen::Index n = cost.rows(), m = cost.cols();
  if (!std::isfinite(unmatchedCost)) throw InputError("assignment", "the cost of an unmatched row must be finite");
  // Each row gets a private outlier column; the other rows cannot use it (a cost high enough that
  // taking it can never beat leaving every row unmatched).
  const double forbidden = std::abs(unmatchedCost) * 4.0 + (cost.size() ? cost.cwiseAbs().maxCoeff() : 0.0) * 4.0 * static_cast<double>(n + 1) + 1.0;
  Eigen::MatrixXd extended = Eigen::MatrixXd::Constant(n, m + n, forbidden);
  extended.leftCols(m) = cost;
  for (Eigen::Index i = 0; i < n; ++i) extended(i, m + i) = unmatchedCost;
  const std::vector<int> columns = solveAssignment(extended);
  std::vector<std::optional<int>> out(static_cast<std::size_t>(n));
  for (Eigen::Index i = 0; i < n; ++i) {
    const int c = columns[static_cast<std::size_t>(i)];
    if (c < m) out[static_cast<std::size_t>(i)] = c;
  }
  return out;
}

double assignmentCost(const Eigen::MatrixXd& cost, const std::vector<std::optional<int>>& columns, double unmatchedCost) {
  double total = 0;
  for (std::size_t i = 0; i < columns.size(); ++i)
    total += columns[i] ? cost(static_cast<Eigen::Index>(i), *columns[i]) : unmatchedCost;
  return total;
}

}  // namespace finestra
