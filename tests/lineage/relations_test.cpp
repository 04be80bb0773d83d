// Candidate copies read off a hand-made character matrix.
#include "lineage/relations.hpp"

#include <doctest/doctest.h>

namespace apograph::lineage {
namespace {

Character Error(const std::string& label, std::vector<signed char> states, bool omission = false) {
  Character c;
  c.label = label;
  c.states = std::move(states);
  c.omission = omission;
  return c;
}

TEST_CASE("a copy may fill in an entry its exemplar leaves blank") {
  CharacterMatrix m;
  m.taxa = {"A", "B", "C"};
  m.characters = {Error("1", {1, 1, 0}), Error("2", {1, 1, 0}), Error("3", {1, 0, 0}, true),
                  Error("4", {0, 1, 0}), Error("5", {0, 0, 1})};
  auto copies = FindCopies(m);
  REQUIRE(copies.size() == 1);
  CHECK(copies[0].copy == "B");
  CHECK(copies[0].exemplar == "A");
  CHECK(copies[0].exemplar_errors == 2);
  CHECK(copies[0].filled == 1);
  CHECK(copies[0].text ==
        "B may be a copy of A: B has all 2 of A's errors and 1 of its own; B fills in 1 entry A "
        "leaves blank");
  // A reading error of A that B lacks (not a blank) refutes the copy.
  m.characters[2].omission = false;
  CHECK(FindCopies(m).empty());
}

}  // namespace
}  // namespace apograph::lineage
