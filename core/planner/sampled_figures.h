#pragma once
// Planner figures over a strain population and an alignment cone: for every sampled centre, the
// figures with the field exactly along the set direction and the worst within the cone, and their
// quantiles over the centres (docs/physics.md, Planner figures).
#include <array>
#include <optional>
#include <vector>

#include "core/planner/fast_kernel.h"
#include "core/planner/strain_population.h"

namespace finestra {

/// One centre's figures of every selected class: on the cone's axis and the worst within it.
struct CentreFigures {
  std::array<ClassFigures, kClassCount> exact{}, worst{};
};

/// Quantiles over the centres of one figure, on the axis and worst in the cone.
struct FigureSpread {
  Quantiles exact, worst;
};
using ClassSpread = std::array<FigureSpread, kFigureCount>;

class SampledFigures {
public:
  /// Without a population (samples 0) the one centre is `model` itself; without a tolerance
  /// (nullopt or 0) the cone is the set direction alone. Both validated (InputError names the key).
  SampledFigures(const CentreModel& model, const PlannerSettings& settings, const StrainPopulation& population,
                 std::optional<double> alignmentToleranceDeg);

  int centreCount() const { return static_cast<int>(kernels_.size()); }
  /// The drawn strains (empty without a population).
  const std::vector<CentreStrain>& centres() const { return centres_; }

  /// Figures of every centre for a field of `magnitudeT` set along the unit crystal direction
  /// `directionCrystal`; `out` is resized to centreCount().
  void evaluate(const Vec3& directionCrystal, double magnitudeT, std::vector<CentreFigures>& out) const;

  /// The figures of `cls` at probability p over the centres, figure by figure, from the worst-in-cone
  /// values (figures not judged in the cone are the values on the axis).
  static ClassFigures worstQuantile(const std::vector<CentreFigures>& centres, int cls, double p,
                                    std::vector<double>& scratch);
  /// p10/p50/p90 of every figure of `cls`, on the axis and worst in the cone.
  static ClassSpread spread(const std::vector<CentreFigures>& centres, int cls);

private:
  std::vector<CentreStrain> centres_;
  std::vector<PlannerKernel> kernels_;
  double toleranceDeg_ = 0;
};

/// Writes `value` into figure `id` of `f` (the inverse of figureValue).
void setFigureValue(ClassFigures& f, FigureId id, double value);

}  // namespace finestra
