// The lane kernel for AVX-512F (8 directions per call); core/CMakeLists.txt compiles this file
// with -mavx512f -mfma, and LineGridKernel calls it only where the CPU reports AVX-512F.
#include "core/optics/line_lanes_body.h"

namespace finestra {

unsigned lineLanesAvx512(const LaneClassInput& in, const double* bx, const double* by, const double* bz,
                         double* const* out) {
  static_assert(kLanes == kLanesAvx512);
  return lineLanes(in, bx, by, bz, out);
}

unsigned middleGapLanesAvx512(const LanePauliForm& form, const double* bx, const double* by, const double* bz,
                        double* gaps) {
  return middleGapLanes(form, bx, by, bz, gaps);
}

}  // namespace finestra
