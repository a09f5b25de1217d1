#pragma once
// Linear assignment (minimum total cost matching) by the Hungarian method with row potentials and
// shortest augmenting paths (the Jonker–Volgenant formulation), O(n² m) for n rows ≤ m columns.
#include <optional>
#include <vector>

#include <Eigen/Dense>

namespace finestra {

/// Column chosen for each row so that every row gets a distinct column and the summed cost is
/// minimal. Needs rows ≤ columns and finite costs (InputError otherwise).
std::vector<int> solveAssignment(const Eigen::MatrixXd& cost);

/// Like solveAssignment, but any row may stay unmatched at the price `unmatchedCost` (its own
/// private "outlier" column); columns may stay unused. Works for any shape.
std::vector<std::optional<int>> solveAssignmentWithOutliers(const Eigen::MatrixXd& cost, double unmatchedCost);

/// Summed cost of an assignment (unmatched rows cost `unmatchedCost`).
double assignmentCost(const Eigen::MatrixXd& cost, const std::vector<std::optional<int>>& columns, double unmatchedCost);

}  // namespace finestra
