#include "core/thermal/level_widths.h"

#include <algorithm>
#include <numbers>

#include "core/common/errors.h"

namespace finestra {

double branchSplittingGHz(const VectorXr& energies, const std::vector<int>& branch) {
  double sum[2] = {0, 0};
  int count[2] = {0, 0};
  for (Eigen::Index i = 0; i < energies.size(); ++i) {
    const int b = branch.at(static_cast<std::size_t>(i)) ? 1 : 0;
    sum[b] += energies[i];
    ++count[b];
  }
  if (count[0] == 0 || count[1] == 0) throw InputError("levels", "a manifold needs levels in both orbital branches");
  return std::max(0.0, sum[1] / count[1] - sum[0] / count[0]);
}

double lineFwhmGHz(double upperDecayPerS, double lowerDecayPerS) {
  // A Lorentzian line between two decaying levels has FWHM (Γ_u + Γ_l)/2π (rates in 1/s).
  return (upperDecayPerS + lowerDecayPerS) / (2.0 * std::numbers::pi) * 1e-9;
}

namespace {

ManifoldDecay manifoldDecay(const PhononConstants& constants, const ManifoldEigen& eigen,
                            const std::vector<int>& branch, double radiativePerS, double temperatureK) {
  ManifoldDecay out;
  out.rates = branchRates(constants, branchSplittingGHz(eigen.energies, branch), temperatureK);
  out.levelDecayPerS.resize(static_cast<std::size_t>(eigen.energies.size()));
  for (std::size_t i = 0; i < out.levelDecayPerS.size(); ++i)
    out.levelDecayPerS[i] = radiativePerS + (branch[i] ? out.rates.downPerS : out.rates.upPerS);
  return out;
}

}  // namespace

ClassThermal classThermal(const CentreParameters& p, int cls, const ManifoldEigen& ground,
                          const std::vector<int>& groundBranch, const ManifoldEigen& excited,
                          const std::vector<int>& excitedBranch, const std::vector<OpticalLine>& lines,
                          double temperatureK) {
  ClassThermal out;
  out.cls = cls;
  const double radiativePerS = 1e9 / p.require(Param::LifetimeNs);
  out.ground = manifoldDecay(phononConstants(p, Manifold::Ground), ground, groundBranch, 0.0, temperatureK);
  out.excited = manifoldDecay(phononConstants(p, Manifold::Excited), excited, excitedBranch, radiativePerS, temperatureK);
  out.lineFwhmGHz.reserve(lines.size());
  for (const OpticalLine& l : lines)
    out.lineFwhmGHz.push_back(lineFwhmGHz(out.excited.levelDecayPerS.at(static_cast<std::size_t>(l.upper)),
                                          out.ground.levelDecayPerS.at(static_cast<std::size_t>(l.lower))));
  // Every hop of the qubit (lower ground branch) to the upper branch and back scrambles the spin
  // phase, since the spin precesses at a different frequency there: T2 ≤ 1/γ_up (Jahnke et al.,
  // New J. Phys. 17, 043011 (2015), discussion of qubit coherence).
  if (out.ground.rates.upPerS > 0) out.spinCoherenceLimitS = 1.0 / out.ground.rates.upPerS;
  return out;
}

ClassThermal classThermal(const CentreModel& model, const ClassSolution& s, double temperatureK) {
  return classThermal(model.setup().centre.parameters, s.cls, s.ground, s.groundBranch, s.excited, s.excitedBranch,
                      s.lines, temperatureK);
}

std::optional<double> governingCoherenceS(const std::optional<double>& phonon, const std::optional<double>& bath) {
  if (phonon && bath) return std::min(*phonon, *bath);
  return phonon ? phonon : bath;
}

}  // namespace finestra
