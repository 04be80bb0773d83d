// Candidate copies read off a hand-made character matrix.
#include "lineage/relations.hpp"

#include <algorithm>
#include <string>

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

TEST_CASE("a copy holding the errors of two exemplars alike is left undecided") {
  CharacterMatrix m;
  m.taxa = {"A", "B", "C"};
  // A and C carry the same two errors; B holds them and one of its own.
  m.characters = {Error("1", {1, 1, 1}), Error("2", {1, 1, 1}), Error("3", {0, 1, 0})};
  std::vector<std::string> undecided;
  const auto copies = ChooseCopies(m, CopyCandidates(m), {}, &undecided);
  CHECK(std::none_of(copies.begin(), copies.end(),
                     [](const CopyCandidate& c) { return c.copy == "B"; }));
  REQUIRE(undecided.size() == 1);
  CHECK(undecided[0].find("B holds all 2 errors of A or C") == 0);
  // One more error of C's that B holds: C is the closer exemplar.
  m.characters.push_back(Error("4", {0, 1, 1}));
  undecided.clear();
  const auto closer = ChooseCopies(m, CopyCandidates(m), {}, &undecided);
  CHECK(undecided.empty());
  CHECK(std::any_of(closer.begin(), closer.end(),
                    [](const CopyCandidate& c) { return c.copy == "B" && c.exemplar == "C"; }));
}

TEST_CASE("a corrector that reads right its exemplar's one-unit errors never had them") {
  CharacterMatrix m;
  m.taxa = {"A", "B", "C"};
  const auto right = [](Character c, bool one_unit) {
    c.base_is_right = true;
    c.one_unit = one_unit;
    return c;
  };
  // A's errors: four more than a unit off (B holds three, reads one right)
  // and one a unit off, which B holds; B corrects against the model.
  m.characters = {right(Error("1", {1, 1, 0}), false), right(Error("2", {1, 1, 0}), false),
                  right(Error("3", {1, 1, 0}), false), right(Error("4", {1, 0, 0}), false),
                  right(Error("5", {1, 1, 0}), true),  right(Error("6", {0, 1, 0}), false)};
  const std::vector<std::string> correctors = {"B"};
  auto copies = FindCopies(m, correctors);
  REQUIRE(copies.size() == 1);
  CHECK(copies[0].copy == "B");
  CHECK(copies[0].corrected == 1);
  // B reads A's one-unit error right: a checker leaves such differences as
  // it finds them, so B never had it (a relative of A, not its copy).
  m.characters[4].states = {1, 0, 0};
  CHECK(FindCopies(m, correctors).empty());
  // Two one-unit errors held against one read right: still a copy.
  m.characters.push_back(right(Error("7", {1, 1, 0}), true));
  m.characters.push_back(right(Error("8", {1, 1, 0}), true));
  CHECK(FindCopies(m, correctors).size() == 1);
}

TEST_CASE("two correctors each holding the other's errors: neither is named a copy") {
  CharacterMatrix m;
  m.taxa = {"A", "B", "C"};
  const auto right = [](Character c) {
    c.base_is_right = true;
    return c;
  };
  // A and B share two errors; each has one more, which the other reads right.
  m.characters = {right(Error("1", {1, 1, 0})), right(Error("2", {1, 1, 0})),
                  right(Error("3", {1, 0, 0})), right(Error("4", {0, 1, 0})),
                  right(Error("5", {0, 0, 1}))};
  const std::vector<std::string> correctors = {"A", "B"};
  std::vector<std::string> undecided;
  CHECK(ChooseCopies(m, CopyCandidates(m, correctors), {}, &undecided).empty());
  REQUIRE(undecided.size() == 1);
  CHECK(undecided[0].find("either may be a copy of the other") != std::string::npos);
  // Only B corrects: B may be a copy of A (A, no corrector, cannot be B's).
  CHECK(FindCopies(m, {"B"}).size() == 1);
}

Character At(int position, std::vector<signed char> states) {
  Character c = Error(std::to_string(position), std::move(states));
  c.position = position;
  c.row_label = std::to_string(position);
  return c;
}

// Witnesses C, X, Z, W. In rows 0-199 C has ten errors of its own and X and
// Z share ten (X one more of its own); from row 200 on C, X and Z share
// six, spread (`spread`: the six spread over the whole table instead).
CharacterMatrix OneLineMatrix(bool spread) {
  CharacterMatrix m;
  m.taxa = {"C", "X", "Z", "W"};
  m.characters.push_back(At(5, {0, 1, 0, 0}));
  for (int k = 0; k < 10; ++k) {
    m.characters.push_back(At(20 * k, {1, 0, 0, 0}));
    m.characters.push_back(At(20 * k + 10, {0, 1, 1, 0}));
  }
  for (int k = 0; k < 6; ++k)
    m.characters.push_back(At(spread ? 35 * k + 7 : 200 + 20 * k, {1, 1, 1, 0}));
  for (int k = 0; k < 3; ++k) m.characters.push_back(At(210 + 20 * k, {0, 0, 0, 1}));
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  return m;
}

TEST_CASE("one relative in one stretch only, no relative in the other: contaminated") {
  const auto found = FindContamination(OneLineMatrix(false));
  REQUIRE(found.size() == 1);
  CHECK(found[0].witness == "C");
  CHECK((found[0].primary.empty() || found[0].secondary.empty()));
  CHECK(found[0].text.find("shares no error with any surviving witness") != std::string::npos);
  // The same shared errors spread along the table: a line, no mixture.
  CHECK(FindContamination(OneLineMatrix(true)).empty());
}

// Witnesses C, X, Z, W. In rows 0-199 X and Z share eight errors that C
// reads right, C has four errors of its own and two shared with W (its own
// line: too few for two lines, and a relative where it leaves X); from row
// 200 on C, X and Z share six (`spread`: the six spread over rows 0-199
// among the eight instead).
CharacterMatrix JoinMatrix(bool spread) {
  CharacterMatrix m;
  m.taxa = {"C", "X", "Z", "W"};
  for (int k = 0; k < 8; ++k) m.characters.push_back(At(20 * k + 10, {0, 1, 1, 0}));
  for (int k = 0; k < 4; ++k) m.characters.push_back(At(40 * k + 5, {1, 0, 0, 0}));
  for (int k = 0; k < 2; ++k) m.characters.push_back(At(60 * k + 25, {1, 0, 0, 1}));
  for (int k = 0; k < 6; ++k)
    m.characters.push_back(At(spread ? 30 * k + 17 : 200 + 20 * k, {1, 1, 1, 0}));
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  return m;
}

TEST_CASE("the common errors of a line held in one part only: contaminated") {
  const auto found = FindContamination(JoinMatrix(false));
  REQUIRE(found.size() == 1);
  CHECK(found[0].witness == "C");
  CHECK(found[0].primary.empty());  // its own line first, then X's
  CHECK(found[0].secondary == "X");
  // The evidence: the shared readings and the ones C reads right.
  CHECK(found[0].text.find("C shares 6 errors of X and Z in rows 200 to 300 (200; 220; 240; "
                           "260; ...) but reads right at all 8 of theirs in rows 10 to 150 (10; "
                           "30; 50; 70; ...)") != std::string::npos);
  // The same six spread among the eight: a line C belongs to, no mixture.
  CHECK(FindContamination(JoinMatrix(true)).empty());
}

// Witnesses C, X, Y, W. C shares two errors with X in rows 10 and 40 (one
// distinctive, weight 2) and `with_y` errors with Y from row 110 on; each of
// C, X, Y and W has errors of its own. `x_late` moves the second X error to
// row 150, among Y's. `c_own` = false: C has none of its own, so that X
// holds every error of C's where C follows it, as a copy of C would.
CharacterMatrix SwitchMatrix(int with_y, bool x_late, bool c_own = true) {
  CharacterMatrix m;
  m.taxa = {"C", "X", "Y", "W"};
  Character distinctive = At(10, {1, 1, 0, 0});
  distinctive.weight = 2;
  m.characters.push_back(distinctive);
  m.characters.push_back(At(x_late ? 150 : 40, {1, 1, 0, 0}));
  for (int k = 0; k < with_y; ++k) m.characters.push_back(At(110 + 30 * k + 5, {1, 0, 1, 0}));
  if (c_own) {
    m.characters.push_back(At(35, {1, 0, 0, 0}));
    m.characters.push_back(At(190, {1, 0, 0, 0}));
  }
  for (int k = 0; k < 4; ++k) {
    m.characters.push_back(At(20 + 60 * k, {0, 1, 0, 0}));
    m.characters.push_back(At(25 + 60 * k, {0, 0, 1, 0}));
    m.characters.push_back(At(30 + 60 * k, {0, 0, 0, 1}));
  }
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  return m;
}

TEST_CASE("a clean switch of exemplar is called on two slips of the weaker side") {
  const auto found = FindContamination(SwitchMatrix(4, false));
  REQUIRE(found.size() == 1);
  CHECK(found[0].witness == "C");
  CHECK(found[0].primary == "X");
  CHECK(found[0].secondary == "Y");
  CHECK(found[0].text.find("C follows X in rows 10 to 40 and Y in rows 115 to 205") !=
        std::string::npos);
  // Three on the stronger side only: a question for the editor, with what
  // it lacks.
  std::vector<Contamination> suspected;
  CHECK(FindContamination(SwitchMatrix(3, false), kMinContaminationEvidence, &suspected).empty());
  REQUIRE(suspected.size() == 1);
  CHECK(suspected[0].shortfall == "2 slips on the weaker side, 3 needed");
  CHECK(suspected[0].text.find("each set in stretches of its own") != std::string::npos);
  // X's second error among Y's: no clean switch, mixed along the table.
  suspected.clear();
  CHECK(FindContamination(SwitchMatrix(4, true), kMinContaminationEvidence, &suspected).empty());
  REQUIRE(suspected.size() == 1);
  CHECK(suspected[0].shortfall.empty());
  CHECK(suspected[0].text.find("the two sets mixed along the table") != std::string::npos);
  // X holds all of C's errors where C seems to follow it and C lacks X's:
  // X copied C there (C's "shared" errors are its own), no switch.
  CHECK(FindContamination(SwitchMatrix(4, false, false)).empty());
}

// Witnesses M, S, X, Y, W. M follows X in rows 0-99 (four common slips of
// their line) and S in rows 100-199, where it holds five distinctive errors
// of S's own; S shares five distinctive errors with Y, its line, in rows
// 0-99 only. Read without dates, each names the other: S seems to follow Y
// and then M, with the heavier evidence (weight 10 against M's 4).
CharacterMatrix MirrorMatrix() {
  CharacterMatrix m;
  m.taxa = {"M", "S", "X", "Y", "W"};
  const auto distinctive = [](int position, std::vector<signed char> states) {
    Character c = At(position, std::move(states));
    c.weight = 2;
    return c;
  };
  for (int k = 0; k < 4; ++k) m.characters.push_back(At(10 + 20 * k, {1, 0, 1, 0, 0}));
  for (int k = 0; k < 5; ++k) {
    m.characters.push_back(distinctive(15 + 20 * k, {0, 1, 0, 1, 0}));
    m.characters.push_back(distinctive(110 + 20 * k, {1, 1, 0, 0, 0}));
  }
  for (int k = 0; k < 3; ++k) {
    m.characters.push_back(At(105 + 30 * k, {0, 0, 1, 0, 0}));
    m.characters.push_back(At(108 + 30 * k, {0, 0, 0, 1, 0}));
    m.characters.push_back(At(12 + 60 * k, {0, 0, 0, 0, 1}));
  }
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  return m;
}

TEST_CASE("of two witnesses naming each other, the older did not take the later one's readings") {
  CharacterMatrix m = MirrorMatrix();
  const auto undated = FindContamination(m);
  REQUIRE(undated.size() == 1);
  CHECK(undated[0].witness == "S");  // the heavier evidence, with no dates to say otherwise
  // S written about 1320, M in 1410: S cannot have turned to M's readings;
  // M changed exemplar, taking S's own errors in its second part.
  m.witnesses.resize(m.taxa.size());
  for (std::size_t k = 0; k < m.taxa.size(); ++k) m.witnesses[k].siglum = m.taxa[k];
  m.witnesses[0].date = "1410";
  m.witnesses[1].date = "c. 1320";
  const auto dated = FindContamination(m);
  REQUIRE(dated.size() == 1);
  CHECK(dated[0].witness == "M");
  CHECK(dated[0].primary == "X");
  CHECK(dated[0].secondary == "S");
  // Dates that overlap decide nothing: the heavier evidence again.
  m.witnesses[1].date = "15th century";
  const auto overlapping = FindContamination(m);
  REQUIRE(overlapping.size() == 1);
  CHECK(overlapping[0].witness == "S");
}

TEST_CASE(
    "a relative holding all of a witness's errors in its stretch, and more, copied it there") {
  // As MirrorMatrix, but M makes two slips of its own in rows 100-199, the
  // part it took from S. S seems to follow Y and then M (the heavier
  // evidence, and no dates), yet there M holds every one of S's errors and
  // two more: M copied S there, S did not copy M.
  CharacterMatrix m = MirrorMatrix();
  for (int p : {150, 170}) m.characters.push_back(At(p, {1, 0, 0, 0, 0}));
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  std::vector<Contamination> suspected;
  const auto found = FindContamination(m, kMinContaminationEvidence, &suspected);
  REQUIRE(found.size() == 1);
  CHECK(found[0].witness == "M");
  CHECK(found[0].primary == "X");
  CHECK(found[0].secondary == "S");
  const auto s = std::find_if(suspected.begin(), suspected.end(),
                              [](const Contamination& c) { return c.witness == "S"; });
  REQUIRE(s != suspected.end());
  CHECK(s->direction_refused);
  CHECK(s->text.find("M holds every error of S's there and 2 more of its own: M more likely "
                     "copied S there, and S is not called contaminated") != std::string::npos);
}

// Witnesses C, J, A, D, W. A follows C in rows 10-90 (five errors of C's
// line) and J in rows 115-195 (five of J's); C and J have five errors of
// their own each in the other part; D holds all of A's errors and two of
// its own, so that A, too, holds D's errors but for two (one in five: the
// tolerance for a copy's lacked errors).
CharacterMatrix HandedDownMatrix() {
  CharacterMatrix m;
  m.taxa = {"C", "J", "A", "D", "W"};
  for (int k = 0; k < 5; ++k) {
    m.characters.push_back(At(10 + 20 * k, {1, 0, 1, 1, 0}));
    m.characters.push_back(At(15 + 20 * k, {0, 1, 0, 0, 0}));
    m.characters.push_back(At(110 + 20 * k, {1, 0, 0, 0, 0}));
    m.characters.push_back(At(115 + 20 * k, {0, 1, 1, 1, 0}));
  }
  for (int p : {62, 162}) m.characters.push_back(At(p, {0, 0, 0, 1, 0}));
  for (int p : {42, 102, 182}) m.characters.push_back(At(p, {0, 0, 0, 0, 1}));
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  return m;
}

TEST_CASE("a mixture handed down to a copy is told once, and the copy follows its exemplar") {
  const CharacterMatrix m = HandedDownMatrix();
  const auto found = FindContamination(m);
  // Each holds the other's errors within the tolerance; D lacks none of
  // A's, A two of D's: D is the copy, and inherits the mixture.
  REQUIRE(found.size() == 1);
  CHECK(found[0].witness == "A");
  CHECK(found[0].primary == "C");
  CHECK(found[0].secondary == "J");
  CHECK(found[0].inherited_by == std::vector<std::string>{"D"});
  // The copy's readings where the mixture follows J are set aside as its
  // exemplar's are, not left to pull it towards J; but not D's own error
  // in that part (row 162), which says that D is A's copy and not its twin.
  const CharacterMatrix masked = MaskSecondaryExemplar(m, found);
  for (const auto& ch : masked.characters) {
    CAPTURE(ch.position);
    if (ch.position < 110) continue;
    if (ch.position == 162) {
      CHECK(ch.states[2] == 0);
      CHECK(ch.states[3] == 1);
      continue;
    }
    CHECK(ch.states[2] == -1);
    CHECK(ch.states[3] == -1);
  }
}

}  // namespace
}  // namespace apograph::lineage

namespace apograph::lineage {
namespace {

// C follows X in rows 0-99 (three errors shared with X) and, from row 100,
// the line of Y and F (sixteen errors all three share): the larger part.
// D is C's copy (it holds every error of C's and one of its own).
TEST_CASE("the second exemplar's line is set aside even where it holds most of the mixture") {
  CharacterMatrix m;
  m.taxa = {"C", "X", "Y", "F", "D", "W"};
  for (int p : {10, 30, 50}) m.characters.push_back(At(p, {1, 1, 0, 0, 1, 0}));
  for (int k = 0; k < 16; ++k) m.characters.push_back(At(110 + 20 * k, {1, 0, 1, 1, 1, 0}));
  m.characters.push_back(At(430, {1, 0, 0, 0, 1, 0}));  // C's own, handed to D
  m.characters.push_back(At(431, {0, 0, 0, 0, 1, 0}));  // D's own
  Contamination c;
  c.witness = "C";
  c.primary = "X";
  c.secondary = "Y";
  c.segments = {{"X", "10", "50", 10, 50, 3, 3}, {"Y", "110", "410", 110, 410, 16, 16}};
  const CharacterMatrix masked = MaskSecondaryExemplar(m, {c});
  for (const auto& ch : masked.characters) {
    CAPTURE(ch.position);
    // Y and F hold 16 of C's 20 errors (within a copy's tolerance) but
    // none where C follows X: not C's copies, so the readings C shares
    // with them there came from the second exemplar.
    if (ch.position >= 110 && ch.position <= 410) CHECK(ch.states[0] == -1);
    if (ch.position < 100) CHECK(ch.states[0] == 1);
  }
  // A reading only C and its copy D carry did not come from Y.
  CHECK(masked.characters[19].states[0] == 1);
}

}  // namespace
}  // namespace apograph::lineage
