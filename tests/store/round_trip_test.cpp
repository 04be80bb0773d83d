// Export -> re-import yields identical database content, on every
// transcription file of the project (corpora/**/*.apo, grammar/examples/*.apo).
#include "store/edition_store.hpp"

#include <doctest/doctest.h>

#include <algorithm>
#include <filesystem>

#include "store_test_util.hpp"
#include "transcription/parser.hpp"
#include "transcription/writer.hpp"

namespace fs = std::filesystem;
namespace store = apograph::store;
using apograph::Transcription;
using apograph::store::Database;
using apograph::testing::TempDb;

namespace {

using apograph::testing::ProjectFiles;

/// Everything the edition holds about current transcriptions except
/// provenance (file names, lines, import times): one string to compare.
std::string Content(Database& db) {
  std::string out;
  auto dump = [&](const std::string& sql, int columns) {
    auto s = db.Prepare(sql);
    while (s.Step()) {
      for (int i = 0; i < columns; ++i) out += (s.IsNull(i) ? "<null>" : s.Text(i)) + "|";
      out += '\n';
    }
  };
  dump("SELECT id, title, author FROM work ORDER BY id", 3);
  dump("SELECT id, work_id, title, kind FROM edition_table ORDER BY id", 4);
  dump("SELECT siglum, library, shelfmark, date, script, note FROM witness ORDER BY siglum", 6);
  dump(
      "SELECT table_id, siglum, number, row_count, cell_count, work_id, work_title, work_author, "
      "table_title, table_kind, library, shelfmark, witness_date, script, witness_note, folios, "
      "hand FROM current_revision ORDER BY table_id, siglum",
      17);
  dump(
      "SELECT r.table_id, r.siglum, lc.position, lc.name, lc.unit, lc.places, lc.title, lc.arg2, "
      "lc.start, lc.step FROM layout_column lc "
      "JOIN current_revision r ON r.id = lc.revision_id ORDER BY 1, 2, 3",
      10);
  dump(
      "SELECT table_id, siglum, row_index, col, column_name, raw, value, value_real, places, "
      "state, "
      "damaged, doubtful, addition, corrected_from, note FROM current_cell "
      "ORDER BY table_id, siglum, row_index, col",
      15);
  return out;
}

}  // namespace

TEST_CASE("every project transcription survives import, export and re-import unchanged") {
  const auto files = ProjectFiles();
  REQUIRE(files.size() >= 6);  // at least grammar/examples
  for (const auto& file : files) {
    CAPTURE(file);
    const auto parsed = apograph::ReadTranscriptionFile(file);
    TempDb first_db("rt-a");
    TempDb second_db("rt-b");
    Database first(first_db.path());
    store::Import(first, parsed.tables);

    std::vector<Transcription> loaded;
    for (const auto& t : parsed.tables) {
      loaded.push_back(store::Load(first, t.table_id, t.witness.siglum));
      CHECK(loaded.back().SameContent(t));
    }
    const std::string exported = apograph::WriteTranscription(loaded);
    const auto reparsed = apograph::ParseTranscription(exported, "exported.apo");
    REQUIRE(reparsed.tables.size() == parsed.tables.size());

    // Into the same database: nothing changes, no revision is added.
    for (const auto& t : store::Import(first, reparsed.tables).tables) CHECK_FALSE(t.changed);
    // Into a fresh database: the same content, table for table and cell for cell.
    Database second(second_db.path());
    store::Import(second, reparsed.tables);
    CHECK(Content(second) == Content(first));
  }
}

TEST_CASE("the content comparison sees a changed cell") {
  const auto files = ProjectFiles();
  REQUIRE_FALSE(files.empty());
  auto parsed = apograph::ReadTranscriptionFile(files.front());
  TempDb a_db("cmp-a");
  TempDb b_db("cmp-b");
  Database a(a_db.path());
  Database b(b_db.path());
  store::Import(a, parsed.tables);
  parsed.tables[0].rows[0].cells[0].note = "changed";
  store::Import(b, parsed.tables);
  CHECK(Content(a) != Content(b));
}
