#pragma once
// Allocation-free evaluation of all planner figures for the 4-state (electronic) manifolds.
//
// The 4×4 Hamiltonian of a manifold is linear in B (physics.md §3), so it is sampled once per class
// through the public electronicHamiltonian() and then rebuilt at any field as a fixed-size linear
// combination. The anticrossing scan over 0..|B| needs only eigenvalues; for it the Hamiltonian is
// written in Pauli components, H = e0 + o·σ⊗1 + 1⊗b·s + c σ_y⊗s_z, whose characteristic polynomial
// is the depressed quartic (x−e0)⁴ − 2S(x−e0)² − 8c o_y b_z (x−e0) + S² − 4P with
// S = |o|² + |b|² + c², P = |o|²|b|² + c²(o_y² + b_z²) (derived in the comment of quarticLevels;
// checked against the self-adjoint solver in tests/core/planner_kernel_test.cpp).
#include <array>

#include "core/crystal/frames.h"
#include "core/model/centre_model.h"
#include "core/planner/figures.h"

namespace finestra {

/// H(B) = constant + Σ_c B_c perTesla[c] with B in crystal axes (exact for the electronic 4×4).
struct LinearHamiltonian4 {
  Matrix4c constant = Matrix4c::Zero();
  std::array<Matrix4c, 3> perTesla{Matrix4c::Zero(), Matrix4c::Zero(), Matrix4c::Zero()};

  static LinearHamiltonian4 sample(const ManifoldModel& m, const StrainTerms& s, const Mat3& defectFrame);
  void at(const Vec3& fieldCrystal, Matrix4c& out) const;
};

/// Pauli components of a LinearHamiltonian4: each of e0, o (σ_x, σ_y, σ_z), b (s_x, s_y, s_z), c
/// is value + gradient·B. `closedForm` is false when any other component is present; the quartic
/// then does not apply and the kernel falls back to the numerical solver.
struct PauliForm4 {
  bool closedForm = false;
  std::array<double, 8> value{};   ///< e0, ox, oy, oz, bx, by, bz, c at B = 0
  std::array<Vec3, 8> gradient{};  ///< d(component)/dB_crystal

  static PauliForm4 fromLinear(const LinearHamiltonian4& h);
};

/// Ascending eigenvalues from the closed-form quartic. Accurate to ~1e-8 of the manifold's energy
/// scale: good for gaps between branches, not for the small qubit splitting.
Vector4r quarticLevels(const PauliForm4& form, const Vec3& fieldCrystal);
/// E2 − E1 (the gap between the lower and the upper pair of levels) from the same quartic.
double quarticMiddleGap(const PauliForm4& form, const Vec3& fieldCrystal);

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
