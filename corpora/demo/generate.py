#!/usr/bin/env python3
"""Generates the demo tradition of apograph: an INVENTED handbook, the
"Lantern Tables", in five invented witnesses. Nothing here is historical.

Run from the repository root:  python3 corpora/demo/generate.py
The output (corpora/demo/*.apo and corpora/demo/TRUTH.md) is committed; the
generator is deterministic (fixed seed), so running it again reproduces the
same files byte for byte.

Other draws of the same story, for tests that must not rest on one lucky
draw:  python3 corpora/demo/generate.py --seed 7 --output /some/folder
(the folder is created; the stemma and the witnesses stay the same, the
slips, their places and the editorial marks' readings change with the seed).

The story the data tell (what the pipeline should find):
  * The author computed four tables:
      sun-eq   solar equation, eccentric model, e = 2;16 on a radius of 60,
               exact at every 6th degree and linearly interpolated between,
               rounded to seconds (2 places); argument 1..180.
      decl     solar declination, obliquity 23;32,40, rounded to seconds.
      shadow   shadow of a gnomon of 12 for altitudes 1..90, truncated to
               2 places.
      sun-mm   mean motion of the sun for days 1..40, made by repeated
               addition of the rounded daily motion 0;59,8,20 (3 places), so
               the entries drift from the more precise rate 0;59,8,19,48.
    and left two inaccuracies of his own in the archetype (one-unit slips in
    sun-eq and decl) that every witness shares.
  * Copies: A and a lost copy alpha were made from the archetype; B is a
    direct copy of A; C and a lost copy beta come from alpha; D comes from
    beta; E follows beta in the first half of each table and A in the second
    (contamination). Every copy adds slips typical of its numeral script.
"""

import argparse
import math
import os
import random

HERE = os.path.dirname(os.path.abspath(__file__))
SEED = 20261201

# ---------------------------------------------------------------- numbers

def to_units(value, places, truncate=False):
    scaled = value * 60 ** places
    return int(math.trunc(scaled)) if truncate else int(math.floor(abs(scaled) + 0.5)) * (1 if scaled >= 0 else -1)


def fmt(units, places):
    """Units of the last place -> trade notation (2;23,10)."""
    sign = "-" if units < 0 else ""
    u = abs(units)
    digits = []
    for _ in range(places):
        digits.append(u % 60)
        u //= 60
    digits.reverse()
    if places == 0:
        return f"{sign}{u}"
    return f"{sign}{u};" + ",".join(str(d) for d in digits)


def split(units, places):
    """Units -> [integer, place1, place2, ...] (non-negative values)."""
    u = abs(units)
    digits = []
    for _ in range(places):
        digits.append(u % 60)
        u //= 60
    return [u] + digits[::-1]


def join(parts, places):
    u = parts[0]
    for d in parts[1:]:
        u = u * 60 + d
    return u

# ---------------------------------------------------------------- the author's tables

def deg(x):
    return x * math.pi / 180


def solar_equation(a, e=2 + 16 / 60):
    return math.degrees(math.atan2(e * math.sin(deg(a)), 60 + e * math.cos(deg(a))))


def interpolated(f, a, grid):
    lo = (a // grid) * grid
    if lo == a:
        return f(a)
    return f(lo) + (f(lo + grid) - f(lo)) * (a - lo) / grid


def make_tables():
    eps = 23 + 32 / 60 + 40 / 3600
    tables = {}
    tables["sun-eq"] = dict(
        title="Equation of the sun", kind="solar equation", arg="anomaly", unit="deg",
        start=1, step=1, column="equation", places=2,
        rows=[(a, to_units(interpolated(solar_equation, a, 6), 2)) for a in range(1, 181)])
    tables["decl"] = dict(
        title="Declination of the sun", kind="declination", arg="longitude", unit="deg",
        start=1, step=1, column="declination", places=2,
        rows=[(a, to_units(math.degrees(math.asin(math.sin(deg(eps)) * math.sin(deg(a)))), 2))
              for a in range(1, 91)])
    tables["shadow"] = dict(
        title="Shadow of a gnomon of twelve", kind="shadow", arg="altitude", unit="deg",
        start=1, step=1, column="shadow", places=2,
        rows=[(a, to_units(12 / math.tan(deg(a)), 2, truncate=True)) for a in range(1, 91)])
    daily = join([0, 59, 8, 20], 3)
    tables["sun-mm"] = dict(
        title="Mean motion of the sun in days", kind="mean motion", arg="days", unit="day",
        start=1, step=1, column="motion", places=3,
        rows=[(d, daily * d) for d in range(1, 41)])
    # The author's own slips, shared by every witness.
    tables["sun-eq"]["rows"][96] = (97, tables["sun-eq"]["rows"][96][1] + 1)
    tables["decl"]["rows"][40] = (41, tables["decl"]["rows"][40][1] - 1)
    return tables

# ---------------------------------------------------------------- copying slips

# Digit confusions used for witnesses in Hindu-Arabic digits; they are among
# the confusions listed in corpora/scripts/hindu-arabic (common practice).
DIGIT_CONFUSIONS = {"hindu-arabic": [("4", "5"), ("7", "8"), ("2", "3"), ("0", "5"), ("1", "7"), ("6", "0")]}


class Cell:
    def __init__(self, units, places):
        self.units = units
        self.places = places
        self.marks = []      # editorial marks as written in the transcription
        self.state = "read"  # read | blank | illegible | partial

    def text(self):
        if self.state == "blank":
            body = "_"
        elif self.state == "illegible":
            body = "?"
        elif self.state == "partial":
            parts = split(self.units, self.places)
            parts[-1] = "?"
            body = f"{parts[0]};" + ",".join(str(p) for p in parts[1:])
        else:
            body = fmt(self.units, self.places)
        return " ".join([body] + self.marks)

    def copy(self):
        c = Cell(self.units, self.places)
        c.state = self.state if self.state in ("blank",) else "read"
        return c


def confuse_digit(units, places, rng, script):
    parts = split(units, places)
    options = []
    for k in range(1, len(parts)):
        s = f"{parts[k]:02d}"
        for i, ch in enumerate(s):
            for a, b in DIGIT_CONFUSIONS[script]:
                for x, y in ((a, b), (b, a)):
                    if ch == x:
                        t = s[:i] + y + s[i + 1:]
                        if int(t) <= 59 and int(t) != parts[k]:
                            options.append((k, int(t)))
    if not options:
        return None
    k, v = rng.choice(options)
    parts[k] = v
    return join(parts, places)


def transpose(units, places, rng):
    parts = split(units, places)
    options = [k for k in range(1, len(parts)) if parts[k] >= 10 and parts[k] % 10 != parts[k] // 10
               and int(str(parts[k])[::-1]) <= 59]
    if not options:
        return None
    k = rng.choice(options)
    parts[k] = int(str(parts[k])[::-1])
    return join(parts, places)


def slip(witness_rows, i, rng, script, log, siglum, table):
    """Applies one random slip at row i of a list of (arg, Cell)."""
    arg, cell = witness_rows[i]
    kind = rng.choice(["digit", "digit", "digit", "transpose", "repeat", "skip-run"])
    before = fmt(cell.units, cell.places)
    if kind == "digit":
        new = confuse_digit(cell.units, cell.places, rng, script)
    elif kind == "transpose":
        new = transpose(cell.units, cell.places, rng)
    elif kind == "repeat" and i > 0:
        new = witness_rows[i - 1][1].units
    elif kind == "skip-run" and i + 4 < len(witness_rows):
        # The eye slips: three entries are each copied from the row below.
        for j in range(i, i + 3):
            witness_rows[j][1].units = witness_rows[j + 1][1].units
        log.append(f"{siglum} {table} args {witness_rows[i][0]}-{witness_rows[i + 2][0]}: run copied one row up")
        return
    else:
        new = None
    if new is None or new == cell.units:
        return
    cell.units = new
    log.append(f"{siglum} {table} arg {arg}: {kind} {before} -> {fmt(new, cell.places)}")


def copy_table(rows, rng, script, slips, log, siglum, table):
    out = [(a, c.copy()) for a, c in rows]
    positions = rng.sample(range(2, len(out) - 6), slips)
    for i in sorted(positions):
        slip(out, i, rng, script, log, siglum, table)
    return out

# ---------------------------------------------------------------- the tradition

WITNESSES = {
    "A": dict(library="Tornholm, Cathedral Library", shelfmark="MS 7", date="c. 1380",
              script="hindu-arabic", note="invented demo witness", hand="main hand"),
    "B": dict(library="Valdric, Town Library", shelfmark="Cod. 212", date="c. 1420",
              script="hindu-arabic", note="invented demo witness", hand="scribe of the colophon"),
    "C": dict(library="Esker Abbey", shelfmark="MS Q.3", date="15th century",
              script="hindu-arabic", note="invented demo witness", hand="first hand"),
    "D": dict(library="Marrow Hall", shelfmark="Lat. 44", date="1461",
              script="hindu-arabic", note="invented demo witness", hand="main hand"),
    "E": dict(library="Ostry, Seminary Library", shelfmark="Ms. 3/19", date="late 15th century",
              script="hindu-arabic", note="invented demo witness", hand="two hands"),
}

FOLIOS = {"sun-eq": "12r-14v", "decl": "15r-15v", "shadow": "16r-16v", "sun-mm": "18r"}


def transmit(tables, rng, log):
    base = {}
    for tid, t in tables.items():
        base[tid] = [(a, Cell(u, t["places"])) for a, u in t["rows"]]
    copies = {"Omega": base}
    plan = [("A", "Omega"), ("alpha", "Omega"), ("B", "A"), ("C", "alpha"), ("beta", "alpha"), ("D", "beta")]
    for child, parent in plan:
        copies[child] = {tid: copy_table(copies[parent][tid], rng, "hindu-arabic", 3, log, child, tid)
                         for tid in tables}
    # E's scribe switched exemplar half way through each table (contamination):
    # beta for the first half, A for the second; then added slips of his own.
    copies["E"] = {}
    for tid in tables:
        half = len(copies["beta"][tid]) // 2
        exemplar = copies["beta"][tid][:half] + copies["A"][tid][half:]
        log.append(f"E {tid}: exemplar beta up to argument {exemplar[half - 1][0]}, A from {exemplar[half][0]}")
        copies["E"][tid] = copy_table(exemplar, rng, "hindu-arabic", 3, log, "E", tid)
    return copies


def editorial_marks(copies, rng, log):
    """What the editor sees on the page: blanks, damage, corrections, additions."""
    marks = [
        ("A", "sun-eq", 30, "blank"), ("B", "decl", 12, "illegible"), ("C", "shadow", 44, "partial"),
        ("D", "sun-eq", 150, "damaged"), ("A", "decl", 60, "margin"), ("C", "sun-eq", 77, "correction"),
        ("E", "sun-mm", 9, "doubt"), ("B", "shadow", 20, "interlinear"), ("D", "sun-mm", 25, "note"),
    ]
    for siglum, tid, idx, what in marks:
        arg, cell = copies[siglum][tid][idx]
        if what in ("blank", "illegible", "partial"):
            cell.state = what
        elif what == "damaged":
            cell.marks.append("{damaged}")
        elif what in ("margin", "interlinear"):
            cell.marks.append("{" + what + "}")
        elif what == "correction":
            wrong = confuse_digit(cell.units, cell.places, rng, "hindu-arabic")
            cell.marks.append("{was " + fmt(wrong, cell.places) + "}")
        elif what == "doubt":
            cell.marks.append("{doubt}")
        elif what == "note":
            cell.marks.append('{note "ink faded, reading from the offset"}')
        log.append(f"{siglum} {tid} arg {arg}: editorial mark {what}")
    # D omits one row of the declination table; B miscopies an argument.
    del copies["D"]["decl"][70]
    log.append("D decl: the row for argument 71 is missing")
    a, c = copies["B"]["shadow"][46]
    copies["B"]["shadow"][46] = (41, c)
    log.append("B shadow: argument 47 written as 41")


def write_witness(siglum, tables, rows_by_table):
    w = WITNESSES[siglum]
    out = [
        "# Demo corpus of apograph: an INVENTED tradition (the Lantern Tables).",
        "# Generated by corpora/demo/generate.py; edit the generator, not this file.",
        "@work lantern title=\"The Lantern Tables\" author=\"Ansgar of Tornholm (invented)\"",
        f"@witness {siglum} library=\"{w['library']}\" shelfmark=\"{w['shelfmark']}\" date=\"{w['date']}\" "
        f"script={w['script']} note=\"{w['note']}\"",
    ]
    for tid, t in tables.items():
        out += [
            "",
            f"@table {tid} title=\"{t['title']}\" kind=\"{t['kind']}\" folios=\"{FOLIOS[tid]}\" hand=\"{w['hand']}\"",
            f"@argument {t['arg']} unit={t['unit']} places=0 start={t['start']} step={t['step']}",
            f"@column {t['column']} unit={t['unit'] if t['unit'] == 'deg' else 'deg'} places={t['places']}",
            "@rows",
        ]
        for arg, cell in rows_by_table[tid]:
            out.append(f"{arg:<4} | {cell.text()}")
    return "\n".join(out) + "\n"


def parse_options():
    parser = argparse.ArgumentParser(description="Writes the demo tradition (invented).")
    parser.add_argument("--seed", type=int, default=SEED,
                        help=f"seed of the slips (default {SEED}, the committed corpus)")
    parser.add_argument("--output", default=HERE,
                        help="folder for the .apo files and TRUTH.md (default: beside this script)")
    return parser.parse_args()


def main():
    options = parse_options()
    rng = random.Random(options.seed)
    tables = make_tables()
    log = []
    copies = transmit(tables, rng, log)
    editorial_marks(copies, rng, log)
    os.makedirs(options.output, exist_ok=True)
    for siglum in WITNESSES:
        with open(os.path.join(options.output, f"{siglum}.apo"), "w", encoding="utf-8") as f:
            f.write(write_witness(siglum, tables, copies[siglum]))
    seed_note = "" if options.seed == SEED else f" with --seed {options.seed}"
    with open(os.path.join(options.output, "TRUTH.md"), "w", encoding="utf-8") as f:
        f.write("# What the generator did (the answer key of the demo)\n\n"
                f"Generated by corpora/demo/generate.py{seed_note}; do not edit.\n\n"
                "Stemma: archetype -> A -> B; archetype -> alpha (lost) -> C; alpha -> beta (lost) -> D;\n"
                "beta -> E, with E following A in the second half of every table.\n\n"
                "Author's own inaccuracies (shared by all): sun-eq at 97 one unit high; decl at 41 one unit low.\n\n"
                "Slips and marks, in the order they were made:\n\n")
        for line in log:
            f.write(f"- {line}\n")


if __name__ == "__main__":
    main()
