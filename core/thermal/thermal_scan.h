#pragma once
// Thermal figures of every selected class of a project over a list of temperatures, at the
// project's field and strain (levels do not depend on temperature; rates and widths do).
#include <optional>
#include <string>
#include <vector>

#include "core/project/project.h"
#include "core/thermal/level_widths.h"

namespace finestra {

inline constexpr std::size_t kMaxThermalTemperatures = 10000;
inline constexpr double kMaxThermalTemperatureK = 1000.0;

/// Throws InputError naming `key` for an empty list, more than kMaxThermalTemperatures entries, or
/// a temperature outside 0..kMaxThermalTemperatureK K.
void validateTemperatures(const std::vector<double>& temperaturesK, const std::string& key);

struct ThermalScanClass {
  ClassSolution solution;
  std::vector<ClassThermal> rows;  ///< one per temperature
};

struct ThermalScan {
  std::vector<double> temperaturesK;
  std::vector<ThermalScanClass> classes;
  std::optional<double> bathT2StarS;  ///< from the project conditions
};

ThermalScan thermalScan(const CentreModel& model, const Project& project, const std::vector<double>& temperaturesK);

}  // namespace finestra
