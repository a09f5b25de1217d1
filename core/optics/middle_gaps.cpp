#include "core/optics/middle_gaps.h"

#include <algorithm>

#include "core/optics/line_grid.h"
#include "core/optics/line_lanes.h"

namespace finestra {

void quarticMiddleGaps(const PauliForm4& form, const Vec3* fields, int count, double* gaps) {
  using GapLanes = unsigned (*)(const LanePauliForm&, const double*, const double*, const double*, double*);
  GapLanes lanes = nullptr;
  int width = 1;
#if defined(FINESTRA_LANE_KERNELS)
  const LaneSet set = bestLaneSet();
  if (set == LaneSet::Avx512) lanes = middleGapLanesAvx512, width = kLanesAvx512;
  if (set == LaneSet::Avx2) lanes = middleGapLanesAvx2, width = kLanesAvx2;
#endif
  if (lanes == nullptr || count < width) {
    for (int k = 0; k < count; ++k) gaps[k] = quarticMiddleGap(form, fields[k]);
    return;
  }
  LanePauliForm lanesForm{};
  for (std::size_t k = 0; k < 8; ++k) {
    lanesForm.value[k] = form.value[k];
    for (int a = 0; a < 3; ++a) lanesForm.gradient[k][a] = form.gradient[k][a];
  }
  for (int start = 0; start < count; start += width) {
    double bx[kLanesAvx512], by[kLanesAvx512], bz[kLanesAvx512], out[kLanesAvx512];
    for (int l = 0; l < width; ++l) {
      const Vec3& b = fields[std::min(start + l, count - 1)];
      bx[l] = b.x(), by[l] = b.y(), bz[l] = b.z();
    }
    const unsigned handedBack = lanes(lanesForm, bx, by, bz, out);
    for (int l = 0; l < width && start + l < count; ++l)
      gaps[start + l] = (handedBack & (1u << l)) ? quarticMiddleGap(form, fields[start + l]) : out[l];
  }
}

}  // namespace finestra
