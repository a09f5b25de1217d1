#pragma once
// Helpers shared by the core tests: building a model directly from a preset and overrides.
#include <map>
#include <random>
#include <string>

#include "core/project/project.h"
#include "core/model/centre_model.h"

namespace finestra::testing {

inline ModelSetup setupFor(const std::string& preset, std::map<std::string, double> overrides = {},
                           const Mat3& strain = Mat3::Zero(), std::optional<std::string> isotope = std::nullopt) {
  ModelSetup s{resolveCentre(preset, isotope, overrides), LabFrame(Vec3(0, 0, 1), Vec3(1, 0, 0)), {}, {}};
  s.strain.crystal = strain;
  return s;
}

inline Mat3 randomStrain(std::mt19937& rng, double scale) {
  std::uniform_real_distribution<double> u(-scale, scale);
  return strainFromComponents(u(rng), u(rng), u(rng), u(rng), u(rng), u(rng));
}

inline Vec3 randomVector(std::mt19937& rng, double scale) {
  std::uniform_real_distribution<double> u(-scale, scale);
  return {u(rng), u(rng), u(rng)};
}

}  // namespace finestra::testing
