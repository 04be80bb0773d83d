// apograph check and apograph formula end to end on the demo witness A,
// imported into a temporary database; and the model store.
#include <sstream>

#include <doctest/doctest.h>
#include <nlohmann/json.hpp>

#include "../store/store_test_util.hpp"
#include "cli/command.hpp"
#include "store/edition_store.hpp"
#include "store/model_store.hpp"
#include "test_paths.hpp"
#include "transcription/parser.hpp"

namespace apograph {
namespace {

struct Run {
  int code = 0;
  std::string out, err;
};

Run Apograph(std::vector<std::string> args) {
  std::ostringstream out, err;
  cli::Io io{out, err};
  Run r;
  r.code = cli::Dispatch(args, io);
  r.out = out.str();
  r.err = err.str();
  return r;
}

/// A database holding the demo witness A.
struct DemoDb {
  testing::TempDb file{"check"};
  DemoDb() {
    store::Database db(file.path());
    auto parsed = ReadTranscriptionFile(std::string(APOGRAPH_SOURCE_DIR) + "/corpora/demo/A.apo");
    store::Import(db, parsed.tables);
  }
  std::vector<std::string> Args(std::vector<std::string> more) const {
    more.push_back("--db");
    more.push_back(file.path());
    return more;
  }
};

TEST_CASE("check on a demo witness flags exactly the entries beyond tolerance") {
  DemoDb demo;
  Run r = Apograph(
      demo.Args({"check", "--table", "sun-eq", "--witness", "A", "--model", "solar-eccentric",
                 "--param", "e=2;16", "--grid", "6", "--format", "json"}));
  CHECK(r.err == "");
  CHECK(r.code == 1);
  auto j = nlohmann::json::parse(r.out);
  CHECK(j["table"] == "sun-eq");
  CHECK(j["witness"] == "A");
  CHECK(j["model"] == "solar-eccentric");
  CHECK(j["params"]["e"].get<double>() == doctest::Approx(2 + 16.0 / 60));
  REQUIRE(j["entries"].size() == 180);
  std::vector<std::string> flagged;
  for (const auto& e : j["entries"]) {
    if (e["flag"].get<bool>()) flagged.push_back(e["arg"]);
  }
  CHECK(flagged == std::vector<std::string>{"41", "66"});
  CHECK(j["entries"][40]["tabulated"] == "1;32,46");
  CHECK(j["entries"][40]["computed"] == "1;22,46");
  CHECK(j["entries"][40]["diff_units"].get<double>() == 600);
  CHECK(j["entries"][30]["diff_units"].is_null());
  CHECK(j["summary"]["flagged"] == 2);
  CHECK(j["summary"]["exact"] == 175);
  CHECK(j["summary"]["within_one"] == 2);
  CHECK(j["summary"]["blank"] == 1);
  CHECK(j["revision"] == 1);
  store::Database db(demo.file.path());
  CHECK(store::CountCheckRuns(db, "sun-eq", "A") == 1);
}

TEST_CASE("check text output and exit code 0 when nothing is flagged") {
  DemoDb demo;
  Run r =
      Apograph(demo.Args({"check", "--table", "decl", "--witness", "A", "--model", "declination",
                          "--param", "obliquity=23;32,40", "--tolerance", "100000"}));
  CHECK(r.code == 0);
  CHECK(r.out.find("table decl, witness A, column declination: model declination with obliquity = "
                   "23.5444444444 (23;32,40)\n") == 0);
  CHECK(r.out.find("practice: nearest to 2 places\n") != std::string::npos);
  CHECK(r.out.find("row  arg  tabulated  computed") != std::string::npos);
  CHECK(r.out.find(" flagged (|diff| > 100000)") != std::string::npos);
}

TEST_CASE("a formula at the command line and a saved formula stand in for the built-in model") {
  DemoDb demo;
  const std::string text = "param g = 12\n g * cos(arg) / sin(arg)";
  Run saved = Apograph(demo.Args({"formula", "save", "gnomon", text, "--description", "shadow"}));
  CHECK(saved.code == 0);
  CHECK(saved.out == "saved formula gnomon (1 parameters)\n");
  Run builtin = Apograph(demo.Args({"check", "--table", "shadow", "--witness", "A", "--model",
                                    "shadow", "--rounding", "truncate", "--format", "csv"}));
  Run byname = Apograph(demo.Args({"check", "--table", "shadow", "--witness", "A", "--model",
                                   "gnomon", "--rounding", "truncate", "--format", "csv"}));
  Run adhoc = Apograph(
      demo.Args({"check", "--table", "shadow", "--witness", "A", "--formula",
                 "12 * cos(arg) / sin(arg)", "--rounding", "truncate", "--format", "csv"}));
  CHECK(builtin.code == 1);  // A's repeated entries at 15, 24 and 41
  CHECK(byname.out == builtin.out);
  CHECK(adhoc.out == builtin.out);
  CHECK(builtin.out.rfind("row,arg,tabulated,computed,exact,diff,flag\r\n", 0) == 0);
  Run list = Apograph(demo.Args({"formula", "list"}));
  CHECK(list.out.find("gnomon") != std::string::npos);
  Run show = Apograph(demo.Args({"formula", "show", "gnomon"}));
  CHECK(show.out.find("param g = 12") != std::string::npos);
}

TEST_CASE("check and formula report bad input with exit code 2") {
  DemoDb demo;
  Run bad =
      Apograph(demo.Args({"check", "--table", "sun-eq", "--witness", "A", "--formula", "1 + * 2"}));
  CHECK(bad.code == 2);
  CHECK(bad.err == "formula:1:5: error: expected an expression, found '*'\n1 + * 2\n    ^\n");
  Run unknown =
      Apograph(demo.Args({"check", "--table", "sun-eq", "--witness", "A", "--model", "nope"}));
  CHECK(unknown.code == 2);
  CHECK(unknown.err.find("--model: error: expected a built-in model or a saved formula") == 0);
  Run column = Apograph(
      demo.Args({"check", "--table", "sun-eq", "--witness", "A", "--formula", "col(chord)"}));
  CHECK(column.code == 2);
  CHECK(column.err ==
        "--formula: error: expected a column of table sun-eq (equation), found col(chord)\n");
  Run param = Apograph(demo.Args(
      {"check", "--table", "sun-eq", "--witness", "A", "--model", "chord", "--param", "R=sixty"}));
  CHECK(param.err == "--param R: error: expected a number such as 2;4,48 or 2.08, found 'sixty'\n");
  Run save = Apograph(demo.Args({"formula", "save", "chord", "crd(arg)"}));
  CHECK(save.code == 2);
  store::Database db(demo.file.path());
  CHECK(store::CountCheckRuns(db, "sun-eq", "A") == 0);  // nothing written on bad input
  CHECK(store::ListFormulas(db).empty());
}

}  // namespace
}  // namespace apograph
