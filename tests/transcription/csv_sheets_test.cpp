// Real sheets: decimal and mixed arguments, ';' delimiters, degrees, minutes
// and seconds in separate columns, attributes the sheet cannot hold, names
// checked, limits. Messages are checked word for word.
#include <doctest/doctest.h>

#include "transcription/csv.hpp"
#include "transcription/parser.hpp"
#include "transcription/writer.hpp"

using apograph::CellState;
using apograph::CsvOptions;
using apograph::ReadCsv;
using apograph::Sexagesimal;

namespace {

Sexagesimal S(const std::string& t) { return Sexagesimal::ParseOrThrow(t); }

CsvOptions Options() {
  CsvOptions o;
  o.head.table_id = "decl";
  o.head.witness.siglum = "K";
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

TEST_CASE("decimal and mixed arguments are normalised; the written form stays as evidence") {
  const auto file =
      ReadCsv("arg,value\n0.5,\"0;1\"\n1,\"0;2\"\n1;30,\"0;3\"\n88.5,\"0;4\"\n2.25,\"0;5\"\n",
              "k.csv", Options());
  const auto& t = file.tables.at(0);
  CHECK(t.argument.places == 1);  // 0.5 = 0;30 and 2.25 = 2;15 need one place each
  REQUIRE(t.rows.size() == 5);
  CHECK(t.rows[0].argument.value->Identical(S("0;30")));
  CHECK(t.rows[0].argument.raw == "0.5");
  CHECK(t.rows[1].argument.value->Identical(S("1;0")));
  CHECK(t.rows[1].argument.raw == "1");
  CHECK(t.rows[2].argument.value->Identical(S("1;30")));
  CHECK(t.rows[3].argument.value->Identical(S("88;30")));
  CHECK(t.rows[3].argument.raw == "88.5");
  CHECK(t.rows[4].argument.value->Identical(S("2;15")));
  for (const auto& row : t.rows) CHECK(row.argument.places == 1);
  // Written out as a transcription, the decimal argument reads back the same.
  const auto again = apograph::ParseTranscription(apograph::WriteTranscription(t), "k.apo");
  CHECK(again.tables.at(0).SameContent(t));
}

TEST_CASE("a decimal argument that needs more places than the argument has is refused") {
  auto o = Options();
  o.column_places["arg"] = 1;
  CHECK(ErrorOf("arg,value\n0.125,1\n", o) ==  // 0.125 = 0;7,30
        "k.csv:2:1: error: expected a reading with 1 fractional place in the argument 'arg', "
        "found '0.125' (2 fractional places)\n"
        "0.125,1\n"
        "^");
  CHECK(ErrorOf("arg,value\n0.5.1,1\n") ==
        "k.csv:2:4: error: expected a digit of a decimal argument such as 88.5, found '.'\n"
        "0.5.1,1\n"
        "   ^");
}

TEST_CASE("';' sheets: the delimiter is read off the header or given") {
  const std::string sheet = "arg;value;count\n1;\"0;4,10\";0,5\n2;\"0;4,11\";1,0\n";
  const auto file = ReadCsv(sheet, "k.csv", Options());
  const auto& t = file.tables.at(0);
  REQUIRE(t.rows.size() == 2);
  CHECK(t.rows[0].cells[0].value->Identical(S("0;4,10")));
  CHECK(t.rows[0].cells[1].value->Identical(S("5")));   // 0,5 is sexagesimal: 0*60 + 5
  CHECK(t.rows[1].cells[1].value->Identical(S("60")));  // 1,0
  auto o = Options();
  o.delimiter = ',';
  CHECK(ErrorOf(sheet, o) ==
        "k.csv:1:16: error: expected a header naming the argument and at least one column, found "
        "1 field\n"
        "arg;value;count\n"
        "               ^");
  o.delimiter = '\t';
  CHECK(ReadCsv("arg\tvalue\n1\t0;4,10\n", "k.csv", o).tables.at(0).rows.at(0).cells.at(0).value ==
        S("0;4,10"));
}

TEST_CASE("degrees, minutes and seconds in three columns: joined on request, refused otherwise") {
  const std::string sheet =
      "arg,decl_d,decl_m,decl_s,note\n1,0,23,54,1\n2,0,47,48,2\n3,1,11,?,3\n4,,,,4\n";
  CHECK(ErrorOf(sheet) ==
        "k.csv:1:5: error: expected one column per value, found columns 'decl_d', 'decl_m', "
        "'decl_s' that read as the degrees, minutes and seconds of one value; join them with "
        "--join 'decl=decl_d+decl_m+decl_s' or keep them apart with --keep-columns\n"
        "arg,decl_d,decl_m,decl_s,note\n"
        "    ^");
  auto o = Options();
  o.joins.push_back(apograph::ParseColumnJoin("decl=decl_d+decl_m+decl_s", "--join"));
  const auto file = ReadCsv(sheet, "k.csv", o);
  const auto& t = file.tables.at(0);
  REQUIRE(t.columns.size() == 2);
  CHECK(t.columns[0].name == "decl");
  CHECK(t.columns[0].places == 2);
  CHECK(t.columns[1].name == "note");
  CHECK(t.rows[0].cells[0].value->Identical(S("0;23,54")));
  CHECK(t.rows[0].cells[0].raw == "0 23 54");
  CHECK(t.rows[0].cells[0].column == 3);
  CHECK(t.rows[2].cells[0].state == CellState::kPartial);
  CHECK(t.rows[3].cells[0].state == CellState::kBlank);
  CHECK(t.rows[1].cells[1].value == S("2"));
  // The joined form writes out and reads back as the same transcription.
  const auto again = apograph::ParseTranscription(apograph::WriteTranscription(t), "k.apo");
  CHECK(again.tables.at(0).SameContent(t));
  o = Options();
  o.keep_columns = true;
  CHECK(ReadCsv(sheet, "k.csv", o).tables.at(0).columns.size() == 4);
  // Columns named like parts but holding other numbers are not parts.
  CHECK(ErrorOf("arg,d,m\n1,\"0;5\",70\n") == "(no error)");
  o = Options();
  o.joins.push_back(apograph::ParseColumnJoin("decl=decl_d+decl_m+decl_s", "--join"));
  CHECK(ErrorOf("arg,decl_d,decl_m,decl_s\n1,0,,54\n", o) ==
        "k.csv:2:5: error: expected a whole number or '?' in every part of the joined column "
        "'decl' (or all parts empty for a blank), found an empty part\n"
        "1,0,,54\n"
        "    ^");
  CHECK(ErrorOf("arg,decl_d,decl_m,decl_s\n1,0,23;5,54\n", o) ==
        "k.csv:2:5: error: expected a whole number or '?' in 'decl_m', one place of the joined "
        "column 'decl', found '23;5'\n"
        "1,0,23;5,54\n"
        "    ^");
  CHECK_THROWS_WITH_AS(apograph::ParseColumnJoin("decl=d", "--join"),
                       "--join: error: expected NAME=A+B[+C] (the columns of one value, integer "
                       "part first), found 'decl=d'",
                       apograph::InputError);
}

TEST_CASE("attributes the sheet cannot hold come with the options; names are checked") {
  auto o = Options();
  o.head.work = {"lantern", "The Lantern Tables", ""};
  o.head.witness.library = "Marrow Hall";
  o.head.witness.date = "c. 1420";
  o.head.witness.kind = "print";
  o.head.witness.script = "hindu-arabic";
  o.head.table_title = "Declination";
  o.head.kind = "declination";
  o.head.folios = "3r-4v";
  o.head.argument.step = S("1");
  o.head.argument.start = S("1");
  const auto file = ReadCsv("arg,decl\n1,\"0;24\"\n", "k.csv", o);
  const auto& t = file.tables.at(0);
  CHECK(t.work.title == "The Lantern Tables");
  CHECK(t.witness.library == "Marrow Hall");
  CHECK(t.witness.Dates().has_value());
  CHECK(t.witness.Kind() == apograph::WitnessKind::kPrint);
  CHECK(t.table_title == "Declination");
  CHECK(t.folios == "3r-4v");
  CHECK(t.argument.step == S("1"));

  o = Options();
  o.head.witness.script = "greek";
  o.read.scripts = std::vector<std::string>{"greek-alphabetic", "hindu-arabic"};
  CHECK(ErrorOf("arg,decl\n1,2\n", o) ==
        "--script: error: expected a numeral script (greek-alphabetic, hindu-arabic), found "
        "'greek'");
  o = Options();
  o.head.table_id = "../../etc/x";
  CHECK(ErrorOf("arg,decl\n1,2\n", o) ==
        "--table: error: expected a table id of letters, digits, '-', '_' or '.' (starting with a "
        "letter or digit, no '..', at most 64 characters), found '../../etc/x'");
  o = Options();
  o.head.witness.kind = "codex";
  CHECK(ErrorOf("arg,decl\n1,2\n", o) ==
        "--kind: error: expected manuscript, print or modern-edition, found 'codex'");
}

TEST_CASE("an empty sheet and a sheet of empty lines are errors at 1:1") {
  CHECK(ErrorOf("") == "k.csv:1:1: error: expected a CSV sheet, found an empty file");
  CHECK(ErrorOf("\n\n") == "k.csv:1:1: error: expected a header row, found only empty lines");
  CHECK(ErrorOf("a,b\n\n") ==
        "k.csv:1:1: error: expected at least one row after the header, found none\n"
        "a,b\n"
        "^");
}

TEST_CASE("a line beyond the limit is refused and echoed cut short") {
  auto o = Options();
  o.read.max_line_bytes = 100;
  const std::string sheet = "arg,v\n1," + std::string(200, '7') + "\n";
  const std::string error = ErrorOf(sheet, o);
  CHECK(error.rfind(
            "k.csv:2:1: error: expected a line of at most 100 bytes, found one of 202 (raise the "
            "limit with --max-line-kb)\n",
            0) == 0);
  CHECK(error.size() < 400);
}

TEST_CASE("a delimiter at the very end of a sheet opens one last empty field") {
  const auto file = ReadCsv("a,e\n1,", "k.csv", Options());
  const auto& t = file.tables.at(0);
  REQUIRE(t.rows.size() == 1);
  CHECK(t.rows[0].cells.at(0).state == CellState::kBlank);
}

TEST_CASE("a whole 0 dropped before the places reads 0; the sheet's form stays as evidence") {
  auto o = Options();
  o.column_places["arg"] = 0;
  const auto file = ReadCsv(
      "arg,value\n1,\";4,10\"\n2,\"-;9,0\"\n3;0,\"0;1,2\"\n\"4;0,0\",\";1,2\"\n", "k.csv", o);
  const auto& t = file.tables.at(0);
  REQUIRE(t.rows.size() == 4);
  CHECK(t.rows[0].cells[0].value->Identical(S("0;4,10")));
  CHECK(t.rows[0].cells[0].raw == ";4,10");
  CHECK(t.rows[1].cells[0].value->Identical(S("-0;9,0")));
  // An argument written with zero places beyond those declared is the same argument.
  CHECK(t.rows[2].argument.value->Identical(S("3")));
  CHECK(t.rows[2].argument.raw == "3;0");
  CHECK(t.rows[3].argument.value->Identical(S("4")));
  // A place that is not zero is still refused, and so is a ';' with nothing after it.
  CHECK(ErrorOf("arg,value\n3;30,1\n", o)
            .rfind("k.csv:2:1: error: expected a reading with 0 fractional places in the argument",
                   0) == 0);
  CHECK(ErrorOf("arg,value\n1,\";\"\n")
            .rfind("k.csv:2:5: error: expected a place (digits or '?'), found end of cell", 0) ==
        0);
}

TEST_CASE("joined place columns: an empty or lone-sign degree field beside places reads 0") {
  auto o = Options();
  o.joins.push_back({"v", {"v_deg", "v_min", "v_sec"}});
  o.column_places["v"] = 2;
  const auto file = ReadCsv("arg,v_deg,v_min,v_sec\n1,,4,10\n2,-,9,0\n3,,,\n", "k.csv", o);
  const auto& t = file.tables.at(0);
  REQUIRE(t.rows.size() == 3);
  CHECK(t.rows[0].cells[0].value->Identical(S("0;4,10")));
  CHECK(t.rows[1].cells[0].value->Identical(S("-0;9,0")));
  CHECK(t.rows[2].cells[0].state == CellState::kBlank);
  // A place left empty after the degree is still an error.
  CHECK(ErrorOf("arg,v_deg,v_min,v_sec\n1,3,,10\n", o)
            .rfind("k.csv:2:5: error: expected a whole number or '?' in every part", 0) == 0);
}

TEST_CASE("an illegible argument beside a declared argument place is an input error or a row") {
  // Found by the CSV fuzz target: a sheet whose argument cell reads '?'
  // overflowed while its places were compared with the declared ones.
  const std::string sheet = std::string("\0arg,decl_d,d\n,03,\n?,\"0;?,15\",", 30);
  int outcomes = 0;
  for (int places : {0, 1, 2}) {
    auto o = Options();
    o.column_places["arg"] = places;
    try {
      ReadCsv(sheet, "k.csv", o);
      ++outcomes;
    } catch (const apograph::InputError&) {
      ++outcomes;  // refused with a position: fine; any other exception fails the test
    }
  }
  CHECK(outcomes == 3);
}
