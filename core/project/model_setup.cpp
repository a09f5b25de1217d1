#include "core/project/model_setup.h"

namespace finestra {

ModelSetup makeModelSetup(const Project& p) {
  ModelSetup s{resolveCentre(p.centre.preset, p.centre.isotope, p.centre.overrides),
               LabFrame(p.sample.normal, p.sample.inPlaneX, "sample"), p.strain, p.conditions};
  return s;
}

}  // namespace finestra
