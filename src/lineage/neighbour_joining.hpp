#pragma once
/// Neighbour joining (Saitou and Nei, 1987) and the distances it is run on.

#include <string>
#include <vector>

#include "lineage/characters.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

using DistanceMatrix = std::vector<std::vector<double>>;

/// Distances between the taxa and, last, the archetype (the base reading of
/// every directed character; unknown for undirected ones):
/// d(i,j) = sum of the weights of the characters where i and j differ,
/// scaled by (total weight / weight of the characters both can be read in).
/// For two witnesses and one error that is |E_i| + |E_j| - 2 |E_i and E_j|:
/// shared errors bring witnesses together, shared right readings add nothing.
/// `weights` (one per character) replaces the characters' own weights when
/// not empty (the bootstrap passes resampled ones).
DistanceMatrix ErrorDistances(const CharacterMatrix& matrix,
                              const std::vector<double>& weights = {});

/// An unrooted tree as edges between nodes; nodes 0..n-1 are the taxa.
struct UnrootedTree {
  int node_count = 0;
  struct Edge {
    int a, b;
    double length;
  };
  std::vector<Edge> edges;
};

/// Neighbour joining on a symmetric distance matrix. Ties in the Q
/// criterion go to the first pair in index order.
UnrootedTree NeighbourJoining(const DistanceMatrix& d);

/// The tree rooted at taxon `root` (the archetype), negative lengths set to 0.
/// `names` names the taxa; the root taxon becomes the stemma's root.
Stemma RootAt(const UnrootedTree& tree, const std::vector<std::string>& names, int root);

/// The NJ stemma of a matrix: distances, joining, rooted at the archetype,
/// groups no error supports contracted, exemplars placed (tree_checks.hpp).
Stemma NeighbourJoiningStemma(const CharacterMatrix& matrix,
                              const std::vector<double>& weights = {});

}  // namespace apograph::lineage
