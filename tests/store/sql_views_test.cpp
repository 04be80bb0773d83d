// The SQL an editor can query (schema/013_decisions.sql): the three example
// queries of the README, read from the README itself and run on the demo
// corpus, and the views agreeing with what the commands say.
#include <doctest/doctest.h>

#include <nlohmann/json.hpp>
#include <regex>
#include <string>
#include <vector>

#include "cli_runner.hpp"
#include "demo_corpus.hpp"
#include "pipeline/decisions.hpp"
#include "store/database.hpp"
#include "store/edition_store.hpp"
#include "store_test_util.hpp"
#include "transcription/parser.hpp"

namespace apograph {
namespace {

using Rows = std::vector<std::vector<std::string>>;

/// The ```sql blocks of the README's section of example queries.
std::vector<std::string> ReadmeQueries() {
  const std::string readme =
      testing::ReadWholeFile(std::string(APOGRAPH_SOURCE_DIR) + "/README.md");
  const auto from = readme.find("### Three queries an editor can run");
  const auto to = readme.find("\n## ", from);
  const std::string section = readme.substr(from, to - from);
  std::vector<std::string> out;
  const std::regex block("```sql\n([^`]*)```");
  for (std::sregex_iterator it(section.begin(), section.end(), block), end; it != end; ++it)
    out.push_back((*it)[1]);
  return out;
}

Rows Query(store::Database& db, const std::string& sql, int columns) {
  auto s = db.Prepare(sql);
  Rows out;
  while (s.Step()) {
    std::vector<std::string> row;
    for (int c = 0; c < columns; ++c) row.push_back(s.IsNull(c) ? "NULL" : s.Text(c));
    out.push_back(row);
  }
  return out;
}

struct DemoDb {
  testing::TempDb file{"sql-views"};
  DemoDb() {
    store::Database db(file.path());
    store::Import(db, testing::DemoTranscriptions());
  }
  testing::CliResult Run(std::vector<std::string> args) const {
    args.insert(args.end(), {"--db", file.path()});
    return testing::RunInProcess(args);
  }
};

}  // namespace

TEST_CASE("the README's three queries run on the demo corpus and answer what they say") {
  const auto queries = ReadmeQueries();
  REQUIRE(queries.size() == 3);
  DemoDb demo;
  const std::vector<std::string> check = {
      "check",           "--table", "sun-eq", "--witness", "B", "--model",
      "solar-eccentric", "--param", "e=2;16", "--grid",    "6"};
  // An earlier run that flags nothing, then the one that counts.
  auto lax = check;
  lax.insert(lax.end(), {"--tolerance", "100000"});
  REQUIRE(demo.Run(lax).code == 0);
  REQUIRE(demo.Run(check).code == 1);
  REQUIRE(demo.Run({"errors", "--table", "sun-eq", "--witness", "D", "--auto"}).code == 1);
  const auto list = nlohmann::json::parse(
      demo.Run({"emendation", "list", "--witness", "D", "--format", "json"}).out)["emendations"];
  REQUIRE(list.size() > 0);
  const std::string id = std::to_string(list[0]["id"].get<long long>());
  REQUIRE(
      demo.Run({"emendation", "accept", id, "--editor", "A. Editor", "--note", "C agrees"}).code ==
      0);

  store::Database db(demo.file.path());
  // 1. B's flagged entries, from the latest check only (the lax one has none).
  const Rows flagged = Query(db, queries[0], 6);
  REQUIRE(flagged.size() >= 2);
  bool at_35 = false;
  for (const auto& r : flagged) {
    CHECK(r[0] == "sun-eq");
    CHECK(r[5] != "NULL");
    at_35 = at_35 || (r[2] == "35" && r[3] == "1;10,20");  // TRUTH.md: B repeats at 35
  }
  CHECK(at_35);
  // 2. One cell in every witness: alpha's slip at 10 in C, D and E.
  const Rows cell = Query(db, queries[1], 5);
  REQUIRE(cell.size() == 5);
  CHECK(cell[0] == std::vector<std::string>{"A", "0;21,43", "read", "none", "NULL"});
  CHECK(cell[1][1] == "0;21,43");
  for (int i = 2; i < 5; ++i) CHECK(cell[static_cast<std::size_t>(i)][1] == "0;27,43");
  // 3. The decision, with who, when and why.
  const Rows decided = Query(db, queries[2], 9);
  REQUIRE(decided.size() >= 1);
  CHECK(decided[0][0] == "D");
  CHECK(decided[0][4] == "accepted");
  CHECK(decided[0][5] == "accept");
  CHECK(decided[0][6] == "A. Editor");
  CHECK(decided[0][7].size() == 20);  // 2026-01-02T03:04:05Z
  CHECK(decided[0][8] == "C agrees");
}

TEST_CASE("the views agree with the decisions module and read repaired arguments") {
  DemoDb demo;
  REQUIRE(demo.Run({"errors", "--table", "decl", "--witness", "A", "--auto"}).code == 1);
  store::Database db(demo.file.path());
  auto findings = pipeline::ListFindings(db, {});
  REQUIRE(findings.size() >= 2);
  pipeline::DecisionRequest r;
  r.action = pipeline::Action::kReject;
  r.target.emendation = findings[1].cells.back().emendation;
  r.editor = "A. Editor";
  pipeline::Decide(db, r);
  findings = pipeline::ListFindings(db, {});
  for (const auto& f : findings) {
    for (const auto& c : f.cells) {
      const Rows v = Query(db,
                           "SELECT coalesce(decision, 0), status FROM finding_decision WHERE "
                           "emendation = " +
                               std::to_string(c.emendation),
                           2);
      REQUIRE(v.size() == 1);
      CHECK(v[0][0] == std::to_string(f.decision ? f.decision->id : 0));
      CHECK(v[0][1] == (f.decision ? "rejected" : "proposed"));
    }
  }
  // Every current row has an argument, the one the row stands for.
  const Rows missing = Query(
      db, "SELECT count(*) FROM collation_by_argument WHERE argument IS NULL OR argument = ''", 1);
  CHECK(missing[0][0] == "0");
  const Rows rows = Query(db,
                          "SELECT (SELECT count(*) FROM collation_by_argument WHERE table_id = "
                          "'decl'), (SELECT sum(rows) FROM transcription_summary WHERE table_id "
                          "= 'decl')",
                          2);
  CHECK(rows[0][0] == rows[0][1]);  // one row per row of every witness (one column)
  CHECK(rows[0][0] != "0");
}

}  // namespace apograph
