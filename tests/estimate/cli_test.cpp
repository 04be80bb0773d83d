// End-to-end: the real binary on a database built from synthetic tables.
#include <doctest/doctest.h>

#include <unistd.h>

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <sstream>

#include <nlohmann/json.hpp>

#include "cli_runner.hpp"
#include "model/model.hpp"
#include "store/edition_store.hpp"
#include "store/estimate_store.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

using Run = apograph::testing::CliResult;

Run Apograph(const std::string& args) { return apograph::testing::RunBinary(args); }

Transcription WithMeta(Transcription t, const std::string& siglum) {
  t.work.id = "qarmel";
  t.work.title = "Tables of Qarmel (invented)";
  t.witness.siglum = siglum;
  t.kind = "solar equation";
  return t;
}

std::string MakeDb() {
  const std::string path = (std::filesystem::temp_directory_path() /
                            ("apograph_est_cli_" + std::to_string(::getpid()) + ".sqlite"))
                               .string();
  std::filesystem::remove(path);
  store::Database db(path);
  const model::Model* m = model::FindBuiltinModel("solar-eccentric");
  testing::SyntheticColumn c;
  c.name = "equation";
  c.places = 2;
  c.f = [m](double a) {
    model::RowContext ctx;
    ctx.arg = a;
    return m->Evaluate({2.0 + 4.0 / 60 + 45.0 / 3600}, ctx);
  };
  c.errors = {{40, 600}};
  std::vector<Transcription> tables = {WithMeta(testing::MakeTable("sun", 1, 1, 180, {c}), "A"),
                                       WithMeta(testing::MakeTable("sun", 1, 1, 180, {c}), "B")};
  store::Import(db, tables);
  return path;
}

}  // namespace

TEST_CASE("cli: fit gives JSON with params, counts, entries and the nearest attested value") {
  const std::string db = MakeDb();
  const Run r =
      Apograph("fit --table sun --witness A --model solar-eccentric --format json --db " + db);
  CHECK(r.code == 1);  // one entry flagged
  const auto j = nlohmann::json::parse(r.out);
  CHECK(j["model"] == "solar-eccentric");
  const double e = j["estimates"]["e"]["value"];
  const double se = j["estimates"]["e"]["stderr"];
  CHECK(j["params"]["e"].get<double>() == e);
  CHECK(std::fabs(e - (2.0 + 4.0 / 60 + 45.0 / 3600)) < 3 * se);
  CHECK(j["flagged"] == 1);
  CHECK(j["entries"].size() == 180);
  CHECK(j["entries"][40]["flag"] == true);
  CHECK(j["entries"][40]["diff_units"] == 600);
  // The catalog's al-Battani value 2;4,45 (from memory) is the nearest.
  CHECK(j["attested"]["e"][0]["value"] == "2;4,45");
  CHECK(j["attested"]["e"][0]["from_memory"] == true);
}

TEST_CASE("cli: fit rejects a bad --fix with the option named") {
  const std::string db = MakeDb();
  const Run r =
      Apograph("fit --table sun --witness A --model solar-eccentric --fix q=2 --db " + db);
  CHECK(r.code == 2);
  CHECK(r.err.find("--fix") != std::string::npos);
  const Run r2 = Apograph("fit --table sun --witness A --model no-such-model --db " + db);
  CHECK(r2.code == 2);
  CHECK(r2.err.find("--model") != std::string::npos);
}

TEST_CASE(
    "cli: identify --all stores one run per column and prints csv without a progress bar when "
    "piped") {
  const std::string db = MakeDb();
  const Run r = Apograph("identify --all --format csv --db " + db);
  CHECK(r.code <= 1);  // 1 when a best candidate flags entries (the exit rule)
  CHECK(r.err.find("identify [") == std::string::npos);
  CHECK(r.out.find("sun,A,equation,solar-") != std::string::npos);
  CHECK(r.out.find("sun,B,equation,solar-") != std::string::npos);
  store::Database d(db);
  CHECK(store::CountIdentifyRuns(d) == 2);
}

TEST_CASE("cli: catalog add stores a row that list shows beside the file's") {
  const std::string db = MakeDb();
  const Run add = Apograph(
      "catalog add --kind obliquity --applies-to declination:obliquity --value '23;33,30' "
      "--tradition 'Tables of Qarmel' --source 'MS Q fol. 3r' --db " +
      db);
  CHECK(add.code == 0);
  const Run list = Apograph("catalog list --kind obliquity --format json --db " + db);
  const auto j = nlohmann::json::parse(list.out)["catalog"];
  bool from_db = false, from_file = false;
  for (const auto& row : j) {
    from_db = from_db || (row["tradition"] == "Tables of Qarmel" && row["from_memory"] == false);
    from_file = from_file || row["value"] == "23;51,20";
  }
  CHECK(from_db);
  CHECK(from_file);
  const Run bad = Apograph(
      "catalog add --kind obliquity --applies-to declination --value 23 --source x --db " + db);
  CHECK(bad.code == 2);
  CHECK(bad.err.find("--applies-to") != std::string::npos);
}

}  // namespace apograph::estimate
