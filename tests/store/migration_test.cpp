// A database written by an older apograph opens in this one: its schema is
// migrated, and what it held reads back as before, through Load() and
// through the views an editor queries from the sqlite3 shell.
#include <sqlite3.h>

#include <doctest/doctest.h>

#include <string>
#include <vector>

#include "store/decision_store.hpp"
#include "store/edition_store.hpp"
#include "store/schema.hpp"
#include "store_test_util.hpp"
#include "transcription/parser.hpp"

namespace store = apograph::store;
using apograph::Transcription;
using apograph::store::Database;
using apograph::testing::MakeTranscription;
using apograph::testing::TempDb;

namespace {

/// A plain SQLite connection: no migration runs when it opens.
class RawDb {
 public:
  explicit RawDb(const std::string& path) {
    REQUIRE(sqlite3_open(path.c_str(), &db_) == SQLITE_OK);
  }
  ~RawDb() { sqlite3_close(db_); }
  RawDb(const RawDb&) = delete;
  RawDb& operator=(const RawDb&) = delete;

  void Execute(const std::string& sql) {
    char* err = nullptr;
    const int rc = sqlite3_exec(db_, sql.c_str(), nullptr, nullptr, &err);
    const std::string message = err ? err : "";
    sqlite3_free(err);
    INFO(message);
    REQUIRE(rc == SQLITE_OK);
  }

  /// Every row of `sql`, its columns joined by '|' (NULL as <null>).
  std::vector<std::string> Rows(const std::string& sql) {
    std::vector<std::string> out;
    char* err = nullptr;
    const int rc = sqlite3_exec(
        db_, sql.c_str(),
        [](void* rows, int n, char** values, char**) {
          std::string line;
          for (int i = 0; i < n; ++i)
            line += (i ? "|" : "") + std::string(values[i] ? values[i] : "<null>");
          static_cast<std::vector<std::string>*>(rows)->push_back(line);
          return 0;
        },
        &out, &err);
    const std::string message = err ? err : "";
    sqlite3_free(err);
    INFO(message);
    REQUIRE(rc == SQLITE_OK);
    return out;
  }

 private:
  sqlite3* db_ = nullptr;
};

/// The transcriptions of the test: every state and mark, a table with no
/// rows, a second revision of one table, and the project's own files (their
/// works and tables renamed apart: several files reuse the same names).
std::vector<std::vector<Transcription>> Imports() {
  std::vector<Transcription> first = {MakeTranscription("sun-eq", "K"),
                                      MakeTranscription("sun-eq", "L", 6),
                                      MakeTranscription("empty", "K", 0)};
  int n = 0;
  for (const auto& file : apograph::testing::ProjectFiles()) {
    const std::string prefix = "f" + std::to_string(++n) + "-";
    for (auto& t : apograph::ReadTranscriptionFile(file).tables) {
      t.table_id = prefix + t.table_id;
      t.work.id = prefix + t.work.id;
      first.push_back(std::move(t));
    }
  }
  Transcription changed = MakeTranscription("sun-eq", "K", 14);
  changed.rows[7].cells[1].raw = "0;3,0";
  changed.rows[7].cells[1].value = apograph::Sexagesimal::ParseOrThrow("0;3,0");
  return {first, {changed}};
}

/// A database at schema `version` as an older apograph left it, holding
/// what `source` holds (written by this apograph): its cells one row of
/// `cell_row` per table row as schema 001 stored them, its row arguments in
/// `revision_argument` as 013 did, except revision 2's.
void WriteOldDatabase(const std::string& path, int version, const std::string& source) {
  RawDb old(path);
  for (const auto& m : store::Migrations()) {
    if (m.version <= version) old.Execute(m.sql);
  }
  old.Execute("PRAGMA user_version = " + std::to_string(version));
  old.Execute("ATTACH '" + source + "' AS src");
  for (const char* table :
       {"work", "edition_table", "witness", "transcription", "revision", "layout_column"}) {
    old.Execute(std::string("INSERT INTO ") + table + " SELECT * FROM src." + table);
  }
  old.Execute(
      "INSERT INTO cell_row(revision_id, row_index, line, cells) "
      "SELECT c.revision_id, r.key, r.value ->> 0, json_remove(r.value, '$[0]') "
      "FROM src.revision_cells c JOIN json_each(c.rows) r");
  // Revision 2 as imported before schema 013 kept row arguments: none.
  old.Execute(
      "INSERT INTO revision_argument(revision_id, arguments) "
      "SELECT revision_id, arguments FROM src.revision_cells WHERE revision_id <> 2");
  old.Execute("DETACH src");
}

/// What an editor sees through the views, in a fixed order.
std::vector<std::string> Views(RawDb& db) {
  std::vector<std::string> out;
  for (const char* sql : {"SELECT * FROM cell ORDER BY revision_id, row_index, col",
                          "SELECT * FROM current_cell ORDER BY table_id, siglum, row_index, col",
                          "SELECT * FROM cell_mark ORDER BY revision_id, row_index, col",
                          "SELECT * FROM row_argument ORDER BY revision_id, row_index",
                          "SELECT * FROM transcription_summary ORDER BY table_id, siglum",
                          "SELECT * FROM witness_cell_states ORDER BY siglum, table_id, state"}) {
    out.push_back(std::string("-- ") + sql);
    for (auto& row : db.Rows(sql)) out.push_back(std::move(row));
  }
  return out;
}

}  // namespace

TEST_CASE(
    "a database of schema 13 (a row per table row) migrates with every cell and view intact") {
  TempDb source_file("migrate-source");
  {
    Database source(source_file.path());
    for (const auto& batch : Imports()) store::Import(source, batch);
  }
  TempDb old_file("migrate-13");
  WriteOldDatabase(old_file.path(), 13, source_file.path());
  std::vector<std::string> before;
  {
    RawDb old(old_file.path());
    before = Views(old);
    CHECK(old.Rows("SELECT count(*) FROM cell_row") != std::vector<std::string>{"0"});
  }
  REQUIRE(before.size() > 1000);

  {
    Database migrated(old_file.path());
    Database source(source_file.path());
    CHECK(migrated.SchemaVersion() == store::Migrations().back().version);
    for (const auto& s : store::ListRevisions(source, std::nullopt, std::nullopt)) {
      CAPTURE(s.table_id);
      CAPTURE(s.siglum);
      const Transcription want = store::Load(source, s.table_id, s.siglum, s.number);
      const Transcription got = store::Load(migrated, s.table_id, s.siglum, s.number);
      CHECK(got.rows == want.rows);
      CHECK(got.SameContent(want));
    }
  }
  {
    RawDb migrated(old_file.path());
    CHECK(Views(migrated) == before);
    CHECK(migrated.Rows("SELECT revision_id FROM revision_cells WHERE arguments IS NULL") ==
          std::vector<std::string>{"2"});
  }
  {
    // Revision 2's arguments, filled in when needed, are those an import writes.
    Database db(old_file.path());
    store::FillRowArguments(db, "sun-eq");
  }
  RawDb migrated(old_file.path());
  migrated.Execute("ATTACH '" + source_file.path() + "' AS src");
  CHECK(migrated.Rows("SELECT count(*) FROM revision_cells a JOIN src.revision_cells b "
                      "USING (revision_id) WHERE a.arguments IS b.arguments") ==
        migrated.Rows("SELECT count(*) FROM src.revision_cells"));
  migrated.Execute("DETACH src");
  CHECK(migrated.Rows("SELECT count(*) FROM sqlite_schema WHERE name = 'cell_row' "
                      "OR name = 'revision_argument'") == std::vector<std::string>{"0"});
  // One row per revision, the revision without rows included.
  CHECK(migrated.Rows("SELECT count(*) = (SELECT count(*) FROM revision) FROM revision_cells") ==
        std::vector<std::string>{"1"});
  CHECK(migrated.Rows("SELECT rows FROM revision_cells JOIN revision ON id = revision_id "
                      "WHERE row_count = 0") == std::vector<std::string>{"[]"});
}

TEST_CASE("an import writes one database row of cells per revision, whatever its rows") {
  TempDb file("one-row");
  {
    Database db(file.path());
    for (const auto& batch : Imports()) store::Import(db, batch);
  }
  RawDb db(file.path());
  const auto revisions = db.Rows("SELECT count(*) FROM revision");
  CHECK(db.Rows("SELECT count(*) FROM revision_cells") == revisions);
  CHECK(db.Rows("SELECT count(*) FROM revision r JOIN revision_cells c ON c.revision_id = r.id "
                "WHERE json_array_length(c.rows) <> r.row_count "
                "OR json_array_length(c.arguments) <> r.row_count") ==
        std::vector<std::string>{"0"});
  CHECK(db.Rows("SELECT sum(row_count) > 1000 FROM revision") == std::vector<std::string>{"1"});
}

TEST_CASE("an upgrade over several schema versions is applied whole or not at all") {
  TempDb file("migrate-fails");
  {
    RawDb old(file.path());
    for (const auto& m : store::Migrations()) {
      if (m.version <= 12) old.Execute(m.sql);
    }
    old.Execute("PRAGMA user_version = 12");
    // A table in the way of the last migration (14): it fails after 13 ran.
    old.Execute("CREATE TABLE revision_cells (x)");
  }
  CHECK_THROWS_AS(Database(file.path()), store::StoreError);
  RawDb db(file.path());
  CHECK(db.Rows("PRAGMA user_version") == std::vector<std::string>{"12"});
  CHECK(db.Rows("SELECT count(*) FROM sqlite_schema WHERE name = 'decision'") ==
        std::vector<std::string>{"0"});
}

TEST_CASE("a new database is created from one script with the schema the migrations give") {
  REQUIRE(store::FreshSchema().version == store::Migrations().back().version);
  const std::string objects =
      "SELECT type, name, tbl_name, sql FROM sqlite_master ORDER BY type, name";
  TempDb fresh_file("fresh");
  TempDb stepped_file("stepped");
  {
    RawDb stepped(stepped_file.path());
    for (const auto& m : store::Migrations()) stepped.Execute(m.sql);
    stepped.Execute("PRAGMA user_version = " + std::to_string(store::Migrations().back().version));
    // The migrations drop tables they empty (cell_row, revision_argument),
    // leaving free pages; the one script creates only what stays.
    CHECK(stepped.Rows("PRAGMA freelist_count") != std::vector<std::string>{"0"});
  }
  { Database created(fresh_file.path()); }
  {
    RawDb created(fresh_file.path());
    CHECK(created.Rows("PRAGMA freelist_count") == std::vector<std::string>{"0"});
  }
  {
    Database fresh(fresh_file.path());      // created here
    Database stepped(stepped_file.path());  // at the last version: nothing to run
    CHECK(fresh.SchemaVersion() == stepped.SchemaVersion());
    for (const auto& batch : Imports()) {
      store::Import(fresh, batch);
      store::Import(stepped, batch);
    }
  }
  RawDb fresh(fresh_file.path());
  RawDb stepped(stepped_file.path());
  const auto want = stepped.Rows(objects);
  REQUIRE(want.size() > 40);
  CHECK(fresh.Rows(objects) == want);
  CHECK(Views(fresh) == Views(stepped));
}
