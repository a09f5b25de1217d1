#pragma once
// Λ systems: one excited level linked to two ground levels by two allowed optical lines, the
// scheme of coherent population trapping, Raman emission and all-optical spin control
// (docs/physics.md, Optical transitions).
#include <string>
#include <vector>

#include "core/model/centre_model.h"

namespace finestra {

/// A leg counts as allowed when its polarisation-summed dipole strength is at least this fraction
/// of the class's strongest line (same threshold for every class and field).
inline constexpr double kAllowedLineFraction = 1e-3;

struct LambdaSystem {
  int excited = 0;
  std::array<int, 2> ground{};           ///< j < k, indices as in the engine's ground levels
  std::array<double, 2> lineGHz{};       ///< absolute frequencies of the legs excited → ground[j], → ground[k]
  double twoPhotonGHz = 0;               ///< Raman detuning: E_g[k] − E_g[j] (= line j − line k)
  std::array<double, 2> strength{};      ///< intensity for the project's analyser (as in `lines`)
  double product = 0;                    ///< strength[0]·strength[1]
  double balance = 0;                    ///< min/max of the two strengths, 1 when equal (0 if both dark)
  std::array<double, 2> branching{};     ///< share of the excited level's emission into each leg
  std::array<double, 2> spinProjection{};///< ⟨S_z⟩ of the two ground levels (defect axis)
};

/// Figure by which the systems of a class are ranked: product, balance, branching (sum of the two
/// shares) from large to small, or two-photon detuning from small to large |Δ|.
enum class LambdaRanking { Product, Balance, Branching, TwoPhoton };
/// Parses "product", "balance", "branching" or "two_photon"; InputError naming `key` otherwise.
LambdaRanking parseLambdaRanking(const std::string& text, const std::string& key);

struct ClassLambda {
  int cls = 0;
  std::vector<LambdaSystem> systems;
};

/// Every Λ system of a solved class, ranked.
ClassLambda lambdaSystems(const ClassSolution& solution, int nuclearDim, LambdaRanking ranking);

/// One coherent-population-trapping dip in a PLE scan of a probe laser while a pump holds the line
/// excited → pumpGround: the probe frequency at two-photon resonance with a ground level `ground`
/// that shares the pump's excited level in a Λ system.
struct CptDip {
  int excited = 0, pumpGround = 0, ground = 0;
  double probeGHz = 0;      ///< absolute probe frequency of the dip: pump line + E_pumpGround − E_ground
  double twoPhotonGHz = 0;  ///< E_ground − E_pumpGround
};

/// Dips for a pump on the line (excited → pumpGround) of a class. Throws InputError ("--pump") when
/// the indices are out of range.
std::vector<CptDip> cptDips(const ClassSolution& solution, const ClassLambda& lambdas, int excited, int pumpGround);

}  // namespace finestra
