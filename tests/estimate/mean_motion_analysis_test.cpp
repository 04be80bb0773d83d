#include "estimate/mean_motion_analysis.hpp"

#include <doctest/doctest.h>

#include "estimate/fit.hpp"
#include "model/model.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

Transcription Table(const std::vector<std::pair<int, const char*>>& rows, int places) {
  Transcription t;
  t.table_id = "mean-motion";
  t.argument = {"days", "days", 0, std::nullopt, std::nullopt};
  t.columns.push_back({"motion", "deg", places, "", std::nullopt});
  for (const auto& [a, v] : rows) {
    Row row;
    row.argument.value = Sexagesimal::FromUnits(a, 0);
    row.argument.raw = std::to_string(a);
    Cell cell;
    cell.value = Sexagesimal::ParseOrThrow(v);
    cell.raw = v;
    cell.places = places;
    row.cells.push_back(cell);
    t.rows.push_back(row);
  }
  return t;
}

const MeanMotionEntry& At(const MeanMotionAnalysis& a, double arg) {
  for (const auto& e : a.entries) {
    if (e.arg == arg) return e;
  }
  FAIL("no entry at " << arg);
  return a.entries.front();
}

}  // namespace

// Published check. Source: Maimonides, *Mishneh Torah*, Laws of the
// Sanctification of the New Moon 13:4 (12th century; values as printed in
// the standard text and in two public English translations, which agree);
// same source, 12:1 (the sun's mean motion).
TEST_CASE(
    "published mean-motion table: 1000 and 10000 days are ten times the rounded entry above; 354 "
    "unexplained") {
  const Transcription t = Table({{1, "0;59,8"},
                                 {10, "9;51,23"},
                                 {100, "98;33,53"},
                                 {1000, "265;38,50"},
                                 {10000, "136;28,20"},
                                 {29, "28;35,1"},
                                 {354, "348;55,15"}},
                                2);
  const MeanMotionAnalysis a = AnalyseMeanMotion(t, 0);
  CHECK_FALSE(a.radix_present);
  CHECK(a.rounding == Rounding::kNearest);
  const auto& e1000 = At(a, 1000);
  CHECK(e1000.origin == EntryOrigin::kMultiple);
  REQUIRE(e1000.from.size() == 1);
  CHECK(t.rows[e1000.from[0]].argument.value->ToDouble() == 100);
  CHECK(e1000.evidence.find("10 x 98;33,53") != std::string::npos);
  CHECK(e1000.evidence.find("985;38,50, less 2 x 360 = 265;38,50") != std::string::npos);
  const auto& e10000 = At(a, 10000);
  CHECK(e10000.origin == EntryOrigin::kMultiple);
  CHECK(e10000.evidence.find("2656;28,20, less 7 x 360 = 136;28,20") != std::string::npos);
  CHECK(At(a, 354).origin == EntryOrigin::kUnexplained);
  CHECK(a.unexplained == 1);
  for (double arg : {1.0, 10.0, 100.0, 29.0}) CHECK(At(a, arg).origin == EntryOrigin::kDirect);
  // The direct entries pin the rate near 0;59,8,19,3x.
  CHECK(a.rate_low > 0.98564);
  CHECK(a.rate_high < 0.98565);
  CHECK(a.verdict.find("Unexplained: 354") != std::string::npos);
}

TEST_CASE("a table made by multiplying a rounded rate: the rate and its places are found exactly") {
  // rate 0;59,8,20 (3 places), entries at seconds for days 1..40, rounded.
  const Sexagesimal rate = Sexagesimal::ParseOrThrow("0;59,8,20");
  std::vector<std::pair<int, std::string>> rows;
  for (int d = 1; d <= 40; ++d) rows.push_back({d, (rate * d).Rounded(2).Modulo(360).ToString()});
  std::vector<std::pair<int, const char*>> view;
  for (const auto& [d, s] : rows) view.push_back({d, s.c_str()});
  const MeanMotionAnalysis a = AnalyseMeanMotion(Table(view, 2), 0);
  CHECK(a.unexplained == 0);
  REQUIRE(a.rounded_rate);
  CHECK(a.rounded_rate->Identical(rate));
  CHECK_FALSE(a.successive_addition);
}

TEST_CASE("successive addition of a rounded unit value: error grows along the table") {
  // Exact rate 0;59,8,19,48; each entry = previous + 0;59,8 (the rounded 1-day value).
  std::vector<std::string> vals;
  Sexagesimal v = Sexagesimal::ParseOrThrow("0;59,8");
  for (int d = 1; d <= 30; ++d) {
    vals.push_back(v.Modulo(360).ToString());
    v = v + Sexagesimal::ParseOrThrow("0;59,8");
  }
  std::vector<std::pair<int, const char*>> view;
  for (int d = 1; d <= 30; ++d) view.push_back({d, vals[static_cast<std::size_t>(d - 1)].c_str()});
  const MeanMotionAnalysis a = AnalyseMeanMotion(Table(view, 2), 0);
  CHECK(a.successive_addition);
  REQUIRE(a.unit_value);
  CHECK(a.unit_value->ToString() == "0;59,8");
  CHECK(a.verdict.find("successive addition") != std::string::npos);
}

TEST_CASE("successive addition is found through a few copying slips, which are named") {
  // Entries = d x 0;59,8,20 (the rounded daily motion, 3 places); a copyist
  // transposed the minutes at 19 (18;34 for 18;43) and repeated 23 at 24.
  std::vector<std::string> vals;
  const Sexagesimal daily = Sexagesimal::ParseOrThrow("0;59,8,20");
  for (int d = 1; d <= 40; ++d) vals.push_back((daily * d).Modulo(360).ToString());
  vals[18] = "18;34,38,20";
  vals[23] = vals[22];
  std::vector<std::pair<int, const char*>> view;
  for (int d = 1; d <= 40; ++d) view.push_back({d, vals[static_cast<std::size_t>(d - 1)].c_str()});
  const MeanMotionAnalysis a = AnalyseMeanMotion(Table(view, 3), 0);
  CHECK(a.successive_addition);
  REQUIRE(a.unit_value);
  CHECK(a.unit_value->ToString() == "0;59,8,20");
  CHECK(a.successive_exceptions == std::vector<std::string>{"19", "24"});
  CHECK(a.verdict.rfind("Built from the rounded unit value 0;59,8,20: 38 of 40 entries", 0) == 0);
}

TEST_CASE("fitting a mean motion to seconds of seconds finds the rate's narrow basin") {
  // 40 days at 3 places: a rate off by 1e-6 deg/day is already 9 units off at
  // the end, far narrower than any grid over the rate's historical range.
  std::vector<std::string> vals;
  const Sexagesimal daily = Sexagesimal::ParseOrThrow("0;59,8,20");
  for (int d = 1; d <= 40; ++d) vals.push_back((daily * d).Modulo(360).ToString());
  vals[18] = "18;34,38,20";  // one copying slip
  std::vector<std::pair<int, const char*>> view;
  for (int d = 1; d <= 40; ++d) view.push_back({d, vals[static_cast<std::size_t>(d - 1)].c_str()});
  const Transcription t = Table(view, 3);
  const FitResult r =
      Fit(*model::FindBuiltinModel("mean-motion"), t, std::vector<int>{0}, FitOptions{});
  CHECK(r.exact == 39);
  CHECK(std::fabs(r.Value("rate") - daily.ToDouble()) < 1e-7);
}

TEST_CASE("a mean motion with a radix at argument 0 wraps past 360 and keeps its radix") {
  const Sexagesimal radix = Sexagesimal::ParseOrThrow("280;10,5");
  const Sexagesimal rate = Sexagesimal::ParseOrThrow("13;10,35,1,48");
  std::vector<std::string> vals;
  for (int d = 0; d <= 60; ++d)
    vals.push_back((radix + rate * d).Rounded(2).Modulo(360).ToString());
  std::vector<std::pair<int, const char*>> view;
  for (int d = 0; d <= 60; ++d) view.push_back({d, vals[static_cast<std::size_t>(d)].c_str()});
  const MeanMotionAnalysis a = AnalyseMeanMotion(Table(view, 2), 0);
  CHECK(a.radix_present);
  CHECK(a.radix.ToString() == "280;10,5");
  CHECK(a.unexplained == 0);
  CHECK(a.rate_low <= rate.ToDouble());
  CHECK(rate.ToDouble() <= a.rate_high);
  CHECK(std::fabs(a.rate - rate.ToDouble()) < 4 * a.rate_stderr + 1e-12);
}

}  // namespace apograph::estimate
