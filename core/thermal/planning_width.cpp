#include "core/thermal/planning_width.h"

#include <algorithm>

#include "core/thermal/level_widths.h"

namespace finestra {

double separationLinewidthGHz(const CentreModel& model) {
  const auto& c = model.setup().conditions;
  const ClassSolution s = model.solve(0, Vec3::Zero(), 8);
  const ClassThermal t = classThermal(model, s, c.temperatureK);
  double widest = 0;
  for (std::size_t k = 0; k < s.lines.size(); ++k)
    if (s.lines[k].parent == 'C') widest = std::max(widest, t.lineFwhmGHz[k]);
  return widest + c.extraBroadeningGHz;
}

}  // namespace finestra
