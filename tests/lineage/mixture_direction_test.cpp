// Which witness changed exemplar: of a flagged witness and its two
// relatives, the one whose division at the stretches shortens the stemma
// most (mixture_direction.hpp).
#include <algorithm>
#include <string>
#include <vector>

#include <doctest/doctest.h>

#include "lineage/mixture_direction.hpp"

namespace apograph::lineage {
namespace {

// Two lines, A (A1 A2) and B (B1 B2), with four errors each in each half
// of a table of twenty rows; X follows line A in rows 0-9 and line B in
// rows 10-19.
CharacterMatrix TwoLines() {
  CharacterMatrix m;
  m.taxa = {"A1", "A2", "B1", "B2", "X"};
  auto add = [&](int row, std::vector<signed char> states) {
    Character ch;
    ch.position = ch.row = row;
    ch.block = "T1 " + std::to_string(row);
    ch.label = ch.block + " eq: error";
    ch.weight = 2;
    ch.states = std::move(states);
    m.characters.push_back(ch);
  };
  for (int k = 0; k < 4; ++k) {
    add(k, {1, 1, 0, 0, 1});       // line A's errors, X with them
    add(4 + k, {0, 0, 1, 1, 0});   // line B's, X without
    add(10 + k, {1, 1, 0, 0, 0});  // line A's, X without (it changed exemplar)
    add(14 + k, {0, 0, 1, 1, 1});  // line B's, X with them
  }
  // Each witness's own slips, two in each half, apart (enough that no
  // witness holds another's errors, as a copy would).
  for (int w = 0; w < 5; ++w) {
    for (int row : {6, 8, 16, 18}) {
      std::vector<signed char> states(5, 0);
      states[static_cast<std::size_t>(w)] = 1;
      add(row, states);
    }
  }
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  return m;
}

Contamination Flag(const std::string& witness, const std::string& primary,
                   const std::string& secondary) {
  Contamination c;
  c.witness = witness, c.primary = primary, c.secondary = secondary;
  c.segments = {{primary, "0", "9", 0, 9, 4, 4}, {secondary, "10", "19", 10, 19, 4, 4}};
  c.text = witness + " follows " + primary + " and " + secondary;
  return c;
}

TEST_CASE("the witness that changed exemplar gains most from its division") {
  const CharacterMatrix m = TwoLines();
  ParsimonyOptions fast;
  fast.exact_limit = 0;
  const Contamination x = Flag("X", "A1", "B1");
  CHECK(DivisionGain(m, x, "X", fast) ==
        doctest::Approx(8));  // four conflicting errors of weight 2
  CHECK(DivisionGain(m, x, "A1", fast) < 1);
  CHECK(DivisionGain(m, x, "B1", fast) < 1);
  std::vector<Contamination> refused;
  const auto kept = KeepDividingWitnesses(m, {x}, &refused);
  REQUIRE(kept.size() == 1);
  CHECK(kept.front().witness == "X");
  CHECK(kept.front().text == "X follows A1 and B1");  // no other reading to tell of
  CHECK(refused.empty());
}

TEST_CASE("a relative named as mixed is refused when the witness it names explains more") {
  // B1 read as following B2 in the first half and X in the second: the
  // pattern X's change of exemplar leaves on its new line.
  const CharacterMatrix m = TwoLines();
  std::vector<Contamination> refused;
  const auto kept = KeepDividingWitnesses(m, {Flag("B1", "B2", "X")}, &refused);
  CHECK(kept.empty());
  REQUIRE(refused.size() == 1);
  CHECK(refused.front().witness == "B1");
  CHECK(refused.front().text.find("dividing X at the same rows shortens the stemma more") !=
        std::string::npos);
}

}  // namespace
}  // namespace apograph::lineage
