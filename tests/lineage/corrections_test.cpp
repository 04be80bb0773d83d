// Correctors: found (FindCorrections) on simulated traditions with none,
// judged by their exemplars (ReviseByExemplars), and their right readings
// set aside (MaskCorrections) on hand-made matrices.
#include "lineage/corrections.hpp"

#include <algorithm>
#include <string>

#include <doctest/doctest.h>

#include "collate/collation.hpp"
#include "lineage/synthetic.hpp"

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

TEST_CASE("the same slip made independently in a relative and an outsider is no correction") {
  // Traditions copied along a tree with no corrector, many slips a copy
  // (two or three a cell over the tradition): a relative of W and a witness
  // outside W's group often make the same slip at one cell, and W then
  // "reads right" an error of a relative's. A correction makes the error's
  // carriers and W one group of the tree; these do not. Before the test of
  // that (kMaxConflictShare), these four draws named 3, 6, 3 and 8 of their
  // 40 witnesses correctors (20 in all; now 1, 1, 0 and 0).
  int named = 0;
  for (unsigned seed = 1; seed <= 4; ++seed) {
    SyntheticOptions o;
    o.witnesses = 40;
    o.lost = 13;
    o.rows = 500;
    o.columns = 2;
    o.slips_min = 25;
    o.slips_max = 50;
    o.seed = seed;
    const auto t = SimulateTradition(o);
    collate::CollateOptions co;
    co.reference = t.Reference();
    co.tolerance_units = 0;
    const auto m = BuildCharacters(collate::Collate(t.Witnesses(), co));
    const auto found = FindCorrections(m);
    named += static_cast<int>(found.size());
    for (const auto& c : found) MESSAGE("seed " << seed << ": " << c.text);
  }
  CHECK(named <= 2);
}

Correction ModernEdition(const std::string& siglum) {
  Correction c;
  c.witness = siglum;
  c.modern_edition = true;
  return c;
}

CopyCandidate CopyOf(const std::string& copy, const std::string& exemplar, int corrected) {
  CopyCandidate c;
  c.copy = copy;
  c.exemplar = exemplar;
  c.exemplar_errors = 12;
  c.corrected = corrected;
  return c;
}

TEST_CASE("a witness set aside is judged by its exemplar once the copies are known") {
  Correction recomputing;  // recomputed the table itself
  recomputing.witness = "R";
  recomputing.recomputed = 20;
  recomputing.departures = 20;
  Correction reprint = recomputing;  // reads the same recomputed values, a copy of R
  reprint.witness = "S";
  Correction checker;  // corrects errors of its group, a copy of an uncorrected M
  checker.witness = "C";
  checker.corrected = 5;
  checker.weight = 5;
  std::vector<Correction> cs = {ModernEdition("E"),  // a faithful edition of manuscript M
                                ModernEdition("F"),  // an edition that corrects M's errors
                                ModernEdition("G"),  // no surviving exemplar: kept as it was
                                recomputing,        reprint, checker};
  cs[1].text = cs[2].text = "as found";
  const std::vector<CopyCandidate> copies = {
      CopyOf("E", "M", 1),  // one of M's errors read right: a slip of M's transcription
      CopyOf("F", "M", 6), CopyOf("S", "R", 0), CopyOf("C", "M", 0)};
  ReviseByExemplars(cs, copies);
  std::vector<std::string> kept;
  for (const auto& c : cs) kept.push_back(c.witness);
  CHECK(kept == std::vector<std::string>{"F", "G", "R", "C"});
  CHECK(cs[0].corrected == 6);
  CHECK(cs[0].basis == "exemplar");
  CHECK(cs[0].relatives == std::vector<std::string>{"M"});
  CHECK(cs[0].text.find("reads the model's value at 6 of the errors of M, its exemplar") !=
        std::string::npos);
  CHECK(cs[1].text == "as found");
}

}  // namespace
}  // namespace apograph::lineage

namespace apograph::lineage {
namespace {

// F copied by B, B by G, which corrects half of what it inherits; A and D
// outside. Rows: F's errors (G keeps some, corrects the others), B's (G
// keeps most), each witness's own.
CharacterMatrix ExemplarAndCorrectingCopy() {
  CharacterMatrix m;
  m.taxa = {"A", "D", "F", "B", "G"};
  for (const auto& [siglum, date] : std::vector<std::pair<std::string, std::string>>{
           {"A", "1320"}, {"D", "1330"}, {"F", "1300"}, {"B", "1350"}, {"G", "1400"}}) {
    WitnessInfo w;
    w.siglum = siglum, w.date = date, w.kind = "manuscript";
    m.witnesses.push_back(w);
  }
  auto add = [&](int row, std::vector<signed char> states) {
    Character ch;
    ch.position = ch.row = row;
    ch.label = std::to_string(row);
    ch.weight = 2;
    ch.base_is_right = true;
    ch.states = std::move(states);
    m.characters.push_back(ch);
  };
  for (int row : {3, 10, 20, 33}) add(row, {0, 0, 1, 1, 1});  // F's, kept by G
  for (int row : {5, 15, 25, 35}) add(row, {0, 0, 1, 1, 0});  // F's, corrected by G
  for (int row : {4, 12, 22, 32}) add(row, {0, 0, 0, 1, 1});  // B's, kept by G
  for (int row : {6, 26}) add(row, {0, 0, 0, 1, 0});          // B's, corrected by G
  for (int row : {7, 27}) add(row, {0, 0, 0, 0, 1});          // G's own
  for (int row : {1, 30}) add(row, {1, 0, 0, 0, 0});          // A's own
  for (int row : {2, 31}) add(row, {0, 1, 0, 0, 0});          // D's own
  std::stable_sort(m.characters.begin(), m.characters.end(),
                   [](const Character& a, const Character& b) { return a.position < b.position; });
  return m;
}

TEST_CASE("an exemplar does not correct the errors its copies made after it") {
  // F reads right B's errors that G shares: as many as the errors of F's
  // that G reads right. But B holds every error of F's (it descends from
  // F), so B's errors arose after F was written: F had the right reading.
  const std::vector<Correction> found = FindCorrections(ExemplarAndCorrectingCopy());
  REQUIRE(found.size() == 1);
  CHECK(found.front().witness == "G");
  CHECK(found.front().basis == "corrections");
  CHECK(found.front().corrected == 3);
}

TEST_CASE("a witness the dates make older is not taken for a descendant") {
  // B holds G's errors but for G's own two (a copy may lack one in four):
  // by the errors alone B could be G's copy, and G's corrections B's
  // slips. Without dates neither F nor G is called; with them, G is.
  CharacterMatrix undated = ExemplarAndCorrectingCopy();
  undated.witnesses.clear();
  CHECK(FindCorrections(undated).empty());
}

}  // namespace
}  // namespace apograph::lineage

namespace apograph::lineage {
namespace {

// archetype -> (A, lost (X, E)); E a modern edition set aside for its kind.
// X's errors at rows 1-4; E keeps `kept` of them and reads the others right.
struct Edition {
  CharacterMatrix matrix;
  Stemma stemma;
};

Edition EditionBeside(int kept) {
  Edition e;
  e.matrix.taxa = {"A", "X", "E"};
  for (int row = 1; row <= 4; ++row) {
    Character ch;
    ch.position = ch.row = row;
    ch.weight = 2;
    ch.base_is_right = true;
    ch.states = {0, 1, static_cast<signed char>(row <= kept ? 1 : 0)};
    e.matrix.characters.push_back(ch);
  }
  Stemma& s = e.stemma;
  s.root = s.Add({kArchetype, false});
  const int lost = s.Add({"", false});
  s.Attach(s.root, s.Add({"A", true}));
  s.Attach(s.root, lost);
  s.Attach(lost, s.Add({"X", true}));
  s.Attach(lost, s.Add({"E", true}));
  return e;
}

std::vector<Correction> SetAsideForKind() {
  Correction c;
  c.witness = "E";
  c.modern_edition = true;
  c.basis = "kind";
  return {c};
}

TEST_CASE("a modern edition that keeps its group's errors is a faithful one, not a corrector") {
  const Edition faithful = EditionBeside(4);
  std::vector<Correction> cs = SetAsideForKind();
  ReviseByGroups(cs, faithful.stemma, faithful.matrix);
  CHECK(cs.empty());
  // Reading three of them right, it corrects: still set aside.
  const Edition correcting = EditionBeside(1);
  cs = SetAsideForKind();
  ReviseByGroups(cs, correcting.stemma, correcting.matrix);
  CHECK(cs.size() == 1);
  // One set aside for its own readings is not judged again.
  cs = SetAsideForKind();
  cs.front().basis = "corrections";
  ReviseByGroups(cs, faithful.stemma, faithful.matrix);
  CHECK(cs.size() == 1);
}

}  // namespace
}  // namespace apograph::lineage
