#include "core/planner/sampled_figures.h"

#include "core/planner/alignment_cone.h"

namespace finestra {

void setFigureValue(ClassFigures& f, FigureId id, double value) {
  switch (id) {
    case FigureId::QubitGHz: f.qubitGHz = value; break;
    case FigureId::DriveGHzPerT: f.driveGHzPerT = value; break;
    case FigureId::DriveFraction: f.driveFraction = value; break;
    case FigureId::Cyclicity: f.cyclicity = value; break;
    case FigureId::SeparationLinewidths: f.separationLinewidths = value; break;
    case FigureId::GroundGapGHz: f.groundGapGHz = value; break;
    case FigureId::ExcitedGapGHz: f.excitedGapGHz = value; break;
    case FigureId::AxisAngleDeg: f.axisAngleDeg = value; break;
    case FigureId::Count: break;
  }
}

SampledFigures::SampledFigures(const CentreModel& model, const PlannerSettings& settings,
                               const StrainPopulation& population, std::optional<double> alignmentToleranceDeg)
    : toleranceDeg_(alignmentToleranceDeg.value_or(0.0)) {
  validateStrainPopulation(population);
  validateAlignmentTolerance(toleranceDeg_);
  if (!population.active()) {
    kernels_.emplace_back(model, settings);
    return;
  }
  centres_ = drawCentres(population);
  kernels_.reserve(centres_.size());
  for (const CentreStrain& c : centres_) kernels_.emplace_back(modelWithEgStrain(model, c), settings);
}

void SampledFigures::evaluate(const Vec3& directionCrystal, double magnitudeT, std::vector<CentreFigures>& out) const {
  const std::vector<Vec3> cone = coneDirections(directionCrystal, toleranceDeg_);
  out.resize(kernels_.size());
  std::array<ClassFigures, kClassCount> sample{};
  for (std::size_t c = 0; c < kernels_.size(); ++c) {
    CentreFigures& f = out[c];
    kernels_[c].evaluate(cone.front(), magnitudeT, f.exact);
    f.worst = f.exact;
    for (std::size_t s = 1; s < cone.size(); ++s) {
      kernels_[c].evaluate(cone[s], magnitudeT, sample);
      for (int cls = 0; cls < kClassCount; ++cls)
        if (kernels_[c].selected(cls)) foldWorst(f.worst[static_cast<std::size_t>(cls)], sample[static_cast<std::size_t>(cls)]);
    }
  }
}

ClassFigures SampledFigures::worstQuantile(const std::vector<CentreFigures>& centres, int cls, double p,
                                           std::vector<double>& scratch) {
  const auto k = static_cast<std::size_t>(cls);
  ClassFigures out = centres.front().worst[k];  // keeps the gap positions of the first centre
  if (centres.size() == 1) return out;
  for (const FigureInfo& info : figureTable()) {
    scratch.clear();
    for (const CentreFigures& c : centres) scratch.push_back(figureValue(c.worst[k], info.id));
    setFigureValue(out, info.id, sampleQuantile(scratch, p));
  }
  return out;
}

ClassSpread SampledFigures::spread(const std::vector<CentreFigures>& centres, int cls) {
  const auto k = static_cast<std::size_t>(cls);
  ClassSpread out{};
  std::vector<double> exact, worst;
  for (const FigureInfo& info : figureTable()) {
    exact.clear(), worst.clear();
    for (const CentreFigures& c : centres) {
      exact.push_back(figureValue(c.exact[k], info.id));
      worst.push_back(figureValue(c.worst[k], info.id));
    }
    out[static_cast<std::size_t>(info.id)] = {quantilesOf(exact), quantilesOf(worst)};
  }
  return out;
}

}  // namespace finestra
