#!/usr/bin/python3
"""The comparison loader: every cell of DIR's sheet_*.csv into a new SQLite
file with the standard csv and sqlite3 modules, in one transaction (a
table of tables and a table of cells: raw text and value in seconds).

usage: load_sheets.py DIR DB
"""
import csv
import glob
import os
import sqlite3
import sys
import time


def seconds(text):
    neg = text.startswith("-")
    d, rest = text.lstrip("-").split(";")
    m, s = rest.split(",")
    v = int(d) * 3600 + int(m) * 60 + int(s)
    return -v if neg else v


def main():
    folder, db_path = sys.argv[1], sys.argv[2]
    if os.path.exists(db_path):
        os.remove(db_path)
    start = time.perf_counter()
    db = sqlite3.connect(db_path)
    db.execute("CREATE TABLE sheets (id INTEGER PRIMARY KEY, name TEXT UNIQUE, rows INTEGER)")
    db.execute("CREATE TABLE cells (sheet_id INTEGER, argument TEXT, column_name TEXT, raw TEXT,"
               " seconds INTEGER, PRIMARY KEY (sheet_id, argument, column_name))")
    cells = 0
    with db:
        for n, path in enumerate(sorted(glob.glob(os.path.join(folder, "sheet_*.csv")))):
            with open(path, newline="") as f:
                reader = csv.reader(f)
                header = next(reader)
                rows = list(reader)
            db.execute("INSERT INTO sheets VALUES (?, ?, ?)", (n, os.path.basename(path), len(rows)))
            db.executemany("INSERT INTO cells VALUES (?, ?, ?, ?, ?)",
                           ((n, r[0], header[1], r[1], seconds(r[1])) for r in rows))
            cells += len(rows)
    spent = time.perf_counter() - start
    print(f"cells {cells}, loaded in {spent:.2f} s, {cells / spent:.0f} cells/s")


if __name__ == "__main__":
    main()
