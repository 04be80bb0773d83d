// The character of a run of a column slid by a row: judged by a model, the
// witnesses without the slide read the run right (a corrector may have
// restored it), so a copy that reads it right does not refute descent.
#include <string>
#include <utility>
#include <vector>

#include <doctest/doctest.h>

#include "../value_cells.hpp"
#include "collate/collation.hpp"
#include "lineage/characters.hpp"

namespace apograph::lineage {
namespace {

using testing::S;
using testing::ValueCell;

// Nine rows of a one-column table, arguments 10 to 90.
const std::vector<std::string> kRight = {"0;20", "0;40", "0;58", "1;15", "1;29",
                                         "1;41", "1;51", "1;57", "1;59"};

Transcription Witness(const std::string& siglum, const std::vector<std::string>& values) {
  Transcription t;
  t.table_id = "T1";
  t.witness.siglum = siglum;
  t.argument.name = "arg";
  t.argument.start = S("10"), t.argument.step = S("10");
  t.columns.push_back({"eq", "", 1, "", std::nullopt});
  for (std::size_t i = 0; i < values.size(); ++i) {
    Row r;
    r.argument = ValueCell(std::to_string(10 * (i + 1)));
    r.cells.push_back(ValueCell(values[i]));
    t.rows.push_back(r);
  }
  return t;
}

// Collation judged by a model that computes kRight.
collate::CollateOptions ByTheRightValues() {
  collate::CollateOptions options;
  options.reference = collate::Reference{
      "the right values", [](const Sexagesimal& argument, int) -> std::optional<Sexagesimal> {
        const auto row = static_cast<std::size_t>(argument.ToDouble() / 10) - 1;
        return row < kRight.size() ? std::optional(S(kRight[row])) : std::nullopt;
      }};
  return options;
}

const Character* Slide(const CharacterMatrix& m) {
  for (const auto& ch : m.characters) {
    if (ch.label.find("column slid by a row") != std::string::npos) return &ch;
  }
  return nullptr;
}

TEST_CASE("a slid run judged by a model: the witnesses without it read it right") {
  auto d = kRight;
  for (int i = 3; i <= 6; ++i) d[i] = kRight[i + 1];  // D's eye slid a row ahead
  const std::vector<Transcription> ws = {Witness("A", kRight), Witness("B", kRight),
                                         Witness("C", kRight), Witness("D", d)};
  const collate::CollateOptions options = ByTheRightValues();
  const CharacterMatrix judged = BuildCharacters(collate::Collate(ws, options));
  const Character* slide = Slide(judged);
  REQUIRE(slide != nullptr);
  CHECK(slide->direction == Direction::kModel);
  CHECK(slide->base_is_right);
  CHECK(slide->states == std::vector<signed char>{0, 0, 0, 1});
  // By the majority alone nothing is called right.
  const CharacterMatrix unjudged = BuildCharacters(collate::Collate(ws));
  const Character* by_majority = Slide(unjudged);
  REQUIRE(by_majority != nullptr);
  CHECK(by_majority->direction == Direction::kMajority);
  CHECK_FALSE(by_majority->base_is_right);
}

TEST_CASE("a slide most witnesses inherited: the few that read the model are not slid") {
  auto slid = kRight;
  for (int i = 3; i <= 6; ++i) slid[i] = kRight[i + 1];  // one lost copy's eye slid a row
  const std::vector<Transcription> ws = {Witness("A", slid), Witness("B", slid), Witness("C", slid),
                                         Witness("D", kRight), Witness("E", kRight)};
  const collate::CollateOptions options = ByTheRightValues();
  const collate::Collation c = collate::Collate(ws, options);
  // Against the others, D and E carry the previous row's values; against
  // the model they read right: no slide is theirs.
  for (const auto& s : c.slides) CHECK((s.siglum != "D" && s.siglum != "E"));
  // The slide is A, B and C's, one character against the model, which D
  // and E read right (before, D and E each seemed slid the other way: a
  // character of weight 3 shared by the few right witnesses).
  const CharacterMatrix m = BuildCharacters(c);
  const Character* slide = Slide(m);
  REQUIRE(slide != nullptr);
  CHECK(slide->direction == Direction::kModel);
  CHECK(slide->states == std::vector<signed char>{1, 1, 1, 0, 0});
  int slides = 0;
  for (const auto& ch : m.characters)
    slides += ch.label.find("column slid by a row") != std::string::npos ? 1 : 0;
  CHECK(slides == 1);
}

}  // namespace
}  // namespace apograph::lineage
