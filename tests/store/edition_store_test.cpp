#include "store/edition_store.hpp"

#include <doctest/doctest.h>

#include "store/import_session.hpp"
#include "store/schema.hpp"
#include "store/value_text.hpp"
#include "store_test_util.hpp"

using apograph::CellState;
using apograph::InputError;
using apograph::Sexagesimal;
using apograph::Transcription;
using apograph::store::Database;
using apograph::store::StoreError;
using apograph::testing::MakeTranscription;
using apograph::testing::TempDb;
namespace store = apograph::store;

namespace {

std::int64_t Count(Database& db, const std::string& table) {
  auto s = db.Prepare("SELECT count(*) FROM " + table);
  s.Step();
  return s.Int(0);
}

}  // namespace

TEST_CASE("migrations are applied once and recorded in user_version") {
  TempDb file("migrate");
  const int latest = store::Migrations().back().version;
  CHECK(latest >= 1);
  {
    Database db(file.path());
    CHECK(db.SchemaVersion() == latest);
    CHECK(Count(db, "work") == 0);
  }
  Database again(file.path());  // re-opening must not re-run the DDL (it would fail)
  CHECK(again.SchemaVersion() == latest);
}

TEST_CASE("a database newer than the program is refused") {
  TempDb file("newer");
  {
    Database db(file.path());
    db.Execute("PRAGMA user_version = 999");
  }
  CHECK_THROWS_AS(Database(file.path()), StoreError);
}

TEST_CASE("values are written exactly as Sexagesimal::ToString writes them") {
  char buffer[store::kValueTextSize];
  for (const char* text : {"0", "2;23,10", "-0;5", "0;0,7", "90;0", "1,30;0,0", "59;59,59,59,59,59",
                           "-123456789012;0,0,0,0,0,0,0,0,0,0,0,1",
                           "999999999999;59,59,59,59,59,59,59,59,59,59,59,59"}) {
    const auto v = Sexagesimal::ParseOrThrow(text);
    CHECK(store::FormatValue(v, buffer) == v.ToString());
  }
}

TEST_CASE("an imported transcription loads back with the same content and provenance") {
  TempDb file("roundtrip");
  Database db(file.path());
  const Transcription t = MakeTranscription("sun-eq", "K");
  auto result = store::Import(db, {t});
  REQUIRE(result.tables.size() == 1);
  CHECK(result.tables[0].changed);
  CHECK(result.tables[0].revision == 1);
  CHECK(result.tables[0].cells == 24);
  CHECK(result.cells_written == 36);  // 12 argument cells + 24 value cells

  const Transcription back = store::Load(db, "sun-eq", "K");
  CHECK(back.SameContent(t));
  CHECK(back.rows == t.rows);  // provenance (line, column) too
  CHECK(back.source_file == t.source_file);
  CHECK(back.source_text == t.source_text);
  CHECK(back.rows[2].cells[0].state == CellState::kPartial);
  CHECK(*back.rows[4].cells[0].corrected_from == "0;10,52");
  CHECK(back.rows[5].cells[0].note == "ink faded");
}

TEST_CASE("a revision whose cells are missing is reported as such, not as no transcription") {
  TempDb file("lost-cells");
  Database db(file.path());
  store::Import(db, {MakeTranscription("sun-eq", "K")});
  db.Execute("DELETE FROM revision_cells");  // damage that Load's one statement must still see
  try {
    store::Load(db, "sun-eq", "K");
    FAIL("loaded a revision without its cells");
  } catch (const StoreError& e) {
    CHECK(std::string(e.what()).find("holds 0 rows of cells, not its 12 rows") !=
          std::string::npos);
  }
}

TEST_CASE("a double-argument table keeps its column argument and arg2 values") {
  TempDb file("grid");
  Database db(file.path());
  Transcription t = MakeTranscription("grid", "K", 3);
  t.argument2 = apograph::ArgumentSpec{"latitude", "deg", 1, std::nullopt, std::nullopt};
  t.columns[0].arg2 = Sexagesimal::ParseOrThrow("36;0");
  t.columns[1].arg2 = Sexagesimal::ParseOrThrow("42;30");
  store::Import(db, {t});
  const Transcription back = store::Load(db, "grid", "K");
  CHECK(back.SameContent(t));
  REQUIRE(back.argument2.has_value());
  CHECK(back.argument2->name == "latitude");
  CHECK(back.columns[1].arg2->Identical(Sexagesimal::ParseOrThrow("42;30")));
}

TEST_CASE("re-importing the same content adds no revision") {
  TempDb file("same");
  Database db(file.path());
  Transcription t = MakeTranscription("sun-eq", "K");
  store::Import(db, {t});
  t.source_file = "moved.apo";  // provenance alone is not a change
  t.rows[0].line = 99;
  t.rows[0].cells[0].line = 99;
  auto again = store::Import(db, {t});
  CHECK_FALSE(again.tables[0].changed);
  CHECK(again.tables[0].revision == 1);
  CHECK(again.cells_written == 0);
  CHECK(store::ListRevisions(db).size() == 1);
  CHECK(Count(db, "cell") == 36);
}

TEST_CASE("re-importing an edited transcription keeps both revisions") {
  TempDb file("edit");
  Database db(file.path());
  const Transcription first = MakeTranscription("sun-eq", "K");
  store::Import(db, {first});
  Transcription second = first;
  second.rows[7].cells[1] = apograph::testing::ReadCell("0;2,8", 2, 17, 18);
  second.witness.shelfmark = "Cod. 112a";
  auto result = store::Import(db, {second});
  CHECK(result.tables[0].changed);
  CHECK(result.tables[0].revision == 2);

  CHECK(store::Load(db, "sun-eq", "K", 1).SameContent(first));
  CHECK(store::Load(db, "sun-eq", "K", 2).SameContent(second));
  CHECK(store::Load(db, "sun-eq", "K").SameContent(second));
  CHECK_FALSE(store::Load(db, "sun-eq", "K", 1).SameContent(second));
  auto revisions = store::ListRevisions(db, std::string("sun-eq"), std::string("K"));
  REQUIRE(revisions.size() == 2);
  CHECK(revisions[1].number == 2);
  CHECK(revisions[1].revisions == 2);
  CHECK_THROWS_AS(store::Load(db, "sun-eq", "K", 3), InputError);
  CHECK_THROWS_AS(store::Load(db, "sun-eq", "Z"), InputError);
}

TEST_CASE("an error in the second table leaves the database byte for byte unchanged") {
  TempDb file("fail");
  {
    Database db(file.path());
    store::Import(db, {MakeTranscription("sun-eq", "K")});
  }
  const std::string before = file.Bytes();
  REQUIRE_FALSE(before.empty());

  SUBCASE("a row with a missing cell") {
    Transcription bad = MakeTranscription("decl", "K");
    bad.rows[3].cells.pop_back();
    Database db(file.path());
    CHECK_THROWS_AS(store::Import(db, {MakeTranscription("moon", "K"), bad}), InputError);
  }
  SUBCASE("a table that moves to another work, found while writing") {
    Transcription moved = MakeTranscription("sun-eq", "L");
    moved.work.id = "other";
    Database db(file.path());
    CHECK_THROWS_AS(store::Import(db, {MakeTranscription("moon", "K"), moved}), InputError);
    CHECK(Count(db, "edition_table") == 1);
  }
  SUBCASE("the same table of a witness twice in one import") {
    Database db(file.path());
    CHECK_THROWS_AS(
        store::Import(db, {MakeTranscription("moon", "K"), MakeTranscription("moon", "K")}),
        InputError);
  }
  CHECK(file.Bytes() == before);
}

TEST_CASE("CHECK and foreign key constraints reject bad rows") {
  TempDb file("checks");
  Database db(file.path());
  store::Import(db, {MakeTranscription("sun-eq", "K", 2)});
  const std::string rows = "INSERT INTO revision_cells(revision_id, rows) VALUES ";
  CHECK_NOTHROW(db.Execute(
      R"(UPDATE revision_cells SET rows = '[[1,["1",1],["1",3],["?",5,{"state":"illegible"}]]]')"));
  CHECK_THROWS_AS(db.Execute(R"(UPDATE revision_cells SET rows = '{"raw":"1"}')"),
                  StoreError);                                   // not an array
  CHECK_THROWS_AS(db.Execute(rows + "(99, '[]')"), StoreError);  // no such revision
  CHECK_THROWS_AS(db.Execute(rows + "(1, '[]')"), StoreError);   // the revision has its rows
  // Cells are written by the import only: `cell` and `cell_mark` are views.
  CHECK_THROWS_AS(
      db.Execute("INSERT INTO cell(revision_id, row_index, col, raw) VALUES(1, 60, 0, '1')"),
      StoreError);
  CHECK_THROWS_AS(db.Execute("DELETE FROM cell_mark"), StoreError);
  CHECK_THROWS_AS(
      db.Execute("INSERT INTO revision(transcription_id, number, work_id) VALUES(1, 0, 'w')"),
      StoreError);
  CHECK_THROWS_AS(db.Execute("INSERT INTO edition_table(id, work_id) VALUES('t', 'no-such-work')"),
                  StoreError);
  CHECK_THROWS_AS(db.Execute("INSERT INTO witness(siglum) VALUES('')"), StoreError);
}

TEST_CASE("lists count tables, witnesses, cells and revisions") {
  TempDb file("lists");
  Database db(file.path());
  Transcription moon = MakeTranscription("moon", "L", 4);
  moon.work = {"other", "", ""};
  store::Import(db, {MakeTranscription("sun-eq", "K"), MakeTranscription("sun-eq", "L", 6), moon});

  auto works = store::ListWorks(db);
  REQUIRE(works.size() == 2);
  CHECK(works[0].work.id == "harbour");
  CHECK(works[0].tables == 1);
  CHECK(works[0].witnesses == 2);
  CHECK(works[0].cells == 24 + 12);

  auto tables = store::ListTables(db);
  REQUIRE(tables.size() == 2);
  CHECK(tables[0].id == "sun-eq");
  CHECK(tables[0].witnesses == 2);
  CHECK(tables[1].id == "moon");
  CHECK(tables[1].cells == 8);
  CHECK(store::ListTables(db, std::string("other")).size() == 1);

  auto witnesses = store::ListWitnesses(db);
  REQUIRE(witnesses.size() == 2);
  CHECK(witnesses[1].witness.siglum == "L");
  CHECK(witnesses[1].tables == 2);
  CHECK(witnesses[1].cells == 12 + 8);
  CHECK(store::ListWitnesses(db, std::string("moon")).size() == 1);

  CHECK(store::Sigla(db, "sun-eq") == std::vector<std::string>{"K", "L"});
  CHECK(store::TablesOfWork(db, "harbour") == std::vector<std::string>{"sun-eq"});
  auto all = store::LoadTable(db, "sun-eq");
  REQUIRE(all.size() == 2);
  CHECK(all[1].rows.size() == 6);
  CHECK(store::ListTranscriptions(db).size() == 3);
  CHECK(store::HasTranscription(db, "moon", "L"));
  CHECK_FALSE(store::HasTranscription(db, "moon", "K"));
}

TEST_CASE("descriptions keep the latest non-empty values; a revision records them as merged") {
  TempDb file("describe");
  Database db(file.path());
  Transcription t = MakeTranscription("sun-eq", "K", 3);
  store::Import(db, {t});
  Transcription sparse = t;
  sparse.witness = {"K", "", "", "", "", ""};  // as a CSV import would give it
  sparse.rows[0].cells[0] = apograph::testing::ReadCell("0;1,1", 2, 1, 1);
  store::Import(db, {sparse});
  auto w = store::ListWitnesses(db);
  REQUIRE(w.size() == 1);
  CHECK(w[0].witness.library == "Nordhafen, Town Library");
  // Not given is not cleared: the new revision records the stored library.
  CHECK(store::Load(db, "sun-eq", "K").witness.library == "Nordhafen, Town Library");
  CHECK(store::CurrentRevision(db, "sun-eq", "K") == 2);
}

TEST_CASE("cells written otherwise than canonically keep raw text, value, places, line and marks") {
  TempDb file("packed");
  Database db(file.path());
  Transcription t = MakeTranscription("sun-eq", "K", 3);
  auto& spaced = t.rows[0].cells[0];  // raw is not the canonical value text
  spaced = apograph::testing::ReadCell("0;4,10", 2, 10, 6);
  spaced.raw = "0 4 10";
  auto& minus_zero = t.rows[0].cells[1];  // `-0;0` reads as 0;0: raw must not stand for the value
  minus_zero = apograph::testing::ReadCell("-0;0", 2, 10, 18);
  auto& odd = t.rows[1].cells[0];  // quotes, backslash, a control character, non-ASCII text
  odd.raw = "\"a\\b\"\t";
  odd.value.reset();
  odd.state = CellState::kIllegible;
  odd.note = "l\xC3\xA4sst \"sich\" nicht lesen\n";
  odd.corrected_from = "0;1,\\2";
  odd.places = 3;  // not the places of its column
  odd.line = 40;   // not the line of its row
  odd.column = 0;  // unknown
  t.rows[1].argument.doubtful = true;
  t.rows[1].argument.addition = apograph::Addition::kInterlinear;
  t.rows[2].cells[1].damaged = true;
  store::Import(db, {t});

  const Transcription back = store::Load(db, "sun-eq", "K");
  CHECK(back.SameContent(t));
  CHECK(back.rows == t.rows);
  CHECK(back.rows[0].cells[0].value->Identical(Sexagesimal::ParseOrThrow("0;4,10")));
  CHECK(back.rows[0].cells[1].raw == "-0;0");

  // The view `cell` shows the same, cell by cell.
  auto s = db.Prepare(
      "SELECT raw, value, value_real, places, state, doubtful, addition, corrected_from, note, "
      "source_line, source_col, column_name FROM cell WHERE revision_id = 1 AND row_index = ?1 "
      "AND col = ?2");
  s.Bind(1, 0).Bind(2, 0);
  REQUIRE(s.Step());
  CHECK(s.Text(0) == "0 4 10");
  CHECK(s.Text(1) == "0;4,10");
  CHECK(s.Real(2) == doctest::Approx(250.0 / 3600.0).epsilon(1e-15));
  CHECK(s.Text(11) == "equation");
  s.Reset();
  s.Bind(1, 1).Bind(2, 0);
  REQUIRE(s.Step());
  CHECK(s.Text(0) == odd.raw);
  CHECK(s.IsNull(1));
  CHECK(s.IsNull(2));
  CHECK(s.Int(3) == 3);
  CHECK(s.Text(4) == "illegible");
  CHECK(s.Text(7) == "0;1,\\2");
  CHECK(s.Text(8) == odd.note);
  CHECK(s.Int(9) == 40);
  CHECK(s.Int(10) == 0);
  s.Reset();
  s.Bind(1, 1).Bind(2, -1);
  REQUIRE(s.Step());
  CHECK(s.Int(5) == 1);
  CHECK(s.Text(6) == "interlinear");
  CHECK(s.Text(11) == "anomaly");

  auto marks = db.Prepare("SELECT row_index, col, damaged FROM cell_mark ORDER BY row_index, col");
  std::vector<std::string> seen;
  while (marks.Step()) {
    seen.push_back(std::to_string(marks.Int(0)) + "," + std::to_string(marks.Int(1)) + "," +
                   std::to_string(marks.Int(2)));
  }
  CHECK(seen == std::vector<std::string>{"1,-1,0", "1,0,0", "2,1,1"});
}

TEST_CASE("value_real follows the sign and every place of the exact value") {
  TempDb file("real");
  Database db(file.path());
  Transcription t = MakeTranscription("sun-eq", "K", 1);
  t.rows[0].cells[0] = apograph::testing::ReadCell("-1,30;0,0,0,0,0,0,0,0,0,0,0,1", 2, 10, 6);
  t.rows[0].cells[1] = apograph::testing::ReadCell("12;59,59", 2, 10, 18);
  store::Import(db, {t});
  auto s = db.Prepare("SELECT value, value_real FROM cell WHERE col >= 0 ORDER BY col");
  REQUIRE(s.Step());
  CHECK(s.Text(0) == "-90;0,0,0,0,0,0,0,0,0,0,0,1");
  CHECK(s.Real(1) == doctest::Approx(-90.0 - 1.0 / 2176782336000000000000.0));
  REQUIRE(s.Step());
  CHECK(s.Real(1) == doctest::Approx(12.0 + 59.0 / 60 + 59.0 / 3600).epsilon(1e-15));
}

TEST_CASE("an import writes with a small page cache and gives the connection its own back") {
  TempDb tmp("import-cache");
  Database db(tmp.path());
  auto cache_size = [&db] {
    auto s = db.Prepare("PRAGMA cache_size");
    REQUIRE(s.Step());
    return s.Int(0);
  };
  REQUIRE(cache_size() == -4096);  // Database::Configure
  {
    store::ImportSession session(db);
    CHECK(cache_size() == -1024);
    session.Add(MakeTranscription("sun-eq", "K"));
    session.Commit();
  }
  CHECK(cache_size() == -4096);
  {
    store::ImportSession dropped(db);  // rolled back: the cache is given back all the same
    dropped.Add(MakeTranscription("moon", "K"));
  }
  CHECK(cache_size() == -4096);
  CHECK(store::Load(db, "sun-eq", "K").rows.size() == MakeTranscription("sun-eq", "K").rows.size());
}
