// Round values of an equivalent model: an equation of anomaly computed at
// the epicycle's greatest or least distance computes what an epicycle at
// mean distance of radius 60 r/(60 +- e) computes; the author's round or
// attested r and e give that radius, which no sexagesimal rounding of the
// estimate reaches. Small tables of their own, slips drawn by seeds
// written here.
#include <doctest/doctest.h>

#include <cmath>
#include <random>

#include "estimate/catalog.hpp"
#include "estimate/identify.hpp"
#include "model_columns.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

using testing::D;

/// Three slips of up to 40 units at rows drawn by `seed`.
void Slips(testing::SyntheticColumn& c, unsigned seed, int rows) {
  std::mt19937 rng(seed);
  std::uniform_int_distribution<int> row(0, rows - 1), units(-40, 40);
  for (int k = 0; k < 3; ++k) c.errors[row(rng)] = units(rng) | 1;
}

/// The radius at mean distance the identification gives (that of the named
/// model, or the one its r and e at greatest or least distance compute).
double RadiusAtMean(const Candidate& c) {
  const FitResult fit = c.Final();
  const std::string& name = c.model->name();
  if (name == "epicycle-anomaly-greatest") return 60 * fit.Value("r") / (60 + fit.Value("e"));
  if (name == "epicycle-anomaly-least") return 60 * fit.Value("r") / (60 - fit.Value("e"));
  return fit.Value("r");
}

}  // namespace

TEST_CASE("an equation of anomaly at greatest or least distance gets its author's r and e") {
  // Mars-like and Venus-like figures (from memory: r = 39;30 with e = 6,
  // r = 43;10 with e = 1;15) and round ones (r = 45 or 20 with e = 2;
  // common practice), at the greatest or least distance, by degree over
  // 1..180, two places, three slips by seeds 1..3. Before, the radius at
  // mean distance was adopted at a rounding (44;5 for 60 43;10/58;45 =
  // 44;5,6,22,..) or left fitted: 0 of 12 right.
  struct Case {
    const char *model, *r, *e;
  };
  int right = 0, tried = 0;
  for (const Case& k :
       {Case{"epicycle-anomaly-greatest", "39;30", "6"},
        Case{"epicycle-anomaly-least", "43;10", "1;15"}, Case{"epicycle-anomaly-least", "45", "2"},
        Case{"epicycle-anomaly-greatest", "20", "2"}}) {
    const bool greatest = std::string(k.model) == "epicycle-anomaly-greatest";
    const double r = D(k.r), e = D(k.e);
    const double expected = 60 * r / (greatest ? 60 + e : 60 - e);
    for (unsigned seed = 1; seed <= 3; ++seed) {
      auto c = testing::FromModel(k.model, {r, e}, 2);
      Slips(c, seed, 180);
      IdentifyOptions o;
      o.catalog = &testing::Catalog();
      const Identification id = Identify(testing::MakeTable("anomaly", 1, 1, 180, {c}), 0, o);
      CAPTURE(k.model);
      CAPTURE(k.r);
      CAPTURE(seed);
      REQUIRE(!id.ranked.empty());
      CAPTURE(id.ranked[0].model->name());
      const double got = RadiusAtMean(id.ranked[0]);
      CAPTURE(got);
      ++tried;
      right += id.explained && std::fabs(got - expected) <= 1e-9 * expected;
    }
  }
  CHECK(right == tried);
}

}  // namespace apograph::estimate
