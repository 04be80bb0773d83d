-- 005: the editor's decisions for the edited table. The apparatus adopts a
-- reading for every cell by itself (the reading of most independent branches
-- of the stemma that recomputation does not call an error); here the editor
-- overrides it for single cells. Decisions are never updated: a new decision
-- for the same cell supersedes the earlier one, and withdrawing an override
-- is a decision with no reading, so the history stays queryable.

-- One decision of the editor about one cell of a table's edited text.
CREATE TABLE apparatus_decision (
  id            INTEGER PRIMARY KEY,
  table_id      TEXT NOT NULL REFERENCES edition_table(id),
  row_argument  TEXT NOT NULL CHECK (length(row_argument) > 0),  -- the row's argument, trade notation
  column_name   TEXT NOT NULL CHECK (length(column_name) > 0),
  reading       TEXT CHECK (reading IS NULL OR length(reading) > 0),  -- adopted reading; NULL: override withdrawn
  note          TEXT NOT NULL DEFAULT '',                          -- the editor's reason, printed in the apparatus
  decided_at    TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now'))
);

CREATE INDEX apparatus_decision_cell ON apparatus_decision (table_id, row_argument, column_name, id);

-- The override in force for each cell: its latest decision, unless that
-- decision withdrew the override.
CREATE VIEW apparatus_override AS
  SELECT d.table_id, d.row_argument, d.column_name, d.reading, d.note, d.decided_at
  FROM apparatus_decision d
  WHERE d.id = (SELECT max(id) FROM apparatus_decision
                WHERE table_id = d.table_id AND row_argument = d.row_argument
                  AND column_name = d.column_name)
    AND d.reading IS NOT NULL;
