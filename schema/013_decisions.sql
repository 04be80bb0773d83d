-- 010: the editor's decisions as the one record every output reads, and
-- views an editor can query from the sqlite3 shell.
--
-- Every decision is a row of `decision`, never updated: accepting or
-- rejecting a finding (a proposed emendation, or a whole displaced run at
-- once), adopting a reading for a cell of the edited table (override), or
-- restoring one no witness has (conjecture); `undo` withdraws an earlier
-- decision. Each says who (editor), when (decided_at, UTC) and why (note).
--
-- A decision on a finding names the witness's cells it covers
-- (decision_cell) by column, the argument the row stands for and the
-- reading as it was when decided. It therefore carries over to any revision
-- of the transcription where that cell still has that reading, and calls
-- for review where the reading has changed. `emendation.status` (004) is
-- kept in step by apograph for the older views; `decision` is the record.

-- The argument each row stands for (Transcription::ArgumentInUse: the
-- written one when it fits its neighbours, repaired when miscopied), one
-- JSON array per revision, written at import. The row's position in the
-- manuscript (row_index) is not its argument; this is.
CREATE TABLE revision_argument (
  revision_id  INTEGER PRIMARY KEY REFERENCES revision(id) ON DELETE CASCADE,
  arguments    TEXT NOT NULL CHECK (json_valid(arguments))  -- [argument or null, one per row]
);

-- One row per row of every revision with its argument in trade notation.
-- Revisions imported before 010 have no stored arguments: their written
-- argument stands in.
CREATE VIEW row_argument AS
  SELECT ra.revision_id, j.key AS row_index, j.value AS argument
  FROM revision_argument ra
  JOIN json_each(ra.arguments) j
  UNION ALL
  SELECT c.revision_id, c.row_index, c.raw AS argument
  FROM cell c
  WHERE c.col = -1 AND c.revision_id NOT IN (SELECT revision_id FROM revision_argument);

-- One decision of the editor.
--   accept, reject: a finding of one witness (`finding`, the id of the
--     finding's first proposal in `emendation`), decided at `revision`; its
--     cells are in decision_cell. Accepting adopts the proposed readings as
--     the editor's; rejecting keeps the witness's readings (they are not
--     errors).
--   override: the edited table adopts `reading` at (argument, column_name).
--   conjecture: the same, for a reading no witness has.
--   undo: withdraws decision `undoes`.
CREATE TABLE decision (
  id           INTEGER PRIMARY KEY,
  table_id     TEXT NOT NULL REFERENCES edition_table(id),
  action       TEXT NOT NULL CHECK (action = 'accept' OR action = 'reject' OR action = 'override'
                                    OR action = 'conjecture' OR action = 'undo'),
  finding      INTEGER REFERENCES emendation(id),
  siglum       TEXT,
  revision     INTEGER CHECK (revision IS NULL OR revision >= 1),
  argument     TEXT,   -- the edited row's argument (override, conjecture); the first cell's otherwise
  column_name  TEXT,
  reading      TEXT CHECK (reading IS NULL OR length(reading) > 0),
  undoes       INTEGER REFERENCES decision(id),
  editor       TEXT NOT NULL CHECK (length(editor) > 0),
  decided_at   TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now')),
  note         TEXT NOT NULL DEFAULT '',
  CHECK ((action = 'accept' OR action = 'reject') = (finding IS NOT NULL AND siglum IS NOT NULL)),
  CHECK ((action = 'override' OR action = 'conjecture') =
         (reading IS NOT NULL AND argument IS NOT NULL AND column_name IS NOT NULL)),
  CHECK ((action = 'undo') = (undoes IS NOT NULL))
);

CREATE INDEX decision_by_table ON decision (table_id, action);
CREATE UNIQUE INDEX decision_undone_once ON decision (undoes) WHERE undoes IS NOT NULL;

-- The witness's cells an accept or reject covers (every cell of a run).
CREATE TABLE decision_cell (
  decision_id  INTEGER NOT NULL REFERENCES decision(id),
  siglum       TEXT NOT NULL,
  column_name  TEXT NOT NULL,
  argument     TEXT NOT NULL,   -- the argument the row stands for, trade notation
  reading      TEXT NOT NULL,   -- the witness's reading when decided
  proposed     TEXT NOT NULL,   -- the proposed reading
  PRIMARY KEY (decision_id, siglum, column_name, argument)
) WITHOUT ROWID;

CREATE INDEX decision_cell_by_cell ON decision_cell (siglum, column_name, argument);

-- Decisions not withdrawn by an undo (undo rows themselves excluded).
CREATE VIEW decision_in_force AS
  SELECT d.* FROM decision d
  WHERE d.action <> 'undo' AND NOT EXISTS (SELECT 1 FROM decision u WHERE u.undoes = d.id);

-- Every decision with who, when and why, newest first; one row per cell
-- for accept and reject. `withdrawn_by` is the undo that withdrew it.
CREATE VIEW decision_log AS
  SELECT d.id AS decision, d.table_id, d.action, d.editor, d.decided_at, d.note,
         coalesce(c.siglum, d.siglum) AS siglum, d.revision, d.finding,
         coalesce(c.argument, d.argument) AS argument,
         coalesce(c.column_name, d.column_name) AS column_name,
         c.reading AS witness_reading, coalesce(c.proposed, d.reading) AS adopted, d.undoes,
         (SELECT u.id FROM decision u WHERE u.undoes = d.id) AS withdrawn_by
  FROM decision d
  LEFT JOIN decision_cell c ON c.decision_id = d.id
  ORDER BY d.id DESC;

-- Existing decisions move in (their editor was not recorded): one per
-- finding, as its latest decided proposal says, covering its decided cells.
INSERT INTO decision (table_id, action, finding, siglum, revision, argument, column_name, editor,
                      decided_at, note)
  SELECT e.table_id, CASE e.status WHEN 'accepted' THEN 'accept' ELSE 'reject' END,
         coalesce(e.finding, e.id), e.siglum, e.revision, e.arg, e.column_name,
         'unknown (decided before schema 010)', e.decided_at, e.editor_note
  FROM emendation e
  WHERE e.status <> 'proposed'
    AND e.id = (SELECT max(x.id) FROM emendation x
                WHERE coalesce(x.finding, x.id) = coalesce(e.finding, e.id)
                  AND x.status <> 'proposed');
INSERT INTO decision_cell (decision_id, siglum, column_name, argument, reading, proposed)
  SELECT d.id, e.siglum, e.column_name, e.arg, e.tabulated, e.proposed
  FROM emendation e
  JOIN decision d ON d.finding = coalesce(e.finding, e.id) AND d.action <> 'override'
  WHERE e.status <> 'proposed';
INSERT INTO decision (table_id, action, argument, column_name, reading, editor, decided_at, note)
  SELECT table_id, 'override', row_argument, column_name, reading,
         'unknown (decided before schema 010)', decided_at, note
  FROM apparatus_override;

-- The overrides and conjectures in force for each cell of the edited
-- table: the latest decision not withdrawn. (Replaces the view of 005,
-- whose table apparatus_decision is no longer written.)
DROP VIEW apparatus_override;
CREATE VIEW apparatus_override AS
  SELECT d.table_id, d.argument AS row_argument, d.column_name, d.reading, d.note, d.decided_at,
         d.action, d.editor, d.id AS decision
  FROM decision_in_force d
  WHERE (d.action = 'override' OR d.action = 'conjecture')
    AND d.id = (SELECT max(x.id) FROM decision_in_force x
                WHERE x.table_id = d.table_id AND x.argument = d.argument
                  AND x.column_name = d.column_name
                  AND (x.action = 'override' OR x.action = 'conjecture'));

-- Every current cell by the argument its row stands for: one row per
-- argument, column and witness, so one cell across witnesses is one
-- WHERE clause (no self-join on row positions).
CREATE VIEW collation_by_argument AS
  SELECT r.table_id, a.argument, c.column_name, r.siglum, c.raw AS reading, c.value,
         c.value_real, c.state, c.damaged, c.doubtful, c.addition, c.corrected_from, c.note,
         r.number AS revision, c.row_index, c.source_line
  FROM current_revision r
  JOIN cell c ON c.revision_id = r.id
  JOIN row_argument a ON a.revision_id = r.id AND a.row_index = c.row_index
  WHERE c.col >= 0;

-- The latest check of every witness's column (check_run keeps them all).
CREATE VIEW latest_check AS
  SELECT r.* FROM check_run r
  WHERE r.id = (SELECT max(x.id) FROM check_run x
                WHERE x.table_id = r.table_id AND x.siglum = r.siglum
                  AND x.column_name = r.column_name);

-- Every entry of the latest check of every witness's column.
CREATE VIEW latest_check_entry AS
  SELECT r.table_id, r.siglum, r.column_name, r.model, r.run_at, r.revision, e.row_index, e.arg,
         e.tabulated, e.exact, e.computed, e.diff_units, e.flag, e.skipped
  FROM latest_check r
  JOIN check_entry e ON e.run_id = r.id;

-- Every proposed emendation with the decision in force for its cell: the
-- latest accept or reject, not withdrawn, of the same witness, column,
-- argument and reading (so a decision made on an earlier revision shows
-- where the reading is unchanged). `status` is apograph's verdict for the
-- whole finding (a run is decided as one).
CREATE VIEW finding_decision AS
  SELECT e.id AS emendation, coalesce(e.finding, e.id) AS finding, e.table_id, e.siglum,
         e.revision, e.arg, e.column_name, e.tabulated, e.proposed, e.class, e.score, e.evidence,
         e.status, d.id AS decision, d.action, d.editor, d.decided_at, d.note,
         d.revision AS decided_on_revision
  FROM emendation e
  LEFT JOIN decision_in_force d ON d.id = (
    SELECT max(x.id) FROM decision_in_force x
    JOIN decision_cell dc ON dc.decision_id = x.id
    WHERE x.table_id = e.table_id AND (x.action = 'accept' OR x.action = 'reject')
      AND dc.siglum = e.siglum AND dc.column_name = e.column_name AND dc.proposed = e.proposed
      AND dc.reading = e.tabulated
      AND dc.argument = coalesce(
        (SELECT a.argument FROM row_argument a
         JOIN revision v ON v.id = a.revision_id AND v.number = e.revision
         JOIN transcription t ON t.id = v.transcription_id
         WHERE t.table_id = e.table_id AND t.siglum = e.siglum AND a.row_index = e.row_index),
        e.arg));
