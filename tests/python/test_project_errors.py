"""Loading, editing and saving a project: the reader's rules and key-naming errors."""
import json

import pytest

import finestra


def test_bad_project_file_raises_naming_the_key(tmp_path, demo_path):
    document = json.loads(open(demo_path, encoding="utf-8").read())
    document["field"]["magnitude_T"] = 5000.0
    bad = tmp_path / "bad.json"
    bad.write_text(json.dumps(document), encoding="utf-8")
    with pytest.raises(finestra.InputError) as raised:
        finestra.load_project(str(bad))
    assert "field.magnitude_T" in str(raised.value)
    assert "field.magnitude_T" in raised.value.key
    assert isinstance(raised.value, ValueError)


def test_unknown_key_is_named(tmp_path, demo_path):
    document = json.loads(open(demo_path, encoding="utf-8").read())
    document["conditions"]["temprature_K"] = 4
    bad = tmp_path / "typo.json"
    bad.write_text(json.dumps(document), encoding="utf-8")
    with pytest.raises(finestra.InputError, match="temprature_K"):
        finestra.load_project(str(bad))


def test_bad_edit_raises_and_leaves_the_project_unchanged(demo_path):
    project = finestra.load_project(demo_path)
    before = project.copy()
    with pytest.raises(finestra.InputError, match=r"conditions\.temperature_K"):
        project.set("conditions.temperature_K", -3.0)
    with pytest.raises(finestra.InputError, match="classes"):
        project.update({"field.magnitude_T": 1.0, "classes": [0, 7]})
    assert project == before


def test_edit_save_and_load_round_trip(tmp_path, demo_path):
    project = finestra.load_project(demo_path)
    project.set("field.magnitude_T", 1.25)
    project.update({"conditions.temperature_K": 6.0, "sweeps[0].points": 11})
    assert project.get("field.magnitude_T") == 1.25
    assert project.get("sweeps[0].points") == 11
    path = tmp_path / "edited.json"
    project.save(str(path))
    again = finestra.load_project(str(path))
    assert again == project
    assert again.to_dict()["conditions"]["temperature_K"] == 6.0
    assert finestra.Project.from_dict(project.to_dict()) == project
    assert "SiV-" in repr(project) and "1.25 T" in repr(project)


def test_unknown_sweep_and_spectrum_unit_are_named(demo_path):
    project = finestra.load_project(demo_path)
    with pytest.raises(finestra.InputError, match="no sweep named"):
        finestra.sweep(project, "nonexistent")
    with pytest.raises(finestra.InputError, match="unit"):
        finestra.spectrum(project, unit="furlongs")


def test_version_is_the_cli_version():
    import os
    import subprocess
    cli = os.environ.get("FINESTRA_CLI")
    if not cli:
        pytest.skip("FINESTRA_CLI is not set (run through ctest)")
    printed = subprocess.run([cli, "--version"], capture_output=True, text=True, check=True).stdout.strip()
    assert finestra.__version__ == printed
