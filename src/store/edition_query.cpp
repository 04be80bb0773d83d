// Reading the edition back: Load() and the list functions of edition_store.hpp.
#include "store/edition_store.hpp"

#include "store/cell_json.hpp"

namespace apograph::store {
namespace {

std::optional<Sexagesimal> ValueFromText(const std::optional<std::string>& text) {
  if (!text) return std::nullopt;
  auto v = Sexagesimal::Parse(*text);
  if (!v) throw StoreError("the database holds an unreadable value '" + *text + "'");
  return v;
}

/// The error for a transcription or revision that is not there.
[[noreturn]] void NoRevision(Database& db, const std::string& table_id, const std::string& siglum,
                             std::optional<int> revision) {
  std::string what = "table '" + table_id + "' of witness '" + siglum + "'";
  if (revision && HasTranscription(db, table_id, siglum)) {
    throw InputError::ForFile(db.path(), ExpectedFound("a revision of " + what,
                                                       "no revision " + std::to_string(*revision) +
                                                           " (see apograph list revisions)"));
  }
  throw InputError::ForFile(db.path(), ExpectedFound("a transcription of " + what,
                                                     "none (see apograph list transcriptions)"));
}

/// A transcription's current or given revision: its id, number and
/// metadata, and the text of its cells (`revision_cells.rows`, column 20),
/// in ONE statement, which `fit --all` runs once per table (it was three).
Statement FindRevision(Database& db, const std::string& table_id, const std::string& siglum,
                       std::optional<int> revision) {
  auto s = db.Prepare(
      "SELECT r.id, r.number, t.table_id, t.siglum, r.source_file, r.source_text, r.work_id, "
      "r.work_title, r.work_author, r.table_title, r.table_kind, r.library, r.shelfmark, "
      "r.witness_date, r.script, r.witness_note, r.folios, r.hand, r.row_count, r.witness_kind, "
      "rc.rows FROM revision r JOIN transcription t ON t.id = r.transcription_id "
      "LEFT JOIN revision_cells rc ON rc.revision_id = r.id "
      "WHERE t.table_id = ?1 AND t.siglum = ?2 AND (?3 IS NULL OR r.number = ?3) "
      "ORDER BY r.number DESC LIMIT 1");
  s.Bind(1, table_id).Bind(2, siglum).Bind(3, revision);
  if (!s.Step()) NoRevision(db, table_id, siglum, revision);
  return s;
}

/// Fills the metadata of `t` from the row of FindRevision.
void ReadMetadata(const Statement& s, Transcription& t) {
  t.table_id = s.Text(2);
  t.witness.siglum = s.Text(3);
  t.source_file = s.Text(4);
  t.source_text = s.Text(5);
  t.work = {s.Text(6), s.Text(7), s.Text(8)};
  t.table_title = s.Text(9);
  t.kind = s.Text(10);
  t.witness.library = s.Text(11);
  t.witness.shelfmark = s.Text(12);
  t.witness.date = s.Text(13);
  t.witness.script = s.Text(14);
  t.witness.note = s.Text(15);
  t.folios = s.Text(16);
  t.hand = s.Text(17);
  t.witness.kind = s.Text(19);
}

void LoadLayout(Database& db, std::int64_t revision, Transcription& t) {
  auto s = db.Prepare(
      "SELECT position, name, unit, places, title, arg2, start, step, listed FROM layout_column "
      "WHERE revision_id = ?1 ORDER BY position");
  s.Bind(1, revision);
  while (s.Step()) {
    const auto position = s.Int(0);
    if (position < 0) {
      ArgumentSpec a{s.Text(1),
                     s.Text(2),
                     static_cast<int>(s.Int(3)),
                     ValueFromText(s.OptionalText(6)),
                     ValueFromText(s.OptionalText(7)),
                     s.Int(8) != 0};
      (position == -1 ? t.argument : t.argument2.emplace()) = std::move(a);
    } else {
      t.columns.push_back({s.Text(1), s.Text(2), static_cast<int>(s.Int(3)), s.Text(4),
                           ValueFromText(s.OptionalText(5))});
    }
  }
}

/// Rows in order, decoded from the revision's JSON (cell_json.hpp), after
/// its layout (which gives the places); the same decoding as the view
/// `cell`, which the tests compare with it.
void ReadCells(const Statement& s, Transcription& t) {
  const std::int64_t revision = s.Int(0), row_count = s.Int(18);
  t.rows.reserve(static_cast<std::size_t>(row_count));
  if (!s.IsNull(20)) DecodeRevisionRows(s.TextView(20), t);
  if (static_cast<std::int64_t>(t.rows.size()) != row_count) {
    throw StoreError("revision " + std::to_string(revision) + " holds " +
                     std::to_string(t.rows.size()) + " rows of cells, not its " +
                     std::to_string(row_count) + " rows");
  }
}

std::vector<std::string> Strings(Statement s) {
  std::vector<std::string> out;
  while (s.Step()) out.push_back(s.Text(0));
  return out;
}

RevisionSummary ReadRevisionSummary(const Statement& s) {
  return {s.Text(0),
          s.Text(1),
          static_cast<int>(s.Int(2)),
          static_cast<int>(s.Int(3)),
          s.Int(4),
          s.Int(5),
          s.Text(6),
          s.Text(7)};
}

}  // namespace

Transcription Load(Database& db, const std::string& table_id, const std::string& siglum,
                   std::optional<int> revision) {
  ReadTransaction read(db);  // one lock for the two statements, one consistent revision
  const Statement found = FindRevision(db, table_id, siglum, revision);
  Transcription t;
  ReadMetadata(found, t);
  LoadLayout(db, found.Int(0), t);
  ReadCells(found, t);
  read.End();
  return t;
}

std::vector<Transcription> LoadTable(Database& db, const std::string& table_id) {
  ReadTransaction read(db);
  std::vector<Transcription> out;
  for (const auto& siglum : Sigla(db, table_id)) out.push_back(Load(db, table_id, siglum));
  read.End();
  return out;
}

std::vector<std::string> Sigla(Database& db, const std::string& table_id) {
  auto s = db.Prepare(
      "SELECT siglum FROM transcription t WHERE table_id = ?1 "
      "AND EXISTS (SELECT 1 FROM revision r WHERE r.transcription_id = t.id) ORDER BY siglum");
  s.Bind(1, table_id);
  return Strings(std::move(s));
}

std::vector<std::string> TablesOfWork(Database& db, const std::string& work_id) {
  auto s = db.Prepare("SELECT id FROM edition_table WHERE work_id = ?1 ORDER BY id");
  s.Bind(1, work_id);
  return Strings(std::move(s));
}

bool HasTranscription(Database& db, const std::string& table_id, const std::string& siglum) {
  auto s = db.Prepare(
      "SELECT 1 FROM transcription t JOIN revision r ON r.transcription_id = t.id "
      "WHERE t.table_id = ?1 AND t.siglum = ?2 LIMIT 1");
  s.Bind(1, table_id).Bind(2, siglum);
  return s.Step();
}

int CurrentRevision(Database& db, const std::string& table_id, const std::string& siglum) {
  auto s = db.Prepare(
      "SELECT max(r.number) FROM transcription t JOIN revision r ON r.transcription_id = t.id "
      "WHERE t.table_id = ?1 AND t.siglum = ?2");
  s.Bind(1, table_id).Bind(2, siglum);
  return s.Step() && !s.IsNull(0) ? static_cast<int>(s.Int(0)) : 0;
}

std::vector<WorkSummary> ListWorks(Database& db) {
  auto s = db.Prepare(
      "SELECT work_id, title, author, tables, witnesses, cells FROM work_summary ORDER BY work_id");
  std::vector<WorkSummary> out;
  while (s.Step()) {
    out.push_back({{s.Text(0), s.Text(1), s.Text(2)},
                   static_cast<int>(s.Int(3)),
                   static_cast<int>(s.Int(4)),
                   s.Int(5)});
  }
  return out;
}

std::vector<TableSummary> ListTables(Database& db, const std::optional<std::string>& work_id) {
  auto s = db.Prepare(
      "SELECT table_id, work_id, title, kind, witnesses, cells FROM table_summary "
      "WHERE ?1 IS NULL OR work_id = ?1 ORDER BY work_id, table_id");
  s.Bind(1, work_id);
  std::vector<TableSummary> out;
  while (s.Step()) {
    out.push_back(
        {s.Text(0), s.Text(1), s.Text(2), s.Text(3), static_cast<int>(s.Int(4)), s.Int(5)});
  }
  return out;
}

std::vector<WitnessSummary> ListWitnesses(Database& db,
                                          const std::optional<std::string>& table_id) {
  auto s = db.Prepare(
      "SELECT w.siglum, w.library, w.shelfmark, w.date, w.script, w.tables, w.cells, w.kind "
      "FROM witness_summary w WHERE ?1 IS NULL OR EXISTS (SELECT 1 FROM transcription_summary x "
      "WHERE x.siglum = w.siglum AND x.table_id = ?1) ORDER BY w.siglum");
  s.Bind(1, table_id);
  std::vector<WitnessSummary> out;
  while (s.Step()) {
    WitnessInfo w{s.Text(0), s.Text(1), s.Text(2), s.Text(3), s.Text(4), "", s.Text(7)};
    out.push_back({std::move(w), static_cast<int>(s.Int(5)), s.Int(6)});
  }
  return out;
}

std::vector<RevisionSummary> ListTranscriptions(Database& db,
                                                const std::optional<std::string>& table_id) {
  auto s = db.Prepare(
      "SELECT table_id, siglum, current_revision, revisions, rows, cells, imported_at, "
      "source_file FROM transcription_summary WHERE ?1 IS NULL OR table_id = ?1 "
      "ORDER BY table_id, siglum");
  s.Bind(1, table_id);
  std::vector<RevisionSummary> out;
  while (s.Step()) out.push_back(ReadRevisionSummary(s));
  return out;
}

std::vector<RevisionSummary> ListRevisions(Database& db, const std::optional<std::string>& table_id,
                                           const std::optional<std::string>& siglum) {
  auto s = db.Prepare(
      "SELECT t.table_id, t.siglum, r.number, "
      "(SELECT count(*) FROM revision x WHERE x.transcription_id = t.id), "
      "r.row_count, r.cell_count, r.imported_at, r.source_file "
      "FROM revision r JOIN transcription t ON t.id = r.transcription_id "
      "WHERE (?1 IS NULL OR t.table_id = ?1) AND (?2 IS NULL OR t.siglum = ?2) "
      "ORDER BY t.table_id, t.siglum, r.number");
  s.Bind(1, table_id).Bind(2, siglum);
  std::vector<RevisionSummary> out;
  while (s.Step()) out.push_back(ReadRevisionSummary(s));
  return out;
}

}  // namespace apograph::store
