#pragma once
// The complete model of one centre in one sample: resolved parameters, frames, strain and
// detection conditions. Evaluates levels and optical lines of any orientation class at any field.
// A CentreModel is immutable once built, so it can be shared by worker threads as a snapshot.
#include <array>
#include <optional>
#include <string>
#include <vector>

#include "core/centre/presets.h"
#include "core/crystal/frames.h"
#include "core/hamiltonian/hamiltonian.h"
#include "core/model/populations.h"

namespace finestra {

/// Extra E-type strain set directly per manifold (defect frame, the same for every class).
struct EgStrain {
  double magnitudeGHz = 0;
  double angleDeg = 0;  ///< ε_Egx = |ε| cos α, ε_Egy = |ε| sin α

  bool operator==(const EgStrain&) const = default;
};

struct StrainSetting {
  Mat3 crystal = Mat3::Zero();  ///< symmetric strain tensor in crystal axes
  EgStrain extraGround, extraExcited;

  bool operator==(const StrainSetting&) const = default;
};

struct DetectionConditions {
  double temperatureK = 4.0;
  PopulationModel populations = PopulationModel::Thermal;
  Vec3 collectionLab = Vec3(0, 0, 1);
  std::optional<Vec3> analyserLab;  ///< none: unpolarised detection along collectionLab
  double extraBroadeningGHz = 0;    ///< inhomogeneous width added to every line's homogeneous FWHM
  bool phononSideband = false;      ///< PL spectra include the phonon sideband (Debye–Waller split)
  std::optional<double> bathT2StarS;  ///< bath-limited spin T2* set by the user (s), beside the phonon limit

  bool operator==(const DetectionConditions&) const = default;
};

struct ModelSetup {
  ResolvedCentre centre;
  LabFrame lab;
  StrainSetting strain;
  DetectionConditions conditions;
};

/// One optical line of one class: excited level `upper` → ground level `lower`.
struct OpticalLine {
  int upper = 0, lower = 0;
  double frequencyGHz = 0;          ///< absolute: ν_ZPL + E_u − E_g
  double intensity = 0;             ///< for the detection geometry, no populations
  std::array<double, 3> intensityCrystal{};  ///< |ê·d|² with ê along crystal x, y, z
  CVec3 amplitudeCrystal = CVec3::Zero();
  char parent = '?';                ///< A, B, C or D
  int subIndex = 0;                 ///< 1-based, by increasing frequency within the parent
  std::string label() const {
    std::string text(1, parent);  // appended, not concatenated: GCC 12 warns falsely on operator+ here
    text += std::to_string(subIndex);
    return text;
  }
};

struct ClassSolution {
  int cls = 0;
  ManifoldEigen ground, excited;
  std::vector<int> groundBranch, excitedBranch;  ///< 0 lower, 1 upper (followed from zero field)
  std::vector<OpticalLine> lines;                ///< ordered by upper then lower index
};

class CentreModel {
public:
  /// Validates the parameters (throws MissingValueError/InputError naming the key).
  explicit CentreModel(ModelSetup setup);

  const ModelSetup& setup() const { return setup_; }
  const ManifoldModel& manifold(Manifold m) const { return m == Manifold::Ground ? ground_ : excited_; }
  double zplGHz() const { return zplGHz_; }
  /// Lifetime-limited FWHM plus the user broadening (GHz): a temperature-free scale for margins.
  /// Per-line widths at the project's temperature come from core/thermal (lineFwhmGHz).
  double linewidthGHz() const;
  /// Thermal shift of the ZPL at the conditions' temperature (GHz), included in zplGHz(); 0 when
  /// the shift coefficient is 0 or unknown.
  double thermalZplShiftGHz() const { return thermalShiftGHz_; }
  /// Analyser unit vectors (crystal frame) of the detection geometry: one analyser, or two
  /// perpendicular to the collection direction for unpolarised detection.
  const std::array<Vec3, 2>& analysersCrystal() const { return analysers_; }
  int analyserCount() const { return analyserCount_; }

  /// Strain terms of manifold m for class `cls`, from the crystal strain (or `strainOverride`).
  StrainTerms strainFor(Manifold m, int cls, const Mat3* strainOverride = nullptr) const;

  /// Levels and lines of one class at a crystal-frame field; labels followed from zero field
  /// along the straight path 0 → B with `labelSteps` steps.
  ClassSolution solve(int cls, const Vec3& fieldCrystal, int labelSteps = 48) const;
  /// Same, strain tensor given explicitly (sweeps along strain).
  ClassSolution solve(int cls, const Vec3& fieldCrystal, const Mat3& strainCrystal, int labelSteps = 48) const;

  /// Levels only (no lines, no labels).
  ManifoldEigen levels(Manifold m, int cls, const Vec3& fieldCrystal, const Mat3* strainOverride = nullptr) const;
  /// Lines between given eigenpairs (no labels).
  std::vector<OpticalLine> lines(int cls, const ManifoldEigen& ground, const ManifoldEigen& excited) const;

private:
  ModelSetup setup_;
  ManifoldModel ground_, excited_;
  double zplGHz_ = 0;
  double thermalShiftGHz_ = 0;
  double dipoleRatio_ = 1;
  std::array<Vec3, 2> analysers_;
  int analyserCount_ = 2;
};

/// Assigns parent letters and sub-indices from the branches of the two manifolds
/// (A = upper→lower, B = upper→upper, C = lower→lower, D = lower→upper).
void labelLines(std::vector<OpticalLine>& lines, const std::vector<int>& groundBranch,
                const std::vector<int>& excitedBranch);

/// Branch of each level of manifold m at field B, following the levels by eigenvector overlap
/// along 0 → B in `steps` steps.
std::vector<int> branchesAtField(const CentreModel& model, Manifold m, int cls, const Vec3& fieldCrystal,
                                 const Mat3* strainOverride, int steps);

}  // namespace finestra
