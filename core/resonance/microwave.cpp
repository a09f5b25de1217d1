#include "core/resonance/microwave.h"

#include <algorithm>
#include <cmath>

#include "core/common/errors.h"
#include "core/common/parallel.h"
#include "core/model/populations.h"
#include "core/resonance/level_character.h"
#include "core/resonance/magnetic_dipole.h"

namespace finestra {
namespace {

Vec3 driveDirectionDefect(const CentreModel& model, int cls, const Vec3& driveLab) {
  if (!driveLab.allFinite() || driveLab.norm() < 1e-12)
    throw InputError("--drive-lab", "the microwave field direction must be a non-zero finite vector x,y,z");
  return defectFrame(cls) * model.setup().lab.toCrystal(driveLab.normalized());
}

double matrixElementSquared(const MatrixXc& op, const ManifoldEigen& e, int lower, int upper) {
  return std::norm((e.vectors.col(upper).adjoint() * op * e.vectors.col(lower))(0, 0));
}

}  // namespace

const char* nuclearChangeName(NuclearChange change) {
  switch (change) {
    case NuclearChange::NoNucleus: return "no nucleus";
    case NuclearChange::Preserving: return "preserving";
    case NuclearChange::Flipping: return "flipping";
  }
  return "";
}

ClassMicrowave microwaveTransitions(const CentreModel& model, int cls, const Vec3& fieldCrystal,
                                    const MicrowaveSettings& settings) {
  if (cls < 0 || cls >= kClassCount) throw InputError("classes", "orientation class must be 0..3");
  const ManifoldModel& manifold = model.manifold(settings.manifold);
  const MagneticDipoleOperators ops = magneticDipoleOperators(manifold, driveDirectionDefect(model, cls, settings.driveLab));
  const MatrixXc total = ops.total();
  const ManifoldEigen e = model.levels(settings.manifold, cls, fieldCrystal);
  const auto& conditions = model.setup().conditions;
  const VectorXr population = levelPopulations(e.energies, conditions.temperatureK, PopulationModel::Thermal);
  const double reference = std::pow(0.5 * manifold.spinZeeman, 2);
  const int n = manifold.nuclearDim;
  const int count = static_cast<int>(e.energies.size());

  std::vector<double> spin(static_cast<std::size_t>(count));
  std::vector<NuclearCharacter> nuclear(static_cast<std::size_t>(count));
  for (int i = 0; i < count; ++i) {
    spin[static_cast<std::size_t>(i)] = electronSpinProjection(e.vectors.col(i), n);
    nuclear[static_cast<std::size_t>(i)] = nuclearCharacter(e.vectors.col(i), n);
  }

  ClassMicrowave out;
  out.cls = cls;
  out.levelsGHz = e.energies;
  out.transitions.reserve(static_cast<std::size_t>(count * (count - 1) / 2));
  for (int lower = 0; lower < count; ++lower)
    for (int upper = lower + 1; upper < count; ++upper) {
      const NuclearCharacter& nl = nuclear[static_cast<std::size_t>(lower)];
      const NuclearCharacter& nu = nuclear[static_cast<std::size_t>(upper)];
      MicrowaveTransition t;
      t.lower = lower;
      t.upper = upper;
      t.frequencyGHz = e.energies[upper] - e.energies[lower];
      if (t.frequencyGHz > kDegenerateTransitionGHz) {
        t.strength = matrixElementSquared(total, e, lower, upper) / reference;
        t.spinPart = matrixElementSquared(ops.spin, e, lower, upper) / reference;
        t.orbitalPart = matrixElementSquared(ops.orbital, e, lower, upper) / reference;
        t.nuclearPart = matrixElementSquared(ops.nuclear, e, lower, upper) / reference;
      } else {
        t.strength = t.spinPart = t.orbitalPart = t.nuclearPart = std::nan("");
      }
      t.spinProjectionLower = spin[static_cast<std::size_t>(lower)];
      t.spinProjectionUpper = spin[static_cast<std::size_t>(upper)];
      t.nuclearProjectionLower = nl.projection;
      t.nuclearProjectionUpper = nu.projection;
      t.nuclearChange = n == 1 ? NuclearChange::NoNucleus
                                : (nl.projection == nu.projection ? NuclearChange::Preserving : NuclearChange::Flipping);
      t.nuclearPurity = nl.purity * nu.purity;
      t.populationLower = population[lower];
      t.populationUpper = population[upper];
      out.transitions.push_back(t);
    }
  std::stable_sort(out.transitions.begin(), out.transitions.end(),
                   [](const MicrowaveTransition& a, const MicrowaveTransition& b) { return a.frequencyGHz < b.frequencyGHz; });
  return out;
}

std::vector<ClassMicrowave> microwaveTransitions(const CentreModel& model, const std::vector<int>& classes,
                                                 const Vec3& fieldCrystal, const MicrowaveSettings& settings) {
  std::vector<ClassMicrowave> out(classes.size());
  parallelChunks(static_cast<long>(out.size()), [&](long b, long e) {
    for (long i = b; i < e; ++i)
      out[static_cast<std::size_t>(i)] = microwaveTransitions(model, classes[static_cast<std::size_t>(i)], fieldCrystal, settings);
  });
  return out;
}

}  // namespace finestra
