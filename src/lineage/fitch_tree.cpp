#include "lineage/fitch_tree.hpp"

#include <algorithm>
#include <cstring>

namespace apograph::lineage::internal {

FitchTree::FitchTree(const Patterns& p) : p_(p) {
  const int nodes = std::max(2 * p.taxa, 4);
  parent_.assign(nodes, -1);
  left_.assign(nodes, -1);
  right_.assign(nodes, -1);
  set0_.assign(static_cast<std::size_t>(nodes) * p.words, 0);
  set1_.assign(static_cast<std::size_t>(nodes) * p.words, 0);
  cost_.assign(nodes, 0);
  tmp0_.assign(p.words, 0);
  tmp1_.assign(p.words, 0);
  std::copy(p.zero.begin(), p.zero.end(), set0_.begin());
  std::copy(p.one.begin(), p.one.end(), set1_.begin());
  for (int n = nodes - 1; n >= p.taxa; --n) free_.push_back(n);
}

int FitchTree::Alloc() {
  const int v = free_.back();
  free_.pop_back();
  cost_[v] = 0;
  left_[v] = right_[v] = parent_[v] = -1;
  return v;
}

void FitchTree::Replace(int parent, int old_child, int new_child) {
  if (parent == 0 || left_[parent] == old_child) {
    left_[parent] = new_child;
  } else {
    right_[parent] = new_child;
  }
}

std::int64_t FitchTree::Combine(int a, int b, std::uint64_t* out0, std::uint64_t* out1) const {
  const std::uint64_t *a0 = Zero(a), *a1 = One(a), *b0 = Zero(b), *b1 = One(b);
  std::int64_t cost = 0;
  for (int w = 0; w < p_.words; ++w) {
    const std::uint64_t i0 = a0[w] & b0[w], i1 = a1[w] & b1[w];
    std::uint64_t empty = ~(i0 | i1);
    if (out0) {
      out0[w] = i0 | (empty & (a0[w] | b0[w]));
      out1[w] = i1 | (empty & (a1[w] | b1[w]));
    }
    while (empty) {
      cost += p_.weight[static_cast<std::size_t>(w) * 64 + __builtin_ctzll(empty)];
      empty &= empty - 1;
    }
  }
  return cost;
}

void FitchTree::UpdateUp(int y, bool force_first) {
  bool first = true;
  const std::size_t bytes = sizeof(std::uint64_t) * p_.words;
  while (y > 0) {
    const std::int64_t c = Combine(left_[y], right_[y], tmp0_.data(), tmp1_.data());
    total_ += c - cost_[y];
    cost_[y] = c;
    std::uint64_t* s0 = &set0_[static_cast<std::size_t>(y) * p_.words];
    std::uint64_t* s1 = &set1_[static_cast<std::size_t>(y) * p_.words];
    const bool same =
        std::memcmp(s0, tmp0_.data(), bytes) == 0 && std::memcmp(s1, tmp1_.data(), bytes) == 0;
    if (same && !(first && force_first)) break;
    std::memcpy(s0, tmp0_.data(), bytes);
    std::memcpy(s1, tmp1_.data(), bytes);
    first = false;
    y = parent_[y];
  }
  root_cost_ = left_[0] >= 0 ? Combine(0, left_[0], nullptr, nullptr) : 0;
}

void FitchTree::Start(int a, int b) {
  const int v = Alloc();
  left_[0] = v;
  parent_[v] = 0;
  left_[v] = a;
  right_[v] = b;
  parent_[a] = parent_[b] = v;
  UpdateUp(v, true);
}

void FitchTree::Insert(int x, int y) {
  const int v = Alloc();
  const int p = parent_[y];
  Replace(p, y, v);
  left_[v] = y;
  right_[v] = x;
  parent_[y] = v;
  parent_[x] = v;
  parent_[v] = p;
  UpdateUp(v, true);
}

int FitchTree::Remove(int x) {
  const int v = parent_[x];
  const int s = left_[v] == x ? right_[v] : left_[v];
  const int p = parent_[v];
  Replace(p, v, s);
  parent_[s] = p;
  parent_[x] = -1;
  total_ -= cost_[v];
  cost_[v] = 0;
  free_.push_back(v);
  if (p > 0) {
    UpdateUp(p, false);
  } else {
    root_cost_ = Combine(0, left_[0], nullptr, nullptr);
  }
  return s;
}

std::vector<int> FitchTree::Subtree(int x) const {
  std::vector<int> out, stack{x};
  while (!stack.empty()) {
    const int n = stack.back();
    stack.pop_back();
    out.push_back(n);
    if (!IsLeaf(n)) {
      stack.push_back(right_[n]);
      stack.push_back(left_[n]);
    }
  }
  return out;
}

std::vector<int> FitchTree::Branches() const {
  return left_[0] >= 0 ? Subtree(left_[0]) : std::vector<int>{};
}

void FitchTree::CopyTopology(const FitchTree& o) {
  parent_ = o.parent_;
  left_ = o.left_;
  right_ = o.right_;
  free_ = o.free_;
  RecomputeAll();
}

void FitchTree::RecomputeAll() {
  total_ = 0;
  std::vector<int> order = Branches();
  std::fill(cost_.begin(), cost_.end(), 0);
  for (auto it = order.rbegin(); it != order.rend(); ++it) {
    const int n = *it;
    if (IsLeaf(n)) continue;
    cost_[n] = Combine(left_[n], right_[n], &set0_[static_cast<std::size_t>(n) * p_.words],
                       &set1_[static_cast<std::size_t>(n) * p_.words]);
    total_ += cost_[n];
  }
  root_cost_ = left_[0] >= 0 ? Combine(0, left_[0], nullptr, nullptr) : 0;
}

std::vector<std::int64_t> FitchTree::BranchLengths() const {
  std::vector<std::int64_t> length(parent_.size(), 0);
  std::vector<std::uint64_t> final_state(parent_.size() * p_.words, 0);
  // The archetype's state where it is known; where it is not (undirected
  // characters), the state its child holds, 0 when either.
  const int top = RootChild();
  for (int w = 0; w < p_.words; ++w) {
    const std::uint64_t open = One(0)[w] & Zero(0)[w];
    const std::uint64_t child_one = top >= 0 ? One(top)[w] & ~Zero(top)[w] : 0;
    final_state[w] = (One(0)[w] & ~Zero(0)[w]) | (open & child_one);
  }
  for (int n : Branches()) {
    const int p = parent_[n];
    for (int w = 0; w < p_.words; ++w) {
      const std::uint64_t fp = final_state[static_cast<std::size_t>(p) * p_.words + w];
      const std::uint64_t f = (fp & One(n)[w]) | (~fp & ~Zero(n)[w]);
      final_state[static_cast<std::size_t>(n) * p_.words + w] = f;
      for (std::uint64_t d = f ^ fp; d; d &= d - 1) {
        length[n] += p_.weight[static_cast<std::size_t>(w) * 64 + __builtin_ctzll(d)];
      }
    }
  }
  return length;
}

}  // namespace apograph::lineage::internal
