// Every command's JSON output against its schema in schema/json/ (the one
// data contract the README documents), on the demo corpus and a decision or
// two; and the validator itself on outputs that break the contract.
#include <doctest/doctest.h>

#include <sstream>
#include <string>

#include <nlohmann/json.hpp>

#include "../store/store_test_util.hpp"
#include "cli_runner.hpp"
#include "demo_corpus.hpp"
#include "json_schema.hpp"
#include "store/edition_store.hpp"
#include "transcription/parser.hpp"

namespace apograph {
namespace {

using nlohmann::json;

const testing::JsonSchemas& Schemas() {
  static const testing::JsonSchemas schemas;
  return schemas;
}

struct Db {
  testing::TempDb file{"json-contract"};
  Db() {
    store::Database db(file.path());
    store::Import(db, testing::DemoTranscriptions());
  }
};

/// Runs a command in process with --db and --format json; checks it
/// succeeded and its output conforms to `schema`; returns the JSON.
json Conforms(const Db& db, std::vector<std::string> args, const std::string& schema) {
  args.insert(args.end(), {"--format", "json", "--db", db.file.path()});
  std::string line;
  for (const auto& a : args) line += a + " ";
  INFO(line);
  const auto r = testing::RunInProcess(args);
  INFO(r.err);
  REQUIRE(r.code <= 1);
  const json j = json::parse(r.out);
  const auto problems = Schemas().Validate(schema, j);
  std::string all;
  for (const auto& p : problems) all += p + "\n";
  CHECK_MESSAGE(problems.empty(), all);
  return j;
}

/// As Conforms for the batch forms: every line of JSON lines conforms to the
/// single form's schema; returns how many lines did.
int LinesConform(const Db& db, std::vector<std::string> args, const std::string& schema) {
  args.insert(args.end(), {"--format", "json", "--db", db.file.path()});
  const auto r = testing::RunInProcess(args);
  INFO(r.err);
  REQUIRE(r.code <= 1);
  std::istringstream in(r.out);
  int lines = 0;
  for (std::string line; std::getline(in, line); ++lines) {
    const json j = json::parse(line);
    if (j.contains("skipped")) continue;
    const auto problems = Schemas().Validate(schema, j);
    std::string all;
    for (const auto& p : problems) all += p + "\n";
    CHECK_MESSAGE(problems.empty(), all);
  }
  return lines;
}

}  // namespace

TEST_CASE("the batch forms' JSON lines conform to the single forms' schemas") {
  Db db;
  CHECK(LinesConform(db, {"fit", "--all", "--model", "declination"}, "fit.json") == 20);
  CHECK(LinesConform(db, {"check", "--work", "lantern", "--auto"}, "check.json") == 20);
  CHECK(LinesConform(db, {"errors", "--all", "--auto", "--no-record"}, "errors.json") == 20);
}

TEST_CASE("the JSON schemas use the supported subset of draft 2020-12") {
  CHECK(Schemas().files().size() >= 16);
  CHECK(Schemas().SchemaProblems() == std::vector<std::string>{});
}

TEST_CASE("every command's JSON output conforms to its schema") {
  Db db;
  Conforms(db, {"list", "works"}, "list.json");
  Conforms(db, {"list", "tables"}, "list.json");
  Conforms(db, {"list", "witnesses"}, "list.json");
  Conforms(db, {"list", "transcriptions"}, "list.json");
  Conforms(db, {"list", "revisions", "--table", "decl"}, "list.json");
  Conforms(db, {"export", "--table", "decl", "--witness", "A"}, "export.json");
  Conforms(db, {"catalog", "list"}, "catalog.json");
  Conforms(db, {"formula", "list", "--builtin"}, "formula.json");
  Conforms(db, {"formula", "show", "sine"}, "formula.json");
  const auto check = Conforms(db,
                              {"check", "--table", "sun-eq", "--witness", "A", "--model",
                               "solar-eccentric", "--param", "e=2;16", "--grid", "6"},
                              "check.json");
  CHECK(check["entries"][40]["arg"] == "41");  // a string in trade notation
  const auto fit = Conforms(
      db, {"fit", "--table", "sun-mm", "--witness", "A", "--model", "mean-motion"}, "fit.json");
  CHECK(fit["entries"][0]["arg"].is_string());
  CHECK(fit["within_one"] == fit["within1"]);
  Conforms(db, {"fit", "--table", "decl", "--witness", "A", "--model", "declination"}, "fit.json");
  const auto one =
      Conforms(db, {"identify", "--table", "sun-mm", "--witness", "A"}, "identify.json");
  CHECK(one["identifications"][0]["candidates"][0]["practice"].is_object());
  const auto all = Conforms(db, {"identify", "--all", "--threads", "2"}, "identify.json");
  CHECK(all["identifications"].size() == 20);
  Conforms(db, {"errors", "--table", "sun-eq", "--witness", "D", "--auto"}, "errors.json");
  Conforms(db, {"errors", "--table", "decl", "--witness", "A", "--auto"}, "errors.json");
  Conforms(db, {"screen", "--table", "sun-eq", "--witness", "D"}, "screen.json");
  Conforms(db, {"collate", "--table", "decl"}, "collate.json");
  const auto collated = Conforms(db, {"collate", "--table", "decl", "--auto"}, "collate.json");
  CHECK(collated["rows"][0]["arg"] == "1");
  Conforms(db, {"stemma", "--table", "decl", "--method", "both", "--bootstrap", "10"},
           "stemma.json");
  Conforms(db, {"stemma", "--work", "lantern", "--auto"}, "stemma.json");
  // Decisions: list, log and each decision's own output.
  const auto list = Conforms(db, {"emendation", "list"}, "emendation-list.json");
  REQUIRE(list["emendations"].size() > 0);
  const std::string id = std::to_string(list["emendations"][0]["id"].get<long long>());
  Conforms(db, {"emendation", "accept", id, "--editor", "A. Editor", "--note", "test"},
           "emendation-decision.json");
  Conforms(db,
           {"emendation", "override", "--table", "decl", "--cell", "46:declination", "--reading",
            "16;41,57", "--editor", "A. Editor"},
           "emendation-decision.json");
  Conforms(db, {"emendation", "undo", id, "--editor", "A. Editor"}, "emendation-decision.json");
  Conforms(db, {"emendation", "list"}, "emendation-list.json");
  Conforms(db, {"emendation", "log"}, "emendation-log.json");
  Conforms(db, {"collate", "--table", "decl", "--auto"}, "collate.json");  // with a decision
}

TEST_CASE("the JSON of import conforms to its schema") {
  testing::ScratchDir dir("json-import");
  const auto r = testing::RunBinary("import '" + std::string(APOGRAPH_SOURCE_DIR) +
                                        "/corpora/demo/A.apo' --format json --db " +
                                        (dir / "e.sqlite").string(),
                                    dir.path());
  REQUIRE(r.code <= 1);
  CHECK(Schemas().Validate("import.json", json::parse(r.out)) == std::vector<std::string>{});
}

TEST_CASE("the validator catches what breaks the contract") {
  const json good = {{"database", "e.sqlite"},
                     {"tables", json::array()},
                     {"warnings", json::array()},
                     {"cells_written", 0}};
  CHECK(Schemas().Validate("import.json", good).empty());
  json unknown = good;
  unknown["extra"] = 1;  // a field the schema does not document
  CHECK(Schemas().Validate("import.json", unknown).size() == 1);
  json missing = good;
  missing.erase("warnings");
  CHECK(Schemas().Validate("import.json", missing).size() == 1);
  json wrong = good;
  wrong["cells_written"] = "0";  // a count as a string
  CHECK(Schemas().Validate("import.json", wrong).size() == 1);
  json bad_item = good;
  bad_item["tables"].push_back({{"file", "a"}});
  CHECK_FALSE(Schemas().Validate("import.json", bad_item).empty());
  const json fit_arg = {{"row", 1},           {"arg", 41},           {"column", "c"},
                        {"tabulated", "1;0"}, {"computed", nullptr}, {"diff_units", nullptr},
                        {"flag", false}};
  json fit = {{"entries", json::array({fit_arg})}};
  const auto problems = Schemas().Validate("fit.json", fit);
  bool arg_type = false;
  for (const auto& p : problems) arg_type |= p.find("$.entries[0].arg") == 0;
  CHECK(arg_type);  // an argument as a number is refused
}

}  // namespace apograph
