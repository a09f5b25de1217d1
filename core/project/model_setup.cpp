#include "core/project/model_setup.h"

namespace finestra {

ModelSetup makeModelSetup(const Project& p) {
  ModelSetup s{resolveCentre(p.centre.preset, p.centre.isotope, p.centre.overrides),
               LabFrame(p.sample.normal, p.sample.inPlaneX, "sample"), p.strain, p.conditions};
  applyAssumedValues(s.centre, p.centre.assumed);
  if (p.centre.zplAnchor) s = anchorZpl(std::move(s), *p.centre.zplAnchor);
  return s;
}

}  // namespace finestra
