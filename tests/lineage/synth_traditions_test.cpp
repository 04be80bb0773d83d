// The lineage stage on traditions of the shared generator (tests/synth):
// the whole pipeline (model estimated from the witnesses, collation judged
// by it, characters, stemma), scored against the draw's answer key over
// several seeds (written below), never one draw.
#include <doctest/doctest.h>

#include <algorithm>
#include <set>
#include <string>
#include <vector>

#include "pipeline/analysis.hpp"
#include "synth/tradition.hpp"

namespace apograph {
namespace {

using Sigla = std::vector<std::string>;

synth::TraditionOptions Small(bool contaminated) {
  synth::TraditionOptions o;
  o.witnesses = 6;
  o.tables = 1;
  o.table.max_rows = 240;
  if (!contaminated) o.share_contaminated = 0;
  return o;
}

lineage::LineageReport Analyse(const synth::Tradition& t) {
  std::vector<std::vector<Transcription>> per_table(t.tables.size());
  for (int node : t.Surviving()) {
    auto tables = t.WitnessTables(node);
    for (std::size_t k = 0; k < tables.size() && k < per_table.size(); ++k)
      per_table[k].push_back(std::move(tables[k]));
  }
  std::vector<pipeline::TableAnalysis> analyses;
  for (auto& ts : per_table) analyses.push_back(pipeline::AnalyseTranscriptions(std::move(ts)));
  return pipeline::WorkLineage(analyses);
}

Sigla Sorted(Sigla s) {
  std::sort(s.begin(), s.end());
  return s;
}

struct Score {
  int marked = 0, recovered = 0;                  // groups two or more errors mark
  int claims = 0, claims_right = 0;               // named copies (twins left open are no claim)
  int against_dates = 0;                          // copies named older than their exemplar
  int draws_with_contamination_flagged = 0;       // (for uncontaminated draws: false alarms)
  int mixed = 0, flagged = 0, flagged_right = 0;  // contaminated witnesses
};

// A witness shows a mixture when it, or a lost ancestor above it (up to the
// first surviving one), took a second exemplar (as the benchmark counts).
bool Mixed(const synth::Tradition& t, int node) {
  for (int i = node; i > 0; i = t.nodes[i].parent) {
    if (t.nodes[i].contamination) return true;
    if (i != node && t.nodes[i].surviving) return false;
  }
  return false;
}

void ScoreMixtures(const synth::Tradition& t, const lineage::LineageReport& r, Score& s) {
  std::set<std::string> flagged;
  for (const auto& c : r.contamination) {
    flagged.insert(c.witness);
    // "handed down to": the report tells the mixture of these too.
    flagged.insert(c.inherited_by.begin(), c.inherited_by.end());
  }
  for (int w : t.Surviving()) {
    const bool mixed = Mixed(t, w), said = flagged.count(t.nodes[w].name) > 0;
    s.mixed += mixed ? 1 : 0;
    s.flagged += said ? 1 : 0;
    s.flagged_right += mixed && said ? 1 : 0;
  }
  s.draws_with_contamination_flagged += flagged.empty() ? 0 : 1;
}

void ScoreGroups(const synth::Tradition& t, const lineage::LineageReport& r, Score& s) {
  std::set<Sigla> found;
  if (!r.results.empty()) {
    for (const auto& g : r.results.front().groups) found.insert(Sorted(g.witnesses));
  }
  for (const auto& g : synth::Groups(t)) {
    if (g.errors_some < 2 || g.witnesses.size() >= t.Surviving().size()) continue;
    ++s.marked;
    s.recovered += found.count(Sorted(g.witnesses)) ? 1 : 0;
  }
}

void ScoreCopies(const synth::Tradition& t, const lineage::LineageReport& r, Score& s) {
  for (const auto& c : r.copies) {
    if (c.twins) continue;
    ++s.claims;
    const int copy = t.Find(c.copy), exemplar = t.Find(c.exemplar);
    REQUIRE(copy >= 0);
    REQUIRE(exemplar >= 0);
    const auto& n = t.nodes[copy];
    const bool second = n.contamination && n.contamination->second == exemplar;
    s.claims_right += n.parent == exemplar || second ? 1 : 0;
    s.against_dates += n.date.to < t.nodes[exemplar].date.from ? 1 : 0;
    if (n.date.to < t.nodes[exemplar].date.from) MESSAGE("against the dates: " << c.text);
  }
}

Score Run(const std::vector<std::uint64_t>& seeds, const synth::TraditionOptions& o) {
  Score s;
  for (std::uint64_t seed : seeds) {
    CAPTURE(seed);
    const auto t = synth::DrawTradition(seed, o);
    const auto r = Analyse(t);
    ScoreGroups(t, r, s);
    ScoreCopies(t, r, s);
    ScoreMixtures(t, r, s);
  }
  return s;
}

TEST_CASE("lineage on shared-generator traditions copied along a tree: rates over seeds") {
  // Seeds 1-16, six witnesses, one table of up to 240 rows, no contamination
  // (correctors, prints and modern editions as the generator draws them).
  // Measured: groups 16 of 20 (15 before the fourth round of issue 11),
  // copies 16 of 18 right, no false alarm. The
  // floors below are under the goals (groups 0.9) where the stage
  // does not reach them yet; they fail if it gets worse.
  const Score s = Run({1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16}, Small(false));
  MESSAGE("groups " << s.recovered << "/" << s.marked << ", copies " << s.claims_right << "/"
                    << s.claims << ", false contamination " << s.draws_with_contamination_flagged
                    << "/16");
  CHECK(s.against_dates == 0);
  // No false alarm of contamination in at least 15 of the 16 draws.
  CHECK(s.draws_with_contamination_flagged <= 1);
  REQUIRE(s.marked > 0);
  CHECK(s.recovered * 10 >= s.marked * 8);
  REQUIRE(s.claims > 0);
  CHECK(s.claims_right * 10 >= s.claims * 8);
}

TEST_CASE("lineage on shared-generator traditions with contamination: rates over seeds") {
  // Seeds 1-12, eight witnesses, two tables of the generator's default
  // size, with its contamination (a change of exemplar part-way through a
  // table or between tables), and the same seeds without it (false alarms).
  // Six witnesses and one table of 240 rows give too few errors on each
  // side to call any (none called, 15 contaminated). Measured: no false alarm
  // in the 12 uncontaminated draws; 1 witness flagged, rightly, of 4
  // contaminated (the criterion, relations.hpp, asks three slips on each
  // side: it prefers silence to a false alarm).
  synth::TraditionOptions o;
  o.witnesses = 8;
  o.tables = 2;
  const std::vector<std::uint64_t> seeds{1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12};
  const Score s = Run(seeds, o);
  o.share_contaminated = 0;
  const Score clean = Run(seeds, o);
  MESSAGE("false alarms: " << clean.draws_with_contamination_flagged << " of 12 draws");
  CHECK(clean.draws_with_contamination_flagged <= 1);
  CHECK(clean.against_dates == 0);
  MESSAGE("contaminated witnesses flagged "
          << s.flagged_right << " of " << s.flagged << " right, " << s.flagged_right << " of "
          << s.mixed << " found; copies " << s.claims_right << "/" << s.claims);
  CHECK(s.against_dates == 0);
  REQUIRE(s.mixed > 0);
  REQUIRE(s.flagged > 0);
  CHECK(s.flagged_right * 10 >= s.flagged * 8);
  CHECK(s.flagged_right >= 1);
}

TEST_CASE("witnesses whose own line shows too few errors: contamination over seeds") {
  // Seeds 89 and 184 of the generator's defaults (as the lineage benchmark
  // draws them): contaminated witnesses whose first line shows fewer than
  // three errors of its own beside the second exemplar's, the case the
  // line-join criterion (relations.hpp) was written for. Measured: 5 of
  // the 8 contaminated witnesses found, 6 flagged (without the line-join
  // criterion 3 of 8, 4 flagged); since a slip repeated over a run of rows
  // counts once (characters.hpp, JoinRepeatedSlips), 3 of 8 found and 3
  // flagged, all by the two-line criterion: the flags lost rested on runs
  // of a place left out at the head of the column (one of them, I of seed
  // 89, right by chance: its stretches were not where the draw changed
  // exemplar). The lineage benchmark over 300 draws measures the change
  // (DEVELOPERS.md, "Lineage accuracy", seventeenth round); this test keeps
  // what it still shows: no false alarm, and no wrong flag.
  synth::TraditionOptions o;
  const std::vector<std::uint64_t> seeds{89, 184};
  const Score s = Run(seeds, o);
  o.share_contaminated = 0;
  const Score clean = Run(seeds, o);
  MESSAGE("contaminated witnesses flagged " << s.flagged_right << " of " << s.flagged
                                            << " right, of " << s.mixed << "; false alarms "
                                            << clean.draws_with_contamination_flagged << " of 2");
  CHECK(clean.draws_with_contamination_flagged == 0);
  CHECK(s.flagged_right >= 3);
  CHECK(s.flagged_right * 10 >= s.flagged * 8);
}

}  // namespace
}  // namespace apograph
