// A planet's free fit started again from the fit under the attested set
// (round_sets.cpp, RestartFromAttestedSet), and a rate's rounding left
// unadopted where the entries barely tell it from the rounding beside it
// (round_values.cpp, FirstAcceptable, kRoundingMargin).
#include <doctest/doctest.h>

#include <cmath>

#include "estimate/fit.hpp"
#include "estimate/identify.hpp"
#include "model/builtin.hpp"
#include "model_columns.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

using testing::D;

/// The adopted value of `param` in `c`, or none.
const AdoptedValue* AdoptedOf(const Candidate& c, const std::string& param) {
  if (!c.adoption) return nullptr;
  for (const auto& a : c.adoption->values) {
    if (a.param == param) return &a;
  }
  return nullptr;
}

}  // namespace

TEST_CASE("a planet's free fit over a short arc reaches the author's basin from the attested set") {
  // Two outer planets with a large epicycle and an inner one, all on a
  // circular deferent with the catalog's radius (radii and daily rates from
  // memory), by day over 105, 66 and 90 days, two places, a fifth of the
  // entries corrupted (seeds 1..6), identified among planets with the
  // catalog. Right: the free fit reproduces exactly at least as many
  // entries, less two, as the fit started at the author's own values.
  // Measured: 8 of 18 from the fit's own starts, 16 from the attested set.
  const model::Model& m = *model::FindBuiltinModel("planet-position");
  const std::vector<std::vector<double>> planets = {
      {D("248;23"), D("0;31,26,36,54"), D("37;38"), D("0;27,41,40,19"), 0, 0, D("39;30"), 360},
      {D("256;29"), D("0;31,26,36,54"), D("4;5"), D("0;27,41,40,19"), 0, 0, D("39;30"), 360},
      {D("85;48"), D("0;59,8,17,13"), D("319;54"), D("0;36,59,25,53"), 0, 0, D("43;10"), 360}};
  const int days[] = {105, 66, 90};
  IdentifyOptions o;
  o.models = {&m};
  o.catalog = &testing::Catalog();
  int right = 0;
  for (std::size_t k = 0; k < planets.size(); ++k) {
    for (unsigned seed = 1; seed <= 6; ++seed) {
      const Transcription t = testing::CorruptAFifth(
          testing::MakeTable("p", 1, 1, days[k],
                             {testing::FromModel("planet-position", planets[k], 2)}),
          seed);
      const Identification id = Identify(t, 0, o);
      REQUIRE(!id.ranked.empty());
      FitOptions from_author;
      for (std::size_t j = 0; j < planets[k].size(); ++j)
        from_author.start[m.params()[j].name] = planets[k][j];
      from_author.fixed["modulus"] = 360;
      const FitResult author = Fit(m, t, std::vector<int>{}, from_author);
      CAPTURE(k);
      CAPTURE(seed);
      CAPTURE(id.ranked[0].fit.exact);
      CAPTURE(author.exact);
      right += id.ranked[0].fit.exact >= author.exact - 2;
    }
  }
  CHECK(right >= 14);
}

TEST_CASE("a rate's rounding the entries barely tell from its neighbour is left fitted") {
  // Mean motions of six places (a planet's daily motions in longitude and in
  // anomaly, from memory; none in the catalog for this model), 60 rows
  // every 5, 10 and 20 days, two places, a fifth of the entries corrupted
  // (seeds 1..3): the rate is fixed to about a unit of its fourth place.
  // Right (as identify_accuracy_bench counts it): the author's rate
  // adopted, or left fitted within 2 standard errors of it. Measured: 0 of
  // 36 adopting the rounding that reproduces most entries exactly, 3 with
  // no tie adopted, 9 with a margin of 2 entries.
  const std::vector<std::vector<double>> columns = {{D("37;12"), D("0;31,26,36,53,51,33"), 360},
                                                    {D("201;40"), D("0;27,41,40,19,20,58"), 360},
                                                    {D("118;5"), D("0;36,59,25,53,11,28"), 360},
                                                    {D("300;31"), D("0;4,59,14,26,46,31"), 360}};
  IdentifyOptions o;
  o.models = {model::FindBuiltinModel("mean-motion")};
  o.catalog = &testing::Catalog();
  int right = 0;
  for (int step : {5, 10, 20}) {
    for (const auto& c : columns) {
      for (unsigned seed = 1; seed <= 3; ++seed) {
        const Transcription t = testing::CorruptAFifth(
            testing::MakeTable("m", step, step, 60, {testing::FromModel("mean-motion", c, 2)}),
            seed);
        const Identification id = Identify(t, 0, o);
        REQUIRE(!id.ranked.empty());
        const FittedParam& rate = id.ranked[0].fit.params[1];
        const AdoptedValue* adopted = AdoptedOf(id.ranked[0], rate.name);
        CAPTURE(step);
        CAPTURE(seed);
        CAPTURE(rate.value);
        right += adopted ? std::fabs(adopted->value - c[1]) < 1e-12
                         : std::fabs(rate.value - c[1]) <= 2 * rate.stderr_;
      }
    }
  }
  CHECK(right >= 6);
}

}  // namespace apograph::estimate
