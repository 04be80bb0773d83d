-- 004: deviations. The emendations the tool proposes for a witness's cells
-- and the editor's decision on each. The tool proposes; the editor decides:
-- a proposal is never changed by the tool, only accepted or rejected (with a
-- note) by `apograph emendation accept|reject`.

-- One proposed reading of one cell of one revision of a transcription.
-- Cells of one displaced run (an eye-skip reported as one finding) share
-- `finding`, the id of the run's first proposal. `class` is the explanation
-- (see `apograph errors --help`), `evidence` the sentence for a note,
-- `score` the tool's confidence in [0, 1], `model` what the entries were
-- compared with (model name and parameters).
CREATE TABLE emendation (
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
  class        TEXT NOT NULL CHECK (class IN ('confusion', 'transposition', 'place', 'displaced-run',
                                              'repetition', 'blank', 'illegible')),
  evidence     TEXT NOT NULL CHECK (length(evidence) > 0),
  score        REAL NOT NULL CHECK (score >= 0 AND score <= 1),
  model        TEXT NOT NULL DEFAULT '',
  finding      INTEGER REFERENCES emendation(id),
  status       TEXT NOT NULL DEFAULT 'proposed' CHECK (status IN ('proposed', 'accepted', 'rejected')),
  proposed_at  TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now')),
  decided_at   TEXT,
  editor_note  TEXT NOT NULL DEFAULT '',
  CHECK ((status = 'proposed') = (decided_at IS NULL)),
  FOREIGN KEY (table_id, siglum) REFERENCES transcription(table_id, siglum),
  UNIQUE (table_id, siglum, revision, row_index, col, proposed)
);

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
