#include "core/sweep/sweep.h"

#include <atomic>

#include "core/common/parallel.h"
#include "core/crystal/frames.h"
#include "core/hamiltonian/linear4.h"
#include "core/model/tracking.h"
#include "core/project/sweep_path.h"
#include "core/thermal/level_widths.h"

namespace finestra {
namespace {

std::vector<int> identity(Eigen::Index n) {
  std::vector<int> v(static_cast<std::size_t>(n));
  for (Eigen::Index i = 0; i < n; ++i) v[i] = static_cast<int>(i);
  return v;
}

/// Carries per-level tags (identity, branch) from the previous point to the current ordering.
std::vector<int> carry(const std::vector<int>& tags, const std::vector<int>& from) {
  std::vector<int> out(from.size());
  for (std::size_t c = 0; c < from.size(); ++c) out[c] = tags[static_cast<std::size_t>(from[c])];
  return out;
}

struct ManifoldTrack {
  ManifoldEigen eigen;
  std::vector<int> id, branch;
  void advance(ManifoldEigen next) {
    const std::vector<int> from = matchStates(eigen.vectors, next.vectors);
    id = carry(id, from);
    branch = carry(branch, from);
    eigen = std::move(next);
  }
};

/// Levels of one class along a field sweep. Without an isotope and with the strain fixed, both
/// manifolds are linear in B (docs/physics.md, Hamiltonian of one manifold): sampled once, then diagonalised per
/// point in closed form (core/hamiltonian/linear4.h, solver fallback at degeneracies) instead of
/// rebuilding and diagonalising the general Hamiltonian. Otherwise CentreModel::levels.
class SweepLevels {
public:
  SweepLevels(const CentreModel& model, const SweepSpec& sweep, int cls) : model_(model), cls_(cls) {
    linear_ = sweep.kind != SweepKind::Strain && !model.setup().centre.parameters.hasNuclearSpin();
    if (!linear_) return;
    for (Manifold m : {Manifold::Ground, Manifold::Excited}) {
      const auto k = static_cast<std::size_t>(m == Manifold::Excited);
      hamiltonian_[k] = LinearHamiltonian4::sample(model.manifold(m), model.strainFor(m, cls), defectFrame(cls));
      form_[k] = PauliForm4::fromLinear(hamiltonian_[k]);
    }
  }

  ManifoldEigen at(Manifold m, const Vec3& fieldCrystal, const Mat3& strain) const {
    if (!linear_ || !(fieldCrystal.norm() <= 1000.0))  // the model's own path reports bad fields
      return model_.levels(m, cls_, fieldCrystal, &strain);
    const auto k = static_cast<std::size_t>(m == Manifold::Excited);
    ManifoldEigen4 fixed;
    eigen4(form_[k], hamiltonian_[k], fieldCrystal, fixed);
    if (!fixed.energies.allFinite() || !fixed.vectors.allFinite()) return model_.levels(m, cls_, fieldCrystal, &strain);
    return {fixed.energies, fixed.vectors};
  }

private:
  const CentreModel& model_;
  int cls_;
  bool linear_ = false;
  std::array<LinearHamiltonian4, 2> hamiltonian_{};
  std::array<PauliForm4, 2> form_{};
};

ClassSweep sweepClass(const CentreModel& model, const Project& project, const SweepSpec& sweep, int cls,
                      const std::vector<double>& xs, const ProgressControl& control, std::atomic<long>& done,
                      long total) {
  const LabFrame& lab = model.setup().lab;
  ClassSweep out;
  out.cls = cls;
  ManifoldTrack g, u;
  const SweepLevels levels(model, sweep, cls);
  for (std::size_t k = 0; k < xs.size(); ++k) {
    control.throwIfCancelled();
    const Vec3 field = sweepField(project, sweep, lab, xs[k]);
    const Mat3 strain = sweepStrain(project, sweep, xs[k]);
    if (k == 0) {
      ClassSolution first = model.solve(cls, field, strain);
      g = {first.ground, identity(first.ground.energies.size()), first.groundBranch};
      u = {first.excited, identity(first.excited.energies.size()), first.excitedBranch};
      out.groundLevels.resize(static_cast<Eigen::Index>(xs.size()), g.eigen.energies.size());
      out.excitedLevels.resize(static_cast<Eigen::Index>(xs.size()), u.eigen.energies.size());
    } else {
      g.advance(levels.at(Manifold::Ground, field, strain));
      u.advance(levels.at(Manifold::Excited, field, strain));
    }
    const auto row = static_cast<Eigen::Index>(k);
    for (Eigen::Index i = 0; i < g.eigen.energies.size(); ++i) out.groundLevels(row, g.id[i]) = g.eigen.energies[i];
    for (Eigen::Index i = 0; i < u.eigen.energies.size(); ++i) out.excitedLevels(row, u.id[i]) = u.eigen.energies[i];
    std::vector<OpticalLine> lines = model.lines(cls, g.eigen, u.eigen);
    labelLines(lines, g.branch, u.branch);
    if (sweep.kind == SweepKind::Temperature)
      out.lineFwhmGHz.push_back(classThermal(model.setup().centre.parameters, cls, g.eigen, g.branch, u.eigen,
                                             u.branch, lines, xs[k])
                                    .lineFwhmGHz);
    for (auto& l : lines) {
      l.upper = u.id[static_cast<std::size_t>(l.upper)];
      l.lower = g.id[static_cast<std::size_t>(l.lower)];
    }
    out.lines.push_back(std::move(lines));
    control.progress(static_cast<double>(++done) / static_cast<double>(total));
  }
  return out;
}

}  // namespace

std::vector<double> sweepAxis(const SweepSpec& s) {
  std::vector<double> xs(static_cast<std::size_t>(s.points));
  for (int k = 0; k < s.points; ++k) xs[static_cast<std::size_t>(k)] = s.from + (s.to - s.from) * k / (s.points - 1);
  return xs;
}

SweepResult runSweep(const CentreModel& model, const Project& project, const SweepSpec& sweep,
                     const ProgressControl& control) {
  SweepResult result;
  result.x = sweepAxis(sweep);
  result.classes.resize(project.classes.size());
  std::atomic<long> done{0};
  const long total = static_cast<long>(result.x.size() * project.classes.size());
  parallelChunks(static_cast<long>(project.classes.size()), [&](long b, long e) {
    for (long i = b; i < e; ++i)
      result.classes[static_cast<std::size_t>(i)] =
          sweepClass(model, project, sweep, project.classes[static_cast<std::size_t>(i)], result.x, control, done, total);
  });
  return result;
}

}  // namespace finestra
