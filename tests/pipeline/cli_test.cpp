// The commands that use a reference (check, errors, collate, stemma,
// apparatus) with the shared model options and --auto, on the demo corpus.
#include <sstream>

#include <doctest/doctest.h>
#include <nlohmann/json.hpp>

#include "../store/store_test_util.hpp"
#include "cli/command.hpp"
#include "cli_runner.hpp"
#include "demo_corpus.hpp"
#include "store/edition_store.hpp"
#include "test_paths.hpp"
#include "transcription/parser.hpp"

namespace apograph {
namespace {

using Run = testing::CliResult;

Run Apograph(const std::vector<std::string>& args) { return testing::RunInProcess(args); }

struct DemoDb {
  testing::TempDb file{"pipeline-cli"};
  DemoDb() {
    store::Database db(file.path());
    store::Import(db, testing::DemoTranscriptions());
  }
  std::vector<std::string> Args(std::vector<std::string> more) const {
    more.push_back("--db");
    more.push_back(file.path());
    return more;
  }
};

DemoDb& Demo() {
  static DemoDb demo;
  return demo;
}

TEST_CASE("errors --auto uses the identified model and practice (grid 6) and finds D's slips") {
  Run r = Apograph(Demo().Args({"errors", "--table", "sun-eq", "--witness", "D", "--auto",
                                "--no-record", "--format", "json"}));
  INFO(r.err);
  CHECK(r.code == 1);
  auto j = nlohmann::json::parse(r.out);
  const std::string model = j["model"];
  INFO(model);
  // solar-eccentric e, solar-epicycle r or epicycle-anomaly r: equivalent, tied
  CHECK(model.find("=2.26667 (2;16) (fitted, e = 2;16 adopted (round, 1 place); entries rounded "
                   "to 2 places, exact every 6 and linear between)") != std::string::npos);
  REQUIRE(j["references"].size() == 1);
  CHECK(j["references"][0]["practice"]["grid"] == 6);
  CHECK(j["references"][0]["source"] == "identified");
  CHECK(j["references"][0]["witness"].is_string());
  // TRUTH.md: 8 slips of D, beta and alpha in sun-eq (two of them runs of 3),
  // and the author's one-unit departure at 97.
  CHECK(j["findings"].size() >= 8);
  CHECK(j["findings"].size() <= 11);
}

TEST_CASE("check --auto and the shared practice options") {
  Run given =
      Apograph(Demo().Args({"check", "--table", "decl", "--witness", "B", "--model", "declination",
                            "--param", "obliquity=23;32,40", "--format", "csv"}));
  Run identified = Apograph(
      Demo().Args({"check", "--table", "decl", "--witness", "B", "--auto", "--format", "csv"}));
  CHECK(given.code == 1);
  CHECK(identified.out == given.out);
  Run text = Apograph(Demo().Args({"check", "--table", "decl", "--witness", "B", "--auto"}));
  CHECK(text.out.rfind("reference: identified from witness B", 0) == 0);
  Run both = Apograph(Demo().Args(
      {"check", "--table", "decl", "--witness", "B", "--auto", "--param", "obliquity=23"}));
  CHECK(both.code == 2);
  CHECK(both.err.find("--param: error: expected no --param with --auto") == 0);
  Run practice = Apograph(
      Demo().Args({"errors", "--table", "decl", "--witness", "B", "--auto", "--grid", "6"}));
  CHECK(practice.code == 2);
  CHECK(practice.err.find("--auto: error:") == 0);
}

TEST_CASE("collate with a model judges readings by the explained deviations") {
  Run r = Apograph(Demo().Args({"collate", "--table", "sun-eq", "--model", "solar-eccentric",
                                "--param", "e=2;16", "--grid", "6", "--format", "json"}));
  CHECK(r.code == 1);
  auto j = nlohmann::json::parse(r.out);
  int judged = 0, other = 0;
  for (const auto& row : j["rows"]) {
    for (const auto& cell : row["cells"]) (cell["basis"] == "judgement" ? judged : other)++;
  }
  CHECK(judged == 180);
  CHECK(other == 0);
  Run majority = Apograph(Demo().Args({"collate", "--table", "sun-eq", "--format", "json"}));
  auto m = nlohmann::json::parse(majority.out);
  CHECK(m["rows"][0]["cells"][0]["basis"] != "judgement");
  Run param_only = Apograph(Demo().Args({"collate", "--table", "sun-eq", "--param", "e=2"}));
  CHECK(param_only.code == 2);
}

TEST_CASE("stemma --auto over one table names B as a copy of A") {
  Run r = Apograph(Demo().Args({"stemma", "--table", "decl", "--auto", "--format", "json"}));
  INFO(r.err);
  auto j = nlohmann::json::parse(r.out);
  bool b_of_a = false;
  for (const auto& c : j["copies"]) b_of_a |= c["copy"] == "B" && c["exemplar"] == "A";
  CHECK(b_of_a);
  Run work = Apograph(Demo().Args({"stemma", "--work", "lantern", "--model", "declination"}));
  CHECK(work.code == 2);
}

TEST_CASE("apparatus --auto adopts the model's reading where the majority carries alpha's slip") {
  // TRUTH.md: alpha (lost) read 0;27,43 for 0;21,43 at 10, inherited by C, D
  // and E; A and B keep the author's reading. By majority the slip wins.
  Run judged =
      Apograph(Demo().Args({"apparatus", "--table", "sun-eq", "--auto", "--format", "csv"}));
  CHECK(judged.code == 0);
  CHECK(judged.out.find("\n10,equation,lemma,\"0;21,43\",A B,value,0,,") != std::string::npos);
  CHECK(judged.out.find("\n10,equation,variant,\"0;27,43\",C D E,value,1,confusion,") !=
        std::string::npos);
  Run majority = Apograph(Demo().Args({"apparatus", "--table", "sun-eq", "--format", "csv"}));
  CHECK(majority.out.find("\n10,equation,lemma,\"0;27,43\",C D E,") != std::string::npos);
  // The author's own departure at 97 (shared by all) is the lemma, with no variant.
  CHECK(judged.out.find("\n97,equation,lemma,\"2;9,21\",A B C D E,value,0,,,,witnesses,") !=
        std::string::npos);
  CHECK(judged.out.find("\n97,equation,variant,") == std::string::npos);
}

}  // namespace
}  // namespace apograph
