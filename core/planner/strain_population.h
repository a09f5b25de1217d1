#pragma once
// Centres of unknown strain: a reproducible random sample of E-type strains, one per centre, and the
// sample quantiles every planner figure is reported as (issue 11, item 3).
#include <array>
#include <cstdint>
#include <optional>
#include <vector>

#include "core/model/centre_model.h"

namespace finestra {

/// The E-type strain of a centre found after the cooldown, as a population (request key
/// "strain_population"). Each centre draws one uniform fraction u ∈ [0, 1) that places both
/// magnitudes in their ranges (|ε_g| = min_g + u (max_g − min_g), the same for the excited
/// manifold) and one angle α uniform in [0°, 360°), shared by both manifolds: one local strain acts
/// on both manifolds (docs/physics.md, Strain). The sampled strain replaces the project's
/// strain.eg_ground / strain.eg_excited; the crystal strain tensor still applies to every class.
struct StrainPopulation {
  std::array<double, 2> groundGHz{0, 0};   ///< [min, max] of |ε_Eg| of the ground manifold
  std::array<double, 2> excitedGHz{0, 0};  ///< [min, max] of |ε_Eg| of the excited manifold
  int samples = 0;                         ///< 0: no population (the project's single strain)
  std::uint64_t seed = 0;
  std::optional<double> angleDeg;          ///< a fixed angle for every centre instead of a random one

  bool active() const { return samples > 0; }
};

/// Largest seed accepted: integers up to 2^53 survive a round trip through any JSON reader.
inline constexpr std::uint64_t kMaxStrainSeed = (std::uint64_t{1} << 53);

/// The E-strain of one sampled centre.
struct CentreStrain {
  double groundGHz = 0, excitedGHz = 0, angleDeg = 0;
};

/// Throws InputError naming `keyPrefix` + the key at fault ("strain_population.samples", ...).
void validateStrainPopulation(const StrainPopulation& population, const std::string& keyPrefix = "strain_population");

/// The centres of the population, in draw order. Deterministic for a seed on every platform:
/// std::mt19937_64 (its output sequence is fixed by the C++ standard) and uniform fractions formed
/// by hand from its top 53 bits, never a standard-library distribution.
std::vector<CentreStrain> drawCentres(const StrainPopulation& population);

/// `model` with its extra E-strain of both manifolds replaced by `strain`.
CentreModel modelWithEgStrain(const CentreModel& model, const CentreStrain& strain);

/// Sample quantile at probability p ∈ [0, 1] of the defined (non-NaN) values, by linear interpolation
/// between order statistics: position h = (n − 1) p, value x₍⌊h⌋₎ + (h − ⌊h⌋)(x₍⌊h⌋+1₎ − x₍⌊h⌋₎)
/// (definition 7 of Hyndman & Fan, The American Statistician 50, 361 (1996)). NaN when no value is
/// defined. Equal values give that value exactly. Reorders `values`.
double sampleQuantile(std::vector<double>& values, double p);

/// The three reported quantiles of one figure over the centres, and how many centres had it undefined.
struct Quantiles {
  double p10 = 0, p50 = 0, p90 = 0;
  int undefinedCount = 0;
};
Quantiles quantilesOf(std::vector<double> values);

}  // namespace finestra
