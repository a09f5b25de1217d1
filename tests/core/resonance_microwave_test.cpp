// Microwave (magnetic-dipole) transitions with the nuclear spin: checked against a brute-force
// diagonalisation of the spin Hamiltonian written out below, against the exact selection rules of
// that Hamiltonian, and against the published ²⁹Si hyperfine constant of SiV⁻.
#include <gtest/gtest.h>

#include <cmath>

#include "core/common/errors.h"
#include "core/resonance/microwave.h"
#include "core/resonance/resonance_spectrum.h"
#include "test_support.h"

using namespace finestra;

namespace {

// SiV⁻ ground-state numbers used by the brute-force model (the preset's values and their sources):
// λ_g = 48 GHz and q_g = 0.1 (Hepp et al., PRL 112, 036405 (2014)); A∥ = A⊥ = 70 MHz for ²⁹Si
// (Pingault et al., Nat. Commun. 8, 15579 (2017)); γ_n(²⁹Si) = −8.465 MHz/T (N. J. Stone, At. Data
// Nucl. Data Tables 90, 75 (2005)); μ_B/h = 13.9962449361 GHz/T and g_e = 2.00231930436 (CODATA 2018).
constexpr double kLambda = 48.0, kQ = 0.1, kAHyperfine = 0.070, kGammaN = -8.465e-3;
constexpr double kBohr = 13.9962449361, kG = 2.00231930436;
constexpr double kEgStrain = 10.0;  // invented E-strain of the ground manifold (GHz), angle 0

ModelSetup siv29(double egStrain = kEgStrain) {
  ModelSetup s = finestra::testing::setupFor("SiV-", {{"A_par_u_MHz", 0.0}, {"A_perp_u_MHz", 0.0}}, Mat3::Zero(), "29Si");
  s.strain.extraGround.magnitudeGHz = egStrain;
  return s;
}

MatrixXc kron(const MatrixXc& a, const MatrixXc& b) {
  MatrixXc out(a.rows() * b.rows(), a.cols() * b.cols());
  for (Eigen::Index i = 0; i < a.rows(); ++i)
    for (Eigen::Index j = 0; j < a.cols(); ++j) out.block(i * b.rows(), j * b.cols(), b.rows(), b.cols()) = a(i, j) * b;
  return out;
}

struct Paulis {
  MatrixXc one, x, y, z;
};
Paulis paulis() {
  const cplx i(0, 1);
  Paulis p{MatrixXc::Identity(2, 2), MatrixXc::Zero(2, 2), MatrixXc::Zero(2, 2), MatrixXc::Zero(2, 2)};
  p.x << 0, 1, 1, 0;
  p.y << 0, -i, i, 0;
  p.z << 1, 0, 0, -1;
  return p;
}

// Full ground Hamiltonian on orbital {e_x, e_y} ⊗ spin {↑, ↓} ⊗ nucleus {+½, −½}, defect frame,
// GHz: H = −(λ/2) L_z s_z + strain (−ε σ_z) + q γ_L B_z L_z + (γ_S/2) B·s + A⊥(S_xI_x + S_yI_y)
// + A∥ S_zI_z − γ_n B·I, with L_z = σ_y on the orbital doublet, s the Pauli matrices of the
// electron spin, S = s/2, I = σ/2 (Hepp et al. 2014 for the electronic part).
MatrixXc bruteHamiltonian(const Vec3& b) {
  const Paulis p = paulis();
  const double gammaS = kG * kBohr, gammaL = kQ * kBohr;
  auto e3 = [&](const MatrixXc& orbital, const MatrixXc& spin, const MatrixXc& nuclear) {
    return kron(kron(orbital, spin), nuclear);
  };
  MatrixXc h = -0.5 * kLambda * e3(p.y, p.z, p.one) - kEgStrain * e3(p.z, p.one, p.one) +
               gammaL * b.z() * e3(p.y, p.one, p.one) +
               0.5 * gammaS * (b.x() * e3(p.one, p.x, p.one) + b.y() * e3(p.one, p.y, p.one) + b.z() * e3(p.one, p.z, p.one));
  h += 0.25 * kAHyperfine * (e3(p.one, p.x, p.x) + e3(p.one, p.y, p.y) + e3(p.one, p.z, p.z));
  h -= 0.5 * kGammaN * (b.x() * e3(p.one, p.one, p.x) + b.y() * e3(p.one, p.one, p.y) + b.z() * e3(p.one, p.one, p.z));
  return h;
}

// Coupling to a unit microwave field along b̂ (defect frame): −∂H/∂B·b̂ up to sign.
MatrixXc bruteDrive(const Vec3& b) { return bruteHamiltonian(b) - bruteHamiltonian(Vec3::Zero()); }

Vec3 crystalFromDefect(int cls, const Vec3& v) { return defectFrame(cls).transpose() * v; }

Vec3 tiltedDefect(double magnitudeT, double tiltDeg) {
  const double t = tiltDeg * M_PI / 180.0;
  return magnitudeT * Vec3(std::sin(t), 0, std::cos(t));
}

MicrowaveSettings transverseDrive(int cls) {
  MicrowaveSettings s;
  s.driveLab = crystalFromDefect(cls, Vec3(1, 0, 0));  // the test lab frame is the crystal frame
  return s;
}

bool spinFlip(const MicrowaveTransition& t) { return t.spinProjectionLower * t.spinProjectionUpper < 0; }

}  // namespace

TEST(ResonanceMicrowave, FrequenciesAndStrengthsMatchBruteForceDiagonalisation) {
  const CentreModel model(siv29());
  const Vec3 fieldDefect = tiltedDefect(0.37, 35.0);
  const Vec3 driveDefect = Vec3(1.0, 0.3, 0.5).normalized();
  MicrowaveSettings settings;
  settings.driveLab = crystalFromDefect(0, driveDefect);
  const ClassMicrowave mw = microwaveTransitions(model, 0, crystalFromDefect(0, fieldDefect), settings);

  Eigen::SelfAdjointEigenSolver<MatrixXc> brute(bruteHamiltonian(fieldDefect));
  const MatrixXc drive = bruteDrive(driveDefect);
  const double reference = std::pow(0.5 * kG * kBohr, 2);
  ASSERT_EQ(mw.transitions.size(), 28u);  // 8 levels: every pair
  for (const MicrowaveTransition& t : mw.transitions) {
    const double f = brute.eigenvalues()[t.upper] - brute.eigenvalues()[t.lower];
    const double s = std::norm((brute.eigenvectors().col(t.upper).adjoint() * drive * brute.eigenvectors().col(t.lower))(0, 0)) / reference;
    EXPECT_NEAR(t.frequencyGHz, f, 1e-9) << t.lower << "→" << t.upper;
    EXPECT_NEAR(t.strength, s, 1e-9 + 1e-7 * s) << t.lower << "→" << t.upper;
  }
}

TEST(ResonanceMicrowave, AxialFieldEsrIsADoubletSplitByTheHyperfineConstant) {
  // Pingault et al., Nat. Commun. 8, 15579 (2017): ²⁹Si hyperfine constant of SiV⁻ ≈ 70 MHz. With
  // B along the axis the two nuclear-preserving ESR lines of the lower branch sit at
  // γ_eff B ± A∥/2 to first order in A (A⊥ only couples to the other branch, 48 GHz away).
  const ModelSetup setup = siv29();
  EXPECT_NEAR(setup.centre.parameters.get(Param::AParG), 70.0, 1e-9);
  const CentreModel model(setup);
  const ClassMicrowave mw = microwaveTransitions(model, 0, crystalFromDefect(0, tiltedDefect(0.5, 0)), transverseDrive(0));
  std::vector<MicrowaveTransition> esr;
  for (const auto& t : mw.transitions)
    if (t.upper < 4 && spinFlip(t) && t.nuclearChange == NuclearChange::Preserving) esr.push_back(t);
  ASSERT_EQ(esr.size(), 2u);
  EXPECT_NEAR(std::abs(esr[1].frequencyGHz - esr[0].frequencyGHz), kAHyperfine, 1e-3);
  for (const auto& t : esr) {
    EXPECT_GT(t.strength, 1e-3) << "E-strain makes the lower-branch spin flip drivable";
    EXPECT_GT(t.nuclearPurity, 0.999);
    EXPECT_GT(t.spinPart, 0.5 * t.strength);  // the spin term dominates a transverse drive
  }
  EXPECT_NEAR(esr[0].strength, esr[1].strength, 0.01 * esr[0].strength);
}

TEST(ResonanceMicrowave, NuclearFlipsAreForbiddenOrWeakOnAxisAndAppearWithATransverseField) {
  const CentreModel model(siv29());
  auto ratio = [&](double tiltDeg) {
    const ClassMicrowave mw =
        microwaveTransitions(model, 0, crystalFromDefect(0, tiltedDefect(0.5, tiltDeg)), transverseDrive(0));
    double preserving = 0, flipping = 0;
    for (const auto& t : mw.transitions) {
      if (t.upper >= 4 || !spinFlip(t)) continue;  // electron-spin resonances of the lower branch
      (t.nuclearChange == NuclearChange::Preserving ? preserving : flipping) =
          std::max(t.nuclearChange == NuclearChange::Preserving ? preserving : flipping, t.strength);
    }
    return flipping / preserving;
  };
  // On axis F_z = S_z + I_z is conserved and a transverse drive changes it by ±1 only: the
  // flip-flop (ΔF_z = 0) and double-flip (ΔF_z = ±2) lines are exactly dark; the remaining ones
  // need A⊥ mixing across a Zeeman gap and stay weak.
  const ClassMicrowave axial = microwaveTransitions(model, 0, crystalFromDefect(0, tiltedDefect(0.5, 0)), transverseDrive(0));
  for (const auto& t : axial.transitions) {
    const double deltaF = (t.spinProjectionUpper + t.nuclearProjectionUpper) - (t.spinProjectionLower + t.nuclearProjectionLower);
    if (std::abs(std::abs(deltaF) - 1.0) > 0.1 && std::isfinite(t.strength)) {
      EXPECT_LT(t.strength, 1e-20) << t.lower << "→" << t.upper;
    }
  }
  EXPECT_LT(ratio(0.0), 1e-4);
  EXPECT_GT(ratio(60.0), 1e-3);
  EXPECT_GT(ratio(60.0), 100 * ratio(0.0));
}

TEST(ResonanceMicrowave, PopulationsAreBoltzmannAtTheProjectTemperature) {
  ModelSetup setup = siv29();
  setup.conditions.temperatureK = 0.3;
  const CentreModel model(setup);
  const ClassMicrowave mw = microwaveTransitions(model, 0, crystalFromDefect(0, tiltedDefect(0.5, 20)), transverseDrive(0));
  // p_u / p_l = exp(−hν/k_BT); h/k_B = 0.0479924 K/GHz (CODATA 2018 exact h and k_B).
  for (const auto& t : mw.transitions) {
    if (t.frequencyGHz > 30) continue;
    EXPECT_NEAR(t.populationUpper / t.populationLower, std::exp(-0.0479924307 * t.frequencyGHz / 0.3), 1e-6);
  }
}

TEST(ResonanceMicrowave, DegenerateLevelsGiveUndefinedStrength) {
  const CentreModel model(siv29(0.0));
  MicrowaveSettings settings;
  const ClassMicrowave mw = microwaveTransitions(model, 0, Vec3::Zero(), settings);
  int undefined = 0;
  for (const auto& t : mw.transitions)
    if (t.frequencyGHz < kDegenerateTransitionGHz) {
      EXPECT_TRUE(std::isnan(t.strength));
      ++undefined;
    }
  EXPECT_GT(undefined, 0);
  settings.driveLab = Vec3::Zero();
  EXPECT_THROW(microwaveTransitions(model, 0, Vec3::Zero(), settings), InputError);
}

TEST(ResonanceSpectrum, LorentzianOfStrengthTimesPopulationDifference) {
  const CentreModel model(siv29());
  const std::vector<ClassMicrowave> classes{
      microwaveTransitions(model, 0, crystalFromDefect(0, tiltedDefect(0.5, 0)), transverseDrive(0))};
  const MicrowaveTransition* strongest = nullptr;
  for (const auto& t : classes[0].transitions)
    if (std::isfinite(t.strength) && (!strongest || t.strength > strongest->strength)) strongest = &t;
  ASSERT_NE(strongest, nullptr);
  ResonanceSpectrumRequest request;
  request.fwhmGHz = 1e-4;
  request.fromGHz = strongest->frequencyGHz - 1e-3;
  request.toGHz = strongest->frequencyGHz + 1e-3;
  request.points = 201;  // the middle point is the line centre
  const ResonanceSpectrum s = resonanceSpectrum(classes, request);
  const double peak = strongest->strength * (strongest->populationLower - strongest->populationUpper);
  EXPECT_NEAR(s.signal[100], peak, 1e-3 * peak);
  // Half maximum one half-width away (Lorentzian line shape).
  EXPECT_NEAR(s.signal[105] / s.signal[100], 0.5, 0.01);

  request.fwhmGHz = 0;
  EXPECT_THROW(resonanceSpectrum(classes, request), InputError);
  request.fwhmGHz = 1e-3;
  request.points = kMaxResonancePoints + 1;
  EXPECT_THROW(resonanceSpectrum(classes, request), InputError);
}
