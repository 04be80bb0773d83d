// A planet's fit also starts from the same fit with the eccentricity held
// at 0 (fit.cpp, CircularStart): near e = 0 the apogee turns freely and
// the free fit's steps wandered along the ridge of the two rates over a
// short arc into another basin.
#include <doctest/doctest.h>

#include <cmath>

#include "estimate/fit.hpp"
#include "model_columns.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {

TEST_CASE("a planet on a circular deferent is fitted in the author's basin") {
  // Three planets with e = 0 (radii and daily rates from memory: an outer
  // planet with a large epicycle, an inner one, a slow outer one), by day
  // over 110 days, two places, a fifth of the entries corrupted (seeds
  // 1..4): 12 fits from the model's own starts. Right: both rates within
  // 2% of the author's and three quarters of the entries reproduced
  // exactly. Before the circular start 0 of 12 (the first planet ended
  // with e = 9 and a rate of 0;20, the third with its rates 2 to 9% off);
  // after, 7 of 12 (one draw of the first planet 2.8% off in anomaly; the
  // inner planet, open, still ends at e = 3;33 with
  // its anomaly's rate 0;58,45 for 0;36,59).
  const model::Model& m = *model::FindBuiltinModel("planet-position");
  const auto& planets = testing::CircularPlanets();
  int right = 0;
  for (const auto& p : planets) {
    for (unsigned seed = 1; seed <= 4; ++seed) {
      const Transcription t = testing::ShortArc(p, seed);
      const FitResult fit = Fit(m, t, std::vector<int>{}, FitOptions{});
      const bool rates = std::fabs(fit.Value("rate") - p[1]) <= 0.02 * p[1] &&
                         std::fabs(fit.Value("anomaly-rate") - p[3]) <= 0.02 * p[3];
      CAPTURE(p[1]);
      CAPTURE(seed);
      CAPTURE(fit.exact);
      CAPTURE(fit.Value("rate"));
      CAPTURE(fit.Value("anomaly-rate"));
      right += rates && fit.exact * 4 >= fit.n * 3;
    }
  }
  CHECK(right >= 7);
}

}  // namespace apograph::estimate
