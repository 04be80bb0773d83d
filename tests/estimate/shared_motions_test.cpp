// One motion, one rate: the columns of a table of positions by date are
// computed from the same mean motions, and a column that fixes a rate
// poorly (an equation of two places) takes the value a better column of
// the table (the mean motion) adopted, when its own entries keep the fit.
#include <doctest/doctest.h>

#include <cmath>
#include <random>
#include <vector>

#include "estimate/identify.hpp"
#include "model_columns.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

using testing::D;

/// A true sun's table by day (days 1..`days`): the solar equation (column
/// 0, slips drawn with `seed` in a tenth of its rows) and the mean sun
/// (column 1), both to two places, computed with one rate.
Transcription SunByDay(double rate, double radix, double apogee, double e, int days,
                       unsigned seed) {
  testing::SyntheticColumn equation = testing::FromModel(
      "solar-equation-by-date", {std::fmod(radix - apogee + 360, 360), rate, e}, 2);
  equation.name = "equation";
  std::mt19937 rng(seed);  // slips in a tenth of the rows, 2 to 30 units each way
  std::uniform_int_distribution<int> row(0, days - 1), units(2, 30), sign(0, 1);
  for (int k = 0; k < days / 10; ++k) equation.errors[row(rng)] = units(rng) * (sign(rng) ? 1 : -1);
  testing::SyntheticColumn mean = testing::FromModel("mean-motion", {radix, rate, 360}, 2);
  mean.name = "mean";
  mean.modulo_360 = true;
  Transcription t = testing::MakeTable("sun", 1, 1, days, {equation, mean});
  t.argument.name = "days";
  return t;
}

}  // namespace

TEST_CASE("the column of the solar equation takes the rate the mean sun's column adopted") {
  // Two suns by day over 40 days (rates of three places as an author
  // rounded them, radices and apogees as drawn, an eccentricity round and
  // one attested), each with slips of 2 to 30 units in a tenth of the
  // equation's entries (seeds 1..6). Alone, the equation (two places: its
  // rate known to about 1e-5 degrees a day) adopts a coarser rounding of
  // the rate, or leaves it fitted; the mean column fixes it to about 1e-7
  // and adopts the author's. Measured: the equation's rate right alone in
  // 0 of 12, with the mean column's adoption shared 12 of 12.
  struct Sun {
    const char *rate, *radix, *apogee, *e;
  };
  const std::vector<Sun> suns = {{"0;31,26,37", "285;19", "80", "2;30"},
                                 {"3;6,24,7", "342;47", "65;30", "2;4,45"}};
  int alone = 0, shared = 0;
  for (const Sun& sun : suns) {
    for (unsigned seed = 1; seed <= 6; ++seed) {
      const Transcription t =
          SunByDay(D(sun.rate), D(sun.radix), D(sun.apogee), D(sun.e), 40, seed);
      IdentifyOptions o;
      o.catalog = &testing::Catalog();
      std::vector<Candidate> bests;
      for (int c = 0; c < 2; ++c) {
        const Identification id = Identify(t, c, o);
        REQUIRE(!id.ranked.empty());
        bests.push_back(id.ranked[0]);
      }
      auto right = [&](const Candidate& b) {
        if (b.model->name() != "solar-equation-by-date" || !b.adoption) return false;
        for (const auto& p : b.Final().params) {
          if (p.name == "anomaly-rate") return p.value == D(sun.rate);
        }
        return false;
      };
      CAPTURE(sun.rate);
      CAPTURE(seed);
      alone += right(bests[0]);
      std::vector<ColumnBest> columns = {{&t, 0, &bests[0]}, {&t, 1, &bests[1]}};
      ShareAdoptedValues(columns, &testing::Catalog());
      shared += right(bests[0]);
    }
  }
  CHECK(alone <= 2);  // the draws still show the problem
  CHECK(shared >= 11);
}

}  // namespace apograph::estimate
