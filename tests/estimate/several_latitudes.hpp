#pragma once
// A table of several latitudes for the one-obliquity tests (issue 9):
// ascensional differences for an obliquity of 23;50 (round) at six
// latitudes written in the columns' headings, every 10 degrees of
// longitude, one place, a fifth of the entries corrupted (drawn with
// `seed`).
#include <cstddef>
#include <vector>

#include "model_columns.hpp"
#include "synthetic.hpp"

namespace apograph::estimate::testing {

inline const std::vector<const char*>& SeveralLatitudes() {
  static const std::vector<const char*> lats = {"23;51", "30;22", "36", "40;56", "45;1", "48;32"};
  return lats;
}

inline Transcription SeveralLatitudesTable(unsigned seed) {
  const std::vector<const char*>& lats = SeveralLatitudes();
  std::vector<SyntheticColumn> cols;
  for (const char* lat : lats) {
    cols.push_back(FromModel(
        "ascensional-difference",
        {Sexagesimal::ParseOrThrow("23;50").ToDouble(), Sexagesimal::ParseOrThrow(lat).ToDouble()},
        1));
  }
  Transcription t = MakeTable("asc", 10, 10, 36, cols);
  t.argument2 = ArgumentSpec{"latitude", "deg", 1};
  for (std::size_t i = 0; i < lats.size(); ++i)
    t.columns[i].arg2 = Sexagesimal::ParseOrThrow(lats[i]);
  return CorruptAFifth(t, seed);
}

}  // namespace apograph::estimate::testing
