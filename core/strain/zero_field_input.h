#pragma once
// Where `strain` takes its four zero-field lines from: one measurement set of the project measured
// at zero field with exactly four peaks. A peak pinned with "assign" takes the letter of its level
// branches (at zero field the lower half of each manifold's levels is the lower branch: upper
// excited → lower ground is A, upper → upper B, lower → lower C, lower excited → upper ground D).
// Unpinned peaks take the remaining letters in order of decreasing frequency, in the order the
// centre's λ_g and λ_u predict (A highest, D lowest; B above C when λ_u > λ_g).
#include <array>
#include <optional>
#include <string>

#include "core/project/project.h"
#include "core/strain/zero_field_strain.h"

namespace finestra {

struct ZeroFieldSelection {
  int measurement = 0;              ///< index into project.measurements
  std::array<int, 4> peak{};        ///< peak index of A, B, C, D
  std::array<bool, 4> pinned{};     ///< letter taken from an "assign" pin
  ZeroFieldLines lines;
};

/// `measurementName`: the set to use; none: the first set whose field is zero. InputError naming
/// the set or peak when no such set exists, the set has a non-zero field or not four peaks, or two
/// pins name the same letter.
ZeroFieldSelection selectZeroFieldLines(const Project& project, const CentreModel& model,
                                        const std::optional<std::string>& measurementName);

}  // namespace finestra
