#pragma once
// Magnetic-dipole coupling of a microwave field to one manifold (docs/physics.md, Hamiltonian of one manifold):
// the part of the Hamiltonian linear in B, evaluated for a unit field along b̂, split into the
// electron-spin Zeeman term (γ_S S·b̂), the orbital term (q γ_L L_z b̂_z; only the defect-axis
// component couples within an E doublet) and the nuclear Zeeman term (−γ_n I·b̂).
#include "core/hamiltonian/manifold_model.h"

namespace finestra {

/// The three parts of the coupling operator in the manifold's full basis, GHz per tesla of
/// microwave field along `driveDefect` (a unit vector in the defect frame).
struct MagneticDipoleOperators {
  MatrixXc spin, orbital, nuclear;
  MatrixXc total() const { return spin + orbital + nuclear; }
};

MagneticDipoleOperators magneticDipoleOperators(const ManifoldModel& manifold, const Vec3& driveDefect);

}  // namespace finestra
