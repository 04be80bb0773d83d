// A planet's screen fit is given more steps than other tables of positions
// (identify.cpp, Screen): over a short arc its valley is long and curved,
// and at 60 steps the solver stopped half way along it, so that every
// refit started from the wrong place.
#include <doctest/doctest.h>

#include <cmath>

#include "estimate/identify.hpp"
#include "model/builtin.hpp"
#include "model_columns.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

using testing::D;

/// Parameters of `fit` within 2 standard errors of `p` (the model's order,
/// the modulus left out; angles compared on the circle).
int Within(const FitResult& fit, const std::vector<double>& p) {
  int n = 0;
  for (std::size_t j = 0; j + 1 < p.size(); ++j) {
    double d = std::fabs(fit.params[j].value - p[j]);
    if (j == 0 || j == 2 || j == 4) d = std::min(std::fmod(d, 360.0), 360 - std::fmod(d, 360.0));
    n += std::isfinite(fit.params[j].stderr_) && d <= 2 * fit.params[j].stderr_;
  }
  return n;
}

}  // namespace

TEST_CASE("a planet with an eccentric deferent is fitted along its valley to the author's values") {
  // Planets on an eccentric deferent (radii, eccentricities, apogees and
  // daily rates from memory: a slow outer planet every 10 days over 530
  // days, the same over 760 days, an inner planet of fast anomaly by day
  // over 79 days), two places, a fifth of the entries corrupted (seeds
  // 1..4), identified among planets only, no values adopted. Counted: the
  // free fit's parameters within 2 standard errors of the author's (7 per
  // table, 84 in all): 23 with the screen's 60 steps, 43 with 150 (the
  // second planet, open, in another basin either way).
  const std::vector<std::vector<double>> planets = {
      {D("306;54"), D("0;2,0,33,31"), D("334;58"), D("0;57,7,43,41"), D("229;14"), D("3;25"),
       D("6;30"), 360},
      {D("182;23"), D("0;2,0,33,31"), D("9;51"), D("0;57,7,43,41"), 233, D("3;25"), D("6;30"), 360},
      {D("269;33"), D("0;59,8,17,13"), D("176;39"), D("3;6,24,6,59"), 190, 3, D("22;30"), 360}};
  const std::vector<std::vector<double>> grids = {{10, 10, 54}, {10, 10, 77}, {1, 1, 79}};
  IdentifyOptions o;
  o.models = {model::FindBuiltinModel("planet-position")};
  o.adopt_round_values = false;
  int right = 0;
  for (std::size_t k = 0; k < planets.size(); ++k) {
    for (unsigned seed = 1; seed <= 4; ++seed) {
      const Transcription t = testing::CorruptAFifth(
          testing::MakeTable("p", grids[k][0], grids[k][1], static_cast<int>(grids[k][2]),
                             {testing::FromModel("planet-position", planets[k], 2)}),
          seed);
      const Identification id = Identify(t, 0, o);
      REQUIRE(!id.ranked.empty());
      CAPTURE(k);
      CAPTURE(seed);
      right += Within(id.ranked[0].fit, planets[k]);
    }
  }
  CHECK(right >= 36);
}

}  // namespace apograph::estimate
