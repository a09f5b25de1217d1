#pragma once
// Level identity by eigenvector overlap: follows states through crossings along any path.
#include <vector>

#include "core/common/types.h"

namespace finestra {

/// For eigenvector sets (columns) at two neighbouring points, returns `from` with
/// from[c] = the column of `previous` that column c of `current` continues. Pairs are taken
/// greedily by largest |⟨prev|cur⟩|², which for small steps is the unique continuation.
std::vector<int> matchStates(const MatrixXc& previous, const MatrixXc& current);

/// Branch (0 = lower orbital branch, 1 = upper) of each level at zero field: the lower half of the
/// levels by energy (Kramers doublets × nuclear states) is the lower branch.
std::vector<int> zeroFieldBranches(Eigen::Index levelCount);

}  // namespace finestra
