#include "core/resonance/magnetic_dipole.h"

#include "core/hamiltonian/hamiltonian.h"

namespace finestra {
namespace {

// A manifold model in which only the chosen Zeeman coupling is kept: since the engine's Hamiltonian
// is linear in B, H(b̂) of this model is exactly that coupling's operator for a unit field.
ManifoldModel onlyZeeman(const ManifoldModel& m, double spinZeeman, double orbitalZeeman, double gammaN) {
  ManifoldModel out;
  out.nuclearDim = m.nuclearDim;
  out.spinZeeman = spinZeeman;
  out.orbitalZeeman = orbitalZeeman;
  out.gammaN = gammaN;
  return out;
}

}  // namespace

MagneticDipoleOperators magneticDipoleOperators(const ManifoldModel& m, const Vec3& b) {
  const StrainTerms none;
  return {fullHamiltonian(onlyZeeman(m, m.spinZeeman, 0, 0), none, b),
          fullHamiltonian(onlyZeeman(m, 0, m.orbitalZeeman, 0), none, b),
          fullHamiltonian(onlyZeeman(m, 0, 0, m.gammaN), none, b)};
}

}  // namespace finestra
