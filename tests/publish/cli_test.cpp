// The real binary on a database: collate, stemma and apparatus end to end.
#include <doctest/doctest.h>

#include <nlohmann/json.hpp>
#include <string>

#include "../store/store_test_util.hpp"
#include "cli_runner.hpp"
#include "lineage/synthetic.hpp"
#include "store/edition_store.hpp"

namespace {

struct Run {
  int code;
  std::string out;  ///< standard output and error together
};

Run Apograph(const std::string& args) {
  const auto r = apograph::testing::RunBinary(args);
  return {r.code, r.out + r.err};
}

}  // namespace

TEST_CASE("collate, stemma and apparatus from the command line") {
  apograph::testing::TempDb tmp("cli-lineage");
  apograph::lineage::SyntheticOptions o;
  o.witnesses = 5;
  o.lost = 2;
  o.rows = 60;
  o.seed = 5;
  auto t = apograph::lineage::SimulateTradition(o);
  t.AddCopy("Q", t.Node("B"));
  {
    apograph::store::Database db(tmp.path());
    apograph::store::Import(db, t.Witnesses());
  }
  const std::string db = " --db '" + tmp.path() + "'";

  auto collate = Apograph("collate --table T1 --format json" + db);
  CHECK(collate.code == 1);  // errors found
  auto cj = nlohmann::json::parse(collate.out);
  CHECK(cj["witnesses"].size() == 6);
  CHECK(cj["rows"].size() == 60);
  CHECK(cj["rows"][0]["cells"][0]["basis"].is_string());

  auto stemma = Apograph("stemma --table T1 --method both --bootstrap 20 --format json" + db);
  CHECK(stemma.code == 1);  // a copy is named
  auto sj = nlohmann::json::parse(stemma.out);
  CHECK(sj["method"] == "parsimony");
  CHECK(sj["newick"].get<std::string>().find("archetype;") != std::string::npos);
  CHECK(sj["results"].size() == 2);
  bool q_copy = false;
  for (const auto& c : sj["copies"]) q_copy |= c["copy"] == "Q" && c["exemplar"] == "B";
  CHECK(q_copy);

  auto dot = Apograph("stemma --table T1 --format dot" + db);
  CHECK(dot.out.rfind("digraph stemma {", 0) == 0);

  auto bad = Apograph("apparatus --table T1 --override 999:c1=1" + db);
  CHECK(bad.code == 2);
  CHECK(bad.out.find("--override") != std::string::npos);

  auto tei = Apograph(
      "apparatus --table T1 --format tei --override '2:c1=7;7,0' --note 'editor test' --editor "
      "'A. Editor'" +
      db);
  CHECK(tei.code == 0);  // the column has 2 places: a reading of 1 place is refused
  CHECK(tei.out.find("<lem type=\"emendation\" resp=\"#ed-A._Editor\">7;7,0</lem>") !=
        std::string::npos);
  auto text = Apograph("apparatus --table T1" + db);  // the override stays
  CHECK(text.out.find("7;7,0 em. (emended by A. Editor: editor test)]") != std::string::npos);
  auto withdrawn = Apograph("apparatus --table T1 --withdraw 2:c1 --format csv" + db);
  CHECK(withdrawn.out.find("7;7,0") == std::string::npos);

  auto missing = Apograph("stemma --table T1 --db /nonexistent/x.sqlite");
  CHECK(missing.code == 2);
}
