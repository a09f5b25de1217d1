"""The vectorised line grid equals a loop of single calls and the labelled lines of lines()."""
import numpy as np
import pytest

import finestra


def random_fields(count, seed=7):
    rng = np.random.default_rng(seed)
    directions = rng.normal(size=(count, 3))
    directions /= np.linalg.norm(directions, axis=1)[:, None]
    return directions * rng.uniform(0.0, 3.0, size=(count, 1))


def test_shapes_and_axis_order(demo_path):
    project = finestra.load_project(demo_path)
    grid = finestra.line_grid(project, random_fields(5))
    assert grid["frequency_GHz"].shape == (5, 4, 4, 4)
    assert grid["intensity_crystal_xyz"].shape == (5, 4, 4, 4, 3)
    assert list(grid["classes"]) == [0, 1, 2, 3]


def test_vectorised_equals_loop_of_single_calls(demo_path):
    project = finestra.load_project(demo_path)
    fields = random_fields(64)
    grid = finestra.line_grid(project, fields)
    for k, field in enumerate(fields):
        single = finestra.line_grid(project, field[None, :])
        np.testing.assert_array_equal(grid["frequency_GHz"][k], single["frequency_GHz"][0])
        np.testing.assert_array_equal(grid["intensity_crystal_xyz"][k], single["intensity_crystal_xyz"][0])


def test_grid_equals_labelled_lines_at_each_field(demo_path):
    project = finestra.load_project(demo_path)
    fields = random_fields(6, seed=11)
    grid = finestra.line_grid(project, fields)
    for k, field in enumerate(fields):
        at_field = project.copy()
        at_field.set("field", {"vector_crystal_T": field.tolist()})
        np.testing.assert_allclose(at_field.field_crystal_T, field, rtol=0, atol=1e-15)
        for c, cls in enumerate(finestra.lines(at_field)["classes"]):
            for line in cls["lines"]:
                u, g = line["upper"], line["lower"]
                # lines() diagonalises with the general solver, line_grid in closed form: equal to rounding.
                assert grid["frequency_GHz"][k, c, u, g] == pytest.approx(line["frequency_GHz"], rel=0, abs=1e-6)
                np.testing.assert_allclose(grid["intensity_crystal_xyz"][k, c, u, g],
                                           line["intensity_crystal_xyz"], rtol=0, atol=1e-9)


def test_bad_fields_raise_naming_the_argument(demo_path):
    project = finestra.load_project(demo_path)
    with pytest.raises(finestra.InputError, match="fields"):
        finestra.line_grid(project, np.zeros((4, 2)))
    with pytest.raises(finestra.InputError, match=r"fields\[1\]"):
        finestra.line_grid(project, np.array([[0.0, 0.0, 1.0], [np.nan, 0.0, 0.0]]))
