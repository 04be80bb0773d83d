-- 001: the edition itself: works, tables, witnesses, transcriptions with
-- revisions, layouts and cells.
--
-- Nothing an editor typed is ever updated in place: a changed transcription
-- becomes a new revision and every earlier revision stays in the database,
-- loadable as it was imported. Only the descriptive rows of work,
-- edition_table and witness follow the latest import (each revision keeps its
-- own copy of that description as imported).
--
-- Start here in the sqlite3 shell:
--   SELECT * FROM work_summary;
--   SELECT * FROM table_summary;
--   SELECT * FROM witness_summary;
--   SELECT * FROM transcription_summary;
--   SELECT * FROM current_cell WHERE table_id = 'sun-eq' AND siglum = 'K' LIMIT 20;

-- A work: a set of tables transmitted together (a handbook, a zij, ...).
-- title, author: the latest non-empty values imported.
CREATE TABLE work (
  id      TEXT PRIMARY KEY CHECK (length(id) > 0),
  title   TEXT NOT NULL DEFAULT '',
  author  TEXT NOT NULL DEFAULT ''
);

-- One table of a work, the same table in every witness that copies it.
-- id is the editor's short name (`sun-eq`); it is unique across works.
-- title, kind: the latest non-empty values imported.
CREATE TABLE edition_table (
  id       TEXT PRIMARY KEY CHECK (length(id) > 0),
  work_id  TEXT NOT NULL REFERENCES work(id),
  title    TEXT NOT NULL DEFAULT '',
  kind     TEXT NOT NULL DEFAULT ''   -- free text: 'solar equation', 'declination', ...
);
CREATE INDEX edition_table_by_work ON edition_table(work_id);

-- One manuscript (or print) holding copies of tables, named by its siglum.
-- script names the numeral script the witness writes its numbers in (a file
-- under corpora/scripts). Descriptive fields: latest non-empty values imported.
CREATE TABLE witness (
  siglum     TEXT PRIMARY KEY CHECK (length(siglum) > 0),
  library    TEXT NOT NULL DEFAULT '',
  shelfmark  TEXT NOT NULL DEFAULT '',
  date       TEXT NOT NULL DEFAULT '',
  script     TEXT NOT NULL DEFAULT '',
  note       TEXT NOT NULL DEFAULT ''
);

-- One witness's copy of one table. Its content lives in its revisions.
CREATE TABLE transcription (
  id        INTEGER PRIMARY KEY,
  table_id  TEXT NOT NULL REFERENCES edition_table(id),
  siglum    TEXT NOT NULL REFERENCES witness(siglum),
  UNIQUE (table_id, siglum)
);
CREATE INDEX transcription_by_witness ON transcription(siglum);

-- Every import that changed a transcription adds a revision numbered 1, 2,
-- ... per transcription; the highest number is current. Each revision keeps
-- the metadata exactly as imported (so an old revision loads exactly as it
-- was), the source file name and the text of its section of that file.
-- row_count and cell_count are written once with the revision (cell_count
-- does not count the argument cells).
CREATE TABLE revision (
  id                INTEGER PRIMARY KEY,
  transcription_id  INTEGER NOT NULL REFERENCES transcription(id),
  number            INTEGER NOT NULL CHECK (number >= 1),
  imported_at       TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now')),
  source_file       TEXT NOT NULL DEFAULT '',
  source_text       TEXT NOT NULL DEFAULT '',
  row_count         INTEGER NOT NULL DEFAULT 0 CHECK (row_count >= 0),
  cell_count        INTEGER NOT NULL DEFAULT 0 CHECK (cell_count >= 0),
  work_id           TEXT NOT NULL CHECK (length(work_id) > 0),
  work_title        TEXT NOT NULL DEFAULT '',
  work_author       TEXT NOT NULL DEFAULT '',
  table_title       TEXT NOT NULL DEFAULT '',
  table_kind        TEXT NOT NULL DEFAULT '',
  library           TEXT NOT NULL DEFAULT '',
  shelfmark         TEXT NOT NULL DEFAULT '',
  witness_date      TEXT NOT NULL DEFAULT '',
  script            TEXT NOT NULL DEFAULT '',
  witness_note      TEXT NOT NULL DEFAULT '',
  folios            TEXT NOT NULL DEFAULT '',
  hand              TEXT NOT NULL DEFAULT '',
  UNIQUE (transcription_id, number)
);

-- The layout of a revision, one row per declared column. position -1 is the
-- row argument, -2 the column argument of a double-argument table, 0, 1, ...
-- the value columns in order. Values (arg2, start, step) are exact, in trade
-- notation (`0;30`).
CREATE TABLE layout_column (
  revision_id  INTEGER NOT NULL REFERENCES revision(id),
  position     INTEGER NOT NULL CHECK (position >= -2),
  name         TEXT NOT NULL CHECK (length(name) > 0),
  unit         TEXT NOT NULL DEFAULT '',
  places       INTEGER NOT NULL CHECK (places BETWEEN 0 AND 12),
  title        TEXT NOT NULL DEFAULT '',
  arg2         TEXT CHECK (arg2 IS NULL OR position >= 0),  -- value of the column argument
  start        TEXT CHECK (start IS NULL OR position < 0),  -- arguments: expected first value
  step         TEXT CHECK (step IS NULL OR position < 0),   -- arguments: expected step
  PRIMARY KEY (revision_id, position)
) WITHOUT ROWID;

-- The cells of a revision as transcribed, one database row per table row
-- (the row's argument and its value cells together). Query them cell by cell
-- through the view `cell` (or `current_cell`), which unpacks this table; the
-- encoding below is documented for completeness, not for hand editing.
--   row_index   0, 1, ... in reading order
--   line        the line of the row's argument in the revision's file
--               (1-based; 0 when unknown): the default line of its cells
--   cells       a JSON array: element 0 is the argument cell as written
--               (arguments are miscopied too), element k + 1 the cell of value
--               column k of layout_column. Each cell is itself an array:
--                 [raw, source_col]           the common case, see below
--                 [raw, source_col, {...}]    anything else
--               raw is the reading as typed (`0;4,10`, `0 4 10`, `?`,
--               `0;?,10`, `_`), source_col where it was typed (1-based; 0
--               when unknown). The two-element form means: read in full,
--               with the exact value written exactly as raw (canonical
--               trade notation), the places of its column, on the row's
--               line, without marks. The object lists only what differs:
--                 "state"           partial | illegible | blank (absent: read)
--                 "value"           the exact value in canonical notation
--                                   when raw is written otherwise (`0 4 10`)
--                 "places"          when not the places of its column
--                 "line"            when not the row's line
--                 "damaged": 1, "doubtful": 1,
--                 "addition"        margin | interlinear
--                 "corrected_from"  a scribal correction: the reading before it
--                 "note"            the editor's note on this cell
--   Example: [["7",1],["0;4,10",5],["0 4 10",14,{"value":"0;4,10"}],
--             ["?",22,{"state":"illegible","doubtful":1}]]
-- Why packed: an import writes a million cells in well under a second only
-- if it writes a few hundred thousand database rows, not a million (each row
-- costs a B-tree insert, a foreign-key lookup and its CHECKs whatever its
-- width; one cell per row topped out below the goal even with no
-- constraints). Exact values and every state and mark are kept; the
-- program validates each cell before writing it (edition_store.cpp) and
-- writes the JSON itself (cell_json.cpp). The database checks the keys, the
-- revision and that `cells` opens an array, not that it is well-formed
-- JSON: json_valid() on every row cost 40% of an import. Malformed text is
-- refused when read, by the view and by the program alike.
CREATE TABLE cell_row (
  revision_id  INTEGER NOT NULL REFERENCES revision(id),
  row_index    INTEGER NOT NULL CHECK (row_index >= 0),
  line         INTEGER NOT NULL CHECK (line >= 0),
  cells        TEXT NOT NULL CHECK (substr(cells, 1, 1) = '['),
  PRIMARY KEY (revision_id, row_index)
) WITHOUT ROWID;

-- Every cell of every revision, one line per cell, unpacked from cell_row.
-- col -1 is the row's argument as written, 0, 1, ... the value columns of
-- layout_column (column_name is the argument's or the column's name).
--   raw             the reading as typed (`0;4,10`, `0 4 10`, `?`, `0;?,10`, `_`)
--   value           the exact value in canonical trade notation; only when
--                   state = 'read'
--   value_real      the same value as a decimal, for queries and sorting
--   places          the places of the column the cell stands in
--   state           read | partial (some places unread) | illegible | blank
--                   (nothing written in the manuscript)
--   damaged         1 when the support is damaged there (a reading is given anyway)
--   doubtful        1 when the editor doubts the reading
--   addition        none | margin | interlinear: where the text stands
--   corrected_from  a scribal correction: the reading before it (the cell
--                   holds the reading after it)
--   note            the editor's note on this cell ('' when none)
--   source_line, source_col: where the cell was typed in the revision's file
--                   (1-based; 0 when unknown)
CREATE VIEW cell AS
  SELECT revision_id, row_index, col, column_name, raw, value,
         CASE WHEN u.value IS NOT NULL THEN
           (CASE WHEN substr(u.value, 1, 1) = '-' THEN -1.0 ELSE 1.0 END) *
           (SELECT total(p.value * (CASE p.key WHEN 0 THEN 1.0 WHEN 1 THEN 1 / 60.0
              WHEN 2 THEN 1 / 3600.0 WHEN 3 THEN 1 / 216000.0 WHEN 4 THEN 1 / 12960000.0
              WHEN 5 THEN 1 / 777600000.0 WHEN 6 THEN 1 / 46656000000.0
              WHEN 7 THEN 1 / 2799360000000.0 WHEN 8 THEN 1 / 167961600000000.0
              WHEN 9 THEN 1 / 10077696000000000.0 WHEN 10 THEN 1 / 604661760000000000.0
              WHEN 11 THEN 1 / 36279705600000000000.0
              ELSE 1 / 2176782336000000000000.0 END))
            FROM json_each('[' || replace(ltrim(u.value, '-'), ';', ',') || ']') p)
         END AS value_real,
         places, state, damaged, doubtful, addition, corrected_from, note,
         source_line, source_col
  FROM (
    SELECT r.revision_id, r.row_index, j.key - 1 AS col, lc.name AS column_name,
           j.value ->> 0 AS raw,
           CASE WHEN j.value ->> '$[2].state' IS NULL
                THEN coalesce(j.value ->> '$[2].value', j.value ->> 0) END AS value,
           coalesce(j.value ->> '$[2].places', lc.places) AS places,
           coalesce(j.value ->> '$[2].state', 'read') AS state,
           coalesce(j.value ->> '$[2].damaged', 0) AS damaged,
           coalesce(j.value ->> '$[2].doubtful', 0) AS doubtful,
           coalesce(j.value ->> '$[2].addition', 'none') AS addition,
           j.value ->> '$[2].corrected_from' AS corrected_from,
           coalesce(j.value ->> '$[2].note', '') AS note,
           coalesce(j.value ->> '$[2].line', r.line) AS source_line,
           j.value ->> 1 AS source_col
    FROM cell_row r
    JOIN json_each(r.cells) j
    -- CROSS JOIN keeps this order: each cell looks up its column (otherwise
    -- SQLite may unpack the row once per column)
    CROSS JOIN layout_column lc ON lc.revision_id = r.revision_id AND lc.position = j.key - 1
  ) u;

-- The editor's marks, one line per cell that has any (a subset of `cell`).
CREATE VIEW cell_mark AS
  SELECT revision_id, row_index, col, damaged, doubtful, addition, corrected_from, note
  FROM cell
  WHERE damaged = 1 OR doubtful = 1 OR addition <> 'none' OR corrected_from IS NOT NULL
     OR note <> '';

-- The current (highest-numbered) revision of every transcription, with its
-- table and witness.
CREATE VIEW current_revision AS
  SELECT r.*, t.table_id, t.siglum
  FROM revision r
  JOIN transcription t ON t.id = r.transcription_id
  WHERE r.number = (SELECT max(number) FROM revision WHERE transcription_id = r.transcription_id);

-- Every current cell with its table, witness and column name: the view to
-- query from the sqlite3 shell. column_name of the argument cells is the
-- argument's name.
CREATE VIEW current_cell AS
  SELECT r.table_id, r.siglum, r.number AS revision, c.row_index, c.column_name,
         c.col, c.raw, c.value, c.value_real, c.places, c.state, c.damaged, c.doubtful,
         c.addition, c.corrected_from, c.note, r.source_file, c.source_line, c.source_col
  FROM current_revision r
  JOIN cell c ON c.revision_id = r.id;

-- One line per transcription: its current revision, how many revisions it
-- has, and the size of the current one.
CREATE VIEW transcription_summary AS
  SELECT r.table_id, r.siglum, r.number AS current_revision,
         (SELECT count(*) FROM revision x WHERE x.transcription_id = r.transcription_id) AS revisions,
         r.row_count AS rows, r.cell_count AS cells, r.imported_at, r.source_file
  FROM current_revision r;

-- One line per table of the edition: its work, how many witnesses copy it,
-- and the number of current cells over all of them.
CREATE VIEW table_summary AS
  SELECT et.id AS table_id, et.work_id, et.title, et.kind,
         count(s.siglum) AS witnesses, coalesce(sum(s.cells), 0) AS cells
  FROM edition_table et
  LEFT JOIN transcription_summary s ON s.table_id = et.id
  GROUP BY et.id;

-- One line per witness: how many tables it was transcribed for, and its
-- number of current cells.
CREATE VIEW witness_summary AS
  SELECT w.siglum, w.library, w.shelfmark, w.date, w.script,
         count(s.table_id) AS tables, coalesce(sum(s.cells), 0) AS cells
  FROM witness w
  LEFT JOIN transcription_summary s ON s.siglum = w.siglum
  GROUP BY w.siglum;

-- One line per work: its tables, the witnesses that copy any of them, and
-- the number of current cells over all of them.
CREATE VIEW work_summary AS
  SELECT w.id AS work_id, w.title, w.author,
         (SELECT count(*) FROM edition_table et WHERE et.work_id = w.id) AS tables,
         (SELECT count(DISTINCT s.siglum) FROM transcription_summary s
            JOIN edition_table et ON et.id = s.table_id WHERE et.work_id = w.id) AS witnesses,
         (SELECT coalesce(sum(s.cells), 0) FROM transcription_summary s
            JOIN edition_table et ON et.id = s.table_id WHERE et.work_id = w.id) AS cells
  FROM work w;

-- Current cells per witness and state (how much is illegible, blank, ...).
CREATE VIEW witness_cell_states AS
  SELECT siglum, table_id, state, count(*) AS cells
  FROM current_cell
  WHERE col >= 0
  GROUP BY siglum, table_id, state;
