#include "core/planner/planner.h"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <numbers>

#include "core/centre/parameter_table.h"
#include "core/common/errors.h"
#include "core/common/limits.h"
#include "core/common/parallel.h"
#include "core/planner/alignment_cone.h"
#include "core/project/field_semantics.h"

namespace finestra {
namespace {

constexpr double kDeg = std::numbers::pi / 180.0;

void requireDirection(const Vec3& v, const std::string& key) {
  if (!v.allFinite() || v.norm() < 1e-12) throw InputError(key, "must be a non-zero finite vector");
}

ReachableDirection fromLab(const Vec3& lab, double magnetAngleDeg, double weight) {
  ReachableDirection d;
  d.lab = lab.normalized();
  const auto angles = anglesOfDirection(d.lab);
  d.polarDeg = angles[0];
  d.azimuthDeg = angles[1];
  d.magnetAngleDeg = magnetAngleDeg;
  d.solidAngleWeight = weight;
  return d;
}

int stepsIn(double rangeDeg, double stepDeg) { return std::max(1, static_cast<int>(std::lround(rangeDeg / stepDeg))); }

// Runs of consecutive feasible entries [first, last] within [begin, end).
template <typename Emit>
void forEachRun(const std::vector<std::uint8_t>& feasible, std::size_t begin, std::size_t end, Emit emit) {
  std::size_t k = begin;
  while (k < end) {
    if (!feasible[k]) {
      ++k;
      continue;
    }
    const std::size_t first = k;
    while (k + 1 < end && feasible[k + 1]) ++k;
    emit(first, k);
    ++k;
  }
}

// Where the magnet setting of a reachable direction really points. Sphere and plane: the
// direction is a magnet setting in the lab. Sample rotation: the magnet is set along its axis m̂
// (calibrated once in the lab), and turning the sample by ψ turns that true field by R(r̂, −ψ) in
// the sample frame.
TrueDirection trueReachDirection(const PlanRequest& request, const ReachableDirection& d) {
  if (request.reach.kind != ReachKind::SampleRotation || request.magnet.isNominal())
    return trueDirection(request.magnet, d.lab);
  const TrueDirection axis = trueDirection(request.magnet, request.reach.magnetAxisLab.normalized());
  const Vec3 r = request.reach.rotationAxisLab.normalized();
  return {rotationAbout(r, -d.magnetAngleDeg * kDeg) * axis.lab, axis.gain};
}

}  // namespace

std::string reachKindText(ReachKind k) {
  switch (k) {
    case ReachKind::Sphere: return "sphere";
    case ReachKind::Plane: return "plane";
    case ReachKind::SampleRotation: return "sample_rotation";
  }
  return "?";
}

bool Constraint::holds(const ClassFigures& f) const {
  const double v = figureValue(f, figure);
  return v >= min && v <= max;
}

bool Constraint::holds(const ClassFigures& low, const ClassFigures& high) const {
  return figureValue(low, figure) >= min && figureValue(high, figure) <= max;
}

std::vector<ReachableDirection> reachableDirections(const MagnetReach& reach) {
  requireInRange(quantity("planner.step_deg"), reach.stepDeg, "reach.step_deg");
  // Count before allocating: a tiny step would otherwise overflow the int counts or exhaust memory.
  const double sphereDirections = (180.0 / reach.stepDeg) * (360.0 / reach.stepDeg);
  const double directions = reach.kind == ReachKind::Sphere ? sphereDirections : 360.0 / reach.stepDeg;
  if (!(directions <= static_cast<double>(limits::kMaxPlannerDirections)))
    throw InputError("reach.step_deg", "too small: more than " + std::to_string(limits::kMaxPlannerDirections) +
                                           " directions (the limit of one plan; a sphere needs a step of at least 0.25 degrees)");
  std::vector<ReachableDirection> out;
  if (reach.kind == ReachKind::Sphere) {
    const int rows = stepsIn(180.0, reach.stepDeg);
    const int columns = stepsIn(360.0, reach.stepDeg);
    const double dTheta = 180.0 / rows;
    for (int i = 0; i <= rows; ++i) {
      const double theta = dTheta * i;
      // Equal-area bookkeeping: the band between θ ∓ Δθ/2 covers (cos a − cos b)/2 of the sphere.
      const double a = std::max(theta - dTheta / 2, 0.0) * kDeg, b = std::min(theta + dTheta / 2, 180.0) * kDeg;
      const double band = (std::cos(a) - std::cos(b)) / 2;
      const bool pole = i == 0 || i == rows;
      const int count = pole ? 1 : columns;
      for (int j = 0; j < count; ++j) {
        const double phi = 360.0 * j / columns;
        ReachableDirection d = fromLab(directionFromAngles(theta, phi), std::nan(""), band / count);
        d.polarDeg = theta;  // keep the grid's own angles (no round-off, azimuth kept at the poles)
        d.azimuthDeg = phi;
        out.push_back(d);
      }
    }
    return out;
  }
  const int count = stepsIn(360.0, reach.stepDeg);
  if (reach.kind == ReachKind::Plane) {
    requireDirection(reach.planeNormalLab, "reach.normal_lab");
    requireDirection(reach.planeStartLab, "reach.start_lab");
    const Vec3 n = reach.planeNormalLab.normalized();
    const Vec3 inPlane = reach.planeStartLab - reach.planeStartLab.dot(n) * n;
    if (inPlane.norm() < 1e-9) throw InputError("reach.start_lab", "is parallel to reach.normal_lab");
    const Vec3 s = inPlane.normalized(), t = n.cross(s);
    for (int k = 0; k < count; ++k) {
      const double alpha = 360.0 * k / count;
      out.push_back(fromLab(std::cos(alpha * kDeg) * s + std::sin(alpha * kDeg) * t, alpha, 1.0 / count));
    }
    return out;
  }
  requireDirection(reach.magnetAxisLab, "reach.magnet_axis_lab");
  requireDirection(reach.rotationAxisLab, "reach.rotation_axis_lab");
  const Vec3 m = reach.magnetAxisLab.normalized(), r = reach.rotationAxisLab.normalized();
  for (int k = 0; k < count; ++k) {
    const double psi = 360.0 * k / count;
    out.push_back(fromLab(rotationAbout(r, -psi * kDeg) * m, psi, 1.0 / count));
  }
  return out;
}

void validatePlanRequest(const PlanRequest& request) {
  if (request.targetClass < 0 || request.targetClass >= kClassCount)
    throw InputError("target_class", "must be 0..3");
  if (std::find(request.settings.classes.begin(), request.settings.classes.end(), request.targetClass) ==
      request.settings.classes.end())
    throw InputError("target_class", "class " + std::to_string(request.targetClass) +
                                         " is not among the project's selected classes");
  if (request.magnitudesT.empty()) throw InputError("magnitudes_T", "needs at least one magnitude");
  for (double b : request.magnitudesT) {
    if (!std::isfinite(b) || b <= 0) throw InputError("magnitudes_T", "every magnitude must be finite and > 0 T");
    requireInRange(quantity("field.magnitude_T"), b, "magnitudes_T");
  }
  for (const Constraint& c : request.constraints)
    if (std::isnan(c.min) || std::isnan(c.max) || c.min > c.max)
      throw InputError("constraints." + std::string(figureInfo(c.figure).key), "needs min <= max");
  if (request.bestCount < 0) throw InputError("best", "must not be negative");
  if (!std::isfinite(request.magnet.fieldScale) || request.magnet.fieldScale <= 0)
    throw InputError("magnet.field_scale", "must be finite and > 0");
  validateStrainPopulation(request.strainPopulation);
  if (request.alignmentToleranceDeg) validateAlignmentTolerance(*request.alignmentToleranceDeg);
  requireInRange(quantity("planner.rank_quantile"), request.rankQuantile, "rank_quantile");
}

PlanResult runPlan(const CentreModel& model, const PlanRequest& request, const ProgressControl& progress) {
  validatePlanRequest(request);
  PlanResult result;
  result.directions = reachableDirections(request.reach);
  const auto& dirs = result.directions;
  const std::size_t n = dirs.size(), magnitudes = request.magnitudesT.size();
  // The true field of direction k at magnet magnitude B is B·gain[k] along crystal[k].
  std::vector<Vec3> trueLab(n), crystal(n);
  std::vector<double> gain(n);
  for (std::size_t k = 0; k < n; ++k) {
    const TrueDirection t = trueReachDirection(request, dirs[k]);
    trueLab[k] = t.lab;
    crystal[k] = model.setup().lab.toCrystal(t.lab);
    gain[k] = t.gain;
  }

  // Target-class figures per (magnitude, direction), at the two quantiles the ranges and the ranking
  // use (the same figures for one centre); all classes are recomputed for the winners.
  const SampledFigures sampled(model, request.settings, request.strainPopulation, request.alignmentToleranceDeg);
  result.centres = sampled.centres();
  const double share = request.rankQuantile;
  std::vector<ClassFigures> targetLow(n * magnitudes), targetHigh(n * magnitudes);
  std::atomic<long> done{0};
  const long total = static_cast<long>(n * magnitudes);
  const int cls = request.targetClass;
  const long progressStride = std::max(1L, 256L / sampled.centreCount());
  parallelChunks(total, [&](long begin, long end) {
    std::vector<CentreFigures> centres;
    std::vector<double> scratch;
    for (long item = begin; item < end; ++item) {
      if ((item - begin) % progressStride == 0) {
        progress.throwIfCancelled();
        progress.progress(static_cast<double>(done.load()) / static_cast<double>(total));
      }
      const auto m = static_cast<std::size_t>(item) / n, k = static_cast<std::size_t>(item) % n;
      sampled.evaluate(crystal[k], request.magnitudesT[m] * gain[k], centres);
      targetLow[static_cast<std::size_t>(item)] = SampledFigures::worstQuantile(centres, cls, 1 - share, scratch);
      targetHigh[static_cast<std::size_t>(item)] = SampledFigures::worstQuantile(centres, cls, share, scratch);
      done.fetch_add(1, std::memory_order_relaxed);
    }
  });
  progress.throwIfCancelled();

  struct Candidate {
    double score;
    std::size_t magnitude, direction;
  };
  std::vector<Candidate> feasible;
  const bool oneDimensional = request.reach.kind != ReachKind::Sphere;
  for (std::size_t m = 0; m < magnitudes; ++m) {
    FeasibleRegion region;
    region.magnitudeT = request.magnitudesT[m];
    region.feasible.assign(n, 0);
    for (std::size_t k = 0; k < n; ++k) {
      const ClassFigures& low = targetLow[m * n + k];
      const ClassFigures& high = targetHigh[m * n + k];
      const bool ok = std::all_of(request.constraints.begin(), request.constraints.end(),
                                  [&](const Constraint& c) { return c.holds(low, high); });
      if (!ok) continue;
      region.feasible[k] = 1;
      ++region.feasibleCount;
      region.fraction += dirs[k].solidAngleWeight;
      const double v = figureValue(request.objective.maximise ? low : high, request.objective.figure);
      if (std::isnan(v)) continue;  // feasible, but cannot be ranked by an undefined figure
      feasible.push_back({request.objective.maximise ? v : -v, m, k});
    }
    if (oneDimensional) {
      forEachRun(region.feasible, 0, n, [&](std::size_t a, std::size_t b) {
        region.intervals.push_back({std::nan(""), dirs[a].magnetAngleDeg, dirs[b].magnetAngleDeg});
      });
    } else {
      std::size_t rowStart = 0;
      while (rowStart < n) {
        std::size_t rowEnd = rowStart;
        while (rowEnd < n && dirs[rowEnd].polarDeg == dirs[rowStart].polarDeg) ++rowEnd;
        forEachRun(region.feasible, rowStart, rowEnd, [&](std::size_t a, std::size_t b) {
          region.intervals.push_back({dirs[a].polarDeg, dirs[a].azimuthDeg, dirs[b].azimuthDeg});
        });
        rowStart = rowEnd;
      }
    }
    result.regions.push_back(std::move(region));
  }

  const std::size_t keep = std::min<std::size_t>(feasible.size(), static_cast<std::size_t>(request.bestCount));
  std::partial_sort(feasible.begin(), feasible.begin() + static_cast<long>(keep), feasible.end(),
                    [](const Candidate& a, const Candidate& b) {
                      if (a.score != b.score) return a.score > b.score;
                      if (a.magnitude != b.magnitude) return a.magnitude < b.magnitude;
                      return a.direction < b.direction;
                    });
  for (std::size_t r = 0; r < keep; ++r) {
    const Candidate& c = feasible[r];
    RankedSetting s;
    s.magnitudeT = request.magnitudesT[c.magnitude];
    s.direction = dirs[c.direction];
    const double trueMagnitudeT = s.magnitudeT * gain[c.direction];
    s.fieldLabT = trueMagnitudeT * trueLab[c.direction];
    s.fieldCrystalT = trueMagnitudeT * crystal[c.direction];
    std::vector<CentreFigures> centres;
    sampled.evaluate(crystal[c.direction], trueMagnitudeT, centres);
    s.objectiveValue = request.objective.maximise ? c.score : -c.score;
    for (int k : request.settings.classes) {
      const auto i = static_cast<std::size_t>(k);
      s.spread[i] = SampledFigures::spread(centres, k);
      s.figures[i] = centres.front().exact[i];
      if (centres.size() > 1)
        for (const FigureInfo& info : figureTable()) setFigureValue(s.figures[i], info.id, s.spread[i][static_cast<std::size_t>(info.id)].exact.p50);
    }
    s.spinTransitions = hyperfineSpinTransitions(model, request.settings, request.targetClass, s.fieldCrystalT);
    result.best.push_back(std::move(s));
  }
  result.trueDirectionsCrystal = std::move(crystal);
  result.targetFiguresLow = std::move(targetLow);
  result.targetFiguresHigh = std::move(targetHigh);
  progress.progress(1.0);
  return result;
}

FigureMap computeFigureMap(const CentreModel& model, const PlannerSettings& settings, const SphereGrid& grid,
                           const ProgressControl& progress, int threads) {
  if (grid.polarCount < 2 || grid.azimuthCount < 2) throw InputError("map", "grid needs at least 2 x 2 points");
  if (static_cast<double>(grid.polarCount) * grid.azimuthCount > static_cast<double>(limits::kMaxMapCells))
    throw InputError("map", "more than " + std::to_string(limits::kMaxMapCells) +
                                " cells (the limit of one map; a full sphere needs a step of at least 0.25 degrees)");
  FigureMap map;
  map.grid = grid;
  map.magnitudeT = settings.magnitudeT;
  map.figures.assign(static_cast<std::size_t>(grid.size() * kClassCount), ClassFigures{});
  const PlannerKernel kernel(model, settings);
  const Mat3 labToCrystal = model.setup().lab.matrix().transpose();
  std::atomic<long> rowsDone{0};
  parallelChunks(
      grid.polarCount,
      [&](long begin, long end) {
        std::array<ClassFigures, kClassCount> figures{};
        for (long i = begin; i < end; ++i) {
          progress.throwIfCancelled();
          for (int j = 0; j < grid.azimuthCount; ++j) {
            const Vec3 direction =
                labToCrystal * directionFromAngles(grid.polarDeg(static_cast<int>(i)), grid.azimuthDeg(j));
            kernel.evaluate(direction, settings.magnitudeT, figures);
            std::copy(figures.begin(), figures.end(),
                      map.figures.begin() + (i * grid.azimuthCount + j) * kClassCount);
          }
          progress.progress(static_cast<double>(rowsDone.fetch_add(1) + 1) / grid.polarCount);
        }
      },
      threads);
  return map;
}

std::vector<ProfilePoint> magnitudeProfile(const CentreModel& model, const PlannerSettings& settings,
                                           const Vec3& directionLab, double maxT, int points) {
  requireDirection(directionLab, "profile direction");
  if (!std::isfinite(maxT) || maxT <= 0) throw InputError("profile.max_T", "must be finite and > 0");
  if (points < 2) throw InputError("profile.points", "needs at least 2 points");
  const PlannerKernel kernel(model, settings);
  const Vec3 direction = model.setup().lab.toCrystal(directionLab.normalized());
  std::vector<ProfilePoint> out(static_cast<std::size_t>(points));
  for (int k = 0; k < points; ++k) {
    ProfilePoint& p = out[static_cast<std::size_t>(k)];
    p.magnitudeT = maxT * k / (points - 1);
    kernel.evaluate(direction, p.magnitudeT, p.figures);
  }
  return out;
}

}  // namespace finestra
