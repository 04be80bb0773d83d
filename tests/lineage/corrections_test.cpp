// Correctors' right readings set aside (MaskCorrections) on a hand-made matrix.
#include "lineage/corrections.hpp"

#include <algorithm>
#include <string>

#include <doctest/doctest.h>

namespace apograph::lineage {
namespace {

TEST_CASE("each corrector's right readings are kept once, as its own tie-break") {
  // Ten witnesses, eight of them correctors reading right everywhere; the
  // other two share 20 errors. Copying other correctors' tie-breaks again
  // doubled the matrix with every corrector (20 * 2^8 characters).
  CharacterMatrix m;
  const int witnesses = 10, correctors = 8, errors = 20;
  for (int w = 0; w < witnesses; ++w) m.taxa.push_back(std::string(1, static_cast<char>('A' + w)));
  for (int k = 0; k < errors; ++k) {
    Character ch;
    ch.label = std::to_string(k + 1);
    ch.base_is_right = true;
    ch.weight = 1;
    ch.states.assign(witnesses, 0);
    ch.states[correctors] = ch.states[correctors + 1] = 1;
    m.characters.push_back(ch);
  }
  std::vector<Correction> cs;
  for (int w = 0; w < correctors; ++w) {
    Correction c;
    c.witness = m.taxa[static_cast<std::size_t>(w)];
    cs.push_back(c);
  }
  const CharacterMatrix out = MaskCorrections(m, cs);
  CHECK(out.characters.size() == static_cast<std::size_t>(errors * (1 + correctors)));
  for (const Character& ch : out.characters) {
    const auto right = std::count(ch.states.begin(), ch.states.begin() + correctors, 0);
    // The original: every corrector set aside; a tie-break: its corrector only.
    CHECK(right == (ch.tie_break ? 1 : 0));
    CHECK(ch.states[correctors] == 1);
  }
  // The weights: the original keeps (1 - k)^n of its weight, each tie-break
  // about k of it.
  double total = 0;
  for (const Character& ch : out.characters) total += ch.label == "1" ? ch.weight : 0;
  CHECK(total == doctest::Approx(1.0).epsilon(correctors * correctors * kCorrectorTieBreak *
                                              kCorrectorTieBreak));
}

}  // namespace
}  // namespace apograph::lineage
