// Rates of the deviation stage over a few seeded traditions of the shared
// generator (tests/synth), references identified automatically, slips from
// the generator's own confusion model (not corpora/scripts/). The full
// figures (300 draws) come from tests/bench/deviation_bench.cpp.
#include <doctest/doctest.h>

#include "test_paths.hpp"
#include "tradition_grade.hpp"

using namespace apograph;

namespace {

double Rate(long a, long b) { return b > 0 ? static_cast<double>(a) / static_cast<double>(b) : 0; }

}  // namespace

TEST_CASE("deviations in seeded traditions: flags, classes, readings and the author's share") {
  const std::string dir = std::string(APOGRAPH_SOURCE_DIR) + "/corpora/scripts";
  testing::Grade g, wrong;
  for (std::uint64_t seed : {101u, 102u, 103u, 104u}) {
    const auto t = synth::DrawTradition(seed, {});
    g.Add(testing::GradeTradition(t, dir));
    for (int how : {0, 1}) wrong.Add(testing::GradeWrongReference(t, dir, how));
  }
  const auto& a = g.all;
  INFO("wrong references: " << g.wrong_columns << " witness columns, " << g.wrong_refused
                            << " refused, " << g.wrong_emendations << " emendations");
  INFO("slips " << a.erroneous << ", caught " << a.caught << ", flagged " << a.flagged
                << ", right class " << a.right_class << ", restored " << a.restored
                << "; departures " << g.departures_kept << "/" << g.departures);
  REQUIRE(a.erroneous >= 200);  // enough slips for the rates to mean something
  // Recall on these four draws was 0.931 once identification (issue 9)
  // changed the references; the goal (0.95) is the 300-draw benchmark's
  // (DEVELOPERS.md). The floor (judgement) fails if a tenth of the slips
  // are lost.
  CHECK(Rate(a.caught, a.erroneous) >= 0.90);
  // Precision over four draws scatters around the benchmark's figure (95.4%
  // over 300 draws; 90.2% to 97.7% in runs of 10 to 40 draws, DEVELOPERS.md);
  // on these four draws it is 0.995. The floor sits below that spread
  // (judgement) and still fails if false flags double.
  CHECK(Rate(a.caught, a.flagged) >= 0.92);
  CHECK(Rate(a.right_class, a.caught) >= 0.90);
  CHECK(Rate(a.restored, a.caught) >= 0.90);
  REQUIRE(g.departures >= 50);
  CHECK(Rate(g.departures_kept, g.departures) >= 0.90);
  // A reference made wrong on purpose never leads to a recorded emendation;
  // one identified near-right (within a unit or two of the author's values)
  // may restore the author's reading, never another.
  CHECK(wrong.wrong_columns > 0);
  CHECK(wrong.wrong_emendations == 0);
  CHECK(g.wrong_false == 0);
  // Emendations on identified references that miss the author's values:
  // 4 on these draws, all the author's reading (14 witness columns, 7
  // refused: measured with the trend test's smoothing and the tradition's
  // model for derived columns). The ceiling (judgement: a little over twice
  // that) fails if a wrong column with its dozens of flags passes again.
  CHECK(g.wrong_emendations <= 10);
}

TEST_CASE("a constant error the other witnesses share is not pinned on the copy that escaped it") {
  // Seeds 2, 18, 20 and 22 of deviation_bench are the four among seeds 1-40
  // where a constant run of one unit made by an ancestor (shared by every
  // other witness) was reported as this copy's "constant error over the
  // run", though it reads the author's values: 247 false flags of that
  // kind before the run stopped at rows the others read as this copy does,
  // 18 after (16 on two runs of -1 on one witness of seed 18 where no other
  // witness agrees on a reading near the model, so only the model speaks; 2
  // on seed 22, a run joining two of the copy's own slips to two rows where
  // the others share an error; DEVELOPERS.md, ninth round).
  const std::string dir = std::string(APOGRAPH_SOURCE_DIR) + "/corpora/scripts";
  testing::Grade g;
  for (std::uint64_t seed : {2u, 18u, 20u, 22u}) {
    g.Add(testing::GradeTradition(synth::DrawTradition(seed, {}), dir, true));
  }
  long false_runs = 0, false_flags = 0;
  for (const auto& n : g.notes) {
    if (n.rfind("FALSE FLAG", 0) != 0) continue;
    ++false_flags;
    false_runs += n.find("one constant error") != std::string::npos;
  }
  INFO("false flags " << false_flags << ", of them constant-error runs " << false_runs << "; slips "
                      << g.all.erroneous << ", caught " << g.all.caught << ", flagged "
                      << g.all.flagged);
  REQUIRE(g.all.erroneous >= 200);
  // Ceiling (judgement): the 18 left and a margin; fails if the run grows
  // over the shared rows again.
  CHECK(false_runs <= 30);
  // Precision and recall on these draws: 0.976 each (judgement: floors a
  // little below; the 247 false flags alone took precision below 0.85).
  CHECK(Rate(g.all.caught, g.all.flagged) >= 0.95);
  CHECK(Rate(g.all.caught, g.all.erroneous) >= 0.95);
}
