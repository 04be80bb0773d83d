-- 006: what kind of object a witness is (manuscript, early print, modern
-- edition). It decides which slips are likely and whether a witness may have
-- been recomputed; lineage also reads the witness's date (already stored as
-- written, in witness.date and revision.witness_date). '' means not declared
-- (treated as a manuscript). Like the other descriptive fields: the witness
-- keeps the latest non-empty value imported, each revision the value as
-- imported.
ALTER TABLE witness ADD COLUMN kind TEXT NOT NULL DEFAULT ''
  CHECK (kind = '' OR kind = 'manuscript' OR kind = 'print' OR kind = 'modern-edition');
ALTER TABLE revision ADD COLUMN witness_kind TEXT NOT NULL DEFAULT ''
  CHECK (witness_kind = '' OR witness_kind = 'manuscript' OR witness_kind = 'print' OR
         witness_kind = 'modern-edition');

-- One line per witness (now with its kind): its tables and current cells.
DROP VIEW witness_summary;
CREATE VIEW witness_summary AS
  SELECT w.siglum, w.library, w.shelfmark, w.date, w.script, w.kind,
         count(s.table_id) AS tables, coalesce(sum(s.cells), 0) AS cells
  FROM witness w
  LEFT JOIN transcription_summary s ON s.siglum = w.siglum
  GROUP BY w.siglum;
