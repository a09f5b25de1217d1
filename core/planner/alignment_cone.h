#pragma once
// The magnet's angular uncertainty: the directions a field set along d̂ may really point within a cone
// of half-angle τ, and the worst figures found there (issue 11, item 4).
#include <array>
#include <vector>

#include "core/common/types.h"
#include "core/planner/figures.h"

namespace finestra {

/// The sampled cone: its axis and rings of kConeRingPoints directions (45° apart, starting at a
/// fixed transverse direction, Eigen's unitOrthogonal of the axis) at the fixed polar angles of
/// kConeRingsDeg up to the first one ≥ τ. The tolerance is rounded up to that ring (conservative:
/// never a smaller cone than asked), and the rings do not depend on τ otherwise, so a wider cone
/// always holds every direction of a narrower one: its worst case is never better.
inline constexpr int kConeRingPoints = 8;
inline constexpr std::array<double, 13> kConeRingsDeg{0.1, 0.25, 0.5, 0.75, 1, 1.5, 2, 3, 4, 5, 6, 8, 10};

/// The polar angles (deg) of the rings sampled for tolerance τ (none for τ = 0).
std::vector<double> coneRingsDeg(double toleranceDeg);

/// Throws InputError naming `key` outside 0..10 degrees.
void validateAlignmentTolerance(double toleranceDeg, const std::string& key = "alignment_tolerance_deg");

/// Unit directions of the sampled cone about the unit vector `axis`, the axis first. A tolerance
/// of 0 gives the axis alone.
std::vector<Vec3> coneDirections(const Vec3& axis, double toleranceDeg);

/// The figures judged within the cone: drive (both forms), cyclicity and separation, all of them
/// "larger is better", so the worst in the cone is the smallest.
bool judgedInCone(FigureId id);

/// Lowers `worst`'s judged figures to `sample`'s where those are smaller. Undefined (NaN) samples
/// are skipped: the degeneracy that makes a figure undefined lies on a set of zero measure (a field
/// exactly perpendicular to the axis without strain), the neighbouring directions carry its limit.
/// The other figures of `worst` are left as they are (the values on the axis).
void foldWorst(ClassFigures& worst, const ClassFigures& sample);

}  // namespace finestra
