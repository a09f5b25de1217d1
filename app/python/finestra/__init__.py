"""Finestra from Python: the fine-structure engine for group-IV vacancy centres in diamond.

Load a project, ask for levels, lines, sweeps and spectra, fit measured peaks and plan the magnet.
Results are the structures of ``finestra-cli ... --format json`` (dicts, lists, floats), with long
number lists as NumPy arrays where documented; units are in the key names (``_GHz``, ``_T``, ``_deg``).

    import finestra
    project = finestra.load_project("membrane-vector-magnet.json")
    table = finestra.lines(project)                      # same as finestra-cli lines --format json
    grid = finestra.line_grid(project, fields)           # fields: (N, 3) crystal-frame tesla
    grid["frequency_GHz"].shape                          # (N, classes, 4 excited, 4 ground)

Long computations (line_grid, sweep, fit, plan, plan_map) release the GIL; their ``progress``
callback receives the finished fraction and may return False to cancel (raises ``Cancelled``).
Bad input raises ``InputError`` (a ValueError) whose message and ``key`` name the key at fault.
"""
from ._finestra import (  # noqa: F401  (re-exported names)
    Cancelled,
    FitResult,
    InputError,
    MissingValueError,
    Project,
    __version__,
    fit,
    levels,
    line_grid,
    lines,
    load_project,
    plan,
    plan_map,
    presets,
    spectrum,
    sweep,
)

__all__ = [
    "Cancelled", "FitResult", "InputError", "MissingValueError", "Project", "__version__", "fit", "levels",
    "line_grid", "lines", "load_project", "plan", "plan_map", "presets", "spectrum", "sweep",
]
