"""Shared fixtures: paths of the examples and a runner for the real finestra-cli."""
import json
import os
import pathlib
import subprocess

import pytest

SOURCE_DIR = pathlib.Path(os.environ.get("FINESTRA_SOURCE_DIR", pathlib.Path(__file__).resolve().parents[2]))
EXAMPLES = SOURCE_DIR / "examples"


@pytest.fixture
def demo_path():
    return str(EXAMPLES / "membrane-vector-magnet.json")


@pytest.fixture
def fit_demo_path():
    return str(EXAMPLES / "fit-demo.json")


@pytest.fixture
def plan_request_path():
    return str(EXAMPLES / "plan-request-two-axis-magnet.json")


@pytest.fixture
def cli_json():
    """Runs finestra-cli with --format json and returns the parsed output (exit 0, or 4 for fit)."""
    cli = os.environ.get("FINESTRA_CLI")
    if not cli:
        pytest.skip("FINESTRA_CLI is not set (run through ctest)")

    def run(*args, allowed=(0,)):
        done = subprocess.run([cli, *args, "--format", "json"], capture_output=True, text=True, check=False)
        assert done.returncode in allowed, done.stderr
        return json.loads(done.stdout)

    return run
