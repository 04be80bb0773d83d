// Spreadsheet import and export.
#include "transcription/csv.hpp"

#include <doctest/doctest.h>

#include "transcription/parser.hpp"
#include "transcription/writer.hpp"

using apograph::CellState;
using apograph::CsvOptions;
using apograph::ReadCsv;
using apograph::Sexagesimal;

namespace {

CsvOptions Options() {
  CsvOptions o;
  o.head.table_id = "sun-eq";
  o.head.witness.siglum = "K";
  o.head.witness.script = "hindu-arabic";
  return o;
}

std::string ErrorOf(const std::string& text, const CsvOptions& options = Options()) {
  try {
    ReadCsv(text, "k.csv", options);
  } catch (const apograph::InputError& e) {
    return e.diagnostics().front().Render();
  }
  return "(no error)";
}

}  // namespace

TEST_CASE("a CSV sheet becomes one transcription; places come from the cells") {
  const auto file = ReadCsv(
      "anomaly,equation,diff\r\n"
      "1,\"0;2,5\",\"0;2,5\"\r\n"
      "2,,?\r\n"
      "\r\n"
      "3,\"0;?,15\", \"0;2,5\" \r\n",
      "k.csv", Options());
  REQUIRE(file.tables.size() == 1);
  const auto& t = file.tables[0];
  CHECK(t.table_id == "sun-eq");
  CHECK(t.work.id == "sun-eq");  // no work named: the table id stands for it
  CHECK(t.witness.siglum == "K");
  CHECK(t.witness.script == "hindu-arabic");
  CHECK(t.argument.name == "anomaly");
  CHECK(t.argument.places == 0);
  REQUIRE(t.columns.size() == 2);
  CHECK(t.columns[0].name == "equation");
  CHECK(t.columns[0].places == 2);
  CHECK(t.columns[1].places == 2);
  REQUIRE(t.rows.size() == 3);
  CHECK(t.rows[0].cells[0].value->Identical(Sexagesimal::ParseOrThrow("0;2,5")));
  CHECK(t.rows[1].cells[0].state == CellState::kBlank);
  CHECK(t.rows[1].cells[0].raw == "_");
  CHECK(t.rows[1].cells[1].state == CellState::kIllegible);
  CHECK(t.rows[2].cells[0].state == CellState::kPartial);
  CHECK(t.rows[2].cells[1].raw == "0;2,5");
  CHECK(t.rows[2].line == 5);
  CHECK(t.rows[2].cells[1].line == 5);
  CHECK(t.rows[2].cells[1].column == 14);
}

TEST_CASE("CSV options: work id, places by option allow blank-separated places") {
  auto options = Options();
  options.head.work.id = "harbour";
  options.places = 2;
  options.column_places["n"] = 1;
  const auto file = ReadCsv("n,e\n0;30,0 4 10\n", "k.csv", options);
  const auto& t = file.tables.at(0);
  CHECK(t.work.id == "harbour");
  CHECK(t.argument.places == 1);
  CHECK(t.rows.at(0).cells.at(0).value->Identical(Sexagesimal::ParseOrThrow("0;4,10")));
}

TEST_CASE("CSV errors are positioned") {
  CHECK(ErrorOf("a,e\n1,\"0;4,10\"\n2,\"0;4\"\n") ==
        "k.csv:3:4: error: expected 2 fractional places like the first reading of column 'e' (line "
        "2), "
        "found '0;4' (1 fractional place)\n"
        "2,\"0;4\"\n"
        "   ^");
  CHECK(ErrorOf("a,e\n1,\"0;60\"\n") ==
        "k.csv:2:6: error: expected a place from 0 to 59, found '60'\n"
        "1,\"0;60\"\n"
        "     ^");
  CHECK(ErrorOf("a,e\n1,2,3\n") ==
        "k.csv:2:5: error: expected 2 fields (the argument and one per column), found 3\n"
        "1,2,3\n"
        "    ^");
  CHECK(ErrorOf("a,e\n1\n") ==
        "k.csv:2:2: error: expected 2 fields (the argument and one per column), found 1\n"
        "1\n"
        " ^");
  CHECK(ErrorOf("a,e\n1,\"0;4\n") ==
        "k.csv:2:3: error: expected a closing '\"' for this field, found end of file\n"
        "1,\"0;4\n"
        "  ^");
  CHECK(ErrorOf("a,e\n1,0;4\"x\n") ==
        "k.csv:2:6: error: expected a field without '\"' (quote the whole field and double the "
        "quote), "
        "found '\"'\n"
        "1,0;4\"x\n"
        "     ^");
  CHECK(ErrorOf("a,e\n1,x\n") ==
        "k.csv:2:3: error: expected a reading (a number such as 0;4,10, '_' or '?'), found 'x'\n"
        "1,x\n"
        "  ^");
  CHECK(ErrorOf("a\n1\n") ==
        "k.csv:1:2: error: expected a header naming the argument and at least one column, found 1 "
        "field\n"
        "a\n"
        " ^");
  CHECK(ErrorOf("") == "k.csv:1:1: error: expected a CSV sheet, found an empty file");
  auto bad = Options();
  bad.head.table_id = "two words";
  CHECK(ErrorOf("a,e\n1,2\n", bad) ==
        "--table: error: expected a table id of letters, digits, '-', '_' or '.' (starting with a "
        "letter or digit, no '..', at most 64 characters), found 'two words'");
  bad = Options();
  bad.column_places["x"] = 2;
  CHECK(ErrorOf("a,e\n1,2\n", bad) ==
        "--places: error: expected a column of the header (a, e), found 'x'");
}

TEST_CASE("WriteCsv quotes readings with commas and reads back to the same cells") {
  const auto file = apograph::ParseTranscription(
      "@work w\n@witness K\n@table sun-eq\n@argument anomaly\n@column equation places=2\n"
      "@column diff places=2\n@rows\n1 | 0;2,5 | _\n2 | ? | 0;?,5\n",
      "k.apo");
  const std::string csv = apograph::WriteCsv(file.tables.at(0));
  CHECK(csv == "anomaly,equation,diff\n1,\"0;2,5\",\n2,?,\"0;?,5\"\n");
  const auto again = ReadCsv(csv, "k.csv", Options());
  const auto& a = file.tables[0];
  const auto& b = again.tables.at(0);
  REQUIRE(b.rows.size() == a.rows.size());
  for (std::size_t r = 0; r < a.rows.size(); ++r) {
    CHECK(b.rows[r].argument.SameContent(a.rows[r].argument));
    for (std::size_t c = 0; c < a.rows[r].cells.size(); ++c) {
      CHECK(b.rows[r].cells[c].SameContent(a.rows[r].cells[c]));
    }
  }
  // A CSV import writes out as a transcription that re-parses to it.
  const auto text = apograph::WriteTranscription(b);
  CHECK(apograph::ParseTranscription(text, "again.apo").tables.at(0).SameContent(b));
}
