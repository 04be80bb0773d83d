// The obliquity most columns of a table of several latitudes adopted is
// offered to a column that adopted nothing of its own (its estimates left
// fitted on the ridge of obliquity and latitude), not only to the columns
// that adopted another value.
#include <doctest/doctest.h>

#include <cstddef>
#include <vector>

#include "estimate/identify.hpp"
#include "several_latitudes.hpp"

namespace apograph::estimate {

TEST_CASE("a column that adopted nothing is offered the obliquity the others adopted") {
  // The table of several_latitudes.hpp (23;50 at six written latitudes,
  // a fifth of the entries corrupted, seeds 1..3); each column in turn
  // identified without adoption (as when its own entries accept no round
  // value), the others as usual, then ShareAdoptedValues. Measured: 0 of
  // 18 columns with the table's obliquity and their written latitude
  // before (never offered), 18 of 18 after.
  const std::vector<const char*>& lats = testing::SeveralLatitudes();
  int right = 0;
  for (unsigned seed = 1; seed <= 3; ++seed) {
    const Transcription c = testing::SeveralLatitudesTable(seed);
    IdentifyOptions o;
    o.catalog = &testing::Catalog();
    IdentifyOptions bare = o;
    bare.adopt_round_values = false;
    std::vector<Candidate> adopted;
    for (std::size_t i = 0; i < lats.size(); ++i) {
      const Identification id = Identify(c, static_cast<int>(i), o);
      REQUIRE(!id.ranked.empty());
      adopted.push_back(id.ranked[0]);
    }
    for (std::size_t k = 0; k < lats.size(); ++k) {
      std::vector<Candidate> bests = adopted;
      const Identification id = Identify(c, static_cast<int>(k), bare);
      REQUIRE(!id.ranked.empty());
      bests[k] = id.ranked[0];
      REQUIRE(!bests[k].adoption);
      std::vector<ColumnBest> columns;
      for (std::size_t i = 0; i < lats.size(); ++i)
        columns.push_back({&c, static_cast<int>(i), &bests[i]});
      ShareAdoptedValues(columns, &testing::Catalog());
      const FitResult& f = bests[k].Final();
      CAPTURE(seed);
      CAPTURE(lats[k]);
      right += bests[k].model->name() == "ascensional-difference" && bests[k].adoption &&
               f.Value("obliquity") == testing::D("23;50") &&
               f.Value("latitude") == testing::D(lats[k]);
    }
  }
  CHECK(right >= 16);
}

}  // namespace apograph::estimate
