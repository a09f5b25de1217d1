#pragma once
// The plain sentence at the top of a plan: which magnet setting to use and what it gives.
#include <string>

#include "core/planner/planner.h"

namespace finestra {

/// What the sentence says. Qualifiers are added by features that know them (e.g. "within ±0.5°"
/// for an alignment tolerance, "for 90 % of centres with |ε_Eg| up to 50 GHz" for a strain
/// population); empty ones are left out.
struct RecommendationFacts {
  double magnitudeT = 0;            ///< magnet setting (before the calibration)
  ReachableDirection direction;     ///< magnet setting angles
  ReachKind reach = ReachKind::Sphere;
  Vec3 fieldCrystalT = Vec3::Zero();///< the true field it gives (crystal axes)
  int targetClass = 0;
  double qubitGHz = 0, cyclicity = 0, separationLinewidths = 0;
  std::string cyclicityQualifier;
  std::string populationQualifier;
};

RecommendationFacts recommendationFacts(const PlanRequest& request, const RankedSetting& best);

/// "Set the magnet to |B| = 0.500 T, polar 54.7°, azimuth 45.0° (true field along crystal [111]):
/// class 0 has qubit 12.345 GHz, cyclicity 123.4, 5.2 linewidths from every other class."
std::string recommendationText(const RecommendationFacts& facts);

/// "|B| = 0.500 T, polar 54.7°, azimuth 45.0°" (plus the in-plane angle or sample rotation).
std::string magnetSettingText(double magnitudeT, const ReachableDirection& d, ReachKind kind);

}  // namespace finestra
