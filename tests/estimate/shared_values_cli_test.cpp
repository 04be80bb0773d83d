// identify shows the one obliquity of a table of several latitudes that the
// reports adopt (issue 9): the same value and the same text, for one table
// and for --all, in text and JSON, as pipeline::ResolveReferences.
#include <doctest/doctest.h>

#include <cstddef>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "../store/store_test_util.hpp"
#include "cli_runner.hpp"
#include "pipeline/reference.hpp"
#include "several_latitudes.hpp"
#include "store/edition_store.hpp"

namespace apograph::estimate {
namespace {

using apograph::testing::RunInProcess;

/// The obliquity adopted and where it comes from ("" when none).
struct Adopted {
  double value = 0;
  std::string source;
};

Adopted FromJson(const nlohmann::json& identification) {
  for (const auto& a : identification.at("candidates").at(0).at("adopted")) {
    if (a.at("param") == "obliquity") return {a.at("value"), a.at("source")};
  }
  return {};
}

Adopted FromReference(const pipeline::ColumnReference& r) {
  for (const auto& a : r.adopted) {
    if (a.param == "obliquity") return {a.value, a.source};
  }
  return {};
}

std::size_t Count(const std::string& text, const std::string& what) {
  std::size_t n = 0;
  for (std::size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
  return n;
}

}  // namespace

TEST_CASE("identify adopts the obliquity of a table of several latitudes as the reports do") {
  // The one-obliquity table (several_latitudes.hpp) in a database, seeds
  // 1..4: identify (one table, --all; JSON and text) against
  // ResolveReferences --auto on the same witness, column by column.
  int shared = 0;
  for (unsigned seed = 1; seed <= 4; ++seed) {
    CAPTURE(seed);
    apograph::testing::TempDb file("shared-identify");
    Transcription t = testing::SeveralLatitudesTable(seed);
    t.work.id = "climates";
    t.work.title = "Tables of the climates (invented)";
    t.kind = "ascensional difference";
    std::vector<pipeline::ColumnReference> refs;
    {
      store::Database db(file.path());
      store::Import(db, {t});
      pipeline::ReferenceRequest automatic;
      automatic.automatic = true;
      automatic.witness = t.witness.siglum;
      refs = pipeline::ResolveReferences({t}, automatic, pipeline::LoadModelLibrary(db));
    }
    const std::vector<std::string> one = {"identify", "--table", "asc",      "--witness",
                                          "S",        "--db",    file.path()};
    auto json = one;
    json.insert(json.end(), {"--format", "json"});
    const auto a = RunInProcess(json);
    const auto b = RunInProcess({"identify", "--all", "--format", "json", "--db", file.path()});
    const auto text = RunInProcess(one);
    REQUIRE(a.err.empty());
    const auto ja = nlohmann::json::parse(a.out).at("identifications");
    const auto jb = nlohmann::json::parse(b.out).at("identifications");
    REQUIRE(ja.size() == refs.size());
    REQUIRE(jb.size() == refs.size());
    std::size_t sources = 0;
    for (std::size_t k = 0; k < refs.size(); ++k) {
      CAPTURE(k);
      const Adopted r = FromReference(refs[k]);
      for (const auto& j : {ja[k], jb[k]}) {
        const Adopted i = FromJson(j);
        CHECK(i.value == r.value);
        CHECK(i.source == r.source);
      }
      shared += r.source.find("one author, one value") != std::string::npos;
      sources += Count(refs[k].how, "one author, one value");
    }
    CHECK(Count(text.out, "one author, one value") == sources);
  }
  CHECK(shared > 0);  // the draws hold columns the shared value changed
}

}  // namespace apograph::estimate
