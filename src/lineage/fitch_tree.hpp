#pragma once
/// Internal to parsimony: a binary tree rooted at taxon 0 (the archetype)
/// that keeps Fitch state sets for binary characters packed 64 to a word,
/// and updates them along one path when a subtree is inserted or removed,
/// so that trying a branch costs a path, not a tree.

#include <cstdint>
#include <vector>

namespace apograph::lineage::internal {

/// Binary characters compressed to patterns: per taxon, bit p of `zero`
/// (`one`) is set when state 0 (1) is possible for pattern p.
struct Patterns {
  int taxa = 0;
  int count = 0;
  int words = 0;
  std::vector<std::uint64_t> zero, one;  ///< [taxon * words + word]
  std::vector<std::int64_t> weight;      ///< per pattern, integer (1/1024 units)
};

class FitchTree {
 public:
  explicit FitchTree(const Patterns& patterns);

  /// A tree of taxon 0 and two others.
  void Start(int a, int b);
  /// Puts the subtree rooted at `x` (a taxon not yet placed, or a subtree
  /// cut by Remove) on the branch above `y`.
  void Insert(int x, int y);
  /// Cuts the subtree rooted at `x` with its parent node; returns the node
  /// that was its sibling (insert there to restore).
  int Remove(int x);
  std::int64_t Length() const { return total_ + root_cost_; }

  /// Nodes above which a subtree can be inserted (every node in the tree
  /// under the root taxon), in preorder.
  std::vector<int> Branches() const;
  /// Nodes of the subtree at x, in preorder.
  std::vector<int> Subtree(int x) const;
  int Parent(int x) const { return parent_[x]; }
  int Left(int x) const { return left_[x]; }
  int Right(int x) const { return right_[x]; }
  int RootChild() const { return left_[0]; }
  int taxa() const { return p_.taxa; }
  bool IsLeaf(int x) const { return x < p_.taxa; }

  /// Copies the topology of another tree over the same taxa and recomputes.
  void CopyTopology(const FitchTree& other);
  /// Weighted changes on the branch above every node (Fitch states resolved
  /// from the root down, keeping the parent's state where possible).
  std::vector<std::int64_t> BranchLengths() const;

 private:
  int Alloc();
  void Replace(int parent, int old_child, int new_child);
  void UpdateUp(int y, bool force_first);
  void RecomputeAll();
  std::int64_t Combine(int a, int b, std::uint64_t* out0, std::uint64_t* out1) const;
  const std::uint64_t* Zero(int n) const { return &set0_[static_cast<std::size_t>(n) * p_.words]; }
  const std::uint64_t* One(int n) const { return &set1_[static_cast<std::size_t>(n) * p_.words]; }

  const Patterns& p_;
  std::vector<int> parent_, left_, right_;
  std::vector<std::uint64_t> set0_, set1_;
  std::vector<std::int64_t> cost_;
  std::vector<int> free_;
  std::vector<std::uint64_t> tmp0_, tmp1_;
  std::int64_t total_ = 0, root_cost_ = 0;
};

}  // namespace apograph::lineage::internal
