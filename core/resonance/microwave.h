#pragma once
// Magnetic-dipole (microwave) transitions between the levels of one manifold of one orientation
// class, with the isotope's nuclear spin resolved (docs/physics.md, Hyperfine; docs/physics.md, Hamiltonian of one manifold).
#include <vector>

#include "core/model/centre_model.h"

namespace finestra {

/// How a transition changes the nuclear projection, judged from the dominant m_I of both levels.
enum class NuclearChange { NoNucleus, Preserving, Flipping };
const char* nuclearChangeName(NuclearChange change);

struct MicrowaveSettings {
  Vec3 driveLab = Vec3(1, 0, 0);        ///< microwave magnetic-field direction, lab frame
  Manifold manifold = Manifold::Ground;
};

/// Below this splitting (GHz) two levels count as degenerate: their eigenvectors, and so the
/// strength of a transition between them, are not defined (reported as undefined, NaN here).
inline constexpr double kDegenerateTransitionGHz = 1e-7;

/// One pair of levels (lower < upper, indices as in the engine's level list of the manifold).
/// Strengths are |⟨upper|V·b̂|lower⟩|² relative to (γ_S/2)², the value for a free electron spin
/// driven by a field perpendicular to its quantisation axis; `strength` is the coherent sum of the
/// parts, so it is not the sum of the three part strengths.
struct MicrowaveTransition {
  int lower = 0, upper = 0;
  double frequencyGHz = 0;  ///< E_upper − E_lower
  double strength = 0, spinPart = 0, orbitalPart = 0, nuclearPart = 0;
  double spinProjectionLower = 0, spinProjectionUpper = 0;        ///< ⟨S_z⟩, defect axis
  double nuclearProjectionLower = 0, nuclearProjectionUpper = 0;  ///< dominant m_I
  NuclearChange nuclearChange = NuclearChange::NoNucleus;
  double nuclearPurity = 1;  ///< product of both levels' dominant-m_I weights (1: pure)
  double populationLower = 0, populationUpper = 0;  ///< thermal, project temperature
};

struct ClassMicrowave {
  int cls = 0;
  VectorXr levelsGHz;
  std::vector<MicrowaveTransition> transitions;  ///< every pair, by increasing frequency
};

/// Transitions of manifold `settings.manifold` for class `cls` at the crystal-frame field.
/// Throws InputError (key "--drive-lab") for a zero or non-finite drive direction.
ClassMicrowave microwaveTransitions(const CentreModel& model, int cls, const Vec3& fieldCrystal,
                                    const MicrowaveSettings& settings);

/// The same for several classes (run in parallel).
std::vector<ClassMicrowave> microwaveTransitions(const CentreModel& model, const std::vector<int>& classes,
                                                 const Vec3& fieldCrystal, const MicrowaveSettings& settings);

}  // namespace finestra
