#!/usr/bin/env python3
"""The program a practitioner would write instead of Finestra's engine: the same model in NumPy.

It is the yardstick of the benchmark ratios (tests/bench/engine_vs_numpy.sh,
tests/bench/planner_vs_numpy.sh, scripts/bench_report.sh) and, through its importable functions,
an independent second implementation that tests/bench/numpy_lines_check.py compares with
`finestra-cli lines --format json`.

Model (docs/physics.md, Hamiltonian of one manifold; docs/physics.md, Optical transitions): each
manifold is an orbital doublet {x, y} times spin 1/2, basis |x up>, |x down>, |y up>, |y down>
(orbital index slow). With Pauli matrices sigma on the orbit and s on the spin, in GHz and tesla:

    H = -(lambda/2) sigma_y s_z + [a1g + (jt_x - eg_x) sigma_z + (jt_y + eg_y) sigma_x]
        + q mu_B B_z sigma_y + (g mu_B / 2) B.s

The electric-dipole operator acts on the orbit only: d_x = r sigma_z, d_y = -r sigma_x, d_z = 1
(defect frame, r = d_perp/d_par). A line from excited level i to ground level j has the absolute
frequency nu_ZPL + E_u,i - E_g,j and, for an analyser along a crystal axis c, the intensity
|sum_k F[k, c] <g_j| d_k |u_i>|^2, where the rows of F are the class's defect axes in crystal
coordinates.

Workload (the unit of every ratio, one "class-point"): one field direction x one orientation
class, both 4x4 manifolds diagonalised, all 16 lines with the three crystal-axis intensities.
N crystal-frame fields of 0.5 T lie on a spiral over the sphere (polar angle arccos of an even
grid in [-1, 1], azimuth 7.3 turns), the SiV- values lambda_g = 48 GHz, lambda_u = 259 GHz,
q = 0.1, no strain. The C++ benchmark BM_LineGrid (tests/bench/engine_bench.cpp) uses the same
fields and values.

Command line (parsed by the scripts above, keep it stable):
    numpy_baseline.py [N, default 20000] [repeats, default 5]
prints one line
    numpy baseline: N directions x 4 classes in T ms -> R class-points/s
with T the best of the repeats. Needs NumPy (Debian: python3-numpy).
"""
from __future__ import annotations

import sys
import time
from dataclasses import dataclass

import numpy as np

# CODATA 2018: Bohr magneton over Planck constant (GHz/T) and the free-electron g-factor.
BOHR_GHZ_PER_T = 13.9962449361
FREE_ELECTRON_G = 2.00231930436256

PAULI_X = np.array([[0, 1], [1, 0]], dtype=complex)
PAULI_Y = np.array([[0, -1j], [1j, 0]], dtype=complex)
PAULI_Z = np.array([[1, 0], [0, -1]], dtype=complex)
IDENTITY_2 = np.eye(2, dtype=complex)


def orbital(op: np.ndarray) -> np.ndarray:
    """An operator on the orbital factor, identity on the spin (orbital index slow)."""
    return np.kron(op, IDENTITY_2)


def spin(op: np.ndarray) -> np.ndarray:
    """An operator on the spin factor, identity on the orbit."""
    return np.kron(IDENTITY_2, op)


def class_frames() -> np.ndarray:
    """Defect frames of the four orientation classes, shape (4, 3, 3); rows are the x, y, z axes
    in crystal coordinates (docs/physics.md, Frames). Class 0: z = [111], x = [11-2] (in a
    mirror plane), y = z cross x; classes 1..3 follow from the cubic twofold rotations about
    [100], [010], [001], which flip the signs of two crystal coordinates."""
    z = np.array([1.0, 1.0, 1.0]) / np.sqrt(3.0)
    x = np.array([1.0, 1.0, -2.0]) / np.sqrt(6.0)
    frame0 = np.array([x, np.cross(z, x), z])
    flips = ([1, 1, 1], [1, -1, -1], [-1, 1, -1], [-1, -1, 1])
    return np.array([frame0 * np.array(f, dtype=float) for f in flips])


@dataclass
class Manifold:
    """The numbers of one manifold (GHz, GHz/T, dimensionless)."""
    spin_orbit_GHz: float
    orbital_reduction: float
    g_spin: float = FREE_ELECTRON_G
    a1g_GHz: float = 0.0  # A1g strain: shifts the manifold
    sigma_z_GHz: float = 0.0  # coefficient of sigma_z: jt_x - eg_x
    sigma_x_GHz: float = 0.0  # coefficient of sigma_x: jt_y + eg_y

    def hamiltonians(self, fields_defect: np.ndarray) -> np.ndarray:
        """H for every field (n, 3) in the defect frame (T): shape (n, 4, 4)."""
        fixed = (-0.5 * self.spin_orbit_GHz * np.kron(PAULI_Y, PAULI_Z)
                 + self.a1g_GHz * np.eye(4) + self.sigma_z_GHz * orbital(PAULI_Z)
                 + self.sigma_x_GHz * orbital(PAULI_X))
        # Only B_z reaches the orbit: L_x and L_y vanish inside an E doublet.
        per_tesla = np.array([
            0.5 * self.g_spin * BOHR_GHZ_PER_T * spin(PAULI_X),
            0.5 * self.g_spin * BOHR_GHZ_PER_T * spin(PAULI_Y),
            0.5 * self.g_spin * BOHR_GHZ_PER_T * spin(PAULI_Z)
            + self.orbital_reduction * BOHR_GHZ_PER_T * orbital(PAULI_Y),
        ])
        return fixed[None, :, :] + np.einsum("nc,cab->nab", fields_defect, per_tesla)


def dipole_operators(ratio_perp_par: float) -> np.ndarray:
    """d_x, d_y, d_z in the defect frame (orbital part, identity on spin), shape (3, 4, 4)."""
    return np.array([ratio_perp_par * orbital(PAULI_Z), -ratio_perp_par * orbital(PAULI_X), np.eye(4, dtype=complex)])


@dataclass
class ClassLines:
    """Levels and lines of one class at n fields. Index order of the lines: [point, upper, lower]."""
    ground_GHz: np.ndarray  # (n, 4), ascending
    excited_GHz: np.ndarray  # (n, 4), ascending
    frequency_GHz: np.ndarray  # (n, 4, 4), absolute
    amplitude_crystal: np.ndarray  # (n, 4, 4, 3), <g_j| d |u_i> along crystal x, y, z

    def intensity_crystal(self) -> np.ndarray:
        """|e.d|^2 for analysers along the crystal axes, shape (n, 4, 4, 3)."""
        return np.abs(self.amplitude_crystal) ** 2


def class_lines(ground: Manifold, excited: Manifold, fields_crystal: np.ndarray, frame: np.ndarray,
                zpl_GHz: float, ratio_perp_par: float) -> ClassLines:
    """Diagonalises both manifolds of one class at every crystal-frame field (n, 3) and forms all
    16 lines with their crystal-frame dipole amplitudes."""
    fields_defect = fields_crystal @ frame.T  # v_defect = F v_crystal, row by row
    eg, vg = np.linalg.eigh(ground.hamiltonians(fields_defect))
    eu, vu = np.linalg.eigh(excited.hamiltonians(fields_defect))
    # <g_j| d_k |u_i> for every point, axis k, upper i, lower j.
    defect_amp = np.einsum("naj,kab,nbi->nijk", vg.conj(), dipole_operators(ratio_perp_par), vu)
    crystal_amp = defect_amp @ frame  # a_c = sum_k F[k, c] a_k
    frequency = zpl_GHz + eu[:, :, None] - eg[:, None, :]
    return ClassLines(eg, eu, frequency, crystal_amp)


def spiral_fields(n: int, magnitude_T: float = 0.5) -> np.ndarray:
    """The benchmark's crystal-frame fields: n points on a spiral over the sphere."""
    polar = np.arccos(np.linspace(-1.0, 1.0, n))
    azimuth = 7.3 * np.linspace(0.0, 2.0 * np.pi, n)
    return magnitude_T * np.stack([np.sin(polar) * np.cos(azimuth), np.sin(polar) * np.sin(azimuth), np.cos(polar)], axis=1)


def silicon_vacancy() -> tuple[Manifold, Manifold]:
    """Ground and excited manifold of the SiV- preset without strain (resources/presets/SiV-.json)."""
    return Manifold(48.0, 0.1), Manifold(259.0, 0.1)


def run_workload(fields_crystal: np.ndarray) -> float:
    """All four classes at every field; returns a checksum so that no work can be skipped."""
    ground, excited = silicon_vacancy()
    checksum = 0.0
    for frame in class_frames():
        lines = class_lines(ground, excited, fields_crystal, frame, zpl_GHz=406774.0, ratio_perp_par=1.0)
        checksum += float(lines.frequency_GHz.sum() + lines.intensity_crystal().sum())
    return checksum


def best_time_s(fields_crystal: np.ndarray, repeats: int) -> float:
    best = float("inf")
    for _ in range(repeats):
        start = time.perf_counter()
        run_workload(fields_crystal)
        best = min(best, time.perf_counter() - start)
    return best


def main(argv: list[str]) -> int:
    try:
        n = int(argv[1]) if len(argv) > 1 else 20000
        repeats = int(argv[2]) if len(argv) > 2 else 5
    except ValueError:
        print("usage: numpy_baseline.py [N directions] [repeats]", file=sys.stderr)
        return 2
    if not 2 <= n <= 10_000_000 or not 1 <= repeats <= 1000:
        print("numpy_baseline.py: N must lie in 2..10000000 and repeats in 1..1000", file=sys.stderr)
        return 2
    fields = spiral_fields(n)
    run_workload(spiral_fields(100))  # warm-up: first calls load LAPACK and allocate
    seconds = best_time_s(fields, repeats)
    print(f"numpy baseline: {n} directions x 4 classes in {seconds * 1e3:.1f} ms "
          f"-> {4 * n / seconds:.3e} class-points/s")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
