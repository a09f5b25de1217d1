#include "core/thermal/thermal_scan.h"

#include <cmath>

#include "core/common/errors.h"
#include "core/project/evaluate.h"

namespace finestra {

void validateTemperatures(const std::vector<double>& t, const std::string& key) {
  if (t.empty()) throw InputError(key, "needs at least one temperature");
  if (t.size() > kMaxThermalTemperatures)
    throw InputError(key, "at most " + std::to_string(kMaxThermalTemperatures) + " temperatures");
  for (double v : t)
    if (!std::isfinite(v) || v < 0 || v > kMaxThermalTemperatureK)
      throw InputError(key, "every temperature must lie between 0 and 1000 K");
}

ThermalScan thermalScan(const CentreModel& model, const Project& project, const std::vector<double>& temperaturesK) {
  validateTemperatures(temperaturesK, "temperatures_K");
  ThermalScan scan;
  scan.temperaturesK = temperaturesK;
  scan.bathT2StarS = model.setup().conditions.bathT2StarS;
  for (ClassSolution& s : solveProjectClasses(model, project)) {
    ThermalScanClass c;
    for (double t : temperaturesK) c.rows.push_back(classThermal(model, s, t));
    c.solution = std::move(s);
    scan.classes.push_back(std::move(c));
  }
  return scan;
}

}  // namespace finestra
