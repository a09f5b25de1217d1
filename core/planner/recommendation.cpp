#include "core/planner/recommendation.h"

#include <cmath>
#include <cstdio>

#include "core/planner/class_symmetry.h"

namespace finestra {
namespace {

std::string number(double v, const char* format) {
  char buf[64];
  std::snprintf(buf, sizeof buf, format, v);
  return buf;
}

std::string cyclicityText(double c) {
  if (std::isnan(c)) return "cyclicity undefined (degenerate levels)";
  if (c >= kCyclicityCap) return "a forbidden spin flip (cyclicity unbounded in this model)";
  return "cyclicity " + number(c, c >= 1e4 ? "%.2e" : "%.1f");
}

std::string separationText(double s) {
  if (std::isnan(s)) return "separation from the other classes undefined";
  if (std::isinf(s)) return "no other class selected";
  return number(s, "%.1f") + " linewidths from every other class";
}

}  // namespace

std::string magnetSettingText(double magnitudeT, const ReachableDirection& d, ReachKind kind) {
  std::string text = "|B| = " + number(magnitudeT, "%.3f") + " T, polar " + number(d.polarDeg, "%.1f") + "°, azimuth " +
                     number(d.azimuthDeg, "%.1f") + "°";
  if (kind == ReachKind::Plane) text += ", in-plane angle " + number(d.magnetAngleDeg, "%.1f") + "°";
  if (kind == ReachKind::SampleRotation) text += ", sample rotation " + number(d.magnetAngleDeg, "%.1f") + "°";
  return text;
}

RecommendationFacts recommendationFacts(const PlanRequest& request, const RankedSetting& best) {
  RecommendationFacts f;
  f.magnitudeT = best.magnitudeT;
  f.direction = best.direction;
  f.reach = request.reach.kind;
  f.fieldCrystalT = best.fieldCrystalT;
  f.targetClass = request.targetClass;
  const ClassFigures& t = best.figures[static_cast<std::size_t>(request.targetClass)];
  f.qubitGHz = t.qubitGHz;
  f.cyclicity = t.cyclicity;
  f.separationLinewidths = t.separationLinewidths;
  return f;
}

std::string recommendationText(const RecommendationFacts& f) {
  std::string text = "Set the magnet to " + magnetSettingText(f.magnitudeT, f.direction, f.reach);
  if (f.fieldCrystalT.norm() > 0) text += " (true field along crystal " + millerDirection(f.fieldCrystalT) + ")";
  text += ": class " + std::to_string(f.targetClass) + " has qubit " +
          (std::isnan(f.qubitGHz) ? std::string("undefined") : number(f.qubitGHz, "%.3f") + " GHz") + ", " +
          cyclicityText(f.cyclicity);
  if (!f.cyclicityQualifier.empty()) text += " " + f.cyclicityQualifier;
  text += ", " + separationText(f.separationLinewidths);
  if (!f.populationQualifier.empty()) text += " " + f.populationQualifier;
  return text + ".";
}

}  // namespace finestra
