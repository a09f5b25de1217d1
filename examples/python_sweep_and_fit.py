#!/usr/bin/env python3
"""Finestra from Python, on an INVENTED scenario (no measured data, no publication).

Loads the demo project (membrane-vector-magnet.json: SiV- in a (001) membrane, vector magnet),
sweeps the field magnitude, then invents a measurement: the lines the model predicts when the magnet
really gives 0.98 of its setting and the zero-phonon line sits 1.5 GHz higher than the preset, plus
Gaussian noise of 0.05 GHz. Fitting field_scale and zpl_offset_GHz to those invented peaks should give
back about 0.98 and 1.5 GHz. Plots the level fan and the fit residuals when matplotlib is installed
(only the plot is skipped otherwise).

Usage: python3 python_sweep_and_fit.py [OUTPUT.png]
(from a build tree: PYTHONPATH=build/release/python python3 examples/python_sweep_and_fit.py)
"""
import os
import sys

import numpy as np

import finestra

HERE = os.path.dirname(os.path.abspath(__file__))
INVENTED_FIELD_SCALE = 0.98      # invented: the magnet gives 98 % of its setting
INVENTED_ZPL_SHIFT_GHZ = 1.5     # invented: this centre's ZPL is 1.5 GHz above the preset
NOISE_GHZ = 0.05
SETTINGS_T = (0.5, 1.0, 1.5, 2.0)


def invented_peaks(project, setting_t, rng):
    """Strong lines of the 'true' (invented) centre at one magnet setting, with noise."""
    truth = project.copy()
    truth.set("field.magnitude_T", setting_t * INVENTED_FIELD_SCALE)
    lines = [line for cls in finestra.lines(truth)["classes"] for line in cls["lines"]]
    strongest = max(line["intensity"] for line in lines)
    return [{"position": line["frequency_GHz"] + INVENTED_ZPL_SHIFT_GHZ + rng.normal(0.0, NOISE_GHZ),
             "unit": "GHz", "sigma": NOISE_GHZ}
            for line in lines if line["intensity"] > 0.2 * strongest]


def main():
    project = finestra.load_project(os.path.join(HERE, "membrane-vector-magnet.json"))
    print(project)

    fan = finestra.sweep(project, "magnitude 0-3 T")
    print(f"sweep '{fan['name']}': {len(fan['x'])} points, classes {[c['class'] for c in fan['classes']]}")

    rng = np.random.default_rng(20261205)
    field = project.get("field")
    measurements = [{"name": f"invented, setting {b} T", "temperature_K": 4.0,
                     "field": dict(field, magnitude_T=b), "peaks": invented_peaks(project, b, rng)}
                    for b in SETTINGS_T]
    project.update({"measurements": measurements, "fit.free": ["field_scale", "zpl_offset_GHz"], "fit.starts": 4})
    print(f"{sum(len(m['peaks']) for m in measurements)} invented peaks in {len(measurements)} sets")

    result = finestra.fit(project, progress=lambda f: print(f"  fit {100 * f:3.0f} %"))
    print(result)
    for name in ("field_scale", "zpl_offset_GHz"):
        print(f"{name}: {result.values[name]:.4f} +- {result.errors[name]} (invented truth "
              f"{INVENTED_FIELD_SCALE if name == 'field_scale' else INVENTED_ZPL_SHIFT_GHZ})")

    try:
        import matplotlib
        matplotlib.use("Agg")
        import matplotlib.pyplot as plt
    except ImportError:
        print("matplotlib is not installed: computation done, plot skipped")
        return
    figure, (levels_axes, residual_axes) = plt.subplots(1, 2, figsize=(11, 4.5))
    for cls in fan["classes"]:
        drawn = levels_axes.plot(fan["x"], cls["ground_GHz"], lw=0.8, color=f"C{cls['class']}")
        drawn[0].set_label(f"class {cls['class']}")
    levels_axes.legend(loc="upper left", fontsize=8)
    levels_axes.set(xlabel="field magnitude (T)", ylabel="ground levels (GHz)",
                    title="Ground levels of the four classes (demo project)")
    residuals = [a["residual_GHz"] for a in result.assignments if a["residual_GHz"] is not None]
    residual_axes.hist(residuals, bins=20, color="C2")
    residual_axes.set(xlabel="residual (GHz)", ylabel="peaks", title="Fit residuals (invented peaks)")
    figure.tight_layout()
    output = sys.argv[1] if len(sys.argv) > 1 else "python_sweep_and_fit.png"
    figure.savefig(output, dpi=110)
    print(f"plot written to {output}")


if __name__ == "__main__":
    main()
