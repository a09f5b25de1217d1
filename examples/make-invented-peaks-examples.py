#!/usr/bin/env python3
"""Writes the INVENTED example inputs of `finestra-cli peaks` and `finestra-cli strain --peaks`.

Nothing here is measured data: the spectrum is four Lorentzian lines (two overlapping) on a sloped
baseline with seeded Gaussian noise; the emitters are SiV- zero-field line quadruplets made from
invented E-strain energies (mostly with the d-type ratio of the preset couplings, one f-type, one
with two lines written in the wrong order) plus seeded noise.
Usage: python3 examples/make-invented-peaks-examples.py   (from the repository root)
"""
import math
import random

random.seed(2026)
with open("examples/invented-spectrum.csv", "w") as f:
    f.write("# INVENTED example spectrum for `finestra-cli peaks` (not measured data): four Lorentzian lines,\n")
    f.write("# two of them overlapping near -45 GHz, on a sloped baseline with Gaussian noise of sigma 2.\n")
    f.write("# Made by examples/make-invented-peaks-examples.py.\n")
    f.write("GHz_detuning,counts\n")
    lines = [(-120.0, 6.0, 80.0), (-48.0, 5.0, 120.0), (-41.0, 5.0, 70.0), (75.0, 8.0, 50.0)]  # centre, FWHM, height
    for i in range(1001):
        x = -200 + 400 * i / 1000
        y = 20 + 0.02 * x
        for c, w, h in lines:
            g = w / 2
            y += h * g * g / ((x - c) ** 2 + g * g)
        f.write(f"{x:.3f},{y + random.gauss(0, 2.0):.4f}\n")

# SiV- preset: lambda_g 48 GHz, lambda_u 259 GHz, d_u/d_g = 1.8/1.3, f_u/f_g = 3.4/1.7.
lam_g, lam_u = 48.0, 259.0
sigma = 0.05
with open("examples/invented-emitters.csv", "w") as f:
    f.write("# INVENTED zero-field lines of 12 SiV- emitters on a sample map (not measured data),\n")
    f.write("# for `finestra-cli strain --centre SiV- --peaks examples/invented-emitters.csv`.\n")
    f.write("# Made by examples/make-invented-peaks-examples.py. e10 follows f-type coupling; e11 has A and B swapped.\n")
    f.write("emitter,unit,A,A_sigma,B,B_sigma,C,C_sigma,D,D_sigma,x_um,y_um\n")
    for k in range(12):
        eg = random.uniform(15, 60)
        eu = eg * (3.4 / 1.7 if k == 10 else 1.8 / 1.3)
        dg = math.sqrt(lam_g**2 + 4 * eg**2)
        du = math.sqrt(lam_u**2 + 4 * eu**2)
        c = random.uniform(-5, 5)
        a, b, cc, d = c + du / 2 + dg / 2, c + du / 2 - dg / 2, c - du / 2 + dg / 2, c - du / 2 - dg / 2
        if k == 11:
            a, b = b, a
        row = [a, b, cc, d]
        cells = ",".join(f"{v + random.gauss(0, sigma):.3f},{sigma}" for v in row)
        f.write(f"e{k},GHz_detuning,{cells},{(k % 4) * 25.0},{(k // 4) * 25.0}\n")
