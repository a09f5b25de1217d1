#include "core/resonance/lambda_systems.h"

#include <algorithm>
#include <cmath>

#include "core/common/errors.h"
#include "core/resonance/level_character.h"

namespace finestra {
namespace {

double totalStrength(const OpticalLine& line) {
  return line.intensityCrystal[0] + line.intensityCrystal[1] + line.intensityCrystal[2];
}

double rankKey(const LambdaSystem& s, LambdaRanking ranking) {
  switch (ranking) {
    case LambdaRanking::Product: return -s.product;
    case LambdaRanking::Balance: return -s.balance;
    case LambdaRanking::Branching: return -(s.branching[0] + s.branching[1]);
    case LambdaRanking::TwoPhoton: return std::abs(s.twoPhotonGHz);
  }
  return 0;
}

}  // namespace

LambdaRanking parseLambdaRanking(const std::string& text, const std::string& key) {
  if (text == "product") return LambdaRanking::Product;
  if (text == "balance") return LambdaRanking::Balance;
  if (text == "branching") return LambdaRanking::Branching;
  if (text == "two_photon") return LambdaRanking::TwoPhoton;
  throw InputError(key, "expected product, balance, branching or two_photon, got '" + text + "'");
}

ClassLambda lambdaSystems(const ClassSolution& solution, int nuclearDim, LambdaRanking ranking) {
  const auto groundCount = static_cast<int>(solution.ground.energies.size());
  const auto excitedCount = static_cast<int>(solution.excited.energies.size());
  // solution.lines is ordered by upper, then lower level.
  auto line = [&](int excited, int ground) -> const OpticalLine& {
    return solution.lines[static_cast<std::size_t>(excited * groundCount + ground)];
  };
  double strongest = 0;
  for (const auto& l : solution.lines) strongest = std::max(strongest, totalStrength(l));
  std::vector<double> spin(static_cast<std::size_t>(groundCount));
  for (int j = 0; j < groundCount; ++j)
    spin[static_cast<std::size_t>(j)] = electronSpinProjection(solution.ground.vectors.col(j), nuclearDim);

  ClassLambda out;
  out.cls = solution.cls;
  if (strongest == 0) return out;
  for (int e = 0; e < excitedCount; ++e) {
    double emission = 0;
    for (int j = 0; j < groundCount; ++j) emission += totalStrength(line(e, j));
    for (int j = 0; j < groundCount; ++j) {
      if (totalStrength(line(e, j)) < kAllowedLineFraction * strongest) continue;
      for (int k = j + 1; k < groundCount; ++k) {
        if (totalStrength(line(e, k)) < kAllowedLineFraction * strongest) continue;
        const OpticalLine& a = line(e, j);
        const OpticalLine& b = line(e, k);
        LambdaSystem s;
        s.excited = e;
        s.ground = {j, k};
        s.lineGHz = {a.frequencyGHz, b.frequencyGHz};
        s.twoPhotonGHz = solution.ground.energies[k] - solution.ground.energies[j];
        s.strength = {a.intensity, b.intensity};
        s.product = a.intensity * b.intensity;
        const double larger = std::max(a.intensity, b.intensity);
        s.balance = larger > 0 ? std::min(a.intensity, b.intensity) / larger : 0.0;
        // Spontaneous emission rates ∝ ν³|d|²; ν varies by < 1e-3 across the lines, so |d|² alone.
        s.branching = {totalStrength(a) / emission, totalStrength(b) / emission};
        s.spinProjection = {spin[static_cast<std::size_t>(j)], spin[static_cast<std::size_t>(k)]};
        out.systems.push_back(s);
      }
    }
  }
  std::stable_sort(out.systems.begin(), out.systems.end(), [ranking](const LambdaSystem& x, const LambdaSystem& y) {
    return rankKey(x, ranking) < rankKey(y, ranking);
  });
  return out;
}

std::vector<CptDip> cptDips(const ClassSolution& solution, const ClassLambda& lambdas, int excited, int pumpGround) {
  const auto groundCount = static_cast<int>(solution.ground.energies.size());
  const auto excitedCount = static_cast<int>(solution.excited.energies.size());
  if (excited < 0 || excited >= excitedCount || pumpGround < 0 || pumpGround >= groundCount)
    throw InputError("--pump", "line EXCITED,GROUND needs 0 <= EXCITED < " + std::to_string(excitedCount) +
                                   " and 0 <= GROUND < " + std::to_string(groundCount));
  const double pumpGHz = solution.lines[static_cast<std::size_t>(excited * groundCount + pumpGround)].frequencyGHz;
  std::vector<CptDip> out;
  for (const LambdaSystem& s : lambdas.systems) {
    if (s.excited != excited || (s.ground[0] != pumpGround && s.ground[1] != pumpGround)) continue;
    const int other = s.ground[0] == pumpGround ? s.ground[1] : s.ground[0];
    CptDip dip;
    dip.excited = excited;
    dip.pumpGround = pumpGround;
    dip.ground = other;
    dip.twoPhotonGHz = solution.ground.energies[other] - solution.ground.energies[pumpGround];
    // Two-photon resonance: ν_probe − ν_pump = E_pumpGround − E_other.
    dip.probeGHz = pumpGHz - dip.twoPhotonGHz;
    out.push_back(dip);
  }
  std::sort(out.begin(), out.end(), [](const CptDip& a, const CptDip& b) { return a.probeGHz < b.probeGHz; });
  return out;
}

}  // namespace finestra
