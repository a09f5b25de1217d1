#include "core/project/evaluate.h"

#include "core/common/parallel.h"
#include "core/project/field_semantics.h"

namespace finestra {

std::vector<ClassSolution> solveProjectClasses(const CentreModel& model, const Project& project) {
  const Vec3 field = projectFieldCrystal(project, model.setup().lab);
  std::vector<ClassSolution> out(project.classes.size());
  parallelChunks(static_cast<long>(out.size()), [&](long b, long e) {
    for (long i = b; i < e; ++i) out[static_cast<std::size_t>(i)] = model.solve(project.classes[static_cast<std::size_t>(i)], field);
  });
  return out;
}

}  // namespace finestra
