#pragma once
// The line-grid kernel across field directions: one orientation class, several directions at a
// time in packed double precision (structure of arrays, real arithmetic only). Plain data only,
// so that the per-instruction-set translation units (line_lanes_avx2.cpp, line_lanes_avx512.cpp)
// share no inline code with the rest of the program. The scalar closed form
// (LineGridKernel::evaluate, core/hamiltonian/linear4) is the reference and the fallback.

namespace finestra {

/// One 4-state manifold in Pauli components: component k (e0, ox, oy, oz, bx, by, bz, c) is
/// value[k] + Σ_a gradient[k][a] B_a with B in crystal axes (PauliForm4, core/hamiltonian/linear4.h).
struct LanePauliForm {
  double value[8];
  double gradient[8][3];
};

/// Everything the lane kernel needs for one class: both manifolds, ZPL and the dipole model.
struct LaneClassInput {
  LanePauliForm ground, excited;
  double zplGHz;
  double dipoleRatio;  ///< r in d_x = r σ_z, d_y = −r σ_x, d_z = 1 (core/model/dipole.h)
  double frame[3][3];  ///< defect frame F(row, column): defect axis `row` against crystal axis `column`
};

/// Output of one class-point in the memory layout of LineGridPoint: 16 frequencies (GHz), then
/// 16 × 3 crystal-axis intensities (checked by a static_assert in line_grid.cpp).
constexpr int kLinePointDoubles = 16 + 16 * 3;

/// Evaluates `kLanes` directions (bx[l], by[l], bz[l]) and writes lane l to out[l]. Returns a bit
/// per lane that the kernel did not finish: levels closer than 1e-7 of the manifold's scale, an
/// or an ill-conditioned elimination (the scalar path's solver or projector fallbacks). The caller
/// evaluates those lanes with the scalar path, so results equal it to rounding.
unsigned lineLanesAvx2(const LaneClassInput& in, const double* bx, const double* by, const double* bz,
                       double* const* out);
unsigned lineLanesAvx512(const LaneClassInput& in, const double* bx, const double* by, const double* bz,
                         double* const* out);
/// E2 − E1 (the gap between the lower and the upper pair of levels, quarticMiddleGap) of one
/// manifold at `kLanes` fields into gaps[l]; the returned bits mark lanes to recompute in scalar.
unsigned middleGapLanesAvx2(const LanePauliForm& form, const double* bx, const double* by, const double* bz,
                            double* gaps);
unsigned middleGapLanesAvx512(const LanePauliForm& form, const double* bx, const double* by, const double* bz,
                              double* gaps);
constexpr int kLanesAvx2 = 4;
constexpr int kLanesAvx512 = 8;

}  // namespace finestra
