#pragma once
// Closed-form strain estimate from the four zero-field lines A, B, C, D (docs/physics.md, Strain from the
// zero-field lines).
//
// With E_m = a1g_m ± Δ_m/2 in each manifold, the lines are
//   A = c + Δu/2 + Δg/2,  B = c + Δu/2 − Δg/2,  C = c − Δu/2 + Δg/2,  D = c − Δu/2 − Δg/2,
// c = ν_ZPL + a1g_u − a1g_g. Weighted least squares gives c, Δg, Δu with their covariance; the
// single remaining combination A − B − C + D (= (A−B) − (C−D) = (A−C) − (B−D)) must vanish and is
// reported as the consistency check. Then |ε_Eg,m| = √(Δ_m² − λ_m²)/2 (Meesala et al., PRB 97,
// 205444 (2018), splitting formula as recalled), the ratio |ε_u|/|ε_g| is compared with d_u/d_g
// (pure d-type strain) and f_u/f_g (pure f-type), and the shift of c from the preset ZPL gives
// the A1g part. λ_m, d, f and t are taken as exact (the presets give no uncertainty for them).
#include <array>

#include "core/hamiltonian/manifold_model.h"

namespace finestra {

struct ZeroFieldLines {
  std::array<double, 4> frequencyGHz{};  ///< absolute, order A, B, C, D
  std::array<double, 4> sigmaGHz{};
};

/// A number with its standard error; NaN error when not defined (then see upperLimit).
struct Reading {
  double value = 0;
  double standardError = 0;
  double upperLimit = 0;  ///< 2σ upper limit when the value sits at a physical bound (else = value)
};

struct StrainReading {
  Reading fromGround, fromExcited, combined;  ///< dimensionless strain magnitude
  double ratioExpected = 0;                    ///< |ε_u|/|ε_g| this assumption predicts
  double ratioPull = 0;                        ///< (measured − expected)/σ
};

struct ZeroFieldStrainEstimate {
  Reading deltaG, deltaU, centroidGHz;   ///< least-squares splittings (GHz) and centroid c
  double deltaCorrelation = 0;           ///< correlation of Δg and Δu
  Reading deltaGFromAB, deltaGFromCD, deltaUFromAC, deltaUFromBD;
  Reading mismatchGHz;                   ///< A − B − C + D
  double mismatchPull = 0;               ///< mismatch / its σ
  Reading egGroundGHz, egExcitedGHz;     ///< |ε_Eg,g|, |ε_Eg,u|
  Reading ratioExcitedToGround;          ///< |ε_Eg,u| / |ε_Eg,g| (NaN error if |ε_g| = 0)
  StrainReading pureD;                   ///< |(ε_xx−ε_yy, −2ε_xy)| in the defect frame
  StrainReading pureF;                   ///< |(ε_zx, ε_yz)| in the defect frame
  Reading zplShiftGHz;                   ///< c − ν_ZPL (preset) = a1g_u − a1g_g
  Reading a1gPerpendicular;              ///< ε_xx+ε_yy if the shift were all t⊥ (defect frame)
  Reading a1gParallel;                   ///< ε_zz if the shift were all t∥
};

/// InputError when a σ is not positive or a frequency not finite.
ZeroFieldStrainEstimate estimateZeroFieldStrain(const ZeroFieldLines& lines, const ManifoldModel& ground,
                                                const ManifoldModel& excited, double zplReferenceGHz);

}  // namespace finestra
