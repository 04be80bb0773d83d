// Column references and judgements on synthetic tables (e = 2;30).
#include "pipeline/reference.hpp"

#include <algorithm>

#include <doctest/doctest.h>

#include "../deviation/synthetic.hpp"
#include "../test_support.hpp"
#include "deviation/numeral_script.hpp"
#include "pipeline/witness_findings.hpp"
#include "support/input_error.hpp"
#include "test_paths.hpp"

namespace apograph::pipeline {
namespace {

const std::string kScripts = std::string(APOGRAPH_SOURCE_DIR) + "/corpora/scripts";

testing::Synthetic Table() { return testing::MakeTable(testing::SolarEquation, 1, 1, 90, 2); }

TEST_CASE("an identified reference adopts the round value and keeps the exact entries") {
  const auto s = Table();
  ReferenceRequest automatic;
  automatic.automatic = true;
  automatic.model = "solar-eccentric";
  const auto a = ResolveReferences({s.table}, automatic).at(0);
  CHECK(a.params.at(0) == 2.5);  // 2;30 exactly, not the fitted 2;30,0,0,x
  CHECK(a.exact == 90);
  REQUIRE(a.adopted.size() == 1);
  CHECK(a.adopted[0].param == "e");
  CHECK(a.adopted[0].value == 2.5);
  CHECK(a.adopted[0].fitted != 2.5);
  // A table made with e = 2;30,30: a coarser value loses entries, so the
  // adopted one keeps its two places.
  const double e = 2.5 + 30.0 / 3600;
  const auto t = testing::MakeTable(
      [e](double x) {
        const double r = x * std::numbers::pi / 180.0;
        return std::atan2(e * std::sin(r), 60.0 + e * std::cos(r)) * 180.0 / std::numbers::pi;
      },
      1, 1, 90, 2);
  const auto b = ResolveReferences({t.table}, automatic).at(0);
  CHECK(Sexagesimal::FromDouble(b.params.at(0), 2).ToString() == "2;30,30");
  CHECK(std::fabs(b.params.at(0) - e) < 1e-12);
  CHECK(b.exact == 90);
}

TEST_CASE("the naming of equivalent models is told once, not again among the near-ties") {
  ReferenceRequest automatic;
  automatic.automatic = true;
  const auto a = ResolveReferences({Table().table}, automatic).at(0);
  REQUIRE(a.naming.find("rather than") != std::string::npos);  // eccentric or epicycle
  CHECK(std::find(a.ties.begin(), a.ties.end(), a.naming) == a.ties.end());
}

TEST_CASE("a given reference and an identified one describe themselves") {
  auto s = Table();
  ReferenceRequest given;
  given.model = "solar-eccentric";
  given.params = {{"e", 2.5}};
  given.practice.grid = 6;
  const auto g = ResolveReferences({s.table}, given).at(0);
  CHECK(g.description ==
        "solar-eccentric e = 2;30, rounded to 2 places, exact every 6 and linear between");
  CHECK(g.how == "given");
  CHECK(g.ModelText() == "solar-eccentric e=2.5 (2;30)");

  ReferenceRequest automatic;
  automatic.automatic = true;
  automatic.model = "solar-eccentric";
  const auto a = ResolveReferences({s.table}, automatic).at(0);
  CHECK(a.source == ReferenceSource::kIdentified);
  CHECK(a.params.at(0) == doctest::Approx(2.5).epsilon(1e-15));
  CHECK(a.exact == 90);
  CHECK(a.how.rfind("identified from witness A (90 of 90 entries exact, 90 within one unit, score ",
                    0) == 0);
  CHECK(a.how.find("e = 2;30 adopted (round, 1 place)") != std::string::npos);

  ReferenceRequest bad = given;
  bad.model = "nonesuch";
  CHECK_THROWS_AS(ResolveReferences({s.table}, bad), InputError);
  ReferenceRequest none;
  CHECK_THROWS_AS(ResolveReferences({s.table}, none), InputError);
}

TEST_CASE("judgements: slips are errors, the author's departures are not, look-alikes are common") {
  auto s = Table();
  const auto conf = s.Row(30);  // tens of seconds 4 <-> 5 or the like: one symbol
  const auto far = s.Row(50);   // a distinctive error: minutes and seconds changed
  const auto blank = s.Row(70);
  const auto original = *s.table.rows[conf].cells[0].value;
  const auto digits = original.FractionDigits();
  s.Set(conf,
        Sexagesimal::FromParts(false, original.IntegerPart(), {digits[0], (digits[1] + 10) % 60})
            .ToString());
  s.Set(far, "0;0,1");
  s.Set(blank, "_");
  ReferenceRequest r;
  r.model = "solar-eccentric";
  r.params = {{"e", 2.5}};
  const auto refs = ResolveReferences({s.table}, r);
  const auto script = deviation::FindNumeralScript("hindu-arabic", kScripts);
  const auto found = ExplainWitness(s.table, refs, script);
  REQUIRE(found.checks.size() == 1);
  CHECK(found.checks[0].summary.exact == 87);
  const auto grid = JudgementsFromFindings(s.table, refs, found.findings);
  REQUIRE(grid.size() == 90);
  CHECK_FALSE(grid[0][0]->error);
  CHECK(grid[0][0]->computed == s.values.computed[0]);
  REQUIRE(grid[far][0].has_value());
  CHECK(grid[far][0]->error);
  CHECK_FALSE(grid[far][0]->common_slip);
  REQUIRE(grid[blank][0].has_value());
  CHECK(grid[blank][0]->error);
  CHECK(grid[blank][0]->cause == "blank");
  CHECK_FALSE(grid[blank][0]->slip.empty());
  REQUIRE(grid[conf][0].has_value());
  CHECK(grid[conf][0]->error);
  const bool confusion = grid[conf][0]->cause == "confusion";
  CHECK(grid[conf][0]->common_slip == confusion);
}

TEST_CASE("judgements: a departure the author's practice explains is a right reading") {
  auto s = Table();
  // One unit off where the exact value lies near a rounding boundary, as an
  // author computing slightly differently would write it.
  std::size_t row = 0;
  for (; row < s.table.rows.size(); ++row) {
    const double units = s.values.exact[row] * 3600;
    if (std::fabs(units - std::floor(units) - 0.5) < 0.03) break;
  }
  REQUIRE(row < s.table.rows.size());
  const auto v = *s.table.rows[row].cells[0].value;
  const bool up = s.values.exact[row] * 3600 > std::round(s.values.exact[row] * 3600);
  s.Set(row, (v + Sexagesimal::FromUnits(up ? 1 : -1, 2)).ToString());
  ReferenceRequest r;
  r.model = "solar-eccentric";
  r.params = {{"e", 2.5}};
  const auto refs = ResolveReferences({s.table}, r);
  const auto found =
      ExplainWitness(s.table, refs, deviation::FindNumeralScript("hindu-arabic", kScripts));
  REQUIRE(found.findings.size() == 1);
  INFO(found.findings[0].Note("A"));
  REQUIRE(found.findings[0].best().cls == deviation::SlipClass::kComputational);
  const auto grid = JudgementsFromFindings(s.table, refs, found.findings);
  CHECK_FALSE(grid[row][0]->error);
  CHECK(grid[row][0]->cause == "computational");
  CHECK_FALSE(grid[row][0]->slip.empty());
  CHECK(found.Departures() == 1);
  CHECK(found.CopyingSlips() == 0);
}

}  // namespace
}  // namespace apograph::pipeline
