-- 001: the edition itself: works, tables, witnesses, transcriptions with
-- revisions, layouts and cells. Nothing is ever updated in place: a changed
-- transcription becomes a new revision and the old one stays.

CREATE TABLE work (
  id      TEXT PRIMARY KEY CHECK (length(id) > 0),
  title   TEXT NOT NULL DEFAULT '',
  author  TEXT NOT NULL DEFAULT ''
);

-- One table of a work (the same table in every witness).
CREATE TABLE edition_table (
  id       TEXT PRIMARY KEY CHECK (length(id) > 0),
  work_id  TEXT NOT NULL REFERENCES work(id),
  title    TEXT NOT NULL DEFAULT '',
  kind     TEXT NOT NULL DEFAULT ''
);

-- One manuscript (or print) that holds copies of the work's tables.
CREATE TABLE witness (
  siglum     TEXT PRIMARY KEY CHECK (length(siglum) > 0),
  library    TEXT NOT NULL DEFAULT '',
  shelfmark  TEXT NOT NULL DEFAULT '',
  date       TEXT NOT NULL DEFAULT '',
  script     TEXT NOT NULL DEFAULT '',
  note       TEXT NOT NULL DEFAULT ''
);

-- One witness's copy of one table.
CREATE TABLE transcription (
  id        INTEGER PRIMARY KEY,
  table_id  TEXT NOT NULL REFERENCES edition_table(id),
  siglum    TEXT NOT NULL REFERENCES witness(siglum),
  UNIQUE (table_id, siglum)
);

-- Every import that changed something adds a revision; the highest number is
-- current. The metadata as imported is kept with each revision.
CREATE TABLE revision (
  id                INTEGER PRIMARY KEY,
  transcription_id  INTEGER NOT NULL REFERENCES transcription(id),
  number            INTEGER NOT NULL CHECK (number >= 1),
  imported_at       TEXT NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%SZ', 'now')),
  source_file       TEXT NOT NULL DEFAULT '',
  source_text       TEXT NOT NULL DEFAULT '',
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

-- The layout of a revision: position -1 is the row argument, -2 the column
-- argument of a double-argument table, 0.. the value columns in order.
CREATE TABLE layout_column (
  revision_id  INTEGER NOT NULL REFERENCES revision(id),
  position     INTEGER NOT NULL CHECK (position >= -2),
  name         TEXT NOT NULL CHECK (length(name) > 0),
  unit         TEXT NOT NULL DEFAULT '',
  places       INTEGER NOT NULL CHECK (places BETWEEN 0 AND 12),
  title        TEXT NOT NULL DEFAULT '',
  arg2         TEXT,            -- column argument value (double-argument tables)
  start        TEXT,            -- arguments only: expected first value
  step         TEXT,            -- arguments only: expected step
  PRIMARY KEY (revision_id, position)
) WITHOUT ROWID;

-- Cells: col -1 is the row's argument as written.
CREATE TABLE cell (
  revision_id     INTEGER NOT NULL REFERENCES revision(id),
  row_index       INTEGER NOT NULL CHECK (row_index >= 0),
  col             INTEGER NOT NULL CHECK (col >= -1),
  raw             TEXT NOT NULL,
  value           TEXT,          -- exact value in trade notation, when read
  value_real      REAL,          -- the same as a decimal, for queries
  places          INTEGER NOT NULL CHECK (places BETWEEN 0 AND 12),
  state           TEXT NOT NULL CHECK (state IN ('read', 'partial', 'illegible', 'blank')),
  damaged         INTEGER NOT NULL DEFAULT 0 CHECK (damaged IN (0, 1)),
  doubtful        INTEGER NOT NULL DEFAULT 0 CHECK (doubtful IN (0, 1)),
  addition        TEXT NOT NULL DEFAULT 'none' CHECK (addition IN ('none', 'margin', 'interlinear')),
  corrected_from  TEXT,          -- scribal correction: the reading before it
  note            TEXT NOT NULL DEFAULT '',
  source_line     INTEGER NOT NULL DEFAULT 0,
  source_col      INTEGER NOT NULL DEFAULT 0,
  CHECK ((state = 'read') = (value IS NOT NULL)),
  PRIMARY KEY (revision_id, row_index, col)
) WITHOUT ROWID;

-- The current revision of every transcription.
CREATE VIEW current_revision AS
  SELECT r.* FROM revision r
  WHERE r.number = (SELECT max(number) FROM revision WHERE transcription_id = r.transcription_id);

-- Every current cell with its table, witness and column names: the view to
-- query from the sqlite3 shell.
CREATE VIEW current_cell AS
  SELECT t.table_id, t.siglum, r.number AS revision, c.row_index,
         lc.name AS column_name,
         c.col, c.raw, c.value, c.value_real, c.places, c.state, c.damaged,
         c.doubtful, c.addition, c.corrected_from, c.note, r.source_file,
         c.source_line, c.source_col
  FROM cell c
  JOIN current_revision r ON r.id = c.revision_id
  JOIN transcription t ON t.id = r.transcription_id
  JOIN layout_column lc ON lc.revision_id = c.revision_id AND lc.position = c.col;
