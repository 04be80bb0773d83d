#pragma once
/// Where the archetype stands. Directed characters (a model or a majority
/// tells which reading was the archetype's) place it: the methods treat it
/// as a witness holding every base reading. Where nothing directs the
/// characters the tree they give is unrooted; it is then rooted at the
/// midpoint of its longest path between two witnesses (a convention, not
/// evidence), and the report says so.

#include <string>

#include "lineage/characters.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

/// Weight of the characters that could place the archetype (two or more
/// witnesses in state 1), by what directs them.
struct RootEvidence {
  double model = 0;
  double majority = 0;
  double undirected = 0;
  /// Enough directed evidence to place the archetype (kMinRootEvidence).
  bool Directed() const;
  /// "model", "majority" or "midpoint".
  std::string Basis() const;
};
RootEvidence CountRootEvidence(const CharacterMatrix& matrix);

/// Directed weight below which the tree is taken as unrooted: two common
/// slips or one distinctive error, a judgement (the threshold for keeping a
/// group was the same until it went down to one slip, tree_checks.hpp).
inline constexpr double kMinRootEvidence = 1.5;

/// Re-roots the stemma at the midpoint of its longest path between two
/// witnesses (branch lengths as they stand); the archetype becomes the new
/// root. Support values are dropped (they belonged to the old groups).
void RootAtMidpoint(Stemma& stemma);

}  // namespace apograph::lineage
