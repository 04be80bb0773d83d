#!/usr/bin/python3
"""The comparison a scholar would script: read every sheet_*.csv of DIR,
parse the entries and fit e of the eccentric model with SciPy's
least_squares (Cauchy loss, scale one second: the loss apograph's robust fit
minimises; closed-form Jacobian). Prints `sheet,e` lines and the time spent
(reading + fitting, no interpreter start-up).

usage: fit_sheets.py DIR
"""
import csv
import glob
import os
import sys
import time

import numpy as np
from scipy.optimize import least_squares


def seconds(text):
    neg = text.startswith("-")
    d, rest = text.lstrip("-").split(";")
    m, s = rest.split(",")
    v = int(d) * 3600 + int(m) * 60 + int(s)
    return -v if neg else v


def fit(args_deg, values):
    r = np.radians(args_deg)
    sin, cos = np.sin(r), np.cos(r)

    def residual(p):
        e = p[0]
        return 3600 * np.degrees(np.arctan2(e * sin, 60 + e * cos)) - values

    def jacobian(p):
        e = p[0]
        # d/de atan2(e s, 60 + e c) = 60 s / ((60 + e c)^2 + (e s)^2)
        d = 60 * sin / ((60 + e * cos) ** 2 + (e * sin) ** 2)
        return (3600 * np.degrees(d)).reshape(-1, 1)

    return least_squares(residual, [2.0], jac=jacobian, loss="cauchy", f_scale=1.0).x[0]


def main():
    files = sorted(glob.glob(os.path.join(sys.argv[1], "sheet_*.csv")))
    start = time.perf_counter()
    out = []
    for path in files:
        with open(path, newline="") as f:
            rows = list(csv.reader(f))[1:]
        a = np.array([float(r[0]) for r in rows])
        v = np.array([seconds(r[1]) for r in rows], dtype=float)
        out.append(f"{os.path.basename(path)},{fit(a, v)!r}")
    spent = time.perf_counter() - start
    print("\n".join(out))
    print(f"tables {len(files)}, fitted in {spent:.2f} s, per table {1000 * spent / max(1, len(files)):.2f} ms")


if __name__ == "__main__":
    main()
