// One slip repeated row after row (the explainer's "systematic" class: a
// place left out or moved over a run of a column) is one event of copying:
// its rows are one character, not one each. At the head of a column,
// where copyists leave out the leading place as a habit and independent
// copies land on the same readings, it weighs as a common slip.
#include <string>
#include <vector>

#include <doctest/doctest.h>

#include "lineage/characters.hpp"

namespace apograph::lineage {
namespace {

Character Cell(int row, const std::string& column, std::vector<signed char> states,
               const std::string& cause = "systematic", double weight = 2) {
  Character ch;
  ch.block = "T1 " + std::to_string(row + 1);
  ch.row_label = std::to_string(row + 1);
  ch.label = ch.block + " " + column + ": x";
  ch.position = row, ch.row = row;
  ch.column = column;
  ch.cause = cause;
  ch.states = std::move(states);
  ch.weight = weight;
  return ch;
}

CharacterMatrix Matrix(std::vector<Character> characters) {
  CharacterMatrix m;
  m.taxa = {"A", "B", "C", "D"};
  m.characters = std::move(characters);
  return m;
}

TEST_CASE("a place left out over the head of a column is one common slip") {
  CharacterMatrix m = Matrix(
      {Cell(0, "eq", {1, 1, 0, 0}), Cell(1, "eq", {1, 1, 0, 0}), Cell(2, "eq", {1, 1, 0, 0})});
  JoinRepeatedSlips(m);
  REQUIRE(m.characters.size() == 1);
  const Character& run = m.characters.front();
  CHECK(run.rows == 3);
  CHECK(run.weight == kRepeatedSlipAtHead);
  CHECK(run.states == std::vector<signed char>{1, 1, 0, 0});
  CHECK(run.label == "T1 1-3 eq: one slip repeated over 3 rows");
}

TEST_CASE("a repeated slip inside a column is one event, as distinctive as its rows") {
  CharacterMatrix m = Matrix({Cell(8, "eq", {0, 1, 1, 0}), Cell(9, "eq", {0, 1, 1, 0})});
  JoinRepeatedSlips(m);
  REQUIRE(m.characters.size() == 1);
  CHECK(m.characters.front().rows == 2);
  CHECK(m.characters.front().weight == 2);  // once, not 2 + 2
  // A distinctive row makes the run distinctive; a witness that reads one
  // row right and the other illegibly is unknown for the run.
  CharacterMatrix d = Matrix({Cell(8, "eq", {0, 1, 1, 0}), Cell(9, "eq", {0, 1, 1, -1}),
                              Cell(10, "eq", {0, 1, 1, 0}, "systematic", 3)});
  JoinRepeatedSlips(d);
  REQUIRE(d.characters.size() == 1);
  CHECK(d.characters.front().weight == kRepeatedSlipWeight);
  CHECK(d.characters.front().states == std::vector<signed char>{0, 1, 1, -1});
  CHECK(d.characters.front().label == "T1 9-11 eq: one slip repeated over 3 rows");
}

TEST_CASE("rows are joined only along one column, with the same carriers, without a gap") {
  CharacterMatrix m =
      Matrix({Cell(0, "eq", {1, 1, 0, 0}), Cell(1, "eq", {1, 0, 0, 0}),    // other carriers
              Cell(2, "diff", {1, 1, 0, 0}), Cell(4, "eq", {1, 1, 0, 0}),  // other column; gap
              Cell(5, "eq", {1, 1, 0, 0}, "confusion", 1)});               // not repeated
  JoinRepeatedSlips(m);
  CHECK(m.characters.size() == 5);
  for (const auto& ch : m.characters) CHECK(ch.rows == 1);
  CHECK(m.characters[0].weight == 2);  // a lone row keeps the weight of its reading
}

}  // namespace
}  // namespace apograph::lineage
