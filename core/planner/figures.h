#pragma once
// Figures of merit of one orientation class at one magnet setting (docs/physics.md, Planner figures) and the
// settings that define them. Plain data shared by the fast map kernel, the reference evaluation,
// the constraints and the reports.
#include <array>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "core/common/types.h"

namespace finestra {

/// Which optical lines are "the chosen lines" of a class. Both families end on the qubit levels
/// g0, g1 (the two lowest ground levels): C starts on the lower excited pair u0, u1, A on the upper
/// pair u2, u3. Levels are taken in energy order at the setting (see PlannerFigures::groundGapGHz
/// for a warning when branches came close on the way from zero field).
enum class LineFamily { C, A };

struct PlannerSettings {
  double magnitudeT = 0.5;             ///< field magnitude at which the figures are evaluated
  Vec3 driveLab = Vec3(1, 0, 0);       ///< microwave field direction b̂ in the lab frame
  LineFamily family = LineFamily::C;
  std::vector<int> classes{0, 1, 2, 3};///< selected classes (others are ignored everywhere)
  int gapScanSamples = 10;             ///< coarse samples of 0..|B| for the smallest level gap
  int gapRefineSteps = 30;             ///< golden-section steps around an interior coarse minimum
};

/// Figures of one class. Cyclicity is capped at kCyclicityCap (an exactly forbidden spin flip).
/// Drive and cyclicity are NaN where the pair of levels they refer to is degenerate.
struct ClassFigures {
  double qubitGHz = 0;          ///< E_g1 − E_g0
  double driveGHzPerT = 0;      ///< |⟨g0|(γ_S S + q γ_L L_z ẑ)·b̂|g1⟩| per tesla of microwave field
  double driveFraction = 0;     ///< driveGHzPerT / (γ_S / 2), the free-electron value
  double cyclicity = 0;         ///< worst of the two chosen excited levels: |d_conserving|²/|d_flip|²
  double separationLinewidths = 0;  ///< smallest |ν_chosen − ν_other class| / FWHM (inf: no other class)
  double groundGapGHz = 0;      ///< min over 0..|B| of E_g2 − E_g1 (branch anticrossing warning)
  double groundGapFieldT = 0;   ///< |B| where that minimum lies
  double excitedGapGHz = 0;     ///< the same for the excited manifold, E_u2 − E_u1
  double excitedGapFieldT = 0;
  double axisAngleDeg = 0;      ///< angle between B and the class axis (as listed, 0..180)
};

inline constexpr double kCyclicityCap = 1e15;
/// Splittings below this (GHz) count as degenerate: drive and cyclicity are then NaN (undefined).
inline constexpr double kDegenerateGHz = 1e-9;

/// The figures a constraint, an objective or a map can name. Keys are file/CLI names.
enum class FigureId {
  QubitGHz, DriveGHzPerT, DriveFraction, Cyclicity, SeparationLinewidths, GroundGapGHz,
  ExcitedGapGHz, AxisAngleDeg, Count
};
inline constexpr int kFigureCount = static_cast<int>(FigureId::Count);

struct FigureInfo {
  FigureId id;
  std::string_view key;      ///< e.g. "qubit_GHz"
  std::string_view meaning;  ///< one line for tables and tooltips
};
const std::array<FigureInfo, kFigureCount>& figureTable();
const FigureInfo& figureInfo(FigureId id);
/// Finds a figure by key; throws InputError naming `where` and listing the valid keys.
FigureId parseFigure(std::string_view key, const std::string& where);
double figureValue(const ClassFigures& f, FigureId id);

std::string lineFamilyText(LineFamily f);
LineFamily parseLineFamily(std::string_view text, const std::string& where);

}  // namespace finestra
