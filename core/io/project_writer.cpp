// Writing the version-1 project file, atomically.
#include <cmath>
#include <nlohmann/json.hpp>

#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/io/text_file.h"

namespace finestra {
namespace {
using nlohmann::json;
using ordered = nlohmann::ordered_json;

ordered vec(const Vec3& v) { return ordered::array({v.x(), v.y(), v.z()}); }

ordered tensor(const Mat3& e) {
  return ordered{{"xx", e(0, 0)}, {"yy", e(1, 1)}, {"zz", e(2, 2)}, {"yz", e(1, 2)}, {"zx", e(2, 0)}, {"xy", e(0, 1)}};
}

ordered field(const FieldSetting& f) {
  switch (f.form) {
    case FieldSetting::Form::Angles:
      return ordered{{"magnitude_T", f.magnitudeT}, {"polar_deg", f.polarDeg}, {"azimuth_deg", f.azimuthDeg}};
    case FieldSetting::Form::VectorLab: return ordered{{"vector_lab_T", vec(f.vector)}};
    case FieldSetting::Form::VectorCrystal: return ordered{{"vector_crystal_T", vec(f.vector)}};
  }
  return {};
}

ordered sweep(const SweepSpec& s) {
  static const char* kinds[] = {"magnitude", "angle", "strain", "temperature"};
  ordered o{{"name", s.name}, {"kind", kinds[static_cast<int>(s.kind)]}, {"from", s.from}, {"to", s.to},
            {"points", s.points}};
  if (s.kind == SweepKind::Angle) {
    o["plane_normal_lab"] = vec(s.planeNormalLab);
    o["start_lab"] = vec(s.startLab);
  }
  if (s.kind == SweepKind::Strain) o["strain_to"] = tensor(s.strainTo);
  return o;
}

ordered peak(const MeasuredPeak& p) {
  ordered o{{"position", p.position}, {"unit", std::string(spectralUnitKey(p.unit))}, {"sigma", p.sigma}};
  o["analyser_lab"] = p.analyserLab ? vec(*p.analyserLab) : ordered(nullptr);
  o["assign"] = p.assign ? ordered{{"class", p.assign->cls}, {"upper", p.assign->upper}, {"lower", p.assign->lower}}
                         : ordered(nullptr);
  return o;
}

/// Key path of the first non-finite number in `j` ("" when all are finite). JSON has no NaN or
/// infinity: written as null, the file could not be read back.
std::string firstNonFinite(const ordered& j, const std::string& path) {
  if (j.is_number_float()) return std::isfinite(j.get<double>()) ? "" : path;
  if (j.is_array())
    for (std::size_t i = 0; i < j.size(); ++i)
      if (auto bad = firstNonFinite(j[i], path + "[" + std::to_string(i) + "]"); !bad.empty()) return bad;
  if (j.is_object())
    for (auto it = j.begin(); it != j.end(); ++it)
      if (auto bad = firstNonFinite(it.value(), path.empty() ? it.key() : path + "." + it.key()); !bad.empty())
        return bad;
  return "";
}

}  // namespace

std::string projectToJson(const Project& p) {
  ordered doc{{"format", "finestra-project"}, {"version", kProjectVersion}};
  if (!p.description.empty()) doc["description"] = p.description;
  ordered params = ordered::object();
  for (const auto& [k, v] : p.centre.overrides) params[k] = v;
  doc["centre"] = ordered{{"preset", p.centre.preset},
                          {"isotope", p.centre.isotope ? ordered(*p.centre.isotope) : ordered(nullptr)},
                          {"parameters", params}};
  if (!p.centre.assumed.empty()) {
    ordered assumed = ordered::object();
    for (const auto& [k, v] : p.centre.assumed) assumed[k] = v;
    doc["centre"]["assumed"] = assumed;
  }
  if (const auto& a = p.centre.zplAnchor)
    doc["centre"]["zpl_anchor"] = ordered{{"line", std::string(1, a->line)}, {"wavelength_nm", a->wavelengthNm},
                                          {"medium", a->air ? "air" : "vacuum"}, {"temperature_K", a->temperatureK}};
  doc["sample"] = ordered{{"normal", vec(p.sample.normal)}, {"in_plane_x", vec(p.sample.inPlaneX)}};
  doc["field"] = field(p.field);
  if (!p.magnet.isNominal())
    doc["magnet"] = ordered{{"field_scale", p.magnet.fieldScale},
                            {"tilt_deg", p.magnet.tiltDeg},
                            {"tilt_azimuth_deg", p.magnet.tiltAzimuthDeg}};
  ordered strain{{"crystal", tensor(p.strain.crystal)}};
  auto eg = [](const EgStrain& e) { return ordered{{"magnitude_GHz", e.magnitudeGHz}, {"angle_deg", e.angleDeg}}; };
  if (p.strain.extraGround.magnitudeGHz != 0) strain["eg_ground"] = eg(p.strain.extraGround);
  if (p.strain.extraExcited.magnitudeGHz != 0) strain["eg_excited"] = eg(p.strain.extraExcited);
  doc["strain"] = strain;
  const auto& c = p.conditions;
  doc["conditions"] = ordered{{"temperature_K", c.temperatureK},
                              {"populations", c.populations == PopulationModel::Thermal ? "thermal" : "equal"},
                              {"collection_lab", vec(c.collectionLab)},
                              {"analyser_lab", c.analyserLab ? vec(*c.analyserLab) : ordered(nullptr)},
                              {"broadening_GHz", c.extraBroadeningGHz}};
  if (c.phononSideband) doc["conditions"]["phonon_sideband"] = true;
  if (c.bathT2StarS) doc["conditions"]["bath_t2star_s"] = *c.bathT2StarS;
  doc["classes"] = p.classes;
  ordered sweeps = ordered::array();
  for (const auto& s : p.sweeps) sweeps.push_back(sweep(s));
  doc["sweeps"] = sweeps;
  ordered measurements = ordered::array();
  for (const auto& m : p.measurements) {
    ordered peaks = ordered::array();
    for (const auto& pk : m.peaks) peaks.push_back(peak(pk));
    measurements.push_back(
        ordered{{"name", m.name}, {"temperature_K", m.temperatureK}, {"field", field(m.field)}, {"peaks", peaks}});
  }
  doc["measurements"] = measurements;
  doc["fit"] = ordered{{"free", p.fit.free}, {"starts", p.fit.starts}};
  if (p.measuredSpectrum)
    doc["measured_spectrum"] = ordered{{"name", p.measuredSpectrum->name},
                                       {"unit", std::string(spectralUnitKey(p.measuredSpectrum->unit))},
                                       {"position", p.measuredSpectrum->position},
                                       {"signal", p.measuredSpectrum->signal}};
  if (const std::string bad = firstNonFinite(doc, ""); !bad.empty())
    throw InputError(bad, "not a finite number; the project was not written");
  return doc.dump(2) + "\n";
}

void writeProjectFile(const Project& project, const std::string& path) {
  std::string text;
  try {
    text = projectToJson(project);
  } catch (const InputError& e) {
    throw InputError(path + ": " + e.where(), "not a finite number; nothing was written, the previous file is unchanged");
  }
  writeFileAtomically(path, text);
}

}  // namespace finestra
