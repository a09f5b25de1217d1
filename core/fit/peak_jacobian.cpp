// PeakFitModel::jacobian: the residual of a peak is (ν_ZPL + E_u − E_g − measured)/σ, so its
// derivative needs the derivative of two levels. Each level's derivative is ⟨v|∂H/∂x_k|v⟩
// (Hellmann–Feynman, core/fit/level_derivatives.h) with the eigenvectors of one diagonalisation at
// x. ∂H/∂x_k is the symmetric difference of the assembled Hamiltonian matrices at x ± h·e_k: H is
// linear in every fit parameter except the magnet tilt angles and the E-strain angles (through
// sines and cosines), so the difference is exact up to rounding for the others and O(h²) for
// those; no eigenproblem is solved at the probes, unlike a central-difference Jacobian of the levels.
#include <algorithm>
#include <array>
#include <optional>

#include <Eigen/Eigenvalues>

#include "core/common/errors.h"
#include "core/crystal/frames.h"
#include "core/fit/level_derivatives.h"
#include "core/fit/peak_model.h"
#include "core/project/model_setup.h"

namespace finestra {
namespace {

constexpr double kMaxFieldT = 1000.0;  // CentreModel::levels' limit

struct SetClass {
  int set = 0, cls = 0;
  friend bool operator==(const SetClass&, const SetClass&) = default;
};

// What the predicted lines of a state depend on: the ZPL and, for every (set, class) in use, the
// ground [0] and excited [1] Hamiltonian matrices.
struct StateHamiltonians {
  double zplGHz = 0;
  std::vector<std::array<MatrixXc, 2>> matrices;
};

// None when the state leaves the model's range (the residuals are then the solver's back-off value).
std::optional<StateHamiltonians> stateHamiltonians(const FitProblem& problem, const Eigen::VectorXd& x,
                                                   const std::vector<SetClass>& pairs) {
  const FitState state = stateFromVariables(problem, x);
  std::optional<CentreModel> model;
  try {
    model.emplace(fitStateSetup(state, problem.baseSetup));
  } catch (const InputError&) {
    return std::nullopt;
  }
  StateHamiltonians out;
  out.zplGHz = model->zplGHz();
  for (const SetClass& p : pairs) {
    const Vec3 field = setFieldCrystal(problem, state, p.set);
    if (!(field.norm() <= kMaxFieldT)) return std::nullopt;
    const Vec3 fieldDefect = defectFrame(p.cls) * field;
    std::array<MatrixXc, 2> h;
    for (Manifold m : {Manifold::Ground, Manifold::Excited})
      h[m == Manifold::Ground ? 0 : 1] = fullHamiltonian(model->manifold(m), model->strainFor(m, p.cls), fieldDefect);
    if (!h[0].allFinite() || !h[1].allFinite()) return std::nullopt;
    out.matrices.push_back(std::move(h));
  }
  return out;
}

}  // namespace

void PeakFitModel::jacobian(const Eigen::VectorXd& x, Eigen::MatrixXd& out) const {
  const FitProblem& problem = *problem_;
  // The (set, class) pair of every residual, as an index into `pairs`.
  std::vector<SetClass> pairs;
  std::vector<std::size_t> pairOfResidual;
  for (int peakIndex : assigned_) {
    const SetClass key{problem.peaks[static_cast<std::size_t>(peakIndex)].set,
                       assignment_[static_cast<std::size_t>(peakIndex)]->cls};
    auto it = std::find(pairs.begin(), pairs.end(), key);
    if (it == pairs.end()) it = pairs.insert(pairs.end(), key);
    pairOfResidual.push_back(static_cast<std::size_t>(it - pairs.begin()));
  }
  const std::optional<StateHamiltonians> here = stateHamiltonians(problem, x, pairs);
  if (!here) {
    FitModel::jacobian(x, out);
    return;
  }
  std::vector<std::array<ManifoldEigen, 2>> eigen(pairs.size());
  for (std::size_t p = 0; p < pairs.size(); ++p)
    for (int m = 0; m < 2; ++m) {
      const Eigen::SelfAdjointEigenSolver<MatrixXc> solver(here->matrices[p][static_cast<std::size_t>(m)]);
      eigen[p][static_cast<std::size_t>(m)] = {solver.eigenvalues(), solver.eigenvectors()};
    }

  const Eigen::VectorXd steps = derivativeSteps(x);
  out.resize(residualCount(), parameterCount());
  std::vector<std::array<VectorXr, 2>> slopes(pairs.size());
  for (int k = 0; k < parameterCount(); ++k) {
    const double h = steps[k];
    Eigen::VectorXd probe = x;
    probe[k] = x[k] + h;
    const std::optional<StateHamiltonians> plus = stateHamiltonians(problem, probe, pairs);
    probe[k] = x[k] - h;
    const std::optional<StateHamiltonians> minus = stateHamiltonians(problem, probe, pairs);
    if (!plus || !minus) {  // a probe left the model's range: difference the residuals instead
      Eigen::VectorXd rPlus, rMinus;
      probe[k] = x[k] + h;
      residuals(probe, rPlus);
      probe[k] = x[k] - h;
      residuals(probe, rMinus);
      out.col(k) = (rPlus - rMinus) / (2.0 * h);
      continue;
    }
    const double zplSlope = (plus->zplGHz - minus->zplGHz) / (2.0 * h);
    for (std::size_t p = 0; p < pairs.size(); ++p)
      for (std::size_t m = 0; m < 2; ++m)
        slopes[p][m] = levelDerivatives(eigen[p][m], (plus->matrices[p][m] - minus->matrices[p][m]) / (2.0 * h));
    for (std::size_t i = 0; i < assigned_.size(); ++i) {
      const auto peakIndex = static_cast<std::size_t>(assigned_[i]);
      const LineRef& ref = *assignment_[peakIndex];
      const auto& s = slopes[pairOfResidual[i]];
      out(static_cast<Eigen::Index>(i), k) = (zplSlope + s[1][ref.upper] - s[0][ref.lower]) / problem.peaks[peakIndex].sigmaGHz;
    }
  }
}

}  // namespace finestra
