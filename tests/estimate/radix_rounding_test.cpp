// A mean motion's whole radix decides the practice: a radix half a unit
// below a whole value under rounding computes what the whole value
// computes under truncation (round_values.cpp, AdoptRoundValues).
#include <doctest/doctest.h>

#include <cmath>
#include <random>

#include "estimate/identify.hpp"
#include "model_columns.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

using testing::D;

}  // namespace

TEST_CASE("a truncated mean motion from radix 0 gets radix 0") {
  // Mean motions per month from 0 (five daily rates from memory: two in
  // anomaly, the sun's, the moon's in anomaly, a slow planet's; times
  // 29;31,50,8,20 days, brought to six places), 12 months, three and four
  // places truncated, whole or with slips of up to 40 units at two rows
  // drawn by seeds 1..3: 40 tables. The rounded practice with a radix of
  // 359;59,59,59,30 ties with the truncated one and is often named first;
  // 0 was then refused where the rate could not make up for it: radix 0
  // adopted in 26 of 40 before, 40 of 40 after (the entries then said
  // truncated where only truncation keeps them).
  const double month = D("29;31,50,8,20");
  int right = 0;
  for (const char* daily : {"0;36,59,25,53", "0;31,26,36,54", "0;59,8,17,13,12,31",
                            "13;3,53,56,17,51,59", "0;2,0,33,31"}) {
    const double rate = Sexagesimal::FromDouble(std::fmod(D(daily) * month, 360.0), 6).ToDouble();
    for (int places : {3, 4}) {
      for (unsigned seed = 0; seed <= 3; ++seed) {
        auto c = testing::FromModel("mean-motion-months", {0, rate, 360}, places);
        c.rounding = Rounding::kTruncate;
        c.modulo_360 = true;
        std::mt19937 rng(seed);
        std::uniform_int_distribution<int> row(0, 11), units(-40, 40);
        for (int k = 0; k < 2 && seed > 0; ++k) c.errors[row(rng)] = units(rng) | 1;
        IdentifyOptions o;
        o.catalog = &testing::Catalog();
        const Identification id = Identify(testing::MakeTable("mm", 1, 1, 12, {c}), 0, o);
        REQUIRE(!id.ranked.empty());
        const Candidate& best = id.ranked[0];
        bool zero = false;
        if (best.adoption) {
          for (const auto& v : best.adoption->values)
            zero = zero || (v.param == "radix" && std::fmod(v.value, 360.0) == 0);
        }
        CAPTURE(daily);
        CAPTURE(places);
        CAPTURE(seed);
        CAPTURE(best.model->name());
        right += zero;
      }
    }
  }
  CHECK(right == 40);
}

}  // namespace apograph::estimate
