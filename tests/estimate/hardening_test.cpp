// Inputs that crashed the estimate stage and the formula language, each now
// a positioned error or a clear refusal (each case failed before: a crash
// or an internal error).
#include <doctest/doctest.h>

#include <string>

#include "cli_runner.hpp"
#include "estimate/fit.hpp"
#include "model/formula.hpp"
#include "store/edition_store.hpp"
#include "store/model_store.hpp"
#include "store/store_test_util.hpp"
#include "support/input_error.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

/// The rendered message of the InputError `text` raises when compiled.
std::string CompileError(const std::string& text) {
  try {
    model::CompileFormula(text);
  } catch (const InputError& e) {
    return e.diagnostics().front().message + " @" +
           std::to_string(e.diagnostics().front().where.column);
  }
  return "compiled";
}

std::string Repeat(const std::string& s, int n) {
  std::string out;
  for (int i = 0; i < n; ++i) out += s;
  return out;
}

/// A database with table t (sine, 2 places) of witness A read in full and
/// witness B with every cell illegible or blank.
void MakeDb(const std::string& path) {
  testing::SyntheticColumn c;
  c.name = "sine";
  c.places = 2;
  c.f = [](double a) { return 60 * std::sin(a * 3.141592653589793 / 180); };
  Transcription a = testing::MakeTable("t", 1, 1, 30, {c});
  a.work.id = "w";
  a.witness.siglum = "A";
  Transcription b = a;
  b.witness.siglum = "B";
  for (std::size_t r = 0; r < b.rows.size(); ++r) {
    Cell& cell = b.rows[r].cells[0];
    cell.value.reset();
    cell.state = r % 2 ? CellState::kIllegible : CellState::kBlank;
    cell.raw = r % 2 ? "?" : "_";
  }
  store::Database db(path);
  store::Import(db, {a, b});
}

}  // namespace

TEST_CASE("formulas nested or chained without limit are refused where they go too far") {
  // A flat sum of 16,000 terms, 13,000 nested parentheses, 10,600 nested sin(.
  CHECK(CompileError("1" + Repeat(" + 1", 16000)) ==
        "expected at most 2000 operations in one chain or nesting, found '1' @8001");
  CHECK(CompileError(Repeat("(", 13000) + "1" + Repeat(")", 13000)) ==
        "expected at most 200 parentheses, calls and signs nested in one another, found '(' "
        "@201");
  CHECK(CompileError(Repeat("sin(", 10600) + "1" + Repeat(")", 10600)) ==
        "expected at most 200 parentheses, calls and signs nested in one another, found '(' "
        "@804");
  CHECK(CompileError(Repeat("-", 5000) + "1") ==
        "expected at most 200 parentheses, calls and signs nested in one another, found '-' "
        "@201");
  // Within the limits a deep formula compiles and evaluates.
  CHECK(CompileError(Repeat("(", 150) + "1" + Repeat(")", 150)) == "compiled");
  CHECK(CompileError("1" + Repeat(" + 1", 1500)) == "compiled");
}

TEST_CASE("row offsets and literals out of range are positioned errors, not stoi/stod") {
  CHECK(CompileError("self(-99999999999)") ==
        "expected a row offset between -1000000 and 1000000, found '99999999999' @7");
  CHECK(CompileError("arg(99999999999)") ==
        "expected a row offset between -1000000 and 1000000, found '99999999999' @5");
  CHECK(CompileError(std::string(310, '9')) ==
        "expected a number below 10^15, found '" + std::string(310, '9') + "' @1");
  CHECK(CompileError("arg + 2 * " + std::string(20, '7')).find("expected a number below 10^15") ==
        0);
}

TEST_CASE("fit on a witness with no readable entry: a clear refusal, no crash") {
  apograph::testing::TempDb file("fit-blank");
  MakeDb(file.path());
  const auto r = apograph::testing::RunInProcess(
      {"fit", "--table", "t", "--witness", "B", "--model", "sine", "--db", file.path()});
  CHECK(r.code == 2);
  CAPTURE(r.err);
  CHECK(r.err.find(
            "--witness: error: expected a witness with readable entries in the columns fitted, "
            "found 'B', whose cells there are all blank, illegible or partly read") !=
        std::string::npos);
  // The library's own answer: no entry, the defaults, not converged.
  const Transcription b = [&] {
    store::Database db(file.path());
    return store::Load(db, "t", "B");
  }();
  const FitResult fit = Fit(*model::FindBuiltinModel("sine"), b, std::vector<int>{}, FitOptions{});
  CHECK(fit.n == 0);
  CHECK_FALSE(fit.converged);
}

TEST_CASE("--auto with a model that gives no value on any row: a clear refusal") {
  apograph::testing::TempDb file("auto-undefined");
  MakeDb(file.path());
  for (const char* command : {"errors", "check"}) {
    CAPTURE(command);
    std::vector<std::string> args = {
        command, "--table",  "t",         "--witness",
        "A",     "--auto",   "--formula", "param e = 1\nsqrt(-e) + arg",
        "--db",  file.path()};
    if (std::string(command) == "errors") args.push_back("--no-record");
    const auto r = apograph::testing::RunInProcess(args);
    CHECK(r.code == 2);
    CHECK(r.err.find("undefined on every row") != std::string::npos);
  }
}

TEST_CASE("one model lookup, one message for an unknown model") {
  apograph::testing::TempDb file("unknown-model");
  MakeDb(file.path());
  const auto fit = apograph::testing::RunInProcess(
      {"fit", "--table", "t", "--witness", "A", "--model", "bogus", "--db", file.path()});
  const auto errors =
      apograph::testing::RunInProcess({"errors", "--table", "t", "--witness", "A", "--model",
                                       "bogus", "--no-record", "--db", file.path()});
  CAPTURE(fit.err);
  CAPTURE(errors.err);
  CHECK(fit.code == 2);
  CHECK(errors.code == 2);
  const std::string want =
      "--model: error: expected a built-in model or a saved formula (chord, sine, ";
  CHECK(fit.err.find(want) != std::string::npos);
  CHECK(errors.err.find(want) != std::string::npos);
  CHECK(fit.err.find("found 'bogus'") != std::string::npos);
  CHECK(errors.err.find("found 'bogus'") != std::string::npos);
}

TEST_CASE("a saved formula that no longer compiles is listed with its reason, never a crash") {
  apograph::testing::TempDb file("bad-formula");
  MakeDb(file.path());
  {
    store::Database db(file.path());
    // Saved by an older version without limits (save compiles first now).
    store::SaveFormula(db, {"deep", Repeat("(", 13000) + "1" + Repeat(")", 13000), "", ""});
  }
  const auto list = apograph::testing::RunInProcess({"formula", "list", "--db", file.path()});
  CHECK(list.code == 0);
  CHECK(list.out.find("does not compile: expected at most 200 parentheses") != std::string::npos);
  // Commands that load the saved formulas warn and go on.
  const auto id = apograph::testing::RunInProcess(
      {"identify", "--table", "t", "--witness", "A", "--db", file.path()});
  CHECK(id.code <= 1);
  CHECK(id.err.find("warning: saved formula deep no longer compiles") != std::string::npos);
}

}  // namespace apograph::estimate
