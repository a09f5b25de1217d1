#pragma once
// Straightforward evaluation of the planner figures with the general (dynamic-size) solver and a
// dense magnitude scan. It is slow and independent of the fast kernel's closed forms: the tests
// use it as the brute-force check, and reports use it for the hyperfine-resolved spin transitions.
#include <array>
#include <vector>

#include "core/model/centre_model.h"
#include "core/planner/figures.h"

namespace finestra {

/// Figures of every selected class (unselected entries default), with `gapSteps` uniform samples
/// of 0..|B| for the level-gap figures.
std::array<ClassFigures, kClassCount> referenceFigures(const CentreModel& model, const PlannerSettings& settings,
                                                       const Vec3& directionCrystal, double magnitudeT,
                                                       int gapSteps = 400);

/// One magnetic-dipole transition inside the lower ground branch with the nuclear spin resolved.
struct SpinTransition {
  int lower = 0, upper = 0;    ///< indices into the ground levels of the full (hyperfine) Hamiltonian
  double frequencyGHz = 0;     ///< E_upper − E_lower
  double driveGHzPerT = 0;     ///< |⟨lower|(γ_S S + q γ_L L_z ẑ)·b̂ ⊗ 1_N|upper⟩|
};

/// Transitions between the 2(2I+1) lowest ground levels of class `cls` whose drive is at least
/// `relativeThreshold` of the strongest, sorted by frequency. Without an isotope this is the qubit
/// transition alone (when it is allowed).
std::vector<SpinTransition> hyperfineSpinTransitions(const CentreModel& model, const PlannerSettings& settings,
                                                     int cls, const Vec3& fieldCrystal,
                                                     double relativeThreshold = 1e-3);

}  // namespace finestra
