#!/usr/bin/env python3
"""Generates the INVENTED demo measurements of examples/membrane-vector-magnet.json.

The peaks and the spectrum are the engine's own prediction (finestra-cli) plus invented noise and
an invented background; they are not measured data and come from no publication.
Usage: examples/make-invented-measurements.py PATH/TO/finestra-cli
"""
import json, random, subprocess, sys, tempfile, os

cli = sys.argv[1]
here = os.path.dirname(os.path.abspath(__file__))
base = json.load(open(os.path.join(here, "membrane-vector-magnet.json")))
rng = random.Random(20240611)


def run(project, *args):
    with tempfile.NamedTemporaryFile("w", suffix=".json", delete=False) as f:
        json.dump(project, f)
    out = subprocess.run([cli, *args, f.name], check=True, capture_output=True, text=True).stdout
    os.unlink(f.name)
    return out


rows = []
for field in (0.25, 0.5, 1.0, 1.5, 2.0, 2.5):
    p = json.loads(json.dumps(base))
    p["field"]["magnitude_T"] = field
    lines = json.loads(run(p, "lines", "--format", "json"))
    flat = [l for c in lines["classes"] for l in c["lines"]]
    strongest = max(l["intensity"] for l in flat)
    picked = []
    for l in sorted(flat, key=lambda l: -l["intensity"]):
        if l["intensity"] < 0.35 * strongest:
            break
        if all(abs(l["frequency_GHz"] - q) > 1.0 for q in picked):
            picked.append(l["frequency_GHz"])
    for f in sorted(picked):
        measured = f + rng.gauss(0.0, 0.12)  # invented scatter, GHz
        rows.append((f"sweep {field:.2f} T", field, measured * 1e-3))

with open(os.path.join(here, "membrane-invented-peaks.csv"), "w") as out:
    out.write("# INVENTED demo data: engine prediction for examples/membrane-vector-magnet.json plus invented\n")
    out.write("# Gaussian scatter (0.12 GHz). Not a measurement; no published data used.\n")
    out.write("measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma,analyser_deg\n")
    for name, field, thz in rows:
        out.write(f"{name},{field},54.7356,0,{thz:.7f},THz,0.0002,\n")

p = json.loads(json.dumps(base))
spectrum = json.loads(run(p, "spectrum", "--format", "json", "--unit", "nm_air", "--points", "700"))
peak = max(spectrum["y"])
with open(os.path.join(here, "membrane-invented-spectrum.csv"), "w") as out:
    out.write("# INVENTED demo spectrum: engine PL prediction at 0.5 T (examples/membrane-vector-magnet.json),\n")
    out.write("# scaled to counts, with an invented flat background and invented Gaussian noise. Not a measurement.\n")
    out.write("nm_air,counts\n")
    for x, y in zip(spectrum["x"], spectrum["y"]):
        counts = 1500.0 * y / peak + 40.0 + rng.gauss(0.0, 12.0)
        out.write(f"{x:.5f},{counts:.1f}\n")
