#!/usr/bin/env python3
"""Checks that the NumPy program (tests/bench/numpy_baseline.py) and the engine compute the same
lines: runs `finestra-cli lines PROJECT --format json` and recomputes every class's levels and
lines with the NumPy functions from the project file and the preset file alone.

This makes the benchmark ratios honest (both programs do the same physics) and gives the engine a
second, independent implementation to agree with. Compared per class: both level lists, and per
line (upper, lower) the absolute frequency, the intensity for the project's detection geometry and
the three crystal-axis intensities. Where levels are degenerate the single-line intensities depend
on the basis chosen inside the degenerate pair, so sums over degenerate levels are compared.

Scope: projects without an isotope (the NumPy program models the 4-state manifolds). The field
forms, the sample frame, the magnet calibration, the crystal strain tensor and the per-manifold
E-strain of the project file are all honoured (docs/physics.md, Frames; docs/physics.md, Strain;
docs/physics.md, Magnet calibration).

Usage: numpy_lines_check.py FINESTRA_CLI PROJECT.json [PROJECT.json ...]
Exit 0 when every project agrees, 1 on a mismatch (each one printed), 2 on bad input.
"""
from __future__ import annotations

import json
import os
import subprocess
import sys

import numpy as np

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from numpy_baseline import Manifold, class_frames, class_lines  # noqa: E402

REPOSITORY = os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__))))
FREQUENCY_TOLERANCE_GHZ = 1e-6   # both diagonalise in double precision; levels are ~1e3 GHz
INTENSITY_TOLERANCE = 1e-9       # intensities are O(1)
DEGENERATE_GHZ = 1e-6


class BadInput(Exception):
    pass


def centre_parameters(project: dict, origin: str) -> dict[str, float]:
    """Preset values replaced by the project's overrides, as the engine resolves them
    (docs/architecture.md, Presets and provenance)."""
    centre = project.get("centre", {})
    if centre.get("isotope") is not None:
        raise BadInput(f"{origin}: centre.isotope: the NumPy program models the 4-state manifolds only")
    preset_name = centre.get("preset", "SiV-")
    preset_path = os.path.join(REPOSITORY, "resources", "presets", f"{preset_name}.json")
    with open(preset_path, encoding="utf-8") as f:
        preset = json.load(f)
    values = {key: entry["value"] for key, entry in preset["parameters"].items()}
    values.update(centre.get("parameters", {}))
    missing = [key for key, value in values.items() if value is None]
    if missing:
        raise BadInput(f"{origin}: centre.parameters: no value for {', '.join(missing)}")
    return values


def lab_frame(project: dict) -> np.ndarray:
    """Rows: lab x, y, z in crystal coordinates (z = sample normal, x = in-plane reference)."""
    sample = project.get("sample", {})
    z = np.array(sample.get("normal", [0, 0, 1]), dtype=float)
    x = np.array(sample.get("in_plane_x", [1, 1, 0]), dtype=float)
    z /= np.linalg.norm(z)
    x /= np.linalg.norm(x)
    return np.array([x, np.cross(z, x), z])


def rotation(axis: np.ndarray, angle_rad: float) -> np.ndarray:
    """Right-handed rotation about a unit axis (Rodrigues' formula)."""
    k = np.array([[0, -axis[2], axis[1]], [axis[2], 0, -axis[0]], [-axis[1], axis[0], 0]])
    return np.eye(3) + np.sin(angle_rad) * k + (1 - np.cos(angle_rad)) * (k @ k)


def true_field_crystal(project: dict, lab: np.ndarray) -> np.ndarray:
    """The project's magnet setting converted to the true field in crystal axes (T)."""
    field = project.get("field", {})
    if "vector_crystal_T" in field:
        nominal_lab = lab @ np.array(field["vector_crystal_T"], dtype=float)
    elif "vector_lab_T" in field:
        nominal_lab = np.array(field["vector_lab_T"], dtype=float)
    else:
        polar, azimuth = np.radians(field.get("polar_deg", 0.0)), np.radians(field.get("azimuth_deg", 0.0))
        nominal_lab = field.get("magnitude_T", 0.0) * np.array(
            [np.sin(polar) * np.cos(azimuth), np.sin(polar) * np.sin(azimuth), np.cos(polar)])
    magnet = project.get("magnet") or {}
    tilt_azimuth = np.radians(magnet.get("tilt_azimuth_deg", 0.0))
    tilt_axis = np.array([-np.sin(tilt_azimuth), np.cos(tilt_azimuth), 0.0])
    true_lab = magnet.get("field_scale", 1.0) * rotation(tilt_axis, np.radians(magnet.get("tilt_deg", 0.0))) @ nominal_lab
    return lab.T @ true_lab


def strain_tensor(project: dict) -> np.ndarray:
    c = project.get("strain", {}).get("crystal", {})
    g = lambda key: float(c.get(key, 0.0))  # noqa: E731
    return np.array([[g("xx"), g("xy"), g("zx")], [g("xy"), g("yy"), g("yz")], [g("zx"), g("yz"), g("zz")]])


def manifold(values: dict, suffix: str, strain_defect: np.ndarray, extra_eg: dict | None) -> Manifold:
    """One manifold with its strain terms (docs/physics.md, Strain): couplings in PHz per unit
    strain, 1 PHz = 1e6 GHz."""
    e = strain_defect
    coupling = lambda name: 1e6 * values[f"{name}_{suffix}_PHz"]  # noqa: E731
    a1g = coupling("tperp") * (e[0, 0] + e[1, 1]) + coupling("tpar") * e[2, 2]
    eg_x = coupling("d") * (e[0, 0] - e[1, 1]) + coupling("f") * e[2, 0]
    eg_y = -2.0 * coupling("d") * e[0, 1] + coupling("f") * e[1, 2]
    if extra_eg:
        angle = np.radians(extra_eg.get("angle_deg", 0.0))
        eg_x += extra_eg.get("magnitude_GHz", 0.0) * np.cos(angle)
        eg_y += extra_eg.get("magnitude_GHz", 0.0) * np.sin(angle)
    return Manifold(spin_orbit_GHz=values[f"lambda_{suffix}_GHz"], orbital_reduction=values[f"q_{suffix}"],
                    g_spin=values["g_spin"], a1g_GHz=a1g,
                    sigma_z_GHz=values[f"jt_x_{suffix}_GHz"] - eg_x, sigma_x_GHz=values[f"jt_y_{suffix}_GHz"] + eg_y)


def detection_intensity(amplitude_crystal: np.ndarray, project: dict, lab: np.ndarray) -> np.ndarray:
    """Intensity for the project's analyser, or unpolarised along the collection direction
    (the sum over two analysers perpendicular to it equals |a|^2 - |k.a|^2)."""
    conditions = project.get("conditions", {})
    analyser = conditions.get("analyser_lab")
    if analyser is not None:
        e = lab.T @ np.array(analyser, dtype=float)
        e /= np.linalg.norm(e)
        return np.abs(amplitude_crystal @ e) ** 2
    k = lab.T @ np.array(conditions.get("collection_lab", [0, 0, 1]), dtype=float)
    k /= np.linalg.norm(k)
    return (np.abs(amplitude_crystal) ** 2).sum(axis=-1) - np.abs(amplitude_crystal @ k) ** 2


def degenerate_blocks(levels: np.ndarray) -> list[list[int]]:
    blocks: list[list[int]] = [[0]]
    for i in range(1, len(levels)):
        if levels[i] - levels[i - 1] < DEGENERATE_GHZ:
            blocks[-1].append(i)
        else:
            blocks.append([i])
    return blocks


def block_sums(matrix: np.ndarray, upper_blocks: list[list[int]], lower_blocks: list[list[int]]) -> np.ndarray:
    """Sums of matrix[upper, lower, ...] over every pair of degenerate blocks."""
    return np.array([[matrix[np.ix_(u, l)].sum(axis=(0, 1)) for l in lower_blocks] for u in upper_blocks])


def compare_class(name: str, cli: dict, ours, detection: np.ndarray) -> list[str]:
    problems = []
    for key, mine in (("ground_GHz", ours.ground_GHz[0]), ("excited_GHz", ours.excited_GHz[0])):
        theirs = np.array(cli[key])
        if theirs.shape != mine.shape or np.max(np.abs(theirs - mine)) > FREQUENCY_TOLERANCE_GHZ:
            problems.append(f"{name}: {key} differ: engine {theirs.tolist()}, NumPy {mine.tolist()}")
    frequency = np.full((4, 4), np.nan)
    intensity = np.full((4, 4), np.nan)
    crystal = np.full((4, 4, 3), np.nan)
    for line in cli["lines"]:
        i, j = line["upper"], line["lower"]
        frequency[i, j] = line["frequency_GHz"]
        intensity[i, j] = line["intensity"]
        crystal[i, j] = line["intensity_crystal_xyz"]
    if np.isnan(frequency).any():
        return problems + [f"{name}: the engine did not list all 16 lines"]
    worst_frequency = np.max(np.abs(frequency - ours.frequency_GHz[0]))
    if worst_frequency > FREQUENCY_TOLERANCE_GHZ:
        problems.append(f"{name}: line frequencies differ by up to {worst_frequency:.3g} GHz")
    upper, lower = degenerate_blocks(ours.excited_GHz[0]), degenerate_blocks(ours.ground_GHz[0])
    for label, theirs, mine in (("intensity", intensity, detection[0]),
                                ("intensity_crystal_xyz", crystal, ours.intensity_crystal()[0])):
        difference = np.max(np.abs(block_sums(theirs, upper, lower) - block_sums(mine, upper, lower)))
        if difference > INTENSITY_TOLERANCE:
            problems.append(f"{name}: {label} differs by up to {difference:.3g}")
    return problems


def check_project(cli_path: str, project_path: str) -> list[str]:
    try:
        with open(project_path, encoding="utf-8") as f:
            project = json.load(f)
    except (OSError, json.JSONDecodeError) as error:
        raise BadInput(f"{project_path}: {error}") from error
    values = centre_parameters(project, project_path)
    lab = lab_frame(project)
    field = true_field_crystal(project, lab)[None, :]
    strain = strain_tensor(project)
    run = subprocess.run([cli_path, "lines", project_path, "--format", "json"], capture_output=True, text=True)
    if run.returncode != 0:
        raise BadInput(f"{project_path}: finestra-cli failed: {run.stderr.strip()}")
    engine = {entry["class"]: entry for entry in json.loads(run.stdout)["classes"]}
    frames = class_frames()
    problems = []
    for cls in project.get("classes", [0, 1, 2, 3]):
        frame = frames[cls]
        strain_defect = frame @ strain @ frame.T
        extra = project.get("strain", {})
        ground = manifold(values, "g", strain_defect, extra.get("eg_ground"))
        excited = manifold(values, "u", strain_defect, extra.get("eg_excited"))
        ours = class_lines(ground, excited, field, frame, 1e3 * values["zpl_THz"], values["dipole_ratio_perp_par"])
        detection = detection_intensity(ours.amplitude_crystal, project, lab)
        if cls not in engine:
            problems.append(f"{project_path}: class {cls} missing from the engine's output")
            continue
        problems += compare_class(f"{project_path}, class {cls}", engine[cls], ours, detection)
    return problems


def main(argv: list[str]) -> int:
    if len(argv) < 3:
        print(__doc__.strip().splitlines()[-3], file=sys.stderr)
        return 2
    failed = False
    for project_path in argv[2:]:
        try:
            problems = check_project(argv[1], project_path)
        except BadInput as error:
            print(f"numpy_lines_check: {error}", file=sys.stderr)
            return 2
        for problem in problems:
            print(problem)
        failed |= bool(problems)
        if not problems:
            print(f"{project_path}: engine and NumPy program agree (levels, 16 lines per class, intensities)")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
