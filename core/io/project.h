#pragma once
// The project: everything a user sets up, as stored in the project file (architecture.md,
// "finestra-project" version 1). Plain data; the engine is built from it with makeModelSetup().
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "core/model/centre_model.h"
#include "core/model/zpl_anchor.h"
#include "core/crystal/magnet_calibration.h"
#include "core/io/spectrum_csv.h"
#include "core/units/spectral_units.h"

namespace finestra {

inline constexpr int kProjectVersion = 1;

struct CentreChoice {
  std::string preset = "SiV-";
  std::optional<std::string> isotope;
  std::map<std::string, double> overrides;  ///< parameter key → value (user-set)
  /// Parameter key → value the user explicitly assumes (e.g. excited hyperfine = 0): used like an
  /// override but carried with status "assumed" into every output that reports provenance.
  std::map<std::string, double> assumed;
  std::optional<ZplAnchor> zplAnchor;  ///< solve the ZPL centroid from a named line's wavelength
};

struct SampleSetting {
  Vec3 normal = Vec3(0, 0, 1);
  Vec3 inPlaneX = Vec3(1, 1, 0);
};

/// A magnet setting as the user gave it: magnitude and lab angles, or a vector in lab or crystal axes.
struct FieldSetting {
  enum class Form { Angles, VectorLab, VectorCrystal };
  Form form = Form::Angles;
  double magnitudeT = 0, polarDeg = 0, azimuthDeg = 0;  ///< used with Form::Angles
  Vec3 vector = Vec3::Zero();                           ///< used with the vector forms (T)

  Vec3 labVector(const LabFrame& lab) const;
  Vec3 crystalVector(const LabFrame& lab) const;
  static FieldSetting fromAngles(double magnitudeT, double polarDeg, double azimuthDeg);
};

enum class SweepKind { Magnitude, Angle, Strain, Temperature };

/// A path through field or strain space. Magnitude: the project's field direction, |B| from..to (T).
/// Angle: |B| of the project's field, direction rotated in the lab plane ⟂ planeNormalLab starting
/// at startLab (projected into the plane), angle from..to (deg). Strain: crystal strain
/// project + t·(strainTo − project) for t from..to. Temperature: the project's field and strain,
/// temperature from..to (K); levels stay, rates and linewidths change.
struct SweepSpec {
  std::string name;
  SweepKind kind = SweepKind::Magnitude;
  double from = 0, to = 1;
  int points = 201;
  Vec3 planeNormalLab = Vec3(0, 1, 0);
  Vec3 startLab = Vec3(0, 0, 1);
  Mat3 strainTo = Mat3::Zero();
};

struct PinnedAssignment {
  int cls = 0, upper = 0, lower = 0;
};

struct MeasuredPeak {
  double position = 0;
  SpectralUnit unit = SpectralUnit::THz;
  double sigma = 0;  ///< uncertainty in the same unit (> 0)
  std::optional<Vec3> analyserLab;
  std::optional<PinnedAssignment> assign;
};

struct MeasurementSet {
  std::string name;
  double temperatureK = 4.0;
  FieldSetting field;
  std::vector<MeasuredPeak> peaks;
};

struct FitSettings {
  std::vector<std::string> free;
  int starts = 8;
};

struct Project {
  CentreChoice centre;
  SampleSetting sample;
  FieldSetting field;  ///< as set on the magnet (nominal)
  MagnetCalibration magnet;  ///< applied to every magnet setting: the project field, sweeps, measurements
  StrainSetting strain;
  DetectionConditions conditions;
  std::vector<int> classes{0, 1, 2, 3};
  std::vector<SweepSpec> sweeps;
  std::vector<MeasurementSet> measurements;
  FitSettings fit;
  /// An imported measured spectrum, kept in the project so that it survives save and open.
  std::optional<MeasuredSpectrum> measuredSpectrum;
  std::string description;  ///< free text, e.g. the scenario of a demo project
};

/// Parses a project document. `origin` (a file name) prefixes every error message.
Project parseProject(const std::string& text, const std::string& origin);
/// Reads a project file; errors name the file (and line for syntax errors, key path otherwise).
Project readProjectFile(const std::string& path);
/// Serialises to the version-1 JSON layout (pretty-printed). A non-finite number (JSON has none)
/// throws InputError naming its key path.
std::string projectToJson(const Project& project);
/// Writes atomically: a temporary file in the same folder, flushed, then renamed over `path`.
/// On failure the previous file is untouched and InputError names the path.
void writeProjectFile(const Project& project, const std::string& path);
/// Writes text atomically (see writeProjectFile).
void writeFileAtomically(const std::string& path, const std::string& text);
/// Reads a whole file; InputError naming the path if it cannot be read.
std::string readTextFile(const std::string& path);

/// The true field (crystal frame, T) of the project's magnet setting: the calibration applied.
Vec3 projectFieldCrystal(const Project& project, const LabFrame& lab);

/// Resolves the centre and frames; throws InputError/MissingValueError naming the key at fault.
ModelSetup makeModelSetup(const Project& project);

/// True field (crystal frame, T; the magnet calibration applied to the nominal sweep path) at
/// parameter value `x` of a sweep, and the strain there.
Vec3 sweepField(const Project& project, const SweepSpec& sweep, const LabFrame& lab, double x);
Mat3 sweepStrain(const Project& project, const SweepSpec& sweep, double x);

/// Symmetric tensor from the six components (xx, yy, zz, yz, zx, xy).
Mat3 strainFromComponents(double xx, double yy, double zz, double yz, double zx, double xy);

}  // namespace finestra
