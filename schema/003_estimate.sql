-- 003: estimation. Attested parameter values the editor adds (beside the
-- shipped corpora/catalog/parameters.tsv) and the stored results of
-- `apograph identify`, one run per (table, witness, column) each time it runs.

-- Parameter values attested in the literature, added with `apograph catalog add`.
-- applies_to lists model:parameter pairs separated by blanks.
CREATE TABLE catalog_entry (
  id           INTEGER PRIMARY KEY,
  kind         TEXT NOT NULL CHECK (length(kind) > 0),
  applies_to   TEXT NOT NULL CHECK (length(applies_to) > 0),
  value        TEXT NOT NULL CHECK (length(value) > 0),  -- trade notation
  value_real   REAL NOT NULL,                            -- the same as a decimal
  tradition    TEXT NOT NULL DEFAULT '',
  source       TEXT NOT NULL CHECK (length(source) > 0),
  from_memory  INTEGER NOT NULL DEFAULT 0 CHECK (from_memory IN (0, 1)),
  added_at     TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now'))
);

-- One identification of one column of one witness's table.
CREATE TABLE identify_run (
  id                  INTEGER PRIMARY KEY,
  table_id            TEXT NOT NULL REFERENCES edition_table(id),
  siglum              TEXT NOT NULL REFERENCES witness(siglum),
  revision            INTEGER NOT NULL CHECK (revision >= 1),  -- the revision identified
  column_name         TEXT NOT NULL,
  run_at              TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now')),
  candidates_tried    INTEGER NOT NULL CHECK (candidates_tried >= 0),
  notes               TEXT NOT NULL DEFAULT '',  -- near-ties, one per line
  mean_motion_verdict TEXT                       -- for mean-motion columns
);

-- The ranked explanations of a run (rank 1 is the best).
CREATE TABLE identify_candidate (
  run_id        INTEGER NOT NULL REFERENCES identify_run(id) ON DELETE CASCADE,
  rank          INTEGER NOT NULL CHECK (rank >= 1),
  model         TEXT NOT NULL,
  params        TEXT NOT NULL,   -- JSON object: name -> {value, stderr, fixed}
  practice      TEXT NOT NULL,   -- e.g. "rounded, grid 6"
  score         REAL NOT NULL,   -- log-likelihood less the parameter penalty
  entries       INTEGER NOT NULL CHECK (entries >= 0),
  exact         INTEGER NOT NULL CHECK (exact >= 0),
  within1       INTEGER NOT NULL CHECK (within1 >= 0),
  flagged       INTEGER NOT NULL CHECK (flagged >= 0),
  robust_scale  REAL NOT NULL,   -- units of the last place
  PRIMARY KEY (run_id, rank)
) WITHOUT ROWID;

-- The best explanation of every column from its latest run: the view to
-- query from the sqlite3 shell.
CREATE VIEW latest_identification AS
  SELECT r.table_id, r.siglum, r.revision, r.column_name, r.run_at, c.model, c.params,
         c.practice, c.score, c.entries, c.exact, c.within1, c.flagged, c.robust_scale, r.notes,
         r.mean_motion_verdict
  FROM identify_run r
  JOIN identify_candidate c ON c.run_id = r.id AND c.rank = 1
  WHERE r.id = (SELECT max(id) FROM identify_run
                WHERE table_id = r.table_id AND siglum = r.siglum AND column_name = r.column_name);
