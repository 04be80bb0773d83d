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
  int marked = 0, recovered = 0;             // groups two or more errors mark
  int claims = 0, claims_right = 0;          // named copies (twins left open are no claim)
  int against_dates = 0;                     // copies named older than their exemplar
  int draws_with_contamination_flagged = 0;  // (for uncontaminated draws: false alarms)
};

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
  }
}

Score Run(const std::vector<std::uint64_t>& seeds, bool contaminated) {
  Score s;
  for (std::uint64_t seed : seeds) {
    CAPTURE(seed);
    const auto t = synth::DrawTradition(seed, Small(contaminated));
    const auto r = Analyse(t);
    ScoreGroups(t, r, s);
    ScoreCopies(t, r, s);
    s.draws_with_contamination_flagged += r.contamination.empty() ? 0 : 1;
  }
  return s;
}

TEST_CASE("lineage on shared-generator traditions copied along a tree: rates over seeds") {
  // Seeds 1-16, six witnesses, one table of up to 240 rows, no contamination
  // (correctors, prints and modern editions as the generator draws them).
  // Measured: groups 14 of 20, copies 13 of 15 right, no false alarm. The
  // floors below are under the goals (groups 0.9) where the stage
  // does not reach them yet; they fail if it gets worse.
  const Score s = Run({1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16}, false);
  MESSAGE("groups " << s.recovered << "/" << s.marked << ", copies " << s.claims_right << "/"
                    << s.claims << ", false contamination " << s.draws_with_contamination_flagged
                    << "/16");
  CHECK(s.against_dates == 0);
  // No false alarm of contamination in at least 15 of the 16 draws.
  CHECK(s.draws_with_contamination_flagged <= 1);
  REQUIRE(s.marked > 0);
  CHECK(s.recovered * 10 >= s.marked * 6);
  REQUIRE(s.claims > 0);
  CHECK(s.claims_right * 10 >= s.claims * 8);
}

}  // namespace
}  // namespace apograph
