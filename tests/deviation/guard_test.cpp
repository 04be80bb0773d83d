// The guard's trend test: rows most witnesses flag on a smooth hill of the
// tradition's difference from the model refuse the reference; a copy's run
// that jumps at once to its size, or rows few witnesses flag, do not. The
// agreed-run test: consecutive rows most witnesses read alike where no slip
// reaches their reading refuse it.
#include "deviation/guard.hpp"

#include <doctest/doctest.h>

using namespace apograph::deviation;

namespace {

/// Rows with the given median differences; `flagged` rows flagged by 3 of 4
/// readers, the rest by none.
std::vector<TrendRow> Rows(const std::vector<double>& units, const std::vector<int>& flagged) {
  std::vector<TrendRow> out;
  for (std::size_t i = 0; i < units.size(); ++i) out.push_back({std::to_string(i), units[i], 4, 0});
  for (int r : flagged) out[static_cast<std::size_t>(r)].flaggers = 3;
  return out;
}

}  // namespace

TEST_CASE("guard: a difference growing smoothly from the author's rounding refuses the reference") {
  // A mean motion's rate slightly off: 1 1 1 2 2 2 3 3, then back to 0.
  const auto rows = Rows({0, 0, 0, 1, 1, 1, 2, 2, 2, 3, 3, 0, 0}, {6, 7, 8, 9, 10});
  const auto v = GuardTrend(rows);
  CHECK_FALSE(v.explains);
  CHECK(v.consensus);
  CHECK(v.flagged == 5);
  CHECK(v.why.find("6 to 10") != std::string::npos);
}

TEST_CASE("guard: a run that jumps at once to its size is a copy's, not the reference's") {
  // A constant error of 5 units over five rows, read by most witnesses
  // (inherited from a lost ancestor): it does not grow out of the rounding.
  CHECK(GuardTrend(Rows({0, 0, 1, 5, 5, 5, 5, 5, 0, 0}, {3, 4, 5, 6, 7})).explains);
  // Steps of more than one unit inside the hill are not smooth either.
  CHECK(GuardTrend(Rows({0, 1, 3, 5, 3, 1, 0}, {2, 3, 4})).explains);
}

TEST_CASE("guard: a smooth hill that few witnesses flag, or too few rows, is no evidence") {
  auto rows = Rows({0, 1, 2, 3, 3, 2, 1, 0}, {});
  for (int r : {2, 3, 4}) rows[static_cast<std::size_t>(r)].flaggers = 2;  // half, not most
  CHECK(GuardTrend(rows).explains);
  CHECK(GuardTrend(Rows({0, 1, 2, 3, 3, 2, 1, 0}, {3, 4})).explains);  // two rows only
  CHECK_FALSE(GuardTrend(Rows({0, 1, 2, 3, 3, 2, 1, 0}, {2, 3, 4})).explains);
  // Rows flagged within the author's rounding say nothing of the reference.
  CHECK(GuardTrend(Rows({0, 1, 1, 1, 0}, {1, 2, 3})).explains);
  // Three rows beyond the rounding, but on two hills: no one trend.
  CHECK(GuardTrend(Rows({0, 1, 2, 2, 1, 0, 1, 2, 1, 0}, {2, 3, 7})).explains);
}

TEST_CASE("guard: a ramp broken by one of the author's departures is still one trend") {
  // 1 1 1 2 2 2 3 3 with the author's -1 at one row: unsmoothed, the ramp
  // falls into two hills, neither starting within a unit with three rows
  // beyond it; the running median of three rows joins them.
  const auto rows = Rows({0, 1, 1, 1, 2, 2, -1, 2, 3, 3, 3, 0}, {4, 5, 6, 7, 8, 9, 10});
  CHECK_FALSE(GuardTrend(rows).explains);
  // A ramp that accelerates (a parameter off where the function is steep).
  CHECK_FALSE(GuardTrend(Rows({0, 1, 2, 3, 4, 6, 8, 11, 0}, {2, 3, 4, 5, 6, 7})).explains);
}

TEST_CASE("guard: a difference proportional to irregular arguments is a rate's error") {
  // A mean motion's rate off: 3, 7, 10, 33 units at 1000, 2000, 3000 and
  // 10000 years, after rows within the rounding.
  auto rows = Rows({0, 0, 0, 3, 7, 10, 33}, {3, 4, 5, 6});
  const double xs[] = {10, 100, 900, 1000, 2000, 3000, 10000};
  for (std::size_t i = 0; i < rows.size(); ++i) rows[i].x = xs[i];
  CHECK_FALSE(GuardTrend(rows).explains);
  // The same sizes at arguments close together are a copy's run, not a rate.
  for (std::size_t i = 0; i < rows.size(); ++i) rows[i].x = 20.0 + static_cast<double>(i);
  CHECK(GuardTrend(rows).explains);
  // A constant error inherited by most witnesses is no trend at any argument.
  auto flat = Rows({0, 0, 0, 5, 5, 5, 5}, {3, 4, 5, 6});
  for (std::size_t i = 0; i < flat.size(); ++i) flat[i].x = xs[i];
  CHECK(GuardTrend(flat).explains);
}

TEST_CASE("guard: a run of rows most witnesses read alike, no slip reaching it, refuses") {
  // A difference column whose reference misses a block of ten rows by about
  // half a degree (the rest right): every witness reads the author's values
  // there and no listed slip reaches them from the model's. It jumps at once
  // to its size, so the trend test lets it through.
  std::vector<double> units(40, 0);
  for (int r = 15; r < 25; ++r) units[static_cast<std::size_t>(r)] = -93800 - 3500.0 * (r - 15);
  auto rows = Rows(units, {});
  for (int r = 15; r < 25; ++r) {
    auto& row = rows[static_cast<std::size_t>(r)];
    row.flaggers = 4;
    row.unexplained = r == 17 ? 3 : 4;  // one row: one of them misread there
  }
  CHECK(GuardTrend(rows).explains);
  auto v = GuardAgreedRun(rows);
  CHECK_FALSE(v.explains);
  CHECK(v.flagged == 10);
  CHECK(v.why.find("15 to 24") != std::string::npos);
}

TEST_CASE("guard: unexplained readings of one witness, or of a few rows, are a copy's") {
  auto rows = Rows(std::vector<double>(20, 0), {4, 5, 6, 7});
  for (int r : {4, 5, 6, 7}) rows[static_cast<std::size_t>(r)].unexplained = 1;  // one of four
  CHECK(GuardAgreedRun(rows).explains);
  for (int r : {4, 5}) rows[static_cast<std::size_t>(r)].unexplained = 3;  // two rows only
  CHECK(GuardAgreedRun(rows).explains);
  rows[6].unexplained = 3;  // three consecutive rows
  CHECK_FALSE(GuardAgreedRun(rows).explains);
  // Rows explained as a slip (a run inherited from a lost ancestor) do not count.
  auto slips = Rows(std::vector<double>(20, 0), {4, 5, 6, 7, 8});
  CHECK(GuardAgreedRun(slips).explains);
}
