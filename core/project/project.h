#pragma once
// The project: everything a user sets up, as plain value types (docs/architecture.md, Project).
// Stored by core/io/project_file.h; the engine is built from it with makeModelSetup()
// (core/project/model_setup.h); magnet settings become true fields only through
// core/project/field_semantics.h. Every part compares with ==, so a change can be found by
// comparing parts.
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "core/model/centre_model.h"
#include "core/model/zpl_anchor.h"
#include "core/crystal/magnet_calibration.h"
#include "core/project/measured_spectrum.h"
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

  bool operator==(const CentreChoice&) const = default;
};

struct SampleSetting {
  Vec3 normal = Vec3(0, 0, 1);
  Vec3 inPlaneX = Vec3(1, 1, 0);

  bool operator==(const SampleSetting&) const = default;
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

  bool operator==(const FieldSetting&) const = default;
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

  bool operator==(const SweepSpec&) const = default;
};

struct PinnedAssignment {
  int cls = 0, upper = 0, lower = 0;

  bool operator==(const PinnedAssignment&) const = default;
};

struct MeasuredPeak {
  double position = 0;
  SpectralUnit unit = SpectralUnit::THz;
  double sigma = 0;  ///< uncertainty in the same unit (> 0)
  std::optional<Vec3> analyserLab;
  std::optional<PinnedAssignment> assign;

  bool operator==(const MeasuredPeak&) const = default;
};

struct MeasurementSet {
  std::string name;
  double temperatureK = 4.0;
  FieldSetting field;
  std::vector<MeasuredPeak> peaks;

  bool operator==(const MeasurementSet&) const = default;
};

struct FitSettings {
  std::vector<std::string> free;
  int starts = 8;

  bool operator==(const FitSettings&) const = default;
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

  bool operator==(const Project&) const = default;
};

/// Symmetric strain tensor from the six components as the project stores them (xx, yy, zz, yz, zx, xy).
Mat3 strainFromComponents(double xx, double yy, double zz, double yz, double zx, double xy);

}  // namespace finestra
