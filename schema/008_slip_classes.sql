-- 008: two more classes of explained slips may be recorded as proposals:
-- 'systematic' (one slip repeated over consecutive rows, such as a place
-- left out in the first rows of a column, or a constant error over a run;
-- its cells share `finding` like a displaced run's) and 'unexplained' (no
-- listed slip reaches the model's value, which is proposed anyway so that the
-- editor sees it). SQLite cannot change a CHECK in place: the table is made
-- anew with the wider CHECK, its rows copied, and its index and views made
-- again as 004 made them.
CREATE TABLE emendation_new (
  id           INTEGER PRIMARY KEY,
  table_id     TEXT NOT NULL,
  siglum       TEXT NOT NULL,
  revision     INTEGER NOT NULL CHECK (revision >= 1),
  row_index    INTEGER NOT NULL CHECK (row_index >= 0),
  col          INTEGER NOT NULL CHECK (col >= 0),
  column_name  TEXT NOT NULL CHECK (length(column_name) > 0),
  arg          TEXT NOT NULL DEFAULT '',
  tabulated    TEXT NOT NULL,
  proposed     TEXT NOT NULL CHECK (length(proposed) > 0),
  class        TEXT NOT NULL CHECK (class = 'confusion' OR class = 'transposition' OR
                                    class = 'place' OR class = 'displaced-run' OR
                                    class = 'systematic' OR class = 'repetition' OR
                                    class = 'blank' OR class = 'illegible' OR
                                    class = 'unexplained'),
  evidence     TEXT NOT NULL CHECK (length(evidence) > 0),
  score        REAL NOT NULL CHECK (score >= 0 AND score <= 1),
  model        TEXT NOT NULL DEFAULT '',
  finding      INTEGER REFERENCES emendation_new(id),
  status       TEXT NOT NULL DEFAULT 'proposed'
               CHECK (status = 'proposed' OR status = 'accepted' OR status = 'rejected'),
  proposed_at  TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now')),
  decided_at   TEXT,
  editor_note  TEXT NOT NULL DEFAULT '',
  CHECK ((status = 'proposed') = (decided_at IS NULL)),
  FOREIGN KEY (table_id, siglum) REFERENCES transcription(table_id, siglum),
  UNIQUE (table_id, siglum, revision, row_index, col, proposed)
);

INSERT INTO emendation_new SELECT * FROM emendation;
DROP VIEW emendation_open;
DROP VIEW emendation_decided;
DROP TABLE emendation;
-- Renaming also renames the self-reference of `finding`.
ALTER TABLE emendation_new RENAME TO emendation;

CREATE INDEX emendation_by_witness ON emendation(table_id, siglum, status);

-- The proposals still waiting for the editor, with the run they belong to.
CREATE VIEW emendation_open AS
  SELECT id, table_id, siglum, revision, arg, column_name, tabulated, proposed, class, score,
         evidence, finding
  FROM emendation WHERE status = 'proposed';

-- The editor's decisions, newest first: what the edition adopts (accepted)
-- and what it keeps as the witness's reading (rejected).
CREATE VIEW emendation_decided AS
  SELECT id, table_id, siglum, revision, arg, column_name, tabulated, proposed, class, status,
         decided_at, editor_note
  FROM emendation WHERE status <> 'proposed'
  ORDER BY decided_at DESC, id DESC;
