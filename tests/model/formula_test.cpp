// The formula language: the grammar's examples, evaluation against the
// built-in models, derived columns checked against their own table, and
// positioned parse errors, word for word.
#include <cmath>
#include <filesystem>
#include <fstream>
#include <sstream>

#include <doctest/doctest.h>

#include "../test_support.hpp"
#include "model/check.hpp"
#include "model/formula.hpp"
#include "model_test_support.hpp"
#include "support/input_error.hpp"
#include "test_paths.hpp"

namespace apograph::model {
namespace {

using testing::D;
using testing::MakeTable;
using testing::S;

double At(const Model& m, double arg, std::vector<double> params = {}) {
  if (params.empty()) params = m.Defaults();
  RowContext row;
  row.arg = arg;
  return m.Evaluate(params, row);
}

std::string ErrorOf(const std::string& text) {
  try {
    CompileFormula(text);
  } catch (const InputError& e) {
    return e.Render();
  }
  return "no error";
}

TEST_CASE("every example in grammar/examples parses") {
  int n = 0;
  for (const auto& entry : std::filesystem::directory_iterator(std::string(APOGRAPH_SOURCE_DIR) +
                                                               "/grammar/examples")) {
    if (entry.path().extension() != ".formula") continue;
    CAPTURE(entry.path().filename().string());
    std::ifstream in(entry.path());
    std::stringstream text;
    text << in.rdbuf();
    CHECK_NOTHROW(
        CompileFormula(text.str(), entry.path().stem().string(), entry.path().filename().string()));
    ++n;
  }
  CHECK(n >= 5);
}

TEST_CASE("a formula stands in for a built-in model") {
  auto f = CompileFormula(
      "param e = 2;4,48 range 1 .. 4 \"eccentricity\"\n"
      "abs(atan2(e * sin(arg), 60 + e * cos(arg)))",
      "my-sun");
  REQUIRE(f->params().size() == 1);
  CHECK(f->params()[0].name == "e");
  CHECK(f->params()[0].default_value == D("2;4,48"));
  CHECK(f->params()[0].low == 1);
  CHECK(f->params()[0].high == 4);
  CHECK(f->params()[0].description == "eccentricity");
  CHECK(f->name() == "my-sun");
  const Model& builtin = *FindBuiltinModel("solar-eccentric");
  for (double a = 0; a <= 360; a += 2.5) {
    CHECK(At(*f, a) == doctest::Approx(At(builtin, a, {D("2;4,48")})).epsilon(1e-15));
    CHECK(At(*f, a, {3}) == doctest::Approx(At(builtin, a, {3})).epsilon(1e-15));
  }
}

TEST_CASE("arithmetic, precedence and the functions") {
  auto v = [](const std::string& text, double arg = 0) { return At(*CompileFormula(text), arg); };
  CHECK(v("1 + 2 * 3") == 7);
  CHECK(v("(1 + 2) * 3") == 9);
  CHECK(v("2 ^ 3 ^ 2") == 512);  // right-associative
  CHECK(v("-2 ^ 2") == -4);
  CHECK(v("10 - 4 - 3") == 3);
  CHECK(v("12 / 4 / 3") == 1);
  CHECK(v("0;30") == 0.5);
  CHECK(v("1;0,36") == doctest::Approx(1.01));
  CHECK(v("2.25") == 2.25);
  CHECK(v("sin(30)") == doctest::Approx(0.5));
  CHECK(v("cos(60)") == doctest::Approx(0.5));
  CHECK(v("tan(45)") == doctest::Approx(1));
  CHECK(std::isnan(v("tan(90)")));
  CHECK(v("asin(0.5)") == doctest::Approx(30));
  CHECK(v("acos(0.5)") == doctest::Approx(60));
  CHECK(v("atan(1)") == doctest::Approx(45));
  CHECK(v("atan2(1, -1)") == doctest::Approx(135));
  CHECK(v("sqrt(16)") == 4);
  CHECK(v("abs(-3)") == 3);
  CHECK(v("floor(-2.5)") == -3);
  CHECK(v("mod(-30, 360)") == 330);
  CHECK(v("min(3, 1, 2)") == 1);
  CHECK(v("max(3, 1;30, 2)") == 3);
  CHECK(v("crd(60)") == doctest::Approx(60));
  CHECK(v("crd(60, 30)") == doctest::Approx(30));
  CHECK(v("round(0;31,25,30, 2)") == doctest::Approx(D("0;31,26")));
  CHECK(v("trunc(0;31,25,30, 2)") == doctest::Approx(D("0;31,25")));
  CHECK(v("arg * 2", 7) == 14);
  CHECK(std::isnan(v("1 / 0")));
  CHECK(v("# a comment\n  1 # another\n + 1") == 2);
  CHECK(v("param k = 2; param m = -1;3 k * m") == doctest::Approx(-2.1));
}

// Source: T. L. Heath, *A History of Greek Mathematics*, vol. 2 (Oxford, 1921),
// chapter on trigonometry, worked values of the ancient chord table.
TEST_CASE("the interpolation column of the chord table from the next row (Heath 1921)") {
  // For the step from 2 to 2;30 the tabulated difference 0;31,24 gives 0;1,2,48.
  Transcription t = MakeTable({"chord", "sixtieths"}, 2,
                              {{"2", "2;5,40", "0;1,2,48"}, {"2;30", "2;37,4", "?"}}, 1);
  t.columns[1].places = 3;
  t.rows[0].cells[1].places = 3;
  auto f = CompileFormula("(col(chord, +1) - col(chord)) / 30");
  CHECK(f->columns() == std::vector<std::string>{"chord"});
  CheckReport r = Check(t, *f, {}, Practice{}, 0.0, 1);
  CHECK(*r.entries[0].computed == S("0;1,2,48"));
  CHECK(*r.entries[0].diff_units == 0);
  CHECK(r.summary.exact == 1);
  CHECK(r.entries[1].skipped == "illegible");
  CHECK(S("2;37,4") - S("2;5,40") == S("0;31,24"));
  CHECK(S("0;31,24").Divided(30, 3) == S("0;1,2,48"));
}

TEST_CASE("a derived column checked against its own table flags exactly the miscopied entry") {
  // A chord table from 0;30 to 20 by 0;30, rounded to seconds, with its
  // sixtieths column computed from the rounded chords (to thirds). One
  // sixtieth is miscopied (a digit changed): the check must flag it alone.
  std::vector<std::vector<std::string>> rows;
  std::vector<Sexagesimal> chords;
  for (int k = 1; k <= 41; ++k)
    chords.push_back(Sexagesimal::FromDouble(120 * std::sin(k * 0.25 * std::numbers::pi / 180), 2));
  for (int k = 1; k <= 40; ++k) {
    const Sexagesimal arc = Sexagesimal::FromUnits(30 * k, 1);
    const Sexagesimal sixtieth = (chords[k] - chords[k - 1]).Divided(30, 3);
    rows.push_back({arc.ToString(), chords[k - 1].ToString(), sixtieth.ToString()});
  }
  rows[16][2] = "0;1,7,48";  // was something else
  Transcription t = MakeTable({"chord", "sixtieths"}, 2, rows, 1);
  t.columns[1].places = 3;
  auto f = CompileFormula("(col(chord, +1) - col(chord)) / 30");
  CheckReport r = Check(t, *f, {}, Practice{}, 1.0, 1);
  std::vector<std::size_t> flagged;
  for (const auto& e : r.entries) {
    if (e.flag) flagged.push_back(e.row);
  }
  CHECK(flagged == std::vector<std::size_t>{16});
  CHECK(r.summary.exact == 38);  // the last row has no next row
  CHECK(r.summary.undefined == 1);
  // The chords themselves against the chord formula and the built-in model.
  CheckReport chords_check = Check(t, *CompileFormula("crd(arg)"), {}, Practice{}, 0.0, 0);
  CHECK(chords_check.summary.exact == 40);
}

TEST_CASE("self() and arg() reach neighbouring rows") {
  Transcription t =
      MakeTable({"sine", "diff"}, 2, {{"30", "30", "0"}, {"31", "0", "0"}, {"32", "0", "0"}});
  auto f = CompileFormula("self(1) - self(0) + 0 * arg(1)");
  RowContext row{30, std::nullopt, &t, 0, 1};
  auto g = CompileFormula("60 * sin(arg(1)) - 60 * sin(arg)");
  CHECK(g->Evaluate({}, row) ==
        doctest::Approx(60 * (std::sin(31 * std::numbers::pi / 180) - 0.5)));
  row.row = 2;
  row.arg = 32;
  CHECK(std::isnan(g->Evaluate({}, row)));  // no next row
  auto h = CompileFormula("arg + self(1)");
  row.row = 0;
  row.arg = 30;
  CHECK(std::isnan(h->Evaluate({}, row)));  // self inside self has no value
  (void)f;
}

TEST_CASE("mistyped formulas: positioned errors, word for word") {
  CHECK(ErrorOf("1 +") ==
        "formula:1:4: error: expected an expression, found end of formula\n1 +\n   ^");
  CHECK(ErrorOf("sin(30") ==
        "formula:1:7: error: expected an operator or ')', found end of formula\nsin(30\n      ^");
  CHECK(ErrorOf("param e = 2\natan2(e * sin(arg), 60 + e cos(arg))") ==
        "formula:2:28: error: expected an operator or ')', found 'cos'\n"
        "atan2(e * sin(arg), 60 + e cos(arg))\n"
        "                           ^");
  CHECK(ErrorOf("x + 1") ==
        "formula:1:1: error: expected a declared parameter, arg, arg2 or a function, found 'x'\n"
        "x + 1\n^");
  CHECK(ErrorOf("atan2(1)") ==
        "formula:1:1: error: expected 2 arguments to atan2, found 1\natan2(1)\n^");
  CHECK(ErrorOf("atan2(1;30,45)") ==
        "formula:1:1: error: expected 2 arguments to atan2, found 1 (1;30,45 is one number; put a "
        "blank after a comma that separates arguments)\natan2(1;30,45)\n^");
  CHECK(CompileFormula("atan2(1;30, 45)")->Evaluate({}, RowContext{}) ==
        doctest::Approx(std::atan2(1.5, 45) * 180 / std::numbers::pi));
  CHECK(ErrorOf("2;60 * arg") ==
        "formula:1:3: error: expected a place from 0 to 59, found '60'\n2;60 * arg\n  ^");
  CHECK(ErrorOf("1 2") ==
        "formula:1:3: error: expected an operator or end of formula, found '2'\n1 2\n  ^");
  CHECK(ErrorOf("param = 3\n1") ==
        "formula:1:7: error: expected a parameter name, found '='\nparam = 3\n      ^");
  CHECK(ErrorOf("frob(1)").rfind("formula:1:1: error: expected a function (sin, cos,", 0) == 0);
  CHECK(ErrorOf("col(chord, x)") ==
        "formula:1:12: error: expected a row offset such as +1 or -1, found 'x'\ncol(chord, x)\n   "
        "        ^");
  CHECK(ErrorOf("sin") ==
        "formula:1:4: error: expected '(' after sin, found end of formula\nsin\n   ^");
  CHECK(ErrorOf("param e = 2 param e = 3 e") ==
        "formula:1:19: error: expected a new parameter name, found 'e' again\nparam e = 2 param e "
        "= 3 e\n                  ^");
  CHECK(ErrorOf("") == "formula:1:1: error: expected an expression, found end of formula");
  CHECK(ErrorOf("arg(0.5)") ==
        "formula:1:5: error: expected a whole-number row offset such as 1 or -1, found "
        "'0.5'\narg(0.5)\n    ^");
}

}  // namespace
}  // namespace apograph::model
