#pragma once
// Decay rates of every level, homogeneous linewidths of every optical line and the
// phonon-limited spin coherence of one orientation class at one temperature
// (docs/physics.md, Phonons and linewidths).
#include <optional>
#include <string>
#include <vector>

#include "core/model/centre_model.h"
#include "core/thermal/phonon_rates.h"

namespace finestra {

/// Δ of one manifold: mean energy of the upper-branch levels minus that of the lower-branch levels
/// (GHz), at the field and strain the levels were computed for. Branch tags: 0 lower, 1 upper.
double branchSplittingGHz(const VectorXr& energiesGHz, const std::vector<int>& branch);

struct ManifoldDecay {
  BranchRates rates;
  std::vector<double> levelDecayPerS;  ///< total decay rate of each level (index as the energies)
};

/// Thermal figures of one class. Line widths are parallel to the lines they were computed for.
struct ClassThermal {
  int cls = 0;
  ManifoldDecay ground, excited;
  std::vector<double> lineFwhmGHz;  ///< homogeneous FWHM (Γ_upper + Γ_lower)/2π of each line
  /// 1/Γ of the lower ground branch: the phonon limit of the qubit's coherence. Empty when the
  /// rate is zero (T = 0 without a higher-order term): no phonon limit.
  std::optional<double> spinCoherenceLimitS;
};

/// Levels, branch tags and lines of one class → its thermal figures at temperature T (K).
/// Excited levels decay radiatively at 1/τ (lifetime_ns) besides the phonon rate of their branch.
/// Throws MissingValueError naming a phonon constant that is unknown.
ClassThermal classThermal(const CentreParameters& parameters, int cls, const ManifoldEigen& ground,
                          const std::vector<int>& groundBranch, const ManifoldEigen& excited,
                          const std::vector<int>& excitedBranch, const std::vector<OpticalLine>& lines,
                          double temperatureK);

/// Same, for a solved class.
ClassThermal classThermal(const CentreModel& model, const ClassSolution& solution, double temperatureK);

/// Homogeneous FWHM (GHz) of one line from the decay rates of its two levels.
double lineFwhmGHz(double upperDecayPerS, double lowerDecayPerS);

/// Coherence time that governs the qubit: the smaller of the phonon limit and a bath-limited T2*
/// (either may be absent); empty when neither is set.
std::optional<double> governingCoherenceS(const std::optional<double>& phononLimitS,
                                          const std::optional<double>& bathT2StarS);

}  // namespace finestra
