// Benchmark of the lineage stage (built with -DAPOGRAPH_BENCH=ON):
//   exact parsimony (branch-and-bound) for 12 witnesses over 2,000 cells, goal < 2 s;
//   heuristic search (stepwise addition + SPR) for 100 witnesses, goal < 30 s;
//   and the whole analysis (AnalyseLineage: the search, rooting, copies,
//   correctors and the three contamination criteria) on the same draws.
// Run: ./build/lineage_bench (--quick: the search and the corrector test only)
#include <chrono>
#include <cstdio>
#include <cstring>

#include "collate/collation.hpp"
#include "lineage/corrections.hpp"
#include "lineage/lineage.hpp"
#include "lineage/synthetic.hpp"

namespace lineage = apograph::lineage;
namespace collate = apograph::collate;

namespace {

double Seconds(std::chrono::steady_clock::time_point since) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - since).count();
}

bool quick = false;  // --quick: the corrector test alone, not the whole analysis

void Run(const char* name, int witnesses, int rows, int columns, double goal, int slips = 0) {
  lineage::SyntheticOptions o;
  if (slips) o.slips_min = slips, o.slips_max = 2 * slips;
  o.witnesses = witnesses;
  o.lost = witnesses / 3;
  o.rows = rows;
  o.columns = columns;
  o.seed = 42;
  const auto t = lineage::SimulateTradition(o);
  auto start = std::chrono::steady_clock::now();
  collate::CollateOptions co;
  co.reference = t.Reference();
  co.tolerance_units = 0;
  const auto c = collate::Collate(t.Witnesses(), co);
  const auto m = lineage::BuildErrorCharacters(c);
  const double prep = Seconds(start);
  start = std::chrono::steady_clock::now();
  const auto r = lineage::Parsimony(m);
  const double search = Seconds(start);
  std::vector<lineage::Group> found;
  for (const auto& [g, n] : r.stemma.Groups()) found.push_back(g);
  const auto cmp = lineage::CompareGroups(t.TrueGroups(), found);
  std::printf("%s: %d witnesses, %d cells, %zu error characters\n", name, witnesses, rows * columns,
              m.characters.size());
  std::printf(
      "  collation + characters %.3f s; search (%s%s) %.3f s, %lld trees examined; goal %.0f s: "
      "%s\n",
      prep, r.search.c_str(), r.exact ? ", exact" : "", search,
      static_cast<long long>(r.trees_examined), goal, search < goal ? "met" : "MISSED");
  std::printf("  groups recovered %d of %d, Robinson-Foulds distance %d\n", cmp.recovered,
              cmp.truth_groups, cmp.distance);
  // The simulation has no correctors: every witness named one is false.
  start = std::chrono::steady_clock::now();
  const auto correctors = lineage::FindCorrections(m);
  std::printf("  corrector test %.3f s: %zu named (none corrects)\n", Seconds(start),
              correctors.size());
  if (quick) return;
  start = std::chrono::steady_clock::now();
  const auto report = lineage::AnalyseLineage(m);
  std::printf("  whole analysis %.3f s (%zu copies, %zu contaminated, %zu correctors named)\n",
              Seconds(start), report.copies.size(), report.contamination.size(),
              report.corrections.size());
}

}  // namespace

int main(int argc, char** argv) {
  quick = argc > 1 && std::strcmp(argv[1], "--quick") == 0;
  Run("exact parsimony", 12, 1000, 2, 2);
  Run("exact parsimony, many slips per copy", 12, 1000, 2, 2, 60);
  Run("heuristic parsimony", 100, 1000, 2, 30);
  Run("heuristic parsimony, many slips per copy", 100, 1000, 2, 30, 30);
  return 0;
}
