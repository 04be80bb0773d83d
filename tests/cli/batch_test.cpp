// The batch forms of the per-table commands (identify, fit, check, errors
// with --all or --work): every transcription in one process, results
// streamed, the same results as the single form table by table. On the
// demo's database (an invented tradition: 4 tables x 5 witnesses).
#include <doctest/doctest.h>

#include <algorithm>
#include <set>
#include <sstream>
#include <stdexcept>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "cli/hardening_support.hpp"
#include "support/ordered_batch.hpp"

namespace {

using apograph::testing::Contains;
using apograph::testing::ImportDemo;
using apograph::testing::RunInProcess;
using apograph::testing::ScratchDir;

std::vector<std::string> Lines(const std::string& text) {
  std::vector<std::string> out;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) {
    if (!line.empty() && line.back() == '\r') line.pop_back();
    out.push_back(line);
  }
  return out;
}

std::vector<std::string> WithDb(std::vector<std::string> args, const ScratchDir& dir) {
  args.push_back("--db");
  args.push_back((dir / "edition.sqlite").string());
  return args;
}

}  // namespace

TEST_CASE("RunInOrder hands results back in order with a bounded window") {
  std::size_t in_hand = 0, most = 0;
  std::vector<std::size_t> delivered;
  apograph::support::RunInOrder<std::size_t, std::size_t>(
      103, {.threads = 2, .window = 8},
      [&](std::size_t i) {
        most = std::max(most, ++in_hand);
        return i;
      },
      [](const std::size_t& i) { return i * i; },
      [&](std::size_t i, std::size_t&& input, std::size_t&& result) {
        --in_hand;
        CHECK(input == i);
        CHECK(result == i * i);
        delivered.push_back(i);
      });
  REQUIRE(delivered.size() == 103);
  CHECK(std::is_sorted(delivered.begin(), delivered.end()));
  CHECK(most == 8);
  // A failing item stops the batch with its exception on the calling thread.
  CHECK_THROWS_AS((apograph::support::RunInOrder<int, int>(
                      5, {.threads = 2}, [](std::size_t i) { return static_cast<int>(i); },
                      [](const int& i) -> int {
                        if (i == 3) throw std::runtime_error("item 3");
                        return i;
                      },
                      [](std::size_t, int&&, int&&) {})),
                  std::runtime_error);
}

TEST_CASE("identify --all streams one entry per column, JSON in the single document") {
  ScratchDir dir("batch-identify");
  ImportDemo(dir.path());
  const auto json =
      RunInProcess(WithDb({"identify", "--all", "--threads", "2", "--format", "json"}, dir));
  CHECK(json.code == 1);  // the demo's witnesses carry slips
  const auto doc = nlohmann::json::parse(json.out);
  REQUIRE(doc["identifications"].size() == 20);
  std::set<std::string> seen;
  for (const auto& one : doc["identifications"])
    seen.insert(one["table"].get<std::string>() + "/" + one["witness"].get<std::string>());
  CHECK(seen.size() == 20);
  // --work of the only work gives the same rows as --all.
  const auto all = RunInProcess(WithDb({"identify", "--all", "--format", "csv"}, dir));
  const auto work = RunInProcess(WithDb({"identify", "--work", "lantern", "--format", "csv"}, dir));
  CHECK(all.out == work.out);
  CHECK(Lines(all.out).size() == 21);
  CHECK(Lines(all.out)[0] == "table,witness,column,model,practice,exact,flagged,ties");
}

TEST_CASE("fit --work fits every transcription and says which it could not") {
  ScratchDir dir("batch-fit");
  ImportDemo(dir.path());
  const auto r = RunInProcess(WithDb({"fit", "--work", "lantern", "--model", "declination",
                                      "--column", "declination", "--format", "csv"},
                                     dir));
  CHECK(r.code == 1);
  const auto lines = Lines(r.out);
  REQUIRE(lines.size() == 21);
  CHECK(lines[0] ==
        "table,witness,revision,model,entries,exact,within_one,flagged,scale,estimates");
  int fitted = 0, skipped = 0;
  for (std::size_t i = 1; i < lines.size(); ++i) {
    if (lines[i].rfind("decl,", 0) == 0) {
      ++fitted;
      CHECK(Contains(lines[i], ",declination,"));
      CHECK(Contains(lines[i], "obliquity=23.544"));  // 23;32,40 (the demo's value)
    } else {
      ++skipped;
      CHECK(Contains(lines[i], "no column declination"));
    }
  }
  CHECK(fitted == 5);
  CHECK(skipped == 15);
  // The single form gives the same estimate for one of them.
  const auto one = RunInProcess(WithDb(
      {"fit", "--table", "decl", "--witness", "C", "--model", "declination", "--format", "json"},
      dir));
  const auto single = nlohmann::json::parse(one.out);
  const auto jl = RunInProcess(WithDb({"fit", "--all", "--model", "declination", "--column",
                                       "declination", "--format", "json", "--threads", "2"},
                                      dir));
  int matched = 0;
  for (const auto& line : Lines(jl.out)) {
    const auto j = nlohmann::json::parse(line);  // JSON lines: one object per line
    if (j["table"] == "decl" && j["witness"] == "C") {
      CHECK(j["params"] == single["params"]);
      CHECK(j["flagged"] == single["flagged"]);
      ++matched;
    }
  }
  CHECK(matched == 1);
}

TEST_CASE("check --all stores a run per transcription and streams JSON lines") {
  ScratchDir dir("batch-check");
  ImportDemo(dir.path());
  const auto r =
      RunInProcess(WithDb({"check", "--all", "--auto", "--format", "json", "--threads", "2"}, dir));
  CHECK(r.code == 1);
  const auto lines = Lines(r.out);
  REQUIRE(lines.size() == 20);
  std::set<long long> runs;
  for (const auto& line : lines) {
    const auto j = nlohmann::json::parse(line);
    CHECK(j["summary"]["entries"].get<int>() > 0);
    runs.insert(j["run_id"].get<long long>());
  }
  CHECK(runs.size() == 20);  // each run stored under its own id
  const auto flagged = RunInProcess(
      WithDb({"check", "--work", "lantern", "--auto", "--format", "csv", "--flagged-only"}, dir));
  const auto rows = Lines(flagged.out);
  REQUIRE(rows.size() > 1);
  CHECK(rows[0] == "table,witness,column,row,arg,tabulated,computed,exact,diff,flag");
  for (std::size_t i = 1; i < rows.size(); ++i) CHECK(Contains(rows[i], ",FLAG"));
}

TEST_CASE("errors --all gives each witness the findings of the single form") {
  ScratchDir dir("batch-errors");
  ImportDemo(dir.path());
  const auto batch = RunInProcess(WithDb(
      {"errors", "--all", "--auto", "--format", "csv", "--no-record", "--threads", "2"}, dir));
  CHECK(batch.code == 1);
  const auto single = RunInProcess(WithDb(
      {"errors", "--table", "decl", "--witness", "B", "--auto", "--format", "csv", "--no-record"},
      dir));
  const auto single_rows = Lines(single.out);
  REQUIRE(single_rows.size() > 2);
  std::vector<std::string> from_batch;
  for (const auto& line : Lines(batch.out)) {
    if (line.rfind("decl,B,", 0) == 0) from_batch.push_back(line.substr(7));
  }
  CHECK(from_batch == std::vector<std::string>(single_rows.begin() + 1, single_rows.end()));
  CHECK(Lines(batch.out)[0].rfind("table,witness,finding,", 0) == 0);
}

TEST_CASE("the batch options are checked before anything runs") {
  ScratchDir dir("batch-options");
  ImportDemo(dir.path());
  auto r = RunInProcess(WithDb({"fit", "--all", "--table", "decl", "--model", "declination"}, dir));
  CHECK(r.code == 2);
  CHECK(r.err == "--all: error: expected either --table and --witness or --all, found both\n");
  r = RunInProcess(WithDb({"check", "--work", "nowhere", "--auto"}, dir));
  CHECK(r.code == 2);
  CHECK(r.err == "--work: error: expected a work of the database (lantern), found 'nowhere'\n");
  r = RunInProcess(WithDb({"errors", "--auto"}, dir));
  CHECK(r.code == 2);
  CHECK(Contains(r.err, "expected --table and --witness, or --all, or --work WORK"));
  r = RunInProcess(WithDb({"identify", "--table", "decl"}, dir));
  CHECK(r.code == 2);
  CHECK(r.err == "--witness: error: expected --table and --witness together, found only one\n");
}
