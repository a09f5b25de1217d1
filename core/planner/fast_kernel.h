#pragma once
// Allocation-free evaluation of all planner figures for the 4-state (electronic) manifolds, built on
// the closed forms of core/hamiltonian/linear4.h.
#include <array>

#include "core/crystal/frames.h"
#include "core/hamiltonian/linear4.h"
#include "core/model/centre_model.h"
#include "core/planner/figures.h"

namespace finestra {

class PlannerKernel {
public:
  /// Samples every selected class of `model`; the settings' drive direction is a lab vector.
  PlannerKernel(const CentreModel& model, const PlannerSettings& settings);

  /// Figures of every selected class for a field of `magnitudeT` along the unit crystal direction
  /// `directionCrystal`. Entries of unselected classes are left untouched. No heap allocation.
  void evaluate(const Vec3& directionCrystal, double magnitudeT, std::array<ClassFigures, kClassCount>& out) const;

  const PlannerSettings& settings() const { return settings_; }
  bool selected(int cls) const { return classes_[static_cast<std::size_t>(cls)].selected; }

private:
  struct ClassData {
    bool selected = false;
    LinearHamiltonian4 ground, excited;
    PauliForm4 groundForm, excitedForm;
    Matrix4c driveOperator = Matrix4c::Zero();  ///< (γ_S S + q γ_L L_z ẑ)·b̂ in the manifold basis
    Vec3 axisCrystal = Vec3::UnitZ();
    double groundGapAtZero = 0, excitedGapAtZero = 0;  ///< E2 − E1 at B = 0
  };
  struct GapResult {
    double gapGHz, atT;
  };
  GapResult smallestMiddleGap(const LinearHamiltonian4& h, const PauliForm4& form, const Vec3& direction,
                              double magnitudeT, double gapAtStart, double gapAtEnd) const;

  PlannerSettings settings_;
  std::array<ClassData, kClassCount> classes_;
  double dipoleRatio_ = 1;
  double linewidthGHz_ = 0;
  double freeElectronDrive_ = 0;  ///< γ_S / 2
};

}  // namespace finestra
