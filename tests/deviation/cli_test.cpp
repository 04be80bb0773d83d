// The real binary on a database: errors, screen and emendation end to end.

#include <doctest/doctest.h>
#include <nlohmann/json.hpp>

#include "../store/store_test_util.hpp"
#include "cli_runner.hpp"
#include "store/database.hpp"
#include "store/edition_store.hpp"
#include "synthetic.hpp"

using namespace apograph;

namespace {

using Run = apograph::testing::CliResult;

Run Apograph(const std::string& args) { return apograph::testing::RunBinary(args); }

std::size_t g_slip_row = 0;

/// A solar equation table (e = 2;30, to minutes) in witness A with 4 read as
/// 5 in the tens of minutes of the first entry that has a 4 there, and a blank
/// at 60.
std::string MakeDb(const testing::TempDb& file) {
  auto s = testing::MakeTable(testing::SolarEquation, 1, 1, 90, 1);
  s.table.work.id = "w";
  s.table.table_id = "sun";
  std::size_t row = 0;
  while (s.table.rows[row].cells[0].value->FractionDigits()[0] / 10 != 4) ++row;
  g_slip_row = row;
  s.Set(row, (*s.table.rows[row].cells[0].value + Sexagesimal::FromUnits(10, 1)).ToString());
  s.Set(s.Row(60), "_");
  store::Database db(file.path());
  store::Import(db, {s.table});
  return "--db " + file.path();
}

}  // namespace

TEST_CASE("apograph errors explains, records proposals, and exits 1") {
  testing::TempDb file("errors-cli");
  const std::string db = MakeDb(file);
  auto text =
      Apograph("errors --table sun --witness A --model solar-eccentric --param e=2.5 " + db);
  CHECK(text.code == 1);
  INFO(text.out);
  CHECK(text.out.find("table sun, witness A (hindu-arabic), compared with solar-eccentric e=2.5 "
                      "(2;30): 2 findings") == 0);
  CHECK(text.out.find("60 equation: _ A] read ") != std::string::npos);
  CHECK(text.out.find("tens of minutes: 4 read as 5") != std::string::npos);

  auto json = Apograph(
      "errors --table sun --witness A --model solar-eccentric --param 'e=2;30' --format json "
      "--no-record " +
      db);
  CHECK(json.code == 1);
  auto j = nlohmann::json::parse(json.out);
  CHECK(j["table"] == "sun");
  CHECK(j["witness"] == "A");
  REQUIRE(j["findings"].size() == 2);
  for (const char* field : {"arg", "column", "tabulated", "computed", "diff_units", "class",
                            "explanation", "emendation", "score"}) {
    CHECK(j["findings"][0].contains(field));
  }
  CHECK(j["findings"][0]["class"] == "confusion");
  CHECK(j["findings"][0]["arg"] == std::to_string(g_slip_row + 1));
  CHECK(j["findings"][1]["class"] == "blank");

  auto list = Apograph("emendation list --format json " + db);
  CHECK(list.code == 0);
  auto l = nlohmann::json::parse(list.out);
  REQUIRE(l["emendations"].size() == 2);  // recorded once by the first run only
  const auto id = l["emendations"][1]["id"].get<long long>();
  auto accept = Apograph("emendation accept " + std::to_string(id) + " --note 'B agrees' " + db);
  CHECK(accept.code == 0);
  auto accepted =
      nlohmann::json::parse(Apograph("emendation list --status accepted --format json " + db).out);
  REQUIRE(accepted["emendations"].size() == 1);
  CHECK(accepted["emendations"][0]["note"] == "B agrees");
  CHECK(Apograph("emendation reject 999 " + db).code == 2);
}

TEST_CASE("apograph errors --auto fits the model first") {
  testing::TempDb file("errors-auto");
  const std::string db = MakeDb(file);
  auto json = Apograph(
      "errors --table sun --witness A --model solar-eccentric --auto --format json --no-record " +
      db);
  CHECK(json.code == 1);
  auto j = nlohmann::json::parse(json.out);
  INFO(j["model"].get<std::string>());
  const std::string model = j["model"];
  REQUIRE(model.find("solar-eccentric e=") == 0);
  CHECK(std::stod(model.substr(18)) == doctest::Approx(2.5).epsilon(0.005));
  CHECK(model ==
        "solar-eccentric e=2.5 (2;30) (fitted, e = 2;30 adopted (attested: 2nd-century Greek "
        "handbook (greatest equation 2;23)))");
  CHECK(j["findings"].size() == 2);
}

TEST_CASE("apograph screen finds the suspects without a model") {
  testing::TempDb file("screen-cli");
  const std::string db = MakeDb(file);
  auto r = Apograph("screen --table sun --witness A --format json " + db);
  CHECK(r.code == 1);
  auto j = nlohmann::json::parse(r.out);
  REQUIRE(j["suspects"].size() == 2);
  CHECK(j["suspects"][0]["arg"] == std::to_string(g_slip_row + 1));
  CHECK(j["suspects"][0]["class"] == "confusion");
  CHECK(j["suspects"][1]["arg"] == "60");
}

TEST_CASE("bad options are refused with exit 2") {
  testing::TempDb file("errors-bad");
  const std::string db = MakeDb(file);
  CHECK(Apograph("errors --table sun --witness A " + db).code == 2);
  CHECK(Apograph("errors --table sun --witness A --model nonesuch " + db).code == 2);
  CHECK(Apograph("errors --table sun --witness Z --model solar-eccentric " + db).code == 2);
  CHECK(Apograph("errors --table sun --witness A --model solar-eccentric --param q=1 " + db).code ==
        2);
  CHECK(Apograph("screen --table sun --witness A --db /nonexistent.sqlite").code == 2);
}
