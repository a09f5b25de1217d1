// Hyperfine structure against the Breit–Rabi formula: Breit & Rabi, Phys. Rev. 38, 2082 (1931).
// With λ = 0, q = 0, no strain and isotropic A, each orbital copy of a manifold is an S = ½ spin
// coupled to a nucleus I: H = A S·I + γ_S B S_z − γ_n B I_z (B along the defect axis). In each block of
// total projection m the two states |↑, m−½⟩, |↓, m+½⟩ give
//   E± = (H11 + H22)/2 ± √((H11 − H22)²/4 + (A/2)²((I+½)² − m²)),
// the Breit–Rabi formula written for this Hamiltonian; m = ±(I+½) are single states.
#include <gtest/gtest.h>

#include <algorithm>
#include <vector>

#include "core/units/constants.h"
#include "test_support.h"

using namespace finestra;

namespace {
std::vector<double> breitRabiLevels(double spin, double aGHz, double gammaS, double gammaN, double b) {
  std::vector<double> levels;
  const double ws = gammaS * b, wn = gammaN * b;
  for (double m = -spin - 0.5; m <= spin + 0.5 + 1e-9; m += 1.0) {
    const bool top = std::abs(std::abs(m) - (spin + 0.5)) < 1e-9;
    if (top) {  // stretched state |↑, I⟩ or |↓, −I⟩
      const double ms = m > 0 ? 0.5 : -0.5, mi = m > 0 ? spin : -spin;
      levels.push_back(aGHz * ms * mi + ws * ms - wn * mi);
      continue;
    }
    const double h11 = aGHz * 0.5 * (m - 0.5) + 0.5 * ws - wn * (m - 0.5);
    const double h22 = -aGHz * 0.5 * (m + 0.5) - 0.5 * ws - wn * (m + 0.5);
    const double off = 0.5 * aGHz * std::sqrt((spin + 0.5) * (spin + 0.5) - m * m);
    const double mean = 0.5 * (h11 + h22), half = std::sqrt(0.25 * (h11 - h22) * (h11 - h22) + off * off);
    levels.push_back(mean - half);
    levels.push_back(mean + half);
  }
  std::sort(levels.begin(), levels.end());
  return levels;
}

void expectBreitRabi(const std::string& preset, const std::string& isotope, double spin, double aMHz) {
  const std::map<std::string, double> overrides{{"lambda_g_GHz", 0.0}, {"lambda_u_GHz", 0.0}, {"q_g", 0.0},
                                                {"q_u", 0.0},          {"A_par_g_MHz", aMHz}, {"A_perp_g_MHz", aMHz},
                                                {"A_par_u_MHz", aMHz}, {"A_perp_u_MHz", aMHz}, {"lifetime_ns", 5.0}};
  const CentreModel model(finestra::testing::setupFor(preset, overrides, Mat3::Zero(), isotope));
  const double gammaN = model.manifold(Manifold::Ground).gammaN;
  const double gammaS = model.manifold(Manifold::Ground).spinZeeman;
  const Vec3 axis = defectFrame(0).row(2).transpose();
  for (double b : {0.0, 0.001, 0.01, 0.05, 0.3, 2.0}) {
    const ManifoldEigen lv = model.levels(Manifold::Ground, 0, b * axis);
    const std::vector<double> copy = breitRabiLevels(spin, aMHz * 1e-3, gammaS, gammaN, b);
    ASSERT_EQ(static_cast<std::size_t>(lv.energies.size()), 2 * copy.size());
    for (std::size_t k = 0; k < copy.size(); ++k) {  // the two orbital copies are degenerate
      EXPECT_NEAR(lv.energies[static_cast<Eigen::Index>(2 * k)], copy[k], 1e-9) << "B=" << b << " k=" << k;
      EXPECT_NEAR(lv.energies[static_cast<Eigen::Index>(2 * k + 1)], copy[k], 1e-9) << "B=" << b << " k=" << k;
    }
  }
}
}  // namespace

TEST(BreitRabi, SpinHalfNucleus) { expectBreitRabi("SiV-", "29Si", 0.5, 70.0); }

TEST(BreitRabi, SpinNineHalvesNucleusForty) {
  // ⁷³Ge, I = 9/2: 4(2I+1) = 40 states per manifold; A set by the test (no preset value exists).
  expectBreitRabi("GeV-", "73Ge", 4.5, 25.0);
}

TEST(BreitRabi, ZeroFieldHyperfineSplittingIsAtimesIplusHalf) {
  // Breit & Rabi (1931): at B = 0 the F = I ± ½ levels are split by ΔW = A(I + ½).
  const auto levels = breitRabiLevels(0.5, 0.07, 28.0, -0.008465, 0.0);
  EXPECT_NEAR(levels.back() - levels.front(), 0.07, 1e-12);
}
