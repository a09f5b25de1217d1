#pragma once
// The parameters a fit may vary (docs/physics.md, Fit): every centre
// parameter key, the crystal strain components, the magnet calibration (scale and tilt), a ZPL
// offset and the per-manifold E-strain. A FitState holds the value of all of them; a
// FitParameterSpec reads and writes one of them by name.
#include <optional>
#include <string>
#include <vector>

#include "core/project/project.h"

namespace finestra {

enum class FitParamKind {
  Centre,           ///< a centre parameter key (index = Param)
  StrainComponent,  ///< crystal strain, index 0..5 = xx, yy, zz, yz, zx, xy
  FieldScale,       ///< true / nominal field magnitude
  TiltAngle,        ///< magnet tilt (deg)
  TiltAzimuth,      ///< azimuth of the tilt (deg)
  ZplOffset,        ///< added to every line (GHz)
  EgMagnitude,      ///< per-manifold E-strain magnitude (GHz), index 0 ground, 1 excited
  EgAngle,          ///< per-manifold E-strain angle (deg), index 0 ground, 1 excited
};

struct FitParameterSpec {
  std::string name;
  FitParamKind kind = FitParamKind::Centre;
  int index = 0;
  std::string unit;
  /// A typical size of a meaningful change: scales the internal fit variable, the numerical
  /// derivative step and the spread of random starts.
  double scale = 1;
};

/// Everything a fit parameter can change, starting from a project.
struct FitState {
  ResolvedCentre centre;
  StrainSetting strain;
  double fieldScale = 1;
  double tiltDeg = 0;
  double tiltAzimuthDeg = 0;
  double zplOffsetGHz = 0;
};

/// Names in the order used by reports: the fit-specific parameters, then the centre keys.
std::vector<std::string> allFitParameterNames();
/// The spec of a name, or std::nullopt when the name is not a fit parameter.
std::optional<FitParameterSpec> findFitParameter(const std::string& name);
/// Spec for each name; InputError naming `where` (e.g. "fit.free[2]") for an unknown or repeated name.
std::vector<FitParameterSpec> fitParameterSpecs(const std::vector<std::string>& names, const std::string& where);

/// The state of a project before any fit: resolved centre, project strain, the project's magnet
/// calibration.
FitState initialFitState(const Project& project);

double fitValue(const FitState& state, const FitParameterSpec& spec);
void setFitValue(FitState& state, const FitParameterSpec& spec, double value);

/// Brings equivalent values to a canonical form: negative E-strain magnitude → positive with
/// angle + 180°, negative tilt → positive with azimuth + 180°, angles in [0, 360).
/// Returns, per spec, the sign by which the parameter's deviation was multiplied (+1 or −1).
std::vector<double> canonicaliseFitState(FitState& state, const std::vector<FitParameterSpec>& specs);

/// The model setup of a state (E-strain magnitudes made non-negative for the engine).
ModelSetup fitStateSetup(const FitState& state, const ModelSetup& base);

/// True field in the lab frame of a magnet setting under the state's calibration
/// (core/project/field_semantics.h).
Vec3 trueFieldLab(const FitState& state, const Vec3& nominalLab);

}  // namespace finestra
