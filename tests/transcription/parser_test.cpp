// The transcription parser on good input: what lands in each Transcription.
#include "transcription/parser.hpp"

#include <doctest/doctest.h>

using apograph::Addition;
using apograph::CellState;
using apograph::ParseTranscription;
using apograph::Sexagesimal;
using apograph::TranscriptionFile;

namespace {

Sexagesimal S(const char* text) { return Sexagesimal::ParseOrThrow(text); }

const char* const kHeader =
    "@work harbour title=\"The Harbour Tables\" author=anonymous\n"
    "@witness K library=\"Nordhafen, Town Library\" shelfmark=\"Cod. 112\" date=\"c. 1420\" "
    "script=hindu-arabic note=\"a \\\"fine\\\" copy \\\\ 2\"\n";

TranscriptionFile Parse(const std::string& text) {
  try {
    return ParseTranscription(text, "t.apo");
  } catch (const apograph::InputError& e) {
    FAIL(e.Render());
    throw;
  }
}

}  // namespace

TEST_CASE("metadata of work, witness and table is copied into the transcription") {
  const auto file = Parse(std::string(kHeader) +
                          "@table sun-eq title=\"Equation of the sun\" kind=\"solar equation\" "
                          "folios=12r-13v hand=\"main hand\"\n"
                          "@argument anomaly unit=deg places=0 start=1 step=1\n"
                          "@column equation unit=deg places=2 title=\"the equation\"\n"
                          "@rows\n1 | 0;2,5\n");
  REQUIRE(file.tables.size() == 1);
  const auto& t = file.tables[0];
  CHECK(t.work.id == "harbour");
  CHECK(t.work.title == "The Harbour Tables");
  CHECK(t.work.author == "anonymous");
  CHECK(t.witness.siglum == "K");
  CHECK(t.witness.library == "Nordhafen, Town Library");
  CHECK(t.witness.shelfmark == "Cod. 112");
  CHECK(t.witness.date == "c. 1420");
  CHECK(t.witness.script == "hindu-arabic");
  CHECK(t.witness.note == "a \"fine\" copy \\ 2");
  CHECK(t.table_id == "sun-eq");
  CHECK(t.table_title == "Equation of the sun");
  CHECK(t.kind == "solar equation");
  CHECK(t.folios == "12r-13v");
  CHECK(t.hand == "main hand");
  CHECK(t.argument.name == "anomaly");
  CHECK(t.argument.unit == "deg");
  CHECK(t.argument.places == 0);
  CHECK(t.argument.start->Identical(S("1")));
  CHECK(t.argument.step->Identical(S("1")));
  REQUIRE(t.columns.size() == 1);
  CHECK(t.columns[0].name == "equation");
  CHECK(t.columns[0].title == "the equation");
  CHECK(t.columns[0].places == 2);
  CHECK(!t.argument2);
  CHECK(file.warnings.empty());
}

TEST_CASE("readings: trade notation, blank-separated places, degree form, states") {
  const auto file = Parse(std::string(kHeader) +
                          "@table t\n@argument a places=0\n@column c places=2\n@rows\n"
                          "1 | 0;4,10\n"
                          "2 |   0  4 10   \n"
                          "3 | 0°4'10\"\n"
                          "4 | -0;5,0\n"
                          "5 | 1,30;0,1\n"
                          "6 | 1 30 0 1\n"
                          "7 | 0;?,10\n"
                          "8 | 0 ? 10\n"
                          "9 | ?\n"
                          "10 | _\n"
                          "11 | \xE2\x88\x92"
                          "0;5,0\n");
  const auto& rows = file.tables.at(0).rows;
  REQUIRE(rows.size() == 11);
  auto cell = [&](int i) { return rows.at(static_cast<std::size_t>(i)).cells.at(0); };
  CHECK(cell(0).raw == "0;4,10");
  CHECK(cell(0).value->Identical(S("0;4,10")));
  CHECK(cell(1).raw == "0  4 10");  // as typed, trimmed
  CHECK(cell(1).value->Identical(S("0;4,10")));
  CHECK(cell(2).value->Identical(S("0;4,10")));
  CHECK(cell(3).value->Identical(S("-0;5,0")));
  CHECK(cell(4).value->Identical(S("90;0,1")));
  CHECK(cell(5).value->Identical(S("90;0,1")));
  CHECK(cell(6).state == CellState::kPartial);
  CHECK(!cell(6).value);
  CHECK(cell(6).raw == "0;?,10");
  CHECK(cell(7).state == CellState::kPartial);
  CHECK(cell(8).state == CellState::kIllegible);
  CHECK(cell(9).state == CellState::kBlank);
  CHECK(cell(10).value->Identical(S("-0;5,0")));
  for (int i = 0; i < 11; ++i) CHECK(cell(i).places == 2);
  CHECK(rows[0].argument.value->Identical(S("1")));
}

TEST_CASE("every editorial mark is recorded on its cell") {
  const auto file = Parse(std::string(kHeader) +
                          "@table t\n@argument a\n@column c places=2\n@rows\n"
                          "1 | 0;1,0 {damaged}\n"
                          "2 | 0;2,0 {doubt}\n"
                          "3 | 0;3,0 {margin}\n"
                          "4 | 0;4,0 {interlinear}\n"
                          "5 | 0;5,0 { was 0;5,9 }\n"
                          "6 | 0;6,0 {note \"ink | faded # here\"}\n"
                          "7 {was 8} | ? {damaged}{doubt} {note \"x\"} {was 0;7,?} {margin}\n");
  const auto& rows = file.tables.at(0).rows;
  REQUIRE(rows.size() == 7);
  CHECK(rows[0].cells[0].damaged);
  CHECK(!rows[0].cells[0].doubtful);
  CHECK(rows[1].cells[0].doubtful);
  CHECK(rows[2].cells[0].addition == Addition::kMargin);
  CHECK(rows[3].cells[0].addition == Addition::kInterlinear);
  CHECK(rows[4].cells[0].corrected_from == "0;5,9");
  CHECK(rows[4].cells[0].value->Identical(S("0;5,0")));
  CHECK(rows[5].cells[0].note == "ink | faded # here");
  const auto& last = rows[6].cells[0];
  CHECK(last.state == CellState::kIllegible);
  CHECK(last.damaged);
  CHECK(last.doubtful);
  CHECK(last.note == "x");
  CHECK(last.corrected_from == "0;7,?");
  CHECK(last.addition == Addition::kMargin);
  CHECK(rows[6].argument.corrected_from == "8");
  CHECK(rows[6].argument.value->Identical(S("7")));
}

TEST_CASE("a grid table keeps its column argument and arg2 values") {
  const auto file = Parse(std::string(kHeader) +
                          "@table grid\n@argument lon places=0 start=0 step=30\n"
                          "@argument2 lat unit=deg places=0\n"
                          "@column l30 places=1 arg2=30\n@column l40 places=1 arg2=40\n@rows\n"
                          "0 | 12;0 | 12;0\n30 | 12;56 | 13;20\n");
  const auto& t = file.tables.at(0);
  REQUIRE(t.argument2);
  CHECK(t.argument2->name == "lat");
  CHECK(t.argument2->unit == "deg");
  CHECK(t.columns.at(0).arg2->Identical(S("30")));
  CHECK(t.columns.at(1).arg2->Identical(S("40")));
  CHECK(t.rows.at(1).cells.at(1).value->Identical(S("13;20")));
  CHECK(t.CellCount() == 4);
}

TEST_CASE("several tables and witnesses in one file, with their own source text") {
  const std::string text =
      std::string(kHeader) +
      "# first\n@table a\n@argument x\n@column c\n@rows\n1 | 2\n# inside\n2 | 3\n"
      "# belongs to no table\n"
      "@witness L\n@table a\n@argument x\n@column c\n@rows\n1 | 2\n";
  const auto file = Parse(text);
  REQUIRE(file.tables.size() == 2);
  CHECK(file.tables[0].witness.siglum == "K");
  CHECK(file.tables[1].witness.siglum == "L");
  CHECK(file.tables[1].witness.library.empty());  // a new @witness starts afresh
  CHECK(file.tables[1].work.id == "harbour");     // the work carries over
  CHECK(file.tables[0].source_text ==
        "@table a\n@argument x\n@column c\n@rows\n1 | 2\n# inside\n2 | 3");
  CHECK(file.tables[1].source_text == "@table a\n@argument x\n@column c\n@rows\n1 | 2");
}

TEST_CASE("provenance: lines and columns are 1-based, columns count characters") {
  const auto file = Parse(std::string(kHeader) +
                          "@table t title=\"\xC3\xA9t\xC3\xA9\"\n@argument a\n@column c places=1\n"
                          "@column d places=1\n@rows\n"
                          "  1 | 2\xC2\xB0"
                          "30' | 0;5 # \xC3\xA9\n");
  const auto& row = file.tables.at(0).rows.at(0);
  CHECK(row.line == 8);
  CHECK(row.argument.line == 8);
  CHECK(row.argument.column == 3);
  CHECK(row.cells[0].column == 7);
  CHECK(row.cells[1].column == 15);  // the degree sign is one character
  CHECK(row.cells[1].line == 8);
}

TEST_CASE("CR LF line ends and a byte order mark are accepted") {
  const auto file = Parse(
      "\xEF\xBB\xBF@work w\r\n@witness K\r\n@table t\r\n@argument a\r\n"
      "@column c\r\n@rows\r\n1 | 2\r\n");
  CHECK(file.tables.at(0).rows.at(0).cells.at(0).raw == "2");
  CHECK(file.tables.at(0).work.id == "w");
}

TEST_CASE("arguments that repeat or break the declared step are warnings, rows kept") {
  const auto file = Parse(std::string(kHeader) +
                          "@table t\n@argument a start=1 step=1\n@column c\n@rows\n"
                          "1 | 5\n3 | 6\n3 | 7\n? | 8\n");
  CHECK(file.tables.at(0).rows.size() == 4);
  REQUIRE(file.warnings.size() == 3);
  CHECK(file.warnings[0].Render() ==
        "t.apo:8:1: warning: expected argument 2, found '3' (a row seems to be missing)\n"
        "3 | 6\n"
        "^");
  CHECK(file.warnings[1].Render() ==
        "t.apo:9:1: warning: expected each argument once, found '3' again (first in line 8)\n"
        "3 | 7\n"
        "^");
  CHECK(file.warnings[2].Render() ==
        "t.apo:9:1: warning: expected argument 4 (it breaks the sequence of its neighbours), "
        "found '3'; the row is taken as argument 4\n"
        "3 | 7\n"
        "^");
}

TEST_CASE("values at the limits of exact numbers are errors or skipped checks, never crashes") {
  const std::string layout = std::string(kHeader) +
                             "@table t\n@argument a start=999999999999 step=999999999999\n"
                             "@column c\n@rows\n";
  const auto file = Parse(layout + "1 | 2\n2 | 3\n3 | 4\n");  // start + 2 * step overflows
  CHECK(file.tables.at(0).rows.size() == 3);
  try {
    ParseTranscription(layout + "1 | 1000000000000\n", "t.apo");
    FAIL("no error");
  } catch (const apograph::InputError& e) {
    CHECK(e.diagnostics().front().message ==
          "expected an integer part below 10^12, found '1000000000000'");
  }
}
