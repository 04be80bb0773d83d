// A majority reading that is one line's error: CheckMajorities (rooting.hpp).
#include <string>
#include <vector>

#include <doctest/doctest.h>

#include "lineage/rooting.hpp"

namespace apograph::lineage {
namespace {

Character Reading(std::vector<signed char> states, Direction d) {
  Character c;
  c.states = std::move(states);
  c.direction = d;
  return c;
}

// Witnesses A, B, C, G, H below one lost copy (alpha); D, E, F each a line
// of its own from the archetype. The model directs two errors of alpha's
// (the archetype placed); at a cell no model judged, the five of alpha
// read one thing and D, E, F another: the majority is alpha's error.
struct Tradition {
  CharacterMatrix m;
  Stemma first;
};

Tradition Draw(int own_lines) {
  Tradition t;
  t.m.taxa = {"A", "B", "C", "G", "H", "D", "E", "F"};
  t.m.characters = {Reading({1, 1, 1, 1, 1, 0, 0, 0}, Direction::kModel),
                    Reading({1, 1, 1, 1, 1, 0, 0, 0}, Direction::kModel),
                    Reading({0, 0, 0, 0, 0, 1, 1, 1}, Direction::kMajority),
                    Reading({0, 0, 0, 1, 1, 0, 1, 0}, Direction::kMajority)};
  Stemma& s = t.first;
  s.root = s.Add({kArchetype, false});
  const int alpha = s.Add({"", false});
  s.Attach(s.root, alpha);
  for (const char* w : {"A", "B", "C", "G", "H"}) s.Attach(alpha, s.Add({w, true}));
  // D, E, F as separate lines, or D and E below a second lost copy.
  if (own_lines == 3) {
    for (const char* w : {"D", "E", "F"}) s.Attach(s.root, s.Add({w, true}));
  } else {
    const int beta = s.Add({"", false});
    s.Attach(s.root, beta);
    for (const char* w : {"D", "E"}) s.Attach(beta, s.Add({w, true}));
    s.Attach(s.root, s.Add({"F", true}));
  }
  return t;
}

TEST_CASE("a majority that is one line's error, against three lines, directs nothing") {
  const Tradition t = Draw(3);
  const CharacterMatrix checked = CheckMajorities(t.m, t.first, t.m);
  // The five of alpha against D, E, F: undirected, left to the stemma.
  CHECK(checked.characters[2].direction == Direction::kNone);
  // A majority most lines keep (G, H and E read the other) stands; so do
  // the model's characters.
  CHECK(checked.characters[3].direction == Direction::kMajority);
  CHECK(checked.characters[0].direction == Direction::kModel);
  // Two lines against one (D and E one line): not enough to overrule it.
  const Tradition two = Draw(2);
  CHECK(CheckMajorities(two.m, two.first, two.m).characters[2].direction == Direction::kMajority);
  // Without the model's root nothing checks the majority.
  CharacterMatrix unrooted = t.m;
  unrooted.characters.erase(unrooted.characters.begin(), unrooted.characters.begin() + 2);
  CHECK(CheckMajorities(unrooted, t.first, unrooted).characters[0].direction ==
        Direction::kMajority);
}

}  // namespace
}  // namespace apograph::lineage
