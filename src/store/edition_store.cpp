#include "store/edition_store.hpp"

#include <map>
#include <optional>
#include <utility>

#include "edition/names.hpp"
#include "store/cell_writer.hpp"
#include "store/import_session.hpp"

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

/// Ids become parts of file names later (reports, apparatus): see names.hpp.
void CheckId(const Transcription& t, const std::string& what, const std::string& value) {
  CheckName(t, what, value);
  if (!IsSafeId(value)) {
    throw ErrorAt(t, 0, "expected " + what + " of " + kSafeIdRule + ", found " + QuotedText(value));
  }
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
  CheckId(t, "a work id", t.work.id);
  CheckId(t, "a table id", t.table_id);
  CheckId(t, "a witness siglum", t.witness.siglum);
  if (!t.witness.script.empty() && !IsSafeId(t.witness.script)) {
    throw ErrorAt(t, 0, "expected a numeral script name, found " + QuotedText(t.witness.script));
  }
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

/// The descriptive attributes shared by every transcription of a work,
/// table or witness (folios and hand belong to one copy and are not here).
struct Description {
  WorkInfo work;
  std::string table_title;
  std::string table_kind;
  WitnessInfo witness;

  explicit Description(const Transcription& t)
      : work(t.work), table_title(t.table_title), table_kind(t.kind), witness(t.witness) {}
  bool Matches(const Transcription& t) const {
    return work == t.work && table_title == t.table_title && table_kind == t.kind &&
           witness == t.witness;
  }
  void CopyTo(Transcription& t) const {
    t.work = work;
    t.table_title = table_title;
    t.kind = table_kind;
    t.witness = witness;
  }
};

/// The prepared statements of one import, reused for every table and cell.
class Writer {
 public:
  explicit Writer(Database& db);
  TableImport Write(const Transcription& t, ImportResult& result);

 private:
  Description Reconcile(const Transcription& t, std::vector<Diagnostic>& warnings);
  void EnsureDescriptions(const Transcription& t, const Description& d);
  std::int64_t EnsureTranscription(const Transcription& t);
  std::int64_t InsertRevision(const Transcription& t, const Description& d,
                              std::int64_t transcription, int number);
  void InsertLayout(const Transcription& t, std::int64_t revision);
  void InsertArgument(std::int64_t revision, int position, const ArgumentSpec& a);

  Database& db_;
  Statement work_, table_work_, table_, witness_, transcription_, transcription_id_;
  Statement current_, revision_, layout_;
  Statement stored_work_, stored_table_, stored_witness_;
  CellWriter cells_;
  /// The witness as the last table gave it and as its row now stands: the
  /// sheets of a batch share one witness, whose row is then read and
  /// written once, not once per table (2 of a table's 13 statements). Only
  /// this session writes the database meanwhile (its transaction holds the
  /// write lock), so the row stays as written.
  WitnessInfo witness_given_;
  std::optional<WitnessInfo> witness_written_;
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
          "INSERT INTO witness(siglum, library, shelfmark, date, script, note, kind) "
          "VALUES(?1, ?2, ?3, ?4, ?5, ?6, ?7) ON CONFLICT(siglum) DO UPDATE SET "
          "library = CASE WHEN excluded.library <> '' THEN excluded.library ELSE library END, "
          "shelfmark = CASE WHEN excluded.shelfmark <> '' THEN excluded.shelfmark ELSE shelfmark "
          "END, "
          "date = CASE WHEN excluded.date <> '' THEN excluded.date ELSE date END, "
          "script = CASE WHEN excluded.script <> '' THEN excluded.script ELSE script END, "
          "note = CASE WHEN excluded.note <> '' THEN excluded.note ELSE note END, "
          "kind = CASE WHEN excluded.kind <> '' THEN excluded.kind ELSE kind END")),
      transcription_(
          db.Prepare("INSERT OR IGNORE INTO transcription(table_id, siglum) VALUES(?1, ?2)")),
      transcription_id_(
          db.Prepare("SELECT id FROM transcription WHERE table_id = ?1 AND siglum = ?2")),
      current_(db.Prepare("SELECT max(number) FROM revision WHERE transcription_id = ?1")),
      revision_(db.Prepare(
          "INSERT INTO revision(transcription_id, number, source_file, source_text, row_count, "
          "cell_count, work_id, work_title, work_author, table_title, table_kind, library, "
          "shelfmark, witness_date, script, witness_note, folios, hand, witness_kind) "
          "VALUES(?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14, ?15, ?16, ?17, "
          "?18, ?19)")),
      layout_(db.Prepare(
          "INSERT INTO layout_column(revision_id, position, name, unit, places, title, arg2, "
          "start, step, listed) VALUES(?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10)")),
      stored_work_(db.Prepare("SELECT title, author FROM work WHERE id = ?1")),
      stored_table_(db.Prepare("SELECT title, kind FROM edition_table WHERE id = ?1")),
      stored_witness_(db.Prepare(
          "SELECT library, shelfmark, date, script, note, kind FROM witness WHERE siglum = ?1")),
      cells_(db) {}

namespace {

/// One attribute: an empty imported value takes the stored one; a different
/// non-empty one is a change, said as a warning.
void Merge(const Transcription& t, const std::string& owner, const char* name,
           std::string& imported, const std::string& stored, std::vector<Diagnostic>& warnings) {
  if (imported.empty()) {
    imported = stored;
  } else if (!stored.empty() && stored != imported) {
    Diagnostic d;
    d.severity = Severity::kWarning;
    d.where.file = t.source_file;
    d.message = owner + ": " + name + " changed from " + QuotedText(stored) + " to " +
                QuotedText(imported) + " (earlier revisions keep the earlier value)";
    warnings.push_back(std::move(d));
  }
}

}  // namespace

Description Writer::Reconcile(const Transcription& t, std::vector<Diagnostic>& warnings) {
  Description d(t);
  stored_work_.Bind(1, t.work.id);
  if (stored_work_.Step()) {
    const std::string owner = "work '" + t.work.id + "'";
    Merge(t, owner, "title", d.work.title, stored_work_.Text(0), warnings);
    Merge(t, owner, "author", d.work.author, stored_work_.Text(1), warnings);
  }
  stored_work_.Reset();
  stored_table_.Bind(1, t.table_id);
  if (stored_table_.Step()) {
    const std::string owner = "table '" + t.table_id + "'";
    Merge(t, owner, "title", d.table_title, stored_table_.Text(0), warnings);
    Merge(t, owner, "kind", d.table_kind, stored_table_.Text(1), warnings);
  }
  stored_table_.Reset();
  if (witness_written_ && witness_given_ == t.witness) {
    d.witness = *witness_written_;  // as the table before left it in the database
    return d;
  }
  auto& s = stored_witness_;
  s.Bind(1, t.witness.siglum);
  if (s.Step()) {
    const std::string owner = "witness '" + t.witness.siglum + "'";
    WitnessInfo& w = d.witness;
    Merge(t, owner, "library", w.library, s.Text(0), warnings);
    Merge(t, owner, "shelfmark", w.shelfmark, s.Text(1), warnings);
    Merge(t, owner, "date", w.date, s.Text(2), warnings);
    Merge(t, owner, "script", w.script, s.Text(3), warnings);
    Merge(t, owner, "note", w.note, s.Text(4), warnings);
    Merge(t, owner, "kind", w.kind, s.Text(5), warnings);
  }
  s.Reset();
  return d;
}

void Writer::EnsureDescriptions(const Transcription& t, const Description& d) {
  work_.Bind(1, t.work.id).Bind(2, d.work.title).Bind(3, d.work.author).Run();
  table_work_.Bind(1, t.table_id);
  if (table_work_.Step() && table_work_.Text(0) != t.work.id) {
    const std::string owner = table_work_.Text(0);
    table_work_.Reset();
    throw ErrorAt(t, 0,
                  "expected table '" + t.table_id + "' in work '" + owner +
                      "' as in the database, found it in work '" + t.work.id + "'");
  }
  table_work_.Reset();
  table_.Bind(1, t.table_id).Bind(2, t.work.id).Bind(3, d.table_title).Bind(4, d.table_kind).Run();
  const auto& w = d.witness;
  if (!witness_written_ || !(*witness_written_ == w)) {
    witness_.Bind(1, w.siglum).Bind(2, w.library).Bind(3, w.shelfmark).Bind(4, w.date);
    witness_.Bind(5, w.script).Bind(6, w.note).Bind(7, w.kind).Run();
  }
  witness_given_ = t.witness;
  witness_written_ = w;
}

std::int64_t Writer::EnsureTranscription(const Transcription& t) {
  transcription_.Bind(1, t.table_id).Bind(2, t.witness.siglum).Run();
  transcription_id_.Bind(1, t.table_id).Bind(2, t.witness.siglum);
  transcription_id_.Step();
  const std::int64_t id = transcription_id_.Int(0);
  transcription_id_.Reset();
  return id;
}

std::int64_t Writer::InsertRevision(const Transcription& t, const Description& d,
                                    std::int64_t transcription, int number) {
  auto& s = revision_;
  const WitnessInfo& w = d.witness;
  s.Bind(1, transcription).Bind(2, number).Bind(3, t.source_file).Bind(4, t.source_text);
  s.Bind(5, static_cast<std::int64_t>(t.rows.size()));
  s.Bind(6, static_cast<std::int64_t>(t.CellCount()));
  s.Bind(7, t.work.id).Bind(8, d.work.title).Bind(9, d.work.author);
  s.Bind(10, d.table_title).Bind(11, d.table_kind).Bind(12, w.library);
  s.Bind(13, w.shelfmark).Bind(14, w.date).Bind(15, w.script);
  s.Bind(16, w.note).Bind(17, t.folios).Bind(18, t.hand).Bind(19, w.kind).Run();
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
  layout_.Bind(10, a.listed ? 1 : 0).Run();
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
    layout_.BindNull(8).BindNull(9).Bind(10, 0).Run();
  }
}

/// True when the current revision holds `t` with the description `d`.
bool Unchanged(Database& db, const Transcription& t, const Description& d, int current) {
  if (current == 0) return false;
  Transcription stored = Load(db, t.table_id, t.witness.siglum, current);
  if (!d.Matches(stored)) return false;
  Description(t).CopyTo(stored);  // the rest compares with t as imported
  return stored.SameContent(t);
}

TableImport Writer::Write(const Transcription& t, ImportResult& result) {
  const Description d = Reconcile(t, result.warnings);
  EnsureDescriptions(t, d);
  const std::int64_t transcription = EnsureTranscription(t);
  current_.Bind(1, transcription);
  current_.Step();
  const int current = current_.IsNull(0) ? 0 : static_cast<int>(current_.Int(0));
  current_.Reset();

  TableImport out{t.table_id, t.witness.siglum, t.source_file, current,
                  false,      t.rows.size(),    t.CellCount()};
  if (Unchanged(db_, t, d, current)) return out;

  const std::int64_t revision = InsertRevision(t, d, transcription, current + 1);
  InsertLayout(t, revision);
  // The cells, and what the views call a row's argument.
  const std::int64_t written = cells_.Write(revision, t);
  result.cells_written += static_cast<std::size_t>(written);
  out.revision = current + 1;
  out.changed = true;
  return out;
}

/// The connection's page cache made small while an import writes, and put
/// back after. An import writes most pages once (a revision's cells and its
/// sheet's text are overflow pages appended to the file), so a page held
/// longer is not used again: a small cache spills each page soon after it
/// was filled, while it is still in the processor's cache. Measured on the
/// 1,000 sheets of `make_sheets.py --seed 1` (interleaved imports into a
/// new file, medians of CPU, load 8-9): 4 MiB 191 ms, 2 MiB 180, 1 MiB 179,
/// 512 KiB 173-179, 256 KiB 178, 128 KiB 184; 1 MiB is the larger of the
/// equally fast sizes (judgement: room for the B-tree pages of a large
/// database). Other commands keep the 4 MiB of Database::Configure.
class ImportCache {
 public:
  explicit ImportCache(Database& db) : db_(db) {
    auto size = db_.Prepare("PRAGMA cache_size");
    size.Step();
    previous_ = size.Int(0);
    size.Reset();
    db_.Execute("PRAGMA cache_size = -1024");
  }
  ~ImportCache() {
    try {
      db_.Execute("PRAGMA cache_size = " + std::to_string(previous_));
    } catch (const StoreError&) {  // a destructor must not throw; memory only
    }
  }
  ImportCache(const ImportCache&) = delete;
  ImportCache& operator=(const ImportCache&) = delete;

 private:
  Database& db_;
  std::int64_t previous_ = 0;
};

}  // namespace

/// The session's transaction, statements and the pairs already written.
struct ImportSession::State {
  explicit State(Database& db) : cache(db), transaction(db), writer(db) {}
  ImportCache cache;  ///< first made, last undone: after the transaction ends
  Transaction transaction;
  Writer writer;
  ImportResult result;
  /// (table, witness) -> the file that brought it first.
  std::map<std::pair<std::string, std::string>, std::string> seen;
};

ImportSession::ImportSession(Database& db) : state_(std::make_unique<State>(db)) {}

ImportSession::~ImportSession() = default;

/// Rejects a (table, witness) pair given twice in one import: which of the
/// two the editor meant is not ours to guess.
void ImportSession::Add(const Transcription& t) {
  Validate(t);
  auto [it, fresh] =
      state_->seen.emplace(std::make_pair(t.table_id, t.witness.siglum), t.source_file);
  if (!fresh) {
    throw ErrorAt(t, 0,
                  "expected each table of a witness once per import, found table '" + t.table_id +
                      "' of witness '" + t.witness.siglum + "' again (first in " + it->second +
                      ")");
  }
  state_->result.tables.push_back(state_->writer.Write(t, state_->result));
}

ImportResult ImportSession::Commit() {
  state_->transaction.Commit();
  return std::move(state_->result);
}

ImportResult Import(Database& db, const std::vector<Transcription>& tables) {
  ImportSession session(db);
  for (const auto& t : tables) session.Add(t);
  return session.Commit();
}

}  // namespace apograph::store
