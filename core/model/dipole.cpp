#include "core/model/dipole.h"

namespace finestra {

double analysedIntensity(const CVec3& a, const std::array<Vec3, 2>& analysers, int count) {
  double sum = 0.0;
  for (int k = 0; k < count; ++k) sum += std::norm(analysers[k].cast<cplx>().dot(a));
  return sum;
}

}  // namespace finestra
