// Reading the version-1 project file (docs/architecture.md, Project file) strictly: unknown keys, wrong types and
// non-finite numbers are errors naming the key path.
#include <cmath>

#include "core/centre/parameter_table.h"
#include "core/common/error_location.h"
#include "core/common/errors.h"
#include "core/common/limits.h"
#include "core/io/json_reader.h"
#include "core/io/measured_validity.h"
#include "core/io/project_file.h"
#include "core/io/text_file.h"

namespace finestra {
namespace {
using nlohmann::json;

// A number at `key` of `r`, checked against the table entry `tableKey` (message names the key).
double checkedNumber(const JsonObjectReader& r, const char* key, const char* tableKey) {
  const double v = r.number(key);
  requireInRange(quantity(tableKey), v, r.keyPath(key));
  return v;
}

double checkedNumber(const JsonObjectReader& r, const char* key, const char* tableKey, double fallback) {
  return r.has(key) ? checkedNumber(r, key, tableKey) : fallback;
}

ZplAnchor readZplAnchor(const JsonObjectReader& r) {
  r.allowOnly({"line", "wavelength_nm", "medium", "temperature_K"});
  ZplAnchor a;
  const std::string line = r.string("line");
  if (line.size() != 1 || line[0] < 'A' || line[0] > 'D') throw InputError(r.keyPath("line"), "expected \"A\", \"B\", \"C\" or \"D\"");
  a.line = line[0];
  a.wavelengthNm = checkedNumber(r, "wavelength_nm", "centre.zpl_anchor.wavelength_nm");
  const std::string medium = r.string("medium", "vacuum");
  if (medium != "vacuum" && medium != "air") throw InputError(r.keyPath("medium"), "expected \"vacuum\" or \"air\"");
  a.air = medium == "air";
  a.temperatureK = checkedNumber(r, "temperature_K", "centre.zpl_anchor.temperature_K", 4.0);
  return a;
}

CentreChoice readCentre(const JsonObjectReader& r) {
  r.allowOnly({"preset", "isotope", "parameters", "assumed", "zpl_anchor"});
  CentreChoice c;
  c.preset = r.string("preset");
  c.isotope = r.optionalString("isotope");
  for (const char* section : {"parameters", "assumed"}) {
    if (!r.has(section)) continue;
    const JsonObjectReader params = r.object(section);
    auto& target = std::string(section) == "parameters" ? c.overrides : c.assumed;
    for (const auto& [key, value] : r.raw(section).items()) {
      if (!findParam(key)) throw InputError(params.keyPath(key), "unknown parameter key");
      target[key] = finiteNumber(value, params.keyPath(key));
      requireInRange(quantity("centre.parameters." + key), target[key], params.keyPath(key));
    }
  }
  if (!r.isNull("zpl_anchor")) c.zplAnchor = readZplAnchor(r.object("zpl_anchor"));
  return c;
}

SampleSetting readSample(const JsonObjectReader& r) {
  r.allowOnly({"normal", "in_plane_x"});
  return {r.vec3("normal"), r.vec3("in_plane_x")};
}

// Names are copied into every row of a report: a stated limit keeps a pasted megabyte out.
void requireNameLength(const std::string& name, const std::string& where) {
  if (name.size() > limits::kMaxNameBytes)
    throw InputError(where, "longer than " + std::to_string(limits::kMaxNameBytes) + " bytes");
}

// The field limit CentreModel enforces, checked here so that the message names the key and file.
void requireFieldInRange(double magnitudeT, const std::string& where) {
  requireInRange(quantity("field.magnitude_T"), magnitudeT, where);
}

FieldSetting readField(const JsonObjectReader& r) {
  r.allowOnly({"magnitude_T", "polar_deg", "azimuth_deg", "vector_lab_T", "vector_crystal_T"});
  const int forms = int(r.has("magnitude_T")) + int(r.has("vector_lab_T")) + int(r.has("vector_crystal_T"));
  if (forms != 1)
    throw InputError(r.keyPath(""), "give exactly one of magnitude_T (with polar_deg, azimuth_deg), "
                                    "vector_lab_T or vector_crystal_T");
  FieldSetting f;
  if (r.has("magnitude_T")) {
    f.form = FieldSetting::Form::Angles;
    f.magnitudeT = checkedNumber(r, "magnitude_T", "field.magnitude_T");
    f.polarDeg = checkedNumber(r, "polar_deg", "field.polar_deg", 0.0);
    f.azimuthDeg = checkedNumber(r, "azimuth_deg", "field.azimuth_deg", 0.0);
  } else {
    // Angles belong to magnitude_T only; next to a vector they would be silently ignored.
    for (const char* angle : {"polar_deg", "azimuth_deg"})
      if (r.has(angle))
        throw InputError(r.keyPath(angle), "is used only with magnitude_T; the field here is given as a vector");
  }
  if (r.has("vector_lab_T")) {
    f.form = FieldSetting::Form::VectorLab;
    f.vector = r.vec3("vector_lab_T");
    requireFieldInRange(f.vector.norm(), r.keyPath("vector_lab_T"));
  } else if (r.has("vector_crystal_T")) {
    f.form = FieldSetting::Form::VectorCrystal;
    f.vector = r.vec3("vector_crystal_T");
    requireFieldInRange(f.vector.norm(), r.keyPath("vector_crystal_T"));
  }
  return f;
}

Mat3 readTensor(const JsonObjectReader& r) {
  r.allowOnly({"xx", "yy", "zz", "yz", "zx", "xy"});
  auto component = [&](const char* key) {
    return checkedNumber(r, key, ("strain.crystal." + std::string(key)).c_str(), 0.0);
  };
  return strainFromComponents(component("xx"), component("yy"), component("zz"), component("yz"), component("zx"),
                              component("xy"));
}

// `tableKeyPrefix` is "strain.eg_ground" or "strain.eg_excited".
EgStrain readEg(const JsonObjectReader& r, const std::string& tableKeyPrefix) {
  r.allowOnly({"magnitude_GHz", "angle_deg"});
  const std::string magnitudeKey = tableKeyPrefix + ".magnitude_GHz";
  const std::string angleKey = tableKeyPrefix + ".angle_deg";
  return {checkedNumber(r, "magnitude_GHz", magnitudeKey.c_str()),
          checkedNumber(r, "angle_deg", angleKey.c_str(), 0.0)};
}

StrainSetting readStrain(const JsonObjectReader& r) {
  r.allowOnly({"crystal", "eg_ground", "eg_excited"});
  StrainSetting s;
  if (r.has("crystal")) s.crystal = readTensor(r.object("crystal"));
  if (r.has("eg_ground")) s.extraGround = readEg(r.object("eg_ground"), "strain.eg_ground");
  if (r.has("eg_excited")) s.extraExcited = readEg(r.object("eg_excited"), "strain.eg_excited");
  return s;
}

DetectionConditions readConditions(const JsonObjectReader& r) {
  r.allowOnly({"temperature_K", "populations", "collection_lab", "analyser_lab", "broadening_GHz", "phonon_sideband",
               "bath_t2star_s"});
  DetectionConditions c;
  c.temperatureK = checkedNumber(r, "temperature_K", "conditions.temperature_K", c.temperatureK);
  const std::string pop = r.string("populations", "thermal");
  if (pop == "thermal") c.populations = PopulationModel::Thermal;
  else if (pop == "equal") c.populations = PopulationModel::Equal;
  else throw InputError(r.keyPath("populations"), "expected \"thermal\" or \"equal\", found \"" + pop + "\"");
  if (r.has("collection_lab")) c.collectionLab = r.vec3("collection_lab");
  c.analyserLab = r.optionalVec3("analyser_lab");
  c.extraBroadeningGHz = checkedNumber(r, "broadening_GHz", "conditions.broadening_GHz", 0.0);
  c.phononSideband = r.boolean("phonon_sideband", false);
  if (!r.isNull("bath_t2star_s")) c.bathT2StarS = checkedNumber(r, "bath_t2star_s", "conditions.bath_t2star_s");
  return c;
}

std::vector<int> readClasses(const json& v, const std::string& path) {
  if (!v.is_array() || v.empty()) throw InputError(path, "expected a non-empty array of class numbers 0..3");
  std::vector<int> out;
  for (std::size_t i = 0; i < v.size(); ++i) {
    const std::string p = path + "[" + std::to_string(i) + "]";
    if (!v[i].is_number_integer()) throw InputError(p, "expected an integer 0..3");
    const auto c = v[i].get<long long>();
    if (c < 0 || c > 3) throw InputError(p, "orientation class must be 0..3");
    for (int seen : out)
      if (seen == c) throw InputError(p, "class listed twice");
    out.push_back(static_cast<int>(c));
  }
  return out;
}

SweepSpec readSweep(const JsonObjectReader& r) {
  r.allowOnly({"name", "kind", "from", "to", "points", "plane_normal_lab", "start_lab", "strain_to"});
  SweepSpec s;
  s.name = r.string("name", "");
  requireNameLength(s.name, r.keyPath("name"));
  const std::string kind = r.string("kind");
  if (kind == "magnitude") s.kind = SweepKind::Magnitude;
  else if (kind == "angle") s.kind = SweepKind::Angle;
  else if (kind == "strain") s.kind = SweepKind::Strain;
  else if (kind == "temperature") s.kind = SweepKind::Temperature;
  else throw InputError(r.keyPath("kind"), "expected \"magnitude\", \"angle\", \"strain\" or \"temperature\"");
  s.from = r.number("from");
  s.to = r.number("to");
  s.points = r.integer("points", s.points);
  requireInRange(quantity("sweeps.points"), s.points, r.keyPath("points"));
  if (s.kind == SweepKind::Magnitude && (s.from < 0 || s.to < 0))
    throw InputError(r.keyPath("from"), "field magnitudes must not be negative");
  if (s.kind == SweepKind::Temperature) {
    requireInRange(quantity("conditions.temperature_K"), s.from, r.keyPath("from"));
    requireInRange(quantity("conditions.temperature_K"), s.to, r.keyPath("to"));
  }
  if (s.kind == SweepKind::Magnitude) {
    requireFieldInRange(s.from, r.keyPath("from"));
    requireFieldInRange(s.to, r.keyPath("to"));
  }
  if (r.has("plane_normal_lab")) s.planeNormalLab = r.vec3("plane_normal_lab");
  if (r.has("start_lab")) s.startLab = r.vec3("start_lab");
  if (s.kind == SweepKind::Angle) {
    if (s.planeNormalLab.norm() < 1e-12) throw InputError(r.keyPath("plane_normal_lab"), "vector is zero");
    const Vec3 inPlane = s.startLab - s.startLab.dot(s.planeNormalLab.normalized()) * s.planeNormalLab.normalized();
    if (inPlane.norm() < 1e-9) throw InputError(r.keyPath("start_lab"), "must not be parallel to plane_normal_lab");
  }
  if (r.has("strain_to")) s.strainTo = readTensor(r.object("strain_to"));
  else if (s.kind == SweepKind::Strain) throw InputError(r.keyPath("strain_to"), "missing (needed by a strain sweep)");
  return s;
}

MeasuredPeak readPeak(const JsonObjectReader& r) {
  r.allowOnly({"position", "unit", "sigma", "analyser_lab", "assign"});
  MeasuredPeak p;
  p.unit = parseSpectralUnit(r.string("unit"), r.keyPath("unit"));
  p.position = r.number("position");
  try {
    checkMeasuredPosition(p.position, p.unit, "");
  } catch (const InputError& e) {
    throw InputError(r.keyPath("position"), e.message());
  }
  p.sigma = r.number("sigma");
  checkPeakSigma(p.sigma, p.position, p.unit, r.keyPath("sigma"));
  p.analyserLab = r.optionalVec3("analyser_lab");
  if (p.analyserLab && p.analyserLab->norm() < 1e-12) throw InputError(r.keyPath("analyser_lab"), "vector is zero");
  if (!r.isNull("assign")) {
    const JsonObjectReader a = r.object("assign");
    a.allowOnly({"class", "upper", "lower"});
    PinnedAssignment pin{a.integer("class"), a.integer("upper"), a.integer("lower")};
    if (pin.cls < 0 || pin.cls > 3) throw InputError(a.keyPath("class"), "orientation class must be 0..3");
    if (pin.upper < 0) throw InputError(a.keyPath("upper"), "level index must not be negative");
    if (pin.lower < 0) throw InputError(a.keyPath("lower"), "level index must not be negative");
    p.assign = pin;
  }
  return p;
}

MeasurementSet readMeasurement(const JsonObjectReader& r) {
  r.allowOnly({"name", "temperature_K", "field", "peaks"});
  MeasurementSet m;
  m.name = r.string("name", "");
  requireNameLength(m.name, r.keyPath("name"));
  m.temperatureK = checkedNumber(r, "temperature_K", "conditions.temperature_K", m.temperatureK);
  m.field = readField(r.object("field"));
  const json& peaks = r.raw("peaks");
  if (!peaks.is_array()) throw InputError(r.keyPath("peaks"), "expected an array");
  for (std::size_t i = 0; i < peaks.size(); ++i)
    m.peaks.push_back(readPeak(JsonObjectReader(peaks[i], r.keyPath("peaks") + "[" + std::to_string(i) + "]")));
  return m;
}

FitSettings readFit(const JsonObjectReader& r) {
  r.allowOnly({"free", "starts"});
  FitSettings f;
  if (r.has("free")) {
    const json& free = r.raw("free");
    if (!free.is_array()) throw InputError(r.keyPath("free"), "expected an array of parameter names");
    for (std::size_t i = 0; i < free.size(); ++i) {
      if (!free[i].is_string()) throw InputError(r.keyPath("free") + "[" + std::to_string(i) + "]", "expected a string");
      f.free.push_back(free[i].get<std::string>());
    }
  }
  f.starts = r.integer("starts", f.starts);
  requireInRange(quantity("fit.starts"), f.starts, r.keyPath("starts"));
  return f;
}

// Numbers of a JSON array at `path`, each finite.
std::vector<double> readNumbers(const json& arr, const std::string& path) {
  if (!arr.is_array()) throw InputError(path, "expected an array of numbers");
  std::vector<double> out;
  out.reserve(arr.size());
  for (std::size_t i = 0; i < arr.size(); ++i) out.push_back(finiteNumber(arr[i], path + "[" + std::to_string(i) + "]"));
  return out;
}

MagnetCalibration readMagnet(const JsonObjectReader& r) {
  r.allowOnly({"field_scale", "tilt_deg", "tilt_azimuth_deg"});
  MagnetCalibration m;
  m.fieldScale = checkedNumber(r, "field_scale", "magnet.field_scale", m.fieldScale);
  m.tiltDeg = checkedNumber(r, "tilt_deg", "magnet.tilt_deg", m.tiltDeg);
  m.tiltAzimuthDeg = checkedNumber(r, "tilt_azimuth_deg", "magnet.tilt_azimuth_deg", m.tiltAzimuthDeg);
  return m;
}

MeasuredSpectrum readMeasuredSpectrum(const JsonObjectReader& r) {
  r.allowOnly({"name", "unit", "position", "signal"});
  MeasuredSpectrum m;
  m.name = r.string("name", "");
  requireNameLength(m.name, r.keyPath("name"));
  m.unit = parseSpectralUnit(r.string("unit"), r.keyPath("unit"));
  m.position = readNumbers(r.raw("position"), r.keyPath("position"));
  m.signal = readNumbers(r.raw("signal"), r.keyPath("signal"));
  if (m.position.size() != m.signal.size())
    throw InputError(r.keyPath("signal"), "has " + std::to_string(m.signal.size()) + " values but position has " +
                                              std::to_string(m.position.size()));
  if (m.position.size() < 2) throw InputError(r.keyPath("position"), "needs at least two points");
  for (std::size_t i = 0; i < m.position.size(); ++i)
    checkMeasuredPosition(m.position[i], m.unit, r.keyPath("position") + "[" + std::to_string(i) + "]");
  return m;
}

template <typename Item, typename ReadOne>
std::vector<Item> readArray(const JsonObjectReader& top, const char* key, ReadOne readOne) {
  std::vector<Item> out;
  if (top.isNull(key)) return out;
  const json& arr = top.raw(key);
  if (!arr.is_array()) throw InputError(top.keyPath(key), "expected an array");
  for (std::size_t i = 0; i < arr.size(); ++i)
    out.push_back(readOne(JsonObjectReader(arr[i], top.keyPath(key) + "[" + std::to_string(i) + "]")));
  return out;
}

Project readDocument(const json& doc) {
  const JsonObjectReader top(doc, "");
  // Format and version first: a newer file may carry keys this version does not know, and the user
  // needs to hear "newer version", not "unknown key".
  if (top.string("format") != "finestra-project")
    throw InputError("format", "not a Finestra project (expected \"finestra-project\")");
  const int version = top.integer("version");
  if (version > kProjectVersion)
    throw InputError("version", "file version " + std::to_string(version) +
                                    " is newer than this Finestra reads (version " + std::to_string(kProjectVersion) +
                                    "); open it with a newer Finestra");
  if (version < 1) throw InputError("version", "must be 1");
  top.allowOnly({"format", "version", "description", "centre", "sample", "field", "strain", "conditions",
                 "classes", "sweeps", "measurements", "fit", "measured_spectrum", "magnet"});
  Project p;
  p.description = top.string("description", "");
  p.centre = readCentre(top.object("centre"));
  if (top.has("sample")) p.sample = readSample(top.object("sample"));
  if (top.has("field")) p.field = readField(top.object("field"));
  if (!top.isNull("magnet")) p.magnet = readMagnet(top.object("magnet"));
  if (top.has("strain")) p.strain = readStrain(top.object("strain"));
  if (top.has("conditions")) p.conditions = readConditions(top.object("conditions"));
  if (top.has("classes")) p.classes = readClasses(top.raw("classes"), "classes");
  p.sweeps = readArray<SweepSpec>(top, "sweeps", readSweep);
  p.measurements = readArray<MeasurementSet>(top, "measurements", readMeasurement);
  if (!top.isNull("fit")) p.fit = readFit(top.object("fit"));
  if (!top.isNull("measured_spectrum")) p.measuredSpectrum = readMeasuredSpectrum(top.object("measured_spectrum"));
  (void)LabFrame(p.sample.normal, p.sample.inPlaneX, "sample");  // reject bad axes now
  return p;
}

}  // namespace

Project parseProject(const std::string& text, const std::string& origin) {
  const json doc = parseJsonStrict(text, origin);
  try {
    return readDocument(doc);
  } catch (const InputError& e) {
    throw locatedIn(e, origin);
  } catch (const json::exception& e) {
    throw InputError(origin, e.what());
  }
}

Project readProjectFile(const std::string& path) { return parseProject(readTextFile(path), path); }

}  // namespace finestra
