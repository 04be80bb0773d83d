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

/// At a cell no model judged, the reading most witnesses share is taken as
/// the archetype's (Direction::kMajority). It may be the error of one large
/// line (eight of eleven witnesses below one lost copy): its few right
/// readers then seem to share errors, to hold each other's errors (as a
/// copy does) and to change exemplar. Returns `matrix` with such majorities
/// left undirected (to be oriented by a stemma like any undirected
/// character): those that `first`, a stemma rooted by the model's
/// characters alone, shows as the reading of one line from the archetype
/// against kLinesAgainstMajority or more lines reading the other
/// (Fitch's sets of the archetype's children, reconstructed on
/// `tree_matrix`, the matrix `first` was built on, whose characters are
/// those of `matrix`). Without the model's root (CountRootEvidence) there
/// is nothing to check a majority against: `matrix` is returned as it is.
CharacterMatrix CheckMajorities(const CharacterMatrix& matrix, const Stemma& first,
                                const CharacterMatrix& tree_matrix);

/// Lines from the archetype that must read against a majority held by one
/// line for CheckMajorities to set it aside. Measured on the lineage
/// benchmark (seeds 1-300, cached characters; DEVELOPERS.md "Lineage
/// accuracy", eighteenth round): with two (the archetype's Fitch state),
/// a mixed witness placed by itself at the archetype sided with the line it
/// mixed in, and six right calls of contamination were lost; with three,
/// none, and false alarms 6 -> 4 of 300.
inline constexpr int kLinesAgainstMajority = 3;

/// Re-roots the stemma at the midpoint of its longest path between two
/// witnesses (branch lengths as they stand); the archetype becomes the new
/// root. Support values are dropped (they belonged to the old groups).
void RootAtMidpoint(Stemma& stemma);

}  // namespace apograph::lineage
