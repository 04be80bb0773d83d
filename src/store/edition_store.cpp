#include "store/edition_store.hpp"

#include <map>
#include <utility>

#include "store/cell_writer.hpp"
#include "store/decision_store.hpp"

namespace apograph::store {
namespace {

InputError ErrorAt(const Transcription& t, int line, const std::string& message) {
  Diagnostic d;
  d.where.file = t.source_file;
  d.where.line = line;
  d.message = message;
  return InputError(d);
}

void CheckName(const Transcription& t, const std::string& what, const std::string& value) {
  if (value.empty()) throw ErrorAt(t, 0, "expected " + what + ", found an empty name");
}

void CheckPlaces(const Transcription& t, const std::string& name, int places) {
  if (places < 0 || places > Sexagesimal::kMaxPlaces) {
    throw ErrorAt(t, 0,
                  "expected 0 to " + std::to_string(Sexagesimal::kMaxPlaces) + " places for '" +
                      name + "', found " + std::to_string(places));
  }
}

void CheckCell(const Transcription& t, const Cell& c) {
  if ((c.state == CellState::kRead) != c.value.has_value()) {
    throw ErrorAt(
        t, c.line,
        ExpectedFound("a value exactly when the cell is read",
                      "state '" + std::string(ToString(c.state)) + "' for '" + c.raw + "'"));
  }
  if (c.places < 0 || c.places > Sexagesimal::kMaxPlaces || c.line < 0 || c.column < 0) {
    throw ErrorAt(t, c.line, ExpectedFound("a cell with 0 to 12 places", "'" + c.raw + "'"));
  }
}

/// What the database cannot check by itself (it would report a constraint
/// error without a position): names, places, cells per row.
void Validate(const Transcription& t) {
  CheckName(t, "a work id", t.work.id);
  CheckName(t, "a table id", t.table_id);
  CheckName(t, "a witness siglum", t.witness.siglum);
  CheckName(t, "an argument name", t.argument.name);
  CheckPlaces(t, t.argument.name, t.argument.places);
  if (t.argument2) {
    CheckName(t, "a column argument name", t.argument2->name);
    CheckPlaces(t, t.argument2->name, t.argument2->places);
  }
  if (t.columns.empty()) throw ErrorAt(t, 0, "expected at least one column, found none");
  for (const auto& c : t.columns) {
    CheckName(t, "a column name", c.name);
    CheckPlaces(t, c.name, c.places);
  }
  for (const auto& row : t.rows) {
    if (row.cells.size() != t.columns.size()) {
      throw ErrorAt(t, row.line,
                    "expected " + std::to_string(t.columns.size()) + " cells, found " +
                        std::to_string(row.cells.size()));
    }
    CheckCell(t, row.argument);
    for (const auto& c : row.cells) CheckCell(t, c);
  }
}

/// The prepared statements of one import, reused for every table and cell.
class Writer {
 public:
  explicit Writer(Database& db);
  TableImport Write(const Transcription& t, ImportResult& result);

 private:
  void EnsureDescriptions(const Transcription& t);
  std::int64_t EnsureTranscription(const Transcription& t);
  std::int64_t InsertRevision(const Transcription& t, std::int64_t transcription, int number);
  void InsertLayout(const Transcription& t, std::int64_t revision);
  void InsertArgument(std::int64_t revision, int position, const ArgumentSpec& a);

  Database& db_;
  Statement work_, table_work_, table_, witness_, transcription_, transcription_id_;
  Statement current_, revision_, layout_;
  CellWriter cells_;
};

Writer::Writer(Database& db)
    : db_(db),
      work_(db.Prepare(
          "INSERT INTO work(id, title, author) VALUES(?1, ?2, ?3) ON CONFLICT(id) DO UPDATE SET "
          "title = CASE WHEN excluded.title <> '' THEN excluded.title ELSE title END, "
          "author = CASE WHEN excluded.author <> '' THEN excluded.author ELSE author END")),
      table_work_(db.Prepare("SELECT work_id FROM edition_table WHERE id = ?1")),
      table_(
          db.Prepare("INSERT INTO edition_table(id, work_id, title, kind) VALUES(?1, ?2, ?3, ?4) "
                     "ON CONFLICT(id) DO UPDATE SET "
                     "title = CASE WHEN excluded.title <> '' THEN excluded.title ELSE title END, "
                     "kind = CASE WHEN excluded.kind <> '' THEN excluded.kind ELSE kind END")),
      witness_(db.Prepare(
          "INSERT INTO witness(siglum, library, shelfmark, date, script, note) "
          "VALUES(?1, ?2, ?3, ?4, ?5, ?6) ON CONFLICT(siglum) DO UPDATE SET "
          "library = CASE WHEN excluded.library <> '' THEN excluded.library ELSE library END, "
          "shelfmark = CASE WHEN excluded.shelfmark <> '' THEN excluded.shelfmark ELSE shelfmark "
          "END, "
          "date = CASE WHEN excluded.date <> '' THEN excluded.date ELSE date END, "
          "script = CASE WHEN excluded.script <> '' THEN excluded.script ELSE script END, "
          "note = CASE WHEN excluded.note <> '' THEN excluded.note ELSE note END")),
      transcription_(
          db.Prepare("INSERT OR IGNORE INTO transcription(table_id, siglum) VALUES(?1, ?2)")),
      transcription_id_(
          db.Prepare("SELECT id FROM transcription WHERE table_id = ?1 AND siglum = ?2")),
      current_(db.Prepare("SELECT max(number) FROM revision WHERE transcription_id = ?1")),
      revision_(db.Prepare(
          "INSERT INTO revision(transcription_id, number, source_file, source_text, row_count, "
          "cell_count, work_id, work_title, work_author, table_title, table_kind, library, "
          "shelfmark, witness_date, script, witness_note, folios, hand) "
          "VALUES(?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14, ?15, ?16, ?17, "
          "?18)")),
      layout_(db.Prepare(
          "INSERT INTO layout_column(revision_id, position, name, unit, places, title, arg2, "
          "start, step) VALUES(?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9)")),
      cells_(db) {}

void Writer::EnsureDescriptions(const Transcription& t) {
  work_.Bind(1, t.work.id).Bind(2, t.work.title).Bind(3, t.work.author).Run();
  table_work_.Bind(1, t.table_id);
  if (table_work_.Step() && table_work_.Text(0) != t.work.id) {
    const std::string owner = table_work_.Text(0);
    table_work_.Reset();
    throw ErrorAt(t, 0,
                  "expected table '" + t.table_id + "' in work '" + owner +
                      "' as in the database, found it in work '" + t.work.id + "'");
  }
  table_work_.Reset();
  table_.Bind(1, t.table_id).Bind(2, t.work.id).Bind(3, t.table_title).Bind(4, t.kind).Run();
  const auto& w = t.witness;
  witness_.Bind(1, w.siglum).Bind(2, w.library).Bind(3, w.shelfmark).Bind(4, w.date);
  witness_.Bind(5, w.script).Bind(6, w.note).Run();
}

std::int64_t Writer::EnsureTranscription(const Transcription& t) {
  transcription_.Bind(1, t.table_id).Bind(2, t.witness.siglum).Run();
  transcription_id_.Bind(1, t.table_id).Bind(2, t.witness.siglum);
  transcription_id_.Step();
  const std::int64_t id = transcription_id_.Int(0);
  transcription_id_.Reset();
  return id;
}

std::int64_t Writer::InsertRevision(const Transcription& t, std::int64_t transcription,
                                    int number) {
  auto& s = revision_;
  s.Bind(1, transcription).Bind(2, number).Bind(3, t.source_file).Bind(4, t.source_text);
  s.Bind(5, static_cast<std::int64_t>(t.rows.size()));
  s.Bind(6, static_cast<std::int64_t>(t.CellCount()));
  s.Bind(7, t.work.id).Bind(8, t.work.title).Bind(9, t.work.author);
  s.Bind(10, t.table_title).Bind(11, t.kind).Bind(12, t.witness.library);
  s.Bind(13, t.witness.shelfmark).Bind(14, t.witness.date).Bind(15, t.witness.script);
  s.Bind(16, t.witness.note).Bind(17, t.folios).Bind(18, t.hand).Run();
  return db_.LastInsertId();
}

void Writer::InsertArgument(std::int64_t revision, int position, const ArgumentSpec& a) {
  layout_.Bind(1, revision).Bind(2, position).Bind(3, a.name).Bind(4, a.unit);
  layout_.Bind(5, a.places).Bind(6, "").BindNull(7);
  if (a.start)
    layout_.Bind(8, a.start->ToString());
  else
    layout_.BindNull(8);
  if (a.step)
    layout_.Bind(9, a.step->ToString());
  else
    layout_.BindNull(9);
  layout_.Run();
}

void Writer::InsertLayout(const Transcription& t, std::int64_t revision) {
  if (t.argument2) InsertArgument(revision, -2, *t.argument2);
  InsertArgument(revision, -1, t.argument);
  for (std::size_t i = 0; i < t.columns.size(); ++i) {
    const auto& c = t.columns[i];
    layout_.Bind(1, revision).Bind(2, static_cast<int>(i)).Bind(3, c.name).Bind(4, c.unit);
    layout_.Bind(5, c.places).Bind(6, c.title);
    if (c.arg2)
      layout_.Bind(7, c.arg2->ToString());
    else
      layout_.BindNull(7);
    layout_.BindNull(8).BindNull(9).Run();
  }
}

TableImport Writer::Write(const Transcription& t, ImportResult& result) {
  EnsureDescriptions(t);
  const std::int64_t transcription = EnsureTranscription(t);
  current_.Bind(1, transcription);
  current_.Step();
  const int current = current_.IsNull(0) ? 0 : static_cast<int>(current_.Int(0));
  current_.Reset();

  TableImport out{t.table_id, t.witness.siglum, t.source_file, current,
                  false,      t.rows.size(),    t.CellCount()};
  if (current > 0 && Load(db_, t.table_id, t.witness.siglum, current).SameContent(t)) return out;

  const std::int64_t revision = InsertRevision(t, transcription, current + 1);
  InsertLayout(t, revision);
  const std::int64_t before = cells_.written();
  for (std::size_t r = 0; r < t.rows.size(); ++r) cells_.Add(revision, t, r);
  cells_.Flush();
  RecordRowArguments(db_, revision, t);  // what the views call a row's argument
  result.cells_written += static_cast<std::size_t>(cells_.written() - before);
  out.revision = current + 1;
  out.changed = true;
  return out;
}

/// Rejects a (table, witness) pair given twice in one import: which of the
/// two the editor meant is not ours to guess.
void CheckUnique(const std::vector<Transcription>& tables) {
  std::map<std::pair<std::string, std::string>, const Transcription*> seen;
  for (const auto& t : tables) {
    auto [it, fresh] = seen.emplace(std::make_pair(t.table_id, t.witness.siglum), &t);
    if (!fresh) {
      throw ErrorAt(t, 0,
                    "expected each table of a witness once per import, found table '" + t.table_id +
                        "' of witness '" + t.witness.siglum + "' again (first in " +
                        it->second->source_file + ")");
    }
  }
}

}  // namespace

ImportResult Import(Database& db, const std::vector<Transcription>& tables) {
  for (const auto& t : tables) Validate(t);
  CheckUnique(tables);
  ImportResult result;
  Transaction transaction(db);
  Writer writer(db);
  for (const auto& t : tables) result.tables.push_back(writer.Write(t, result));
  transaction.Commit();
  return result;
}

}  // namespace apograph::store
