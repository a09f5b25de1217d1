#include "core/fit/fit_parameters.h"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <set>

#include "core/common/errors.h"
#include "core/project/field_semantics.h"

namespace finestra {
namespace {

constexpr const char* kStrainNames[6] = {"strain_xx", "strain_yy", "strain_zz", "strain_yz", "strain_zx", "strain_xy"};
// (row, column) of each strain component in the symmetric tensor.
constexpr int kStrainRow[6] = {0, 1, 2, 1, 2, 0};
constexpr int kStrainCol[6] = {0, 1, 2, 2, 0, 1};

std::vector<FitParameterSpec> buildCatalogue() {
  std::vector<FitParameterSpec> out;
  for (int k = 0; k < 6; ++k) out.push_back({kStrainNames[k], FitParamKind::StrainComponent, k, "", 1e-6});
  out.push_back({"field_scale", FitParamKind::FieldScale, 0, "", 1e-3});
  out.push_back({"magnet_tilt_deg", FitParamKind::TiltAngle, 0, "deg", 0.5});
  out.push_back({"magnet_tilt_azimuth_deg", FitParamKind::TiltAzimuth, 0, "deg", 10});
  out.push_back({"zpl_offset_GHz", FitParamKind::ZplOffset, 0, "GHz", 1});
  out.push_back({"eg_strain_g_GHz", FitParamKind::EgMagnitude, 0, "GHz", 1});
  out.push_back({"eg_strain_u_GHz", FitParamKind::EgMagnitude, 1, "GHz", 1});
  out.push_back({"eg_angle_g_deg", FitParamKind::EgAngle, 0, "deg", 10});
  out.push_back({"eg_angle_u_deg", FitParamKind::EgAngle, 1, "deg", 10});
  for (const ParamInfo& info : paramTable()) {
    // A typical change: 1 % of the SiV value for couplings, 1 GHz-equivalent otherwise.
    double scale = 1;
    switch (info.id) {
      case Param::ZplTHz: scale = 1e-3; break;  // 1 GHz
      case Param::QG: case Param::QU: scale = 0.01; break;
      case Param::GSpin: scale = 1e-3; break;
      case Param::TperpG: case Param::TparG: case Param::DG: case Param::FG:
      case Param::TperpU: case Param::TparU: case Param::DU: case Param::FU: scale = 0.01; break;
      case Param::DipoleRatio: scale = 0.01; break;
      case Param::LifetimeNs: scale = 0.1; break;
      case Param::AParG: case Param::APerpG: case Param::AParU: case Param::APerpU: scale = 1; break;
      case Param::NuclearSpin: scale = 0.5; break;
      case Param::GammaN: scale = 0.1; break;
      default: scale = 1; break;  // GHz quantities
    }
    out.push_back({std::string(info.key), FitParamKind::Centre, static_cast<int>(info.id), std::string(info.unit), scale});
  }
  return out;
}

const std::vector<FitParameterSpec>& catalogue() {
  static const std::vector<FitParameterSpec> specs = buildCatalogue();
  return specs;
}

double wrapDegrees(double a) {
  a = std::fmod(a, 360.0);
  return a < 0 ? a + 360.0 : a;
}

}  // namespace

std::vector<std::string> allFitParameterNames() {
  std::vector<std::string> names;
  for (const auto& s : catalogue()) names.push_back(s.name);
  return names;
}

std::optional<FitParameterSpec> findFitParameter(const std::string& name) {
  for (const auto& s : catalogue())
    if (s.name == name) return s;
  return std::nullopt;
}

std::vector<FitParameterSpec> fitParameterSpecs(const std::vector<std::string>& names, const std::string& where) {
  std::vector<FitParameterSpec> out;
  std::set<std::string> seen;
  for (std::size_t i = 0; i < names.size(); ++i) {
    const std::string at = where + "[" + std::to_string(i) + "]";
    auto spec = findFitParameter(names[i]);
    if (!spec)
      throw InputError(at, "unknown fit parameter '" + names[i] +
                               "' (expected a centre parameter key, strain_xx … strain_xy, field_scale, "
                               "magnet_tilt_deg, magnet_tilt_azimuth_deg, zpl_offset_GHz, eg_strain_g_GHz, "
                               "eg_strain_u_GHz, eg_angle_g_deg or eg_angle_u_deg)");
    if (!seen.insert(names[i]).second) throw InputError(at, "fit parameter '" + names[i] + "' is listed twice");
    out.push_back(*spec);
  }
  return out;
}

FitState initialFitState(const Project& project) {
  FitState s;
  s.centre = resolveCentre(project.centre.preset, project.centre.isotope, project.centre.overrides);
  s.strain = project.strain;
  s.fieldScale = project.magnet.fieldScale;
  s.tiltDeg = project.magnet.tiltDeg;
  s.tiltAzimuthDeg = project.magnet.tiltAzimuthDeg;
  return s;
}

double fitValue(const FitState& s, const FitParameterSpec& spec) {
  switch (spec.kind) {
    case FitParamKind::Centre: return s.centre.parameters.get(static_cast<Param>(spec.index));
    case FitParamKind::StrainComponent: return s.strain.crystal(kStrainRow[spec.index], kStrainCol[spec.index]);
    case FitParamKind::FieldScale: return s.fieldScale;
    case FitParamKind::TiltAngle: return s.tiltDeg;
    case FitParamKind::TiltAzimuth: return s.tiltAzimuthDeg;
    case FitParamKind::ZplOffset: return s.zplOffsetGHz;
    case FitParamKind::EgMagnitude: return (spec.index == 0 ? s.strain.extraGround : s.strain.extraExcited).magnitudeGHz;
    case FitParamKind::EgAngle: return (spec.index == 0 ? s.strain.extraGround : s.strain.extraExcited).angleDeg;
  }
  return 0;
}

void setFitValue(FitState& s, const FitParameterSpec& spec, double v) {
  switch (spec.kind) {
    case FitParamKind::Centre: s.centre.parameters.set(static_cast<Param>(spec.index), v); break;
    case FitParamKind::StrainComponent:
      s.strain.crystal(kStrainRow[spec.index], kStrainCol[spec.index]) = v;
      s.strain.crystal(kStrainCol[spec.index], kStrainRow[spec.index]) = v;
      break;
    case FitParamKind::FieldScale: s.fieldScale = v; break;
    case FitParamKind::TiltAngle: s.tiltDeg = v; break;
    case FitParamKind::TiltAzimuth: s.tiltAzimuthDeg = v; break;
    case FitParamKind::ZplOffset: s.zplOffsetGHz = v; break;
    case FitParamKind::EgMagnitude: (spec.index == 0 ? s.strain.extraGround : s.strain.extraExcited).magnitudeGHz = v; break;
    case FitParamKind::EgAngle: (spec.index == 0 ? s.strain.extraGround : s.strain.extraExcited).angleDeg = v; break;
  }
}

std::vector<double> canonicaliseFitState(FitState& s, const std::vector<FitParameterSpec>& specs) {
  std::vector<double> sign(specs.size(), 1.0);
  auto flip = [&](FitParamKind kind, int index) {
    for (std::size_t k = 0; k < specs.size(); ++k)
      if (specs[k].kind == kind && specs[k].index == index) sign[k] = -1.0;
  };
  for (int m = 0; m < 2; ++m) {
    EgStrain& e = m == 0 ? s.strain.extraGround : s.strain.extraExcited;
    if (e.magnitudeGHz < 0) {
      e.magnitudeGHz = -e.magnitudeGHz;
      e.angleDeg += 180.0;
      flip(FitParamKind::EgMagnitude, m);
    }
    e.angleDeg = wrapDegrees(e.angleDeg);
  }
  if (s.tiltDeg < 0) {
    s.tiltDeg = -s.tiltDeg;
    s.tiltAzimuthDeg += 180.0;
    flip(FitParamKind::TiltAngle, 0);
  }
  s.tiltAzimuthDeg = wrapDegrees(s.tiltAzimuthDeg);
  return sign;
}

ModelSetup fitStateSetup(const FitState& s, const ModelSetup& base) {
  ModelSetup setup = base;
  setup.centre = s.centre;
  setup.strain = s.strain;
  // The ZPL offset moves every line alike, exactly like a change of the centroid ν_ZPL.
  setup.centre.parameters.set(Param::ZplTHz, s.centre.parameters.get(Param::ZplTHz) + s.zplOffsetGHz * 1e-3);
  // The engine takes a non-negative magnitude; a negative one is the same vector turned by 180°.
  for (EgStrain* e : {&setup.strain.extraGround, &setup.strain.extraExcited}) {
    if (e->magnitudeGHz < 0) {
      e->magnitudeGHz = -e->magnitudeGHz;
      e->angleDeg += 180.0;
    }
  }
  return setup;
}

Vec3 trueFieldLab(const FitState& s, const Vec3& nominalLab) {
  return finestra::trueFieldLab(MagnetCalibration{s.fieldScale, s.tiltDeg, s.tiltAzimuthDeg}, nominalLab);
}

}  // namespace finestra
