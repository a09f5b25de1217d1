#include "core/planner/strain_population.h"

#include <algorithm>
#include <cmath>
#include <random>

#include "core/centre/parameter_table.h"
#include "core/common/errors.h"

namespace finestra {
namespace {

// A uniform fraction in [0, 1) from the top 53 bits of one 64-bit draw: every value k·2⁻⁵³.
double uniformFraction(std::mt19937_64& engine) { return static_cast<double>(engine() >> 11) * 0x1.0p-53; }

void validateRange(const std::array<double, 2>& range, const std::string& key) {
  const QuantitySpec& spec = quantity("strain.eg_ground.magnitude_GHz");
  requireInRange(spec, range[0], key + "[0]");
  requireInRange(spec, range[1], key + "[1]");
  if (range[0] > range[1]) throw InputError(key, "min is larger than max");
}

}  // namespace

void validateStrainPopulation(const StrainPopulation& population, const std::string& keyPrefix) {
  if (!population.active()) return;
  validateRange(population.groundGHz, keyPrefix + ".eg_ground_GHz");
  validateRange(population.excitedGHz, keyPrefix + ".eg_excited_GHz");
  requireInRange(quantity("planner.strain_samples"), population.samples, keyPrefix + ".samples");
  if (population.seed > kMaxStrainSeed)
    throw InputError(keyPrefix + ".seed", "must be an integer from 0 to 2^53 = 9007199254740992");
  if (population.angleDeg) requireInRange(quantity("strain.eg_ground.angle_deg"), *population.angleDeg, keyPrefix + ".angle_deg");
}

std::vector<CentreStrain> drawCentres(const StrainPopulation& population) {
  std::mt19937_64 engine(population.seed);
  std::vector<CentreStrain> centres(static_cast<std::size_t>(std::max(population.samples, 0)));
  const auto& g = population.groundGHz;
  const auto& u = population.excitedGHz;
  for (CentreStrain& c : centres) {
    // Always two draws per centre, so the magnitudes of centre k do not depend on angleDeg.
    const double fraction = uniformFraction(engine);
    const double angleFraction = uniformFraction(engine);
    // min + u·(max − min) is exactly min for a zero-width range.
    c.groundGHz = g[0] + fraction * (g[1] - g[0]);
    c.excitedGHz = u[0] + fraction * (u[1] - u[0]);
    c.angleDeg = population.angleDeg ? *population.angleDeg : 360.0 * angleFraction;
  }
  return centres;
}

CentreModel modelWithEgStrain(const CentreModel& model, const CentreStrain& strain) {
  ModelSetup setup = model.setup();
  setup.strain.extraGround = {strain.groundGHz, strain.angleDeg};
  setup.strain.extraExcited = {strain.excitedGHz, strain.angleDeg};
  return CentreModel(std::move(setup));
}

double sampleQuantile(std::vector<double>& values, double p) {
  values.erase(std::remove_if(values.begin(), values.end(), [](double v) { return std::isnan(v); }), values.end());
  if (values.empty()) return std::nan("");
  const double h = (static_cast<double>(values.size()) - 1) * std::clamp(p, 0.0, 1.0);
  const auto lo = static_cast<std::size_t>(std::floor(h));
  std::nth_element(values.begin(), values.begin() + static_cast<long>(lo), values.end());
  const double low = values[lo];
  if (lo + 1 >= values.size() || h == std::floor(h)) return low;
  const double high = *std::min_element(values.begin() + static_cast<long>(lo) + 1, values.end());
  if (high == low) return low;  // also keeps infinities out of ∞ − ∞
  return low + (h - std::floor(h)) * (high - low);
}

Quantiles quantilesOf(std::vector<double> values) {
  Quantiles q;
  q.undefinedCount = static_cast<int>(std::count_if(values.begin(), values.end(), [](double v) { return std::isnan(v); }));
  q.p10 = sampleQuantile(values, 0.1);
  q.p50 = sampleQuantile(values, 0.5);
  q.p90 = sampleQuantile(values, 0.9);
  return q;
}

}  // namespace finestra
