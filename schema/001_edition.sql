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

-- The cells of a revision as transcribed, stored in reading order. col -1
-- is the row's argument as written (arguments are miscopied too), 0, 1, ...
-- the value columns of layout_column.
--   raw             the reading as typed (`0;4,10`, `0 4 10`, `?`, `0;?,10`, `_`)
--   value           the exact value in canonical trade notation; only when
--                   state = 'read'
--   value_real      the same value as a decimal, for queries and sorting
--   places          the places of the column the cell stands in
--   state           read | partial (some places unread) | illegible | blank
--                   (nothing written in the manuscript)
--   source_line, source_col: where the cell was typed in the revision's file
--                   (1-based; 0 when unknown)
-- The editor's marks on a cell are in cell_mark (most cells have none); the
-- view current_cell shows both together.
-- (The CHECKs spell out `a = .. OR a = ..` rather than `a IN (..)`: SQLite
-- builds a temporary index for an IN list on every insert, which made a large
-- import several times slower. For the same reason of speed the rare marks
-- live in their own table: every column of this one costs on each of a
-- million inserts.)
CREATE TABLE cell (
  revision_id     INTEGER NOT NULL REFERENCES revision(id),
  row_index       INTEGER NOT NULL CHECK (row_index >= 0),
  col             INTEGER NOT NULL CHECK (col >= -1),
  raw             TEXT NOT NULL,
  value           TEXT,
  value_real      REAL,
  places          INTEGER NOT NULL CHECK (places BETWEEN 0 AND 12),
  state           TEXT NOT NULL CHECK (state = 'read' OR state = 'partial' OR
                                       state = 'illegible' OR state = 'blank'),
  source_line     INTEGER NOT NULL CHECK (source_line >= 0),
  source_col      INTEGER NOT NULL CHECK (source_col >= 0),
  CHECK ((state = 'read') = (value IS NOT NULL)),
  CHECK ((value IS NULL) = (value_real IS NULL)),
  PRIMARY KEY (revision_id, row_index, col)
) WITHOUT ROWID;

-- The editor's marks on a cell, one row only for a cell that has any.
--   damaged         1 when the support is damaged there (a reading is given anyway)
--   doubtful        1 when the editor doubts the reading
--   addition        none | margin | interlinear: where the text stands
--   corrected_from  a scribal correction: the reading before it (the cell
--                   holds the reading after it)
--   note            the editor's note on this cell
CREATE TABLE cell_mark (
  revision_id     INTEGER NOT NULL,
  row_index       INTEGER NOT NULL,
  col             INTEGER NOT NULL,
  damaged         INTEGER NOT NULL DEFAULT 0 CHECK (damaged = 0 OR damaged = 1),
  doubtful        INTEGER NOT NULL DEFAULT 0 CHECK (doubtful = 0 OR doubtful = 1),
  addition        TEXT NOT NULL DEFAULT 'none' CHECK (addition = 'none' OR addition = 'margin' OR
                                                    addition = 'interlinear'),
  corrected_from  TEXT,
  note            TEXT NOT NULL DEFAULT '',
  CHECK (damaged = 1 OR doubtful = 1 OR addition <> 'none' OR corrected_from IS NOT NULL OR
         note <> ''),
  PRIMARY KEY (revision_id, row_index, col),
  FOREIGN KEY (revision_id, row_index, col) REFERENCES cell(revision_id, row_index, col)
) WITHOUT ROWID;

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
  SELECT r.table_id, r.siglum, r.number AS revision, c.row_index,
         lc.name AS column_name,
         c.col, c.raw, c.value, c.value_real, c.places, c.state,
         coalesce(m.damaged, 0) AS damaged, coalesce(m.doubtful, 0) AS doubtful,
         coalesce(m.addition, 'none') AS addition, m.corrected_from,
         coalesce(m.note, '') AS note, r.source_file, c.source_line, c.source_col
  FROM current_revision r
  JOIN cell c ON c.revision_id = r.id
  JOIN layout_column lc ON lc.revision_id = c.revision_id AND lc.position = c.col
  LEFT JOIN cell_mark m ON m.revision_id = c.revision_id AND m.row_index = c.row_index
                       AND m.col = c.col;

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
