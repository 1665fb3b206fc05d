"""Baseline for bench/whole-process.bench.ts: fit the on-axis loop field to every survey
file of a folder with scipy.optimize.least_squares (method 'lm', MINPACK lmder, analytic
Jacobian), and print one JSON line per survey (file, parameters, chi-square).

The model is the loop's on-axis field (Jackson, Classical Electrodynamics, 3rd ed., eq. 5.40
on the axis; DOMAIN.md loop on axis):

    B(d) = mu0 * NI * R^2 / (2 * (R^2 + (d + offset)^2)^(3/2)) + background

with the same four free parameters ringfall's loop model fits on axis. Reads the files as
make-fleet.ts writes them: '#' metadata lines, a header "distance (mm),B (mT)", rows.

Run: python3 bench/scipy-loop-fit.py DIR > out.jsonl
"""
import json
import math
import os
import sys

import numpy as np
from scipy.optimize import least_squares

MU0 = 4e-7 * math.pi


def read_survey(path):
    distances, fields = [], []
    with open(path, encoding="utf-8") as handle:
        header_seen = False
        for line in handle:
            line = line.strip()
            if not line or line.startswith("#"):
                continue
            if not header_seen:
                header_seen = True
                continue
            d, b = line.split(",")
            distances.append(float(d) * 1e-3)
            fields.append(float(b) * 1e-3)
    return np.array(distances), np.array(fields)


def residuals(p, d, b, sigma):
    ni, r, off, bg = p
    z = d + off
    q = r * r + z * z
    return (MU0 * ni * r * r / (2 * q ** 1.5) + bg - b) / sigma


def jacobian(p, d, b, sigma):
    ni, r, off, bg = p
    z = d + off
    q = r * r + z * z
    base = MU0 / (2 * q ** 1.5)
    j = np.empty((d.size, 4))
    j[:, 0] = base * r * r
    j[:, 1] = MU0 * ni * (r / q ** 1.5 - 1.5 * r ** 3 / q ** 2.5)
    j[:, 2] = -1.5 * MU0 * ni * r * r * 2 * z / (2 * q ** 2.5)
    j[:, 3] = 1.0
    return j / sigma[:, None]


def main(folder):
    out = sys.stdout
    for name in sorted(os.listdir(folder)):
        if not name.endswith(".csv"):
            continue
        d, b = read_survey(os.path.join(folder, name))
        sigma = np.hypot(0.005 * b, 1e-6)
        # start: radius from the half-value distance (B(R*0.766) = B(0)/2 on axis), ampere-turns from B(0)
        b0 = b[0]
        half = d[np.argmin(np.abs(b - b0 / 2))]
        r0 = max(half / 0.766, 1e-3)
        start = [2 * r0 * b0 / MU0, r0, 0.0, 0.0]
        fit = least_squares(residuals, start, jac=jacobian, method="lm", args=(d, b, sigma))
        chi2 = float(np.sum(fit.fun ** 2))
        out.write(json.dumps({"file": name, "params": fit.x.tolist(), "chi2": chi2}) + "\n")


if __name__ == "__main__":
    main(sys.argv[1])
