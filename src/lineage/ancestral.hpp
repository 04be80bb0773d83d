#pragma once
/// The readings of the lost nodes of a stemma, reconstructed by Fitch's
/// rule (a node holds the state most of its children hold; a witness at an
/// inner node holds its own), and what they tell: which state each
/// undirected character had at the root, on which branch each change lies,
/// and how many characters back each group or contradict it.

#include <vector>

#include "lineage/characters.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

/// State sets per node and character: bit 1 = state 0 possible, bit 2 =
/// state 1 possible. The archetype (root) holds state 0 where the
/// character is directed and either state where it is not.
struct AncestralStates {
  std::vector<std::vector<unsigned char>> sets;  ///< [node][character], after the pass down
  std::vector<std::vector<signed char>> state;   ///< [node][character]: 0, 1, or -1 (either)
  std::vector<int> parent;                       ///< the stemma's parent of each node

  /// The character changes on the branch above `node` (both ends known, different).
  bool Changes(int node, int character) const;
};

/// Fitch's two passes over any rooted stemma (nodes with any number of children).
AncestralStates Reconstruct(const Stemma& stemma, const CharacterMatrix& matrix);

/// A copy of the matrix whose undirected characters are oriented by the
/// stemma: where the root holds state 1, states 0 and 1 are swapped, so that
/// state 1 is always the reading that arose below the root; those
/// characters become Direction::kTree. Characters whose root state is open
/// stay undirected.
CharacterMatrix Orient(const CharacterMatrix& matrix, const Stemma& stemma);

/// What backs one group of a stemma.
struct GroupEvidence {
  int characters = 0;   ///< characters that change on the branch above the group
  double weight = 0;    ///< their weight
  int conflicting = 0;  ///< informative characters that cannot hold on any tree with the group
  double conflict_weight = 0;
};

/// Evidence for the group below `node` (characters as oriented by Orient).
GroupEvidence EvidenceFor(const Stemma& stemma, int node, const CharacterMatrix& oriented,
                          const AncestralStates& states);

}  // namespace apograph::lineage
