// The lane kernel for AVX2 + FMA (4 directions per call); core/CMakeLists.txt compiles this file
// with -mavx2 -mfma, and LineGridKernel calls it only where the CPU reports AVX2 and FMA.
#include "core/optics/line_lanes_body.h"

namespace finestra {

unsigned lineLanesAvx2(const LaneClassInput& in, const double* bx, const double* by, const double* bz,
                       double* const* out) {
  static_assert(kLanes == kLanesAvx2);
  return lineLanes(in, bx, by, bz, out);
}

unsigned middleGapLanesAvx2(const LanePauliForm& form, const double* bx, const double* by, const double* bz,
                        double* gaps) {
  return middleGapLanes(form, bx, by, bz, gaps);
}

}  // namespace finestra
