// The cells of a revision are stored packed (revision_cells) and read back by two
// decoders: Load() in C++ and the view `cell` for the sqlite3 shell. They
// must agree on every cell of every project transcription.
#include "store/edition_store.hpp"

#include <doctest/doctest.h>

#include <algorithm>
#include <filesystem>

#include "store_test_util.hpp"
#include "transcription/parser.hpp"

namespace fs = std::filesystem;
namespace store = apograph::store;
using apograph::Cell;
using apograph::Transcription;
using apograph::store::Database;
using apograph::testing::MakeTranscription;
using apograph::testing::TempDb;

namespace {

using apograph::testing::ProjectFiles;

/// One cell as text, from Load() ...
std::string Describe(const Cell& c) {
  return c.raw + "|" + (c.value ? c.value->ToString() : "<null>") + "|" + std::to_string(c.places) +
         "|" + apograph::ToString(c.state) + "|" + std::to_string(c.damaged) + "|" +
         std::to_string(c.doubtful) + "|" + apograph::ToString(c.addition) + "|" +
         c.corrected_from.value_or("<null>") + "|" + c.note + "|" + std::to_string(c.line) + "|" +
         std::to_string(c.column);
}

std::vector<std::string> FromLoad(const Transcription& t) {
  std::vector<std::string> out;
  for (const auto& row : t.rows) {
    out.push_back(Describe(row.argument));
    for (const auto& c : row.cells) out.push_back(Describe(c));
  }
  return out;
}

/// ... and the same from the view.
std::vector<std::string> FromView(Database& db, const Transcription& t) {
  auto s = db.Prepare(
      "SELECT raw, coalesce(value, '<null>'), places, state, damaged, doubtful, addition, "
      "coalesce(corrected_from, '<null>'), note, source_line, source_col FROM current_cell "
      "WHERE table_id = ?1 AND siglum = ?2 ORDER BY row_index, col");
  s.Bind(1, t.table_id).Bind(2, t.witness.siglum);
  std::vector<std::string> out;
  while (s.Step()) {
    std::string line;
    for (int i = 0; i < 11; ++i) line += (i ? "|" : "") + s.Text(i);
    out.push_back(line);
  }
  return out;
}

}  // namespace

TEST_CASE("Load() and the view cell read the same cells") {
  std::vector<Transcription> all;
  for (const auto& file : ProjectFiles()) {
    for (auto& t : apograph::ReadTranscriptionFile(file).tables) all.push_back(std::move(t));
  }
  all.push_back(MakeTranscription("made", "K"));  // every state and mark
  REQUIRE(all.size() >= 6);
  std::size_t cells = 0;
  for (const auto& t : all) {
    CAPTURE(t.source_file);
    CAPTURE(t.table_id);
    TempDb file("view");
    Database db(file.path());
    store::Import(db, {t});
    const Transcription back = store::Load(db, t.table_id, t.witness.siglum);
    CHECK(back.rows == t.rows);
    const auto loaded = FromLoad(back);
    CHECK(loaded == FromView(db, t));
    cells += loaded.size();
  }
  CHECK(cells > 1000);
}

TEST_CASE("rows of cells the program cannot read are a store error, not a crash") {
  TempDb file("badrow");
  Database db(file.path());
  store::Import(db, {MakeTranscription("sun-eq", "K", 1)});
  for (const char* rows :
       {R"([[1,["1",1],["0;1,2",6]]])",                       // a cell short
        R"([[1,["1",1],["0;1,2",6],["0;1,2",18],["1",2]]])",  // a cell too many
        R"([[1,["1",1],["0;x",6],["0;1,2",18]]])",            // not a value
        R"([[1,["1",1],["?",6,{"state":"smudged"}],["0;1,2",18]]])",
        R"([[1,["1",1],["?",6,{"colour":"red"}],["0;1,2",18]]])",
        R"([[1,["1",1],["?",6,{"state":"illegible","value":"1"}],["0;1,2",18]]])",
        R"([[1,["1",1],["0;1,2",6],["0;1,2","18"]]])",
        R"([[1,["1",1],["0;1,2",6,{"places":13}],["0;1,2",18]]])",
        R"([[1,["1",-1],["0;1,2",6],["0;1,2",18]]])",
        R"([[1,["1",1],["0;1,2",6,{"line":-3}],["0;1,2",18]]])",
        R"([[1,["1",1],["0;1,2",6],["0;1,2\u00"]]])",  // not JSON
        R"([[1,["1",1],["0;1,2",6],["0;1,2",18]]] ])",
        R"([[["1",1],["0;1,2",6],["0;1,2",18]]])",     // no line
        R"([[-1,["1",1],["0;1,2",6],["0;1,2",18]]])",  // a negative line
        R"([])",                                       // a row short
        R"([[1,["1",1],["0;1,2",6],["0;1,2",18]],)"
        R"([2,["2",1],["0;1,2",6],["0;1,2",18]]])"}) {  // a row too many
    const std::string text = rows;
    CAPTURE(text);
    db.Execute(std::string("UPDATE revision_cells SET rows = '") + rows + "'");
    CHECK_THROWS_AS(store::Load(db, "sun-eq", "K"), store::StoreError);
  }
  // Not an array: the database refuses it.
  CHECK_THROWS_AS(db.Execute(R"(UPDATE revision_cells SET rows = '{"raw":"1"}')"),
                  store::StoreError);
  db.Execute(
      R"(UPDATE revision_cells SET rows = '[[ 4, ["1" , 1] , ["0;1,2",6,{ }], ["\u0030;1,2",18] ]] ')");
  const auto back = store::Load(db, "sun-eq", "K");
  CHECK(back.rows[0].cells[1].raw == "0;1,2");
  CHECK(back.rows[0].line == 4);
}
