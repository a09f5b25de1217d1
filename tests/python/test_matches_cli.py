"""Every Python result equals the JSON of finestra-cli for the same project and options."""
import numpy as np
import pytest

import finestra


def test_lines_equal_cli_json(demo_path, cli_json):
    assert finestra.lines(finestra.load_project(demo_path)) == cli_json("lines", demo_path)


def test_levels_equal_cli_json(demo_path, cli_json):
    assert finestra.levels(finestra.load_project(demo_path)) == cli_json("levels", demo_path)


def test_presets_equal_cli_json(cli_json):
    assert finestra.presets() == cli_json("presets")


def test_sweep_equals_cli_json(demo_path, cli_json):
    project = finestra.load_project(demo_path)
    name = project.sweep_names[1]
    ours = finestra.sweep(project, name)
    theirs = cli_json("sweep", demo_path, "--name", name)
    assert ours["name"] == theirs["name"] and ours["kind"] == theirs["kind"]
    np.testing.assert_array_equal(ours["x"], theirs["x"])
    for mine, cli in zip(ours["classes"], theirs["classes"], strict=True):
        assert mine["class"] == cli["class"]
        np.testing.assert_array_equal(mine["ground_GHz"], np.array(cli["ground_GHz"]))
        np.testing.assert_array_equal(mine["excited_GHz"], np.array(cli["excited_GHz"]))
        assert mine["lines"] == cli["lines"]


def test_spectrum_equals_cli_json(demo_path, cli_json):
    ours = finestra.spectrum(finestra.load_project(demo_path), unit="nm_air", kind="PLE", points=500)
    theirs = cli_json("spectrum", demo_path, "--unit", "nm_air", "--kind", "PLE", "--points", "500")
    assert (ours["kind"], ours["unit"]) == (theirs["kind"], theirs["unit"])
    np.testing.assert_array_equal(ours["x"], theirs["x"])
    np.testing.assert_array_equal(ours["y"], theirs["y"])


def test_fit_equals_cli_json(fit_demo_path, cli_json):
    result = finestra.fit(finestra.load_project(fit_demo_path), starts=2, seed=3)
    theirs = cli_json("fit", fit_demo_path, "--starts", "2", "--seed", "3", allowed=(0, 4))
    assert result.to_dict() == theirs
    assert result.converged == theirs["converged"]
    assert result.values == {p["name"]: p["value"] for p in theirs["parameters"]}
    assert result.errors == {p["name"]: p["stderr"] for p in theirs["parameters"]}
    assert result.assignments == theirs["assignments"]
    assert result.undetermined == theirs["unidentifiable"]
    matrix = theirs["correlations"]["matrix"]
    assert result.correlation_names == theirs["correlations"]["names"]
    assert result.correlation.shape == (len(matrix), len(matrix))
    for a, row in enumerate(matrix):
        for b, value in enumerate(row):
            if value is None:
                assert result.correlation.mask[a, b]
            else:
                assert result.correlation[a, b] == value


def test_plan_equals_cli_json(demo_path, plan_request_path, cli_json):
    request = plan_request_path
    ours = finestra.plan(finestra.load_project(demo_path), request)
    assert ours == cli_json("plan", demo_path, "--request", request)


def test_plan_map_equals_cli_json(demo_path, cli_json):
    ours = finestra.plan_map(finestra.load_project(demo_path), step_deg=15)
    theirs = cli_json("plan", demo_path, "--what", "map", "--map-step-deg", "15")
    assert ours["magnitude_T"] == theirs["magnitude_T"]
    classes = list(ours["classes"])
    count = 0
    for row in theirs["points"]:
        i = int(np.flatnonzero(ours["polar_deg"] == row["polar_deg"])[0])
        j = int(np.flatnonzero(ours["azimuth_deg"] == row["azimuth_deg"])[0])
        c = classes.index(int(row["class"]))
        for key in ("qubit_GHz", "drive_fraction", "cyclicity", "separation_linewidths", "axis_angle_deg"):
            if row[key] is None:  # undefined there: masked on our side
                assert ours[key].mask[c, i, j], (key, row)
            else:  # the CLI's map table prints 15 significant digits
                assert ours[key][c, i, j] == pytest.approx(row[key], rel=1e-14, abs=0), (key, row)
        count += 1
    assert count == ours["qubit_GHz"].size

