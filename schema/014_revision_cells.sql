-- 014: the cells of a revision in one database row (revision_cells), not
-- one row per table row (cell_row, which this migration empties into it and
-- drops), beside the arguments its rows stand for (revision_argument of
-- 013, likewise moved in and dropped). The views `cell`, `cell_mark`,
-- `current_cell` and `row_argument` keep their columns and results; `cell`
-- and `row_argument` are made anew to read the new table.
--
-- revision_cells.rows is a JSON array with one element per table row in
-- reading order (the element's index is the row_index of the view `cell`).
-- Each element is an array: the row's line (the line of its argument in the
-- revision's file, 1-based; 0 when unknown), then its cells exactly as
-- cell_row.cells held them (001): the argument cell as written, then the
-- cell of each value column of layout_column.
--   Example of a revision of two rows of two columns:
--     [[12,["7",1],["0;4,10",5],["0 4 10",14,{"value":"0;4,10"}]],
--      [13,["8",1],["0;4,20",5],["?",14,{"state":"illegible","doubtful":1}]]]
-- Every revision has its row here, rows '[]' when it has no rows.
-- revision_cells.arguments: the argument each row stands for
-- (Transcription::ArgumentInUse: the written one when it fits its
-- neighbours, repaired when miscopied), a JSON array with one element per
-- row, in trade notation or null: `["7","8"]`. NULL for a revision imported
-- before 013, which recorded none (apograph fills it in when it needs it;
-- meanwhile the view row_argument gives the written argument).
--
-- Why one row per revision: an import of 1,000 sheets of 360 rows spent
-- about 40% of its time in SQLite inserting one B-tree entry per table row,
-- and another 15% inserting each revision's arguments apart (perf;
-- DEVELOPERS.md, issue 15). A revision's text now goes into a single entry
-- and its overflow pages, and is read back the same way. The database checks
-- the key, the revision and that `rows` and `arguments` open an array; the
-- program validates every cell before writing it and refuses malformed text
-- when reading it, as the view does.
CREATE TABLE revision_cells (
  revision_id  INTEGER PRIMARY KEY REFERENCES revision(id),
  rows         TEXT NOT NULL CHECK (substr(rows, 1, 1) = '['),
  arguments    TEXT CHECK (arguments IS NULL OR substr(arguments, 1, 1) = '[')
);

-- Existing revisions move in, their rows in row_index order (the scan of
-- cell_row's primary key (revision_id, row_index) gives that order).
INSERT INTO revision_cells (revision_id, rows, arguments)
  SELECT revision_id, '[' || group_concat(packed, ',') || ']',
         (SELECT a.arguments FROM revision_argument a WHERE a.revision_id = p.revision_id)
  FROM (SELECT revision_id, row_index,
               '[' || line ||
               CASE WHEN ltrim(substr(cells, 2), char(32, 9, 10, 13)) LIKE ']%' THEN ']'
                    ELSE ',' || substr(cells, 2) END AS packed
        FROM cell_row
        ORDER BY revision_id, row_index) p
  GROUP BY revision_id;
INSERT INTO revision_cells (revision_id, rows, arguments)
  SELECT id, '[]', (SELECT a.arguments FROM revision_argument a WHERE a.revision_id = r.id)
  FROM revision r WHERE id NOT IN (SELECT revision_id FROM revision_cells);

DROP VIEW row_argument;
DROP VIEW cell;
DROP TABLE cell_row;
DROP TABLE revision_argument;

-- Every cell of every revision, one line per cell, unpacked from
-- revision_cells: the same columns and values as 001 made it (see there).
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
    SELECT rc.revision_id, r.key AS row_index, j.key - 2 AS col, lc.name AS column_name,
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
           coalesce(j.value ->> '$[2].line', r.value ->> 0) AS source_line,
           j.value ->> 1 AS source_col
    FROM revision_cells rc
    JOIN json_each(rc.rows) r
    JOIN json_each(r.value) j ON j.key >= 1  -- element 0 is the row's line, not a cell
    -- CROSS JOIN keeps this order: each cell looks up its column (otherwise
    -- SQLite may unpack the rows once per column)
    CROSS JOIN layout_column lc ON lc.revision_id = rc.revision_id AND lc.position = j.key - 2
  ) u;

-- One row per row of every revision with its argument in trade notation
-- (as 013 made it). Revisions imported before 013 have no stored arguments:
-- their written argument stands in.
CREATE VIEW row_argument AS
  SELECT rc.revision_id, j.key AS row_index, j.value AS argument
  FROM revision_cells rc
  JOIN json_each(rc.arguments) j
  UNION ALL
  SELECT c.revision_id, c.row_index, c.raw AS argument
  FROM cell c
  WHERE c.col = -1
    AND c.revision_id IN (SELECT revision_id FROM revision_cells WHERE arguments IS NULL);
