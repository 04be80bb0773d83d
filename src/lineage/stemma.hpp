#pragma once
/// A stemma: a rooted tree of witnesses and lost copies with the archetype
/// at the root, as the methods return it and the formats write it.

#include <optional>
#include <string>
#include <vector>

namespace apograph::lineage {

/// The name of the virtual witness that carries no error (the root).
inline constexpr const char* kArchetype = "archetype";

struct StemmaNode {
  std::string name;  ///< siglum, kArchetype, or empty for a lost copy
  bool witness = false;
  int parent = -1;
  std::vector<int> children;
  double length = 0;              ///< weighted errors (parsimony) or distance (NJ) from the parent
  std::optional<double> support;  ///< bootstrap fraction of the group below this node
};

/// A group: the sigla below one node, sorted.
using Group = std::vector<std::string>;

struct Stemma {
  std::vector<StemmaNode> nodes;
  int root = -1;

  int Add(StemmaNode node);
  void Attach(int parent, int child);
  /// Sigla below (and at) a node, sorted.
  Group Below(int node) const;
  /// Every group of two or more witnesses other than the whole tradition,
  /// with the node that carries it, in preorder.
  std::vector<std::pair<Group, int>> Groups() const;
  /// Drops nodes no longer reachable from the root and renumbers.
  void Compact();
};

/// Robinson-Foulds distance between the groups of two stemmata (groups in
/// one and not the other, counted both ways) and the share of `truth`'s
/// groups found in `found`.
struct GroupComparison {
  int distance = 0;
  int truth_groups = 0;
  int recovered = 0;
};
GroupComparison CompareGroups(const std::vector<Group>& truth, const std::vector<Group>& found);

/// Newick with branch lengths; lost copies unnamed; support (percent) as the
/// label of lost inner nodes when known; every witness is a leaf (a
/// surviving exemplar drawn above its copies is written as a leaf of length
/// 0 beside them), so that general phylogenetics tools read it.
/// Example: `((A:2,B:1)95:3,C:4)archetype;`, `((B:2,A:0)A:3,C:1)archetype;`
/// is written `((B:2,A:0):3,C:1)archetype;`.
std::string ToNewick(const Stemma& stemma);

/// How editors label the nodes: witnesses by siglum, lost copies by Greek
/// letters (alpha, beta, ... in preorder), the archetype omega. Per node.
std::vector<std::string> NodeLabels(const Stemma& stemma);

/// A dashed line in the drawing (contamination: from the second exemplar).
struct DashedEdge {
  int from = -1, to = -1;  ///< nodes
  std::string label;
};

/// Graphviz DOT: witnesses as boxes, lost copies as Greek letters, the
/// archetype as omega, errors (and support) on the edges; `extra` dashed.
std::string ToDot(const Stemma& stemma, const std::string& title,
                  const std::vector<DashedEdge>& extra = {});
/// An indented drawing for the terminal (lost copies by their Greek letters).
std::string ToText(const Stemma& stemma);

/// The node of a witness, or -1.
int FindWitness(const Stemma& stemma, const std::string& siglum);

}  // namespace apograph::lineage
