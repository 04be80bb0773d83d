#!/usr/bin/python3
"""Writes N CSV sheets of the solar equation (eccentric model, radius 60) for
the whole-job benchmarks (tests/bench/whole_jobs.sh): sheet_NNNN.csv with the
header `anomaly,equation`, rows a = 360 i / R (i = 1..R, decimal degrees),
entries rounded to the second and written d;m,s; e drawn per sheet from
[1.8, 2.6); with probability 1% an entry has one place replaced by another
value 0..59. Also truth.csv (sheet,e). Seeded: the same files on any Python 3.

usage: make_sheets.py --out DIR --tables N --rows R --seed S
"""
import argparse
import math
import os
import random


def place_text(total_seconds):
    sign = "-" if total_seconds < 0 else ""
    s = abs(total_seconds)
    return f"{sign}{s // 3600};{s // 60 % 60},{s % 60}"


def main():
    p = argparse.ArgumentParser()
    p.add_argument("--out", required=True)
    p.add_argument("--tables", type=int, default=1000)
    p.add_argument("--rows", type=int, default=360)
    p.add_argument("--seed", type=int, default=1)
    a = p.parse_args()
    rng = random.Random(a.seed)
    os.makedirs(a.out, exist_ok=True)
    truth = []
    for n in range(a.tables):
        e = 1.8 + 0.8 * rng.random()
        name = f"sheet_{n:04d}.csv"
        lines = ["anomaly,equation"]
        for i in range(1, a.rows + 1):
            arg = 360.0 * i / a.rows
            r = math.radians(arg)
            q = math.degrees(math.atan2(e * math.sin(r), 60 + e * math.cos(r)))
            sec = round(q * 3600)
            if rng.random() < 0.01:  # a copyist's slip in one place
                parts = [abs(sec) // 3600, abs(sec) // 60 % 60, abs(sec) % 60]
                parts[rng.randrange(3)] = rng.randrange(60)
                sec = (-1 if sec < 0 else 1) * (parts[0] * 3600 + parts[1] * 60 + parts[2])
            lines.append(f'{round(arg, 6):g},"{place_text(sec)}"')
        with open(os.path.join(a.out, name), "w") as f:
            f.write("\n".join(lines) + "\n")
        truth.append(f"{name},{e!r}")
    with open(os.path.join(a.out, "truth.csv"), "w") as f:
        f.write("sheet,e\n" + "\n".join(truth) + "\n")


if __name__ == "__main__":
    main()
