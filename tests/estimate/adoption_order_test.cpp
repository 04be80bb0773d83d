// Which round values are adopted and in what order: whole values of every
// parameter before finer roundings of any, so that a rate held at a
// rounding the entries cannot tell from the author's does not push the
// others off their simple values; a latitude written in a column's heading
// before any other; the obliquity most columns of a table adopted tried in
// the others.
#include <doctest/doctest.h>

#include <cmath>

#include "estimate/fit.hpp"
#include "estimate/identify.hpp"
#include "model_columns.hpp"
#include "several_latitudes.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

using testing::D;

}  // namespace

TEST_CASE("a planet without eccentricity gets e = 0 although its rates are finer than rounded") {
  // A planet on a simple epicycle (e = 0; r = 11;30 from memory) with
  // daily rates of four places (0;4,59,14,27 and 0;54,9,2,46, from memory:
  // the generator's outer planet), every 10 days over 800 days, two places,
  // a fifth of the entries corrupted (seeds 1..8). The free fit ends at
  // a small e with some apogee; before, the anomaly's rate was adopted at
  // 0;54,9,3 first and e = 0 then lost entries against the fit (0 of 8
  // draws; 8 of 8 after).
  const model::Model& m = *model::FindBuiltinModel("planet-position");
  const std::vector<double> p = {D("318;43"), D("0;4,59,14,27"), D("218;8"), D("0;54,9,2,46"), 0,
                                 0,           D("11;30"),        360};
  int right = 0;
  for (unsigned seed = 1; seed <= 8; ++seed) {
    const Transcription t = testing::CorruptAFifth(
        testing::MakeTable("p", 10, 10, 80, {testing::FromModel("planet-position", p, 2)}), seed);
    FitOptions o;
    o.start = {{"radix", p[0]},
               {"rate", p[1]},
               {"anomaly-radix", p[2]},
               {"anomaly-rate", p[3]},
               {"apogee", 100},
               {"e", 0.003},
               {"r", p[6]}};
    const FitResult fit = Fit(m, t, std::vector<int>{}, o);
    const auto a = AdoptRoundValues(m, fit, t, 0, &testing::Catalog());
    bool zero = false;
    if (a) {
      for (const auto& v : a->values) zero = zero || (v.param == "e" && v.value == 0);
    }
    CAPTURE(seed);
    CAPTURE(fit.Value("e"));
    right += zero;
  }
  CHECK(right >= 7);
}

TEST_CASE(
    "each column of a table of several latitudes gets its written latitude and the obliquity") {
  // Ascensional differences for an obliquity of 23;50 (round) at six
  // latitudes written in the columns' headings, every 10 degrees of
  // longitude, one place, a fifth of the entries corrupted (seeds 1..3).
  // With the latitude free, obliquity and latitude lie on a ridge over 36
  // entries and each column took a simple pair along it: 2 of 18 right
  // before, 14 of 18 after (at 30;22 the column is named truncated, where
  // 23;35 with 30;40 reproduces as many entries as the author's pair
  // rounded; one draw at 48;32 is not identified).
  int right = 0;
  for (const char* lat : {"23;51", "30;22", "36", "40;56", "45;1", "48;32"}) {
    for (unsigned seed = 1; seed <= 3; ++seed) {
      Transcription t = testing::MakeTable(
          "asc", 10, 10, 36,
          {testing::FromModel("ascensional-difference", {D("23;50"), D(lat)}, 1)});
      t.argument2 = ArgumentSpec{"latitude", "deg", 1};
      t.columns[0].arg2 = Sexagesimal::ParseOrThrow(lat);
      IdentifyOptions o;
      o.catalog = &testing::Catalog();
      const Identification id = Identify(testing::CorruptAFifth(t, seed), 0, o);
      REQUIRE(!id.ranked.empty());
      const FitResult f = id.ranked[0].Final();
      CAPTURE(lat);
      CAPTURE(seed);
      right += id.ranked[0].model->name() == "ascensional-difference" &&
               f.Value("obliquity") == D("23;50") && f.Value("latitude") == D(lat);
    }
  }
  CHECK(right >= 14);
}

}  // namespace apograph::estimate

namespace apograph::estimate {

TEST_CASE("the obliquity most columns of a table adopted is tried in the others") {
  // One table of ascensional differences for an obliquity of 23;50 at six
  // latitudes written in the columns' headings, every 10 degrees, one
  // place, a fifth of the entries corrupted (seeds 1..4): each column
  // identified alone, then ShareAdoptedValues. Measured: 20 of 24 columns
  // with the author's obliquity and written latitude alone (the others
  // took another obliquity along the ridge, or truncation for rounding),
  // 24 of 24 with the value most columns adopted tried in the others.
  const std::vector<const char*>& lats = testing::SeveralLatitudes();
  int alone = 0, shared = 0;
  for (unsigned seed = 1; seed <= 4; ++seed) {
    const Transcription c = testing::SeveralLatitudesTable(seed);
    IdentifyOptions o;
    o.catalog = &testing::Catalog();
    std::vector<Candidate> bests;
    for (std::size_t i = 0; i < lats.size(); ++i) {
      const Identification id = Identify(c, static_cast<int>(i), o);
      REQUIRE(!id.ranked.empty());
      bests.push_back(id.ranked[0]);
    }
    auto right = [&](const Candidate& b, std::size_t i) {
      const FitResult& f = b.Final();
      return b.model->name() == "ascensional-difference" && f.Value("obliquity") == D("23;50") &&
             f.Value("latitude") == D(lats[i]);
    };
    std::vector<ColumnBest> columns;
    for (std::size_t i = 0; i < lats.size(); ++i) {
      alone += right(bests[i], i);
      columns.push_back({&c, static_cast<int>(i), &bests[i]});
    }
    ShareAdoptedValues(columns, &testing::Catalog());
    for (std::size_t i = 0; i < lats.size(); ++i) shared += right(bests[i], i);
  }
  CHECK(alone <= 21);  // the draws still show the problem
  CHECK(shared >= 23);
}

}  // namespace apograph::estimate
