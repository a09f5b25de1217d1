#pragma once
// The magnet planner: figures of merit over the field directions a magnet can reach, the region
// where every wanted range holds, and the best settings ranked by one figure (issue 5).
#include <cstdint>
#include <limits>
#include <optional>
#include <vector>

#include "core/common/progress.h"
#include "core/crystal/magnet_calibration.h"
#include "core/planner/fast_kernel.h"
#include "core/planner/reference.h"
#include "core/planner/sampled_figures.h"

namespace finestra {

/// Directions the magnet can produce, in the lab (sample) frame.
/// Sphere: any direction (a polar/azimuth grid). Plane: a two-axis magnet, field direction
/// cos α ŝ + sin α (n̂ × ŝ) with ŝ the start direction projected into the plane ⟂ n̂.
/// SampleRotation: a fixed magnet axis m̂ and the sample turned by ψ about r̂ (both lab vectors at
/// ψ = 0); in the sample frame the field points along R(r̂, −ψ) m̂, a cone about r̂.
enum class ReachKind { Sphere, Plane, SampleRotation };

struct MagnetReach {
  ReachKind kind = ReachKind::Sphere;
  double stepDeg = 1.0;
  Vec3 planeNormalLab = Vec3(0, 0, 1);
  Vec3 planeStartLab = Vec3(1, 0, 0);
  Vec3 magnetAxisLab = Vec3(1, 0, 0);
  Vec3 rotationAxisLab = Vec3(0, 0, 1);
};

std::string reachKindText(ReachKind k);

/// A wanted range of one figure of the target class (bounds inclusive; infinite = open).
struct Constraint {
  FigureId figure = FigureId::QubitGHz;
  double min = -std::numeric_limits<double>::infinity();
  double max = std::numeric_limits<double>::infinity();
  bool holds(const ClassFigures& f) const;
  /// With a strain population: the lower bound applies to `low` (the figures a share q of the
  /// centres reach or exceed), the upper bound to `high` (those a share q stay at or below).
  bool holds(const ClassFigures& low, const ClassFigures& high) const;
};

struct Objective {
  FigureId figure = FigureId::Cyclicity;
  bool maximise = true;
};

/// The reach directions and magnitudes are magnet settings; `magnet` (the project's calibration)
/// turns each into the true field the centres see (core/project/field_semantics.h).
struct PlanRequest {
  int targetClass = 0;
  PlannerSettings settings;             ///< settings.magnitudeT is the first of magnitudesT
  std::vector<double> magnitudesT{0.5}; ///< magnet magnitudes tried for every reachable direction
  MagnetReach reach;
  MagnetCalibration magnet;
  std::vector<Constraint> constraints;
  Objective objective;
  int bestCount = 10;
  StrainPopulation strainPopulation;            ///< samples 0: the project's own strain
  std::optional<double> alignmentToleranceDeg;  ///< magnet's angular uncertainty; none: exact alignment
  /// Share q of the centres a setting must serve: ranges and ranking use the (1 − q) quantile of a
  /// figure for a lower bound or a maximised objective, the q quantile for an upper bound or a
  /// minimised one (q = 0.9: "good for 90 % of the centres" ranks a maximised figure by its p10).
  double rankQuantile = 0.5;
};

/// One reachable direction: lab unit vector, its lab angles and the magnet coordinate
/// (in-plane angle α, or sample rotation ψ; NaN on the sphere).
struct ReachableDirection {
  Vec3 lab = Vec3::UnitZ();
  double polarDeg = 0, azimuthDeg = 0;
  double magnetAngleDeg = std::numeric_limits<double>::quiet_NaN();
  double solidAngleWeight = 0;  ///< share of the reachable set it stands for (weights sum to 1)
};

/// Throws InputError naming the reach key for zero or parallel vectors and bad steps. On the sphere
/// every grid direction appears once (poles once, azimuth 360 dropped).
std::vector<ReachableDirection> reachableDirections(const MagnetReach& reach);

/// A run of consecutive feasible grid points: an azimuth interval on one polar row of the sphere
/// (polarDeg set), or an interval of the magnet angle (polarDeg NaN).
struct FeasibleInterval {
  double polarDeg = std::numeric_limits<double>::quiet_NaN();
  double fromDeg = 0, toDeg = 0;
};

struct FeasibleRegion {
  double magnitudeT = 0;
  std::vector<std::uint8_t> feasible;  ///< one flag per reachable direction (same order)
  int feasibleCount = 0;
  double fraction = 0;                 ///< solid-angle (sphere) or angle (plane, rotation) share
  std::vector<FeasibleInterval> intervals;
};

/// A magnet setting (magnitude and direction as set) and the true field it gives.
struct RankedSetting {
  double magnitudeT = 0;
  ReachableDirection direction;
  Vec3 fieldLabT = Vec3::Zero(), fieldCrystalT = Vec3::Zero();  ///< true field
  std::array<ClassFigures, kClassCount> figures{};
  std::vector<SpinTransition> spinTransitions;  ///< target class, nuclear spin resolved
  /// The value ranked by: the objective figure of the target class at the rank quantile, worst in
  /// the alignment cone when judged there (equal to the figure itself for one exact centre).
  double objectiveValue = 0;
  /// Quantiles over the centres of every figure of every selected class, on the axis and worst in
  /// the cone. Without a population `figures` holds the one centre's figures; with one, the medians
  /// of the on-axis figures.
  std::array<ClassSpread, kClassCount> spread{};
};

struct PlanResult {
  std::vector<ReachableDirection> directions;
  std::vector<FeasibleRegion> regions;  ///< one per magnitude
  std::vector<RankedSetting> best;      ///< feasible settings, best objective first
  std::vector<Vec3> trueDirectionsCrystal;  ///< true field direction of each reachable direction (crystal, unit)
  /// Target-class figures the constraints were checked on, [m·n + k]: a range's lower end is checked
  /// on targetFiguresLow (the pessimistic quantile), its upper end on targetFiguresHigh. Without a
  /// strain population or cone the two are equal.
  std::vector<ClassFigures> targetFiguresLow, targetFiguresHigh;
  std::vector<CentreStrain> centres;    ///< the drawn strain population (empty without one)
};

/// Validates the request against the model (classes, constraints, magnitudes).
void validatePlanRequest(const PlanRequest& request);

/// Evaluates every reachable direction at every magnitude (in parallel, with progress and
/// cancellation: throws Cancelled), marks the feasible ones and ranks them.
PlanResult runPlan(const CentreModel& model, const PlanRequest& request, const ProgressControl& progress = {});

/// A polar × azimuth grid over the whole sphere (lab angles), both ends included: polar
/// 0..180 in polarCount points, azimuth 0..360 in azimuthCount points.
struct SphereGrid {
  int polarCount = 181, azimuthCount = 361;
  double polarDeg(int i) const { return 180.0 * i / (polarCount - 1); }
  double azimuthDeg(int j) const { return 360.0 * j / (azimuthCount - 1); }
  long size() const { return static_cast<long>(polarCount) * azimuthCount; }
};

/// Figures of all selected classes at every grid direction, index (i·azimuthCount + j)·4 + class.
struct FigureMap {
  SphereGrid grid;
  double magnitudeT = 0;
  std::vector<ClassFigures> figures;
  const ClassFigures& at(int polarIndex, int azimuthIndex, int cls) const {
    return figures[static_cast<std::size_t>((static_cast<long>(polarIndex) * grid.azimuthCount + azimuthIndex) * kClassCount + cls)];
  }
};

/// Fills a figure map at settings.magnitudeT; rows are shared between worker threads.
FigureMap computeFigureMap(const CentreModel& model, const PlannerSettings& settings, const SphereGrid& grid,
                           const ProgressControl& progress = {}, int threads = 0);

/// Figures along the magnitude for one lab direction, |B| = maxT·k/(points−1).
struct ProfilePoint {
  double magnitudeT = 0;
  std::array<ClassFigures, kClassCount> figures{};
};
std::vector<ProfilePoint> magnitudeProfile(const CentreModel& model, const PlannerSettings& settings,
                                           const Vec3& directionLab, double maxT, int points);

}  // namespace finestra
