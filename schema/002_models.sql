-- 002: the model library's records: user formulas saved by name, and every
-- check run (a witness's column recomputed from a model under a computing
-- practice) with its parameters, summary and per-entry results.

-- A user formula (grammar/formula.ebnf), usable wherever a built-in model
-- is: `apograph check --model NAME` looks up built-in models first, then
-- these. Saving a name again replaces the text (updated_at records when).
CREATE TABLE formula (
  name         TEXT PRIMARY KEY CHECK (length(name) > 0),
  text         TEXT NOT NULL CHECK (length(text) > 0),
  description  TEXT NOT NULL DEFAULT '',
  created_at   TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now')),
  updated_at   TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now'))
);

-- One run of `apograph check`: which column of which witness, the model (a
-- built-in name, a saved formula's name, or "formula" for an ad-hoc one with
-- its text in formula_text), the computing practice, the tolerance and the
-- summary counts.
CREATE TABLE check_run (
  id             INTEGER PRIMARY KEY,
  run_at         TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now')),
  table_id       TEXT NOT NULL REFERENCES edition_table(id),
  siglum         TEXT NOT NULL REFERENCES witness(siglum),
  revision       INTEGER CHECK (revision IS NULL OR revision >= 1),
  column_name    TEXT NOT NULL,
  model          TEXT NOT NULL CHECK (length(model) > 0),
  formula_text   TEXT,            -- the formula's text when the model is a formula
  rounding       TEXT NOT NULL CHECK (rounding = 'nearest' OR rounding = 'truncate'),
  places         INTEGER NOT NULL CHECK (places BETWEEN 0 AND 12),
  grid           REAL NOT NULL DEFAULT 0 CHECK (grid >= 0),   -- 0: no interpolation grid
  grid_origin    REAL NOT NULL DEFAULT 0,
  round_nodes    INTEGER NOT NULL DEFAULT 0 CHECK (round_nodes = 0 OR round_nodes = 1),
  displacement   REAL NOT NULL DEFAULT 0,
  tolerance      REAL NOT NULL CHECK (tolerance >= 0),        -- flag when |diff| > tolerance units
  entries        INTEGER NOT NULL CHECK (entries >= 0),
  compared       INTEGER NOT NULL CHECK (compared >= 0),
  exact          INTEGER NOT NULL CHECK (exact >= 0),
  within_one     INTEGER NOT NULL CHECK (within_one >= 0),
  flagged        INTEGER NOT NULL CHECK (flagged >= 0),
  blank          INTEGER NOT NULL CHECK (blank >= 0),
  illegible      INTEGER NOT NULL CHECK (illegible >= 0),
  undefined      INTEGER NOT NULL CHECK (undefined >= 0),
  worst          REAL NOT NULL DEFAULT 0                      -- largest |diff| in units
);

-- The parameter values a check run used, in the model's order.
CREATE TABLE check_param (
  run_id    INTEGER NOT NULL REFERENCES check_run(id) ON DELETE CASCADE,
  position  INTEGER NOT NULL CHECK (position >= 0),
  name      TEXT NOT NULL CHECK (length(name) > 0),
  value     REAL NOT NULL,
  PRIMARY KEY (run_id, position)
) WITHOUT ROWID;

-- Every entry of a check run: the argument and reading as written, the exact
-- model value, the value after the practice (trade notation), the difference
-- in units of the last place and the flag. Entries not compared (blank,
-- illegible, partial, no argument, model undefined) say why in `skipped`.
CREATE TABLE check_entry (
  run_id       INTEGER NOT NULL REFERENCES check_run(id) ON DELETE CASCADE,
  row_index    INTEGER NOT NULL CHECK (row_index >= 0),
  arg          TEXT NOT NULL,
  tabulated    TEXT NOT NULL,    -- the reading as typed
  exact        REAL,             -- NULL where the model has no value
  computed     TEXT,             -- after the practice; NULL where none
  diff_units   REAL,             -- tabulated - computed; NULL when not compared
  flag         INTEGER NOT NULL CHECK (flag = 0 OR flag = 1),
  skipped      TEXT NOT NULL DEFAULT '',
  PRIMARY KEY (run_id, row_index)
) WITHOUT ROWID;

-- The flagged entries of every check run with its model and witness: the
-- view to query from the sqlite3 shell.
CREATE VIEW check_flag AS
  SELECT r.id AS run_id, r.run_at, r.table_id, r.siglum, r.column_name, r.model,
         e.row_index, e.arg, e.tabulated, e.computed, e.diff_units
  FROM check_entry e JOIN check_run r ON r.id = e.run_id
  WHERE e.flag = 1;
