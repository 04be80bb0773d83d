#pragma once
/// Synthetic traditions: a table copied along a known random stemma (lost
/// intermediates included), each copy inheriting its exemplar's readings and
/// adding a few slips of its own. Used by the tests and the benchmarks to
/// check that the stemma comes back; nothing historical.

#include <random>
#include <string>
#include <vector>

#include "collate/collation.hpp"
#include "edition/transcription.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

struct SyntheticOptions {
  int witnesses = 8;  ///< extant copies
  int lost = 3;       ///< lost intermediate copies
  int rows = 200;
  int columns = 1;
  int places = 2;
  int slips_min = 3;  ///< slips each copy adds
  int slips_max = 6;
  /// Share of slips that change one symbol (the rest change a whole place).
  double one_symbol_share = 0.5;
  unsigned seed = 1;
};

struct SyntheticTradition {
  std::vector<std::string> names;  ///< node 0 is the archetype
  std::vector<int> parent;         ///< per node, -1 for the archetype
  std::vector<bool> extant;
  std::vector<std::vector<std::vector<Sexagesimal>>> values;  ///< [node][row][column]
  SyntheticOptions options;
  std::mt19937 rng;

  /// The extant witnesses as transcriptions of table "T1".
  std::vector<Transcription> Witnesses() const;
  /// The archetype's values as the recomputed reference.
  collate::Reference Reference() const;
  /// The true groups: extant witnesses descending from (or being) a node.
  std::vector<Group> TrueGroups() const;
  int Node(const std::string& name) const;
  /// Adds an extant copy of node `exemplar` with its own slips.
  int AddCopy(const std::string& name, int exemplar);
  /// Adds an extant copy that follows node `a` before row `split` and node
  /// `b` from it on (contamination), with its own slips.
  int AddContaminated(const std::string& name, int a, int b, int split);
};

SyntheticTradition SimulateTradition(const SyntheticOptions& options);

}  // namespace apograph::lineage
