#pragma once
// Batch evaluation of all lines of the 4-state manifolds (no isotope) for many fields: the workload
// of direction maps and of the engine benchmark. Fixed-size and allocation-free per point, parallel
// over points. Each manifold is diagonalised in closed form (core/hamiltonian/linear4.h) and falls
// back to the self-adjoint solver at (near-)degenerate points, so the numbers equal
// CentreModel::lines to rounding. Batches run the lane kernel (line_lanes.h: 8 or 4 directions at
// once with AVX-512 or AVX2, chosen when the program runs) and the scalar closed form for the lanes
// it hands back and on CPUs without AVX2.
#include <array>
#include <vector>

#include "core/common/progress.h"
#include "core/hamiltonian/linear4.h"
#include "core/optics/line_lanes.h"
#include "core/model/centre_model.h"

namespace finestra {

/// Instruction sets of the lane kernel; Scalar is the closed form one direction at a time.
enum class LaneSet { Scalar, Avx2, Avx512 };
/// True when this build has the lane kernel for `set` and this CPU runs it.
bool laneSetSupported(LaneSet set);
/// The widest supported set.
LaneSet bestLaneSet();

/// The 16 lines (upper i = 0..3 × lower j = 0..3, index 4i + j) of one class at one field.
struct LineGridPoint {
  std::array<double, 16> frequencyGHz{};
  std::array<std::array<double, 3>, 16> intensityCrystal{};  ///< |ê·d|² for ê along crystal x, y, z
};

class LineGridKernel {
public:
  /// Samples both manifolds of every class of `model`. Throws InputError when the model has an
  /// isotope (hyperfine-resolved lines come from CentreModel::solve).
  explicit LineGridKernel(const CentreModel& model);

  /// Lines of class `cls` (0..3) at one crystal-frame field, without labels or allocation.
  void evaluate(int cls, const Vec3& fieldCrystal, LineGridPoint& out) const;
  /// Lines of class `cls` at fields[k] into out[k * outStride], k < count, with the lane kernel of
  /// `set` (which must be supported) and the scalar path for the lanes it hands back; returns the
  /// number of points the scalar path evaluated.
  long evaluateMany(int cls, const Vec3* fields, long count, LineGridPoint* out, long outStride, LaneSet set) const;

private:
  struct Manifold4 {
    LinearHamiltonian4 linear;
    PauliForm4 form;
  };

  std::array<Manifold4, 4> ground_, excited_;
  double zplGHz_ = 0;
  double dipoleRatio_ = 1;
  std::array<LaneClassInput, 4> lanes_{};
};

/// out[k * classes.size() + c] = lines of classes[c] at fieldsCrystal[k], on all cores.
void evaluateLineGrid(const CentreModel& model, const std::vector<Vec3>& fieldsCrystal, const std::vector<int>& classes,
                      std::vector<LineGridPoint>& out, const ProgressControl& control = {},
                      LaneSet lanes = bestLaneSet());

}  // namespace finestra
