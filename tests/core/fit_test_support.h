#pragma once
// Synthetic fit scenarios shared by the fit tests: a project of one centre, a "true" state with
// invented strain and magnet miscalibration, and noisy peaks made by the core model.
#include <random>
#include <string>
#include <vector>

#include "core/fit/project_fit.h"
#include "core/fit/synthetic_peaks.h"

namespace finestra::testing {

inline Project scenarioProject(const std::string& preset) {
  Project p;
  p.centre.preset = preset;
  p.sample.normal = Vec3(0, 0, 1);
  p.sample.inPlaneX = Vec3(1, 1, 0);
  p.conditions.collectionLab = Vec3(0, 0, 1);
  return p;
}

/// Six magnet settings chosen so that the four classes see different fields.
inline std::vector<SyntheticSetSpec> sixSettings(double sigmaGHz, int peaksPerSet = 10, double fieldFactor = 1.0) {
  // Generic directions: no two classes see the same angle to the field, so lines stay resolved.
  const double polar[6] = {35, 65, 80, 20, 50, 75};
  const double azimuth[6] = {20, 75, 150, 200, 290, 330};
  const double magnitude[6] = {0.3, 0.5, 0.7, 0.4, 0.6, 0.8};
  std::vector<SyntheticSetSpec> specs;
  for (int k = 0; k < 6; ++k) {
    SyntheticSetSpec s;
    s.name = "setting " + std::to_string(k + 1);
    s.field = FieldSetting::fromAngles(fieldFactor * magnitude[k], polar[k], azimuth[k]);
    s.sigmaGHz = sigmaGHz;
    s.maxPeaks = peaksPerSet;
    s.resolutionGHz = 30 * sigmaGHz;
    specs.push_back(s);
  }
  return specs;
}

/// The invented truth: E-strain in both manifolds, a miscalibrated and tilted magnet, a ZPL offset.
inline FitState scenarioTruth(const Project& project, std::mt19937_64& rng) {
  FitState t = initialFitState(project);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  t.strain.extraGround = {10.0 + 10.0 * u(rng), 360.0 * u(rng)};
  t.strain.extraExcited = {15.0 + 15.0 * u(rng), 360.0 * u(rng)};
  t.fieldScale = 1.0 + 0.02 * (u(rng) - 0.5);
  t.tiltDeg = 1.0 + 2.0 * u(rng);
  t.tiltAzimuthDeg = 360.0 * u(rng);
  t.zplOffsetGHz = 4.0 * (u(rng) - 0.5);
  if (project.centre.preset != "SnV-") {
    t.centre.parameters.set(Param::QG, 0.1 + 0.04 * (u(rng) - 0.5));
    t.centre.parameters.set(Param::QU, 0.1 + 0.04 * (u(rng) - 0.5));
  }
  return t;
}

/// The project a user would fit from: E-strain magnitudes known to about 1 GHz (e.g. from the
/// closed-form zero-field estimate), nominal magnet, preset ZPL and q.
inline Project startingProject(Project p, const FitState& truth, std::mt19937_64& rng) {
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  p.strain.extraGround = {truth.strain.extraGround.magnitudeGHz + u(rng), 0.0};
  p.strain.extraExcited = {truth.strain.extraExcited.magnitudeGHz + u(rng), 0.0};
  return p;
}

/// Heavier centres lock the spin to the orbit: their lines split less in a field, so they are
/// measured at higher fields with finer resolution.
inline std::vector<SyntheticSetSpec> settingsFor(const std::string& preset) {
  if (preset == "SnV-") return sixSettings(0.02, 10, 3.0);
  return sixSettings(0.05);
}

/// For SnV- (large λ) the orbital Zeeman terms move the strong spin-conserving lines only
/// weakly and together with the tilt, so q_g and q_u stay fixed there.
inline std::vector<std::string> scenarioFree(const std::string& preset = "SiV-") {
  std::vector<std::string> free{"eg_strain_g_GHz", "eg_strain_u_GHz", "field_scale", "magnet_tilt_deg",
                                "magnet_tilt_azimuth_deg", "zpl_offset_GHz"};
  if (preset != "SnV-") {
    free.push_back("q_g");
    free.push_back("q_u");
  }
  return free;
}

inline double truthValue(const FitState& truth, const std::string& name) {
  return fitValue(truth, *findFitParameter(name));
}

/// Project with the synthetic sets as measurements; `truthLines` receives the line of each peak.
inline Project withMeasurements(Project p, const std::vector<SyntheticSet>& sets, std::vector<std::vector<LineRef>>* truthLines = nullptr) {
  for (const auto& s : sets) {
    p.measurements.push_back(s.measurement);
    if (truthLines) truthLines->push_back(s.truth);
  }
  return p;
}

inline const FittedParameter& parameter(const FitResult& r, const std::string& name) {
  for (const auto& p : r.parameters)
    if (p.name == name) return p;
  throw std::runtime_error("no parameter " + name);
}

}  // namespace finestra::testing
