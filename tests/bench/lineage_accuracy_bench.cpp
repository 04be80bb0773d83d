// Accuracy of the lineage stage over seeded synthetic traditions (built
// with -DAPOGRAPH_BENCH=ON):
//   ./build-bench/lineage_accuracy_bench [draws=300] [first_seed=1] [mode=estimated] [verbose=0]
// mode: estimated (the whole pipeline: model and practice identified from
// the witnesses, deviations explained, collation judged by them), given
// (collation against the author's model), none (no model: majority and
// undirected characters).
// Each draw is lineage::DrawTradition with seed first_seed + k (4 to 15
// witnesses, lost copies, copies of surviving witnesses, contamination,
// correctors, modern editions; see tests/synth/lineage_tradition.hpp);
// the same seeds are drawn a second time with no contamination to measure
// false alarms. Goals (issue 11): marked groups recovered >= 90%; normalised
// Robinson-Foulds within 0.05 of the best tree the surviving readings allow;
// copies precision >= 0.9, recall >= 0.8; contaminated witnesses precision
// >= 0.8, recall >= 0.7; false contamination <= 5% of uncontaminated draws;
// no copy claim against the dates.
#include <cstdio>
#include <cstdlib>
#include <string>
#include <vector>

#include "collate/collation.hpp"
#include "lineage/characters.hpp"
#include "lineage/lineage.hpp"
#include "pipeline/analysis.hpp"
#include "synth/lineage_tradition.hpp"

namespace lineage = apograph::lineage;
namespace collate = apograph::collate;
namespace pipeline = apograph::pipeline;

namespace {

lineage::LineageReport Analyse(const lineage::TraditionDraw& d, const std::string& mode) {
  lineage::LineageOptions lo;
  if (mode == "estimated") {
    pipeline::AnalysisOptions o;
    o.lineage = lo;
    std::vector<pipeline::TableAnalysis> tables;
    for (const auto& t : d.tables) tables.push_back(pipeline::AnalyseTranscriptions(t, o));
    return pipeline::WorkLineage(tables, lo);
  }
  std::vector<lineage::CharacterMatrix> parts;
  for (std::size_t t = 0; t < d.tables.size(); ++t) {
    collate::CollateOptions co;
    if (mode == "given") co.reference = d.models[t];
    parts.push_back(lineage::BuildCharacters(collate::Collate(d.tables[t], co)));
  }
  const auto m = lineage::MergeMatrices(parts);
  if (const char* w = std::getenv("LINEAGE_DEBUG_WITNESS")) {  // for studying one draw
    const int t = m.TaxonIndex(w);
    for (const auto& ch : m.characters) {
      if (t < 0 || ch.states[t] != 1) continue;
      std::printf("  %s w%.1f %s:", ch.label.c_str(), ch.weight, lineage::ToString(ch.direction));
      for (std::size_t k = 0; k < m.taxa.size(); ++k)
        std::printf(" %s%s", m.taxa[k].c_str(), ch.states[k] == 1 ? "+" : ch.states[k] ? "?" : "-");
      std::printf("\n");
    }
  }
  return lineage::AnalyseLineage(m, lo);
}

struct Totals {
  int draws = 0;
  long marked = 0, recovered = 0, true_groups = 0, strong = 0, strong_recovered = 0;
  double rf_found = 0, rf_best = 0;
  long claims = 0, claims_right = 0, copies = 0, copies_named = 0, date_violations = 0;
  long contaminated = 0, flagged = 0, flagged_right = 0;
  long correctors = 0, correctors_flagged = 0, correctors_right = 0;
  int clean_draws = 0, clean_false_alarms = 0;

  void Add(const lineage::DrawScore& s) {
    ++draws;
    marked += s.marked_groups, recovered += s.marked_recovered, true_groups += s.true_groups;
    strong += s.strongly_marked, strong_recovered += s.strongly_marked_recovered;
    rf_found += s.rf_found, rf_best += s.rf_best;
    claims += s.copy_claims, claims_right += s.copy_claims_right;
    copies += s.true_copies, copies_named += s.true_copies_named;
    date_violations += s.date_violations;
    contaminated += s.contaminated, flagged += s.flagged, flagged_right += s.flagged_right;
    correctors += s.correctors, correctors_flagged += s.correctors_flagged;
    correctors_right += s.correctors_right;
  }
};

double Share(long a, long b) { return b ? static_cast<double>(a) / static_cast<double>(b) : 0; }

void Verbose(const lineage::TraditionDraw& d, const lineage::LineageReport& r,
             const lineage::DrawScore& s, unsigned seed) {
  std::printf("seed %u: %zu tables; nodes:", seed, d.tables.size());
  for (const auto& n : d.nodes) {
    std::printf(
        " %s<-%s%s%s%s", n.name.c_str(), n.parent >= 0 ? d.nodes[n.parent].name.c_str() : "-",
        n.second_exemplar >= 0 ? ("+" + d.nodes[n.second_exemplar].name).c_str() : "",
        n.corrector ? "(corr)" : "", n.kind == apograph::WitnessKind::kModernEdition ? "(ed)" : "");
  }
  std::printf(
      "\n  groups %d/%d marked found, %d found, rf %.2f (best %.2f); copies %d/%d right;"
      " contamination %d/%d right (truth %d); correctors %d/%d (truth %d)\n",
      s.marked_recovered, s.marked_groups, s.found_groups, s.rf_found, s.rf_best,
      s.copy_claims_right, s.copy_claims, s.flagged_right, s.flagged, s.contaminated,
      s.correctors_right, s.correctors_flagged, s.correctors);
  auto print = [](const char* what, const std::vector<lineage::Group>& gs) {
    if (gs.empty()) return;
    std::printf("  %s:", what);
    for (const auto& g : gs) {
      std::printf(" {");
      for (std::size_t i = 0; i < g.size(); ++i) std::printf("%s%s", i ? " " : "", g[i].c_str());
      std::printf("}");
    }
    std::printf("\n");
  };
  print("missed", s.missed);
  if (!s.missed_copies.empty() || !s.wrong_copies.empty()) {
    std::printf("  copies missed:");
    for (const auto& c : s.missed_copies) std::printf(" %s", c.c_str());
    std::printf("; wrong:");
    for (const auto& c : s.wrong_copies) std::printf(" %s", c.c_str());
    std::printf("\n");
  }
  print("false", s.false_groups);
  if (!r.results.empty()) std::printf("%s", lineage::ToText(r.results[0].stemma).c_str());
  for (const auto& c : r.contamination) std::printf("  contamination: %s\n", c.text.c_str());
  for (const auto& c : r.corrections) std::printf("  correction: %s\n", c.text.c_str());
  for (const auto& c : r.copies) std::printf("  copy: %s\n", c.text.c_str());
}

}  // namespace

int main(int argc, char** argv) {
  const int draws = argc > 1 ? std::atoi(argv[1]) : 300;
  const unsigned first = argc > 2 ? static_cast<unsigned>(std::atoi(argv[2])) : 1;
  const std::string mode = argc > 3 ? argv[3] : "estimated";
  const bool verbose = argc > 4 && std::atoi(argv[4]) != 0;
  // "plain": copies along the tree only (no contamination, correctors or
  // modern editions), to see the methods without those phenomena.
  // "only-correctors", "only-editions", "only-contamination": one phenomenon.
  const std::string only = argc > 5 ? argv[5] : "";
  const bool plain = only == "plain";
  Totals all;
  for (int k = 0; k < draws; ++k) {
    lineage::DrawOptions o;
    o.seed = first + static_cast<unsigned>(k);
    if (plain) o.contamination = 0, o.corrector = 0, o.modern_editions = 0;
    if (only == "only-correctors") o.contamination = 0, o.modern_editions = 0;
    if (only == "only-editions") o.contamination = 0, o.corrector = 0;
    if (only == "only-contamination") o.corrector = 0, o.modern_editions = 0;
    const auto d = lineage::DrawTradition(o);
    const auto r = Analyse(d, mode);
    const auto s = lineage::ScoreDraw(d, r);
    all.Add(s);
    if (verbose) Verbose(d, r, s, o.seed);
    o.contamination = 0;
    const auto clean = lineage::DrawTradition(o);
    const auto rc = Analyse(clean, mode);
    ++all.clean_draws;
    all.clean_false_alarms += rc.contamination.empty() ? 0 : 1;
    if (verbose && !rc.contamination.empty())
      std::printf("  FALSE ALARM (clean draw %u): %s\n", o.seed, rc.contamination[0].text.c_str());
  }
  std::printf("lineage accuracy: %d draws (seeds %u to %u), mode %s\n", all.draws, first,
              first + static_cast<unsigned>(draws) - 1, mode.c_str());
  std::printf("  marked groups recovered      %.3f (%ld of %ld; %ld true groups)  goal >= 0.90\n",
              Share(all.recovered, all.marked), all.recovered, all.marked, all.true_groups);
  std::printf(
      "  strongly marked recovered    %.3f (%ld of %ld: marked by a reading more than a unit "
      "off)\n",
      Share(all.strong_recovered, all.strong), all.strong_recovered, all.strong);
  std::printf(
      "  normalised RF                %.3f, best the readings allow %.3f  goal: within 0.05\n",
      all.rf_found / all.draws, all.rf_best / all.draws);
  std::printf(
      "  direct copies                precision %.3f (%ld of %ld), recall %.3f (%ld of %ld)"
      "  goal 0.9 / 0.8\n",
      Share(all.claims_right, all.claims), all.claims_right, all.claims,
      Share(all.copies_named, all.copies), all.copies_named, all.copies);
  std::printf(
      "  contaminated witnesses       precision %.3f (%ld of %ld), recall %.3f (%ld of %ld)"
      "  goal 0.8 / 0.7\n",
      Share(all.flagged_right, all.flagged), all.flagged_right, all.flagged,
      Share(all.flagged_right, all.contaminated), all.flagged_right, all.contaminated);
  std::printf(
      "  false contamination          %.3f of uncontaminated draws (%d of %d)  goal <= 0.05\n",
      Share(all.clean_false_alarms, all.clean_draws), all.clean_false_alarms, all.clean_draws);
  std::printf("  copy claims against dates    %ld  goal 0\n", all.date_violations);
  std::printf(
      "  correctors                   precision %.3f (%ld of %ld), recall %.3f (%ld of %ld)\n",
      Share(all.correctors_right, all.correctors_flagged), all.correctors_right,
      all.correctors_flagged, Share(all.correctors_right, all.correctors), all.correctors_right,
      all.correctors);
  return 0;
}
