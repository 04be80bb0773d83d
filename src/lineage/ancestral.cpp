#include "lineage/ancestral.hpp"

#include <algorithm>

namespace apograph::lineage {
namespace {

unsigned char Mask(signed char state) { return state == 1 ? 2 : (state == 0 ? 1 : 3); }

// Taxon index of every node (-1 for lost copies and the archetype).
std::vector<int> TaxonOf(const Stemma& s, const CharacterMatrix& m) {
  std::vector<int> out(s.nodes.size(), -1);
  for (std::size_t n = 0; n < s.nodes.size(); ++n) {
    if (s.nodes[n].witness) out[n] = m.TaxonIndex(s.nodes[n].name);
  }
  return out;
}

// Nodes reachable from the root, parents before children.
std::vector<int> Preorder(const Stemma& s) {
  std::vector<int> out, stack{s.root};
  while (!stack.empty()) {
    const int n = stack.back();
    stack.pop_back();
    out.push_back(n);
    for (auto it = s.nodes[n].children.rbegin(); it != s.nodes[n].children.rend(); ++it)
      stack.push_back(*it);
  }
  return out;
}

// Fitch's set of node n for character k, its children's sets being known.
unsigned char Down(const Stemma& s, int n, int k, const CharacterMatrix& m,
                   const std::vector<int>& taxon, const AncestralStates& a) {
  const int t = taxon[n];
  if (t >= 0 && m.characters[k].states[t] >= 0) return Mask(m.characters[k].states[t]);
  if (n == s.root && m.characters[k].Directed()) return 1;
  int zero = 0, one = 0;
  for (int c : s.nodes[n].children) {
    zero += a.sets[c][k] & 1;
    one += (a.sets[c][k] >> 1) & 1;
  }
  if (zero == 0 && one == 0) return 3;
  return static_cast<unsigned char>((zero >= one ? 1 : 0) | (one >= zero ? 2 : 0));
}

signed char Single(unsigned char set) { return set == 1 ? 0 : (set == 2 ? 1 : -1); }

}  // namespace

bool AncestralStates::Changes(int node, int k) const {
  const int p = parent[node];
  if (p < 0) return false;
  const signed char a = state[p][k], b = state[node][k];
  return a >= 0 && b >= 0 && a != b;
}

AncestralStates Reconstruct(const Stemma& s, const CharacterMatrix& m) {
  AncestralStates a;
  const std::size_t chars = m.characters.size();
  a.sets.assign(s.nodes.size(), std::vector<unsigned char>(chars, 3));
  a.state.assign(s.nodes.size(), std::vector<signed char>(chars, -1));
  a.parent.assign(s.nodes.size(), -1);
  if (s.root < 0) return a;
  const auto taxon = TaxonOf(s, m);
  const auto order = Preorder(s);
  for (int n : order) {
    for (int c : s.nodes[n].children) a.parent[c] = n;
  }
  for (auto it = order.rbegin(); it != order.rend(); ++it) {
    for (std::size_t k = 0; k < chars; ++k)
      a.sets[*it][k] = Down(s, *it, static_cast<int>(k), m, taxon, a);
  }
  for (int n : order) {
    const int p = a.parent[n];
    for (std::size_t k = 0; k < chars; ++k) {
      const unsigned char set = a.sets[n][k];
      const signed char up = p < 0 ? -1 : a.state[p][k];
      a.state[n][k] = up >= 0 && (set & Mask(up)) ? up : Single(set);
    }
  }
  return a;
}

CharacterMatrix Orient(const CharacterMatrix& m, const Stemma& s) {
  CharacterMatrix out = m;
  if (s.root < 0) return out;
  const AncestralStates a = Reconstruct(s, m);
  for (std::size_t k = 0; k < out.characters.size(); ++k) {
    Character& ch = out.characters[k];
    if (ch.Directed()) continue;
    const signed char root = a.state[s.root][k];
    if (root < 0) continue;
    if (root == 1) {
      for (auto& x : ch.states) x = x < 0 ? x : static_cast<signed char>(1 - x);
      ch.base_is_right = false;  // the base is now the other reading
      ch.omission = false;
    }
    ch.direction = Direction::kTree;
  }
  return out;
}

GroupEvidence EvidenceFor(const Stemma& s, int node, const CharacterMatrix& m,
                          const AncestralStates& a) {
  GroupEvidence e;
  std::vector<bool> inside(m.taxa.size(), false);
  for (const auto& name : s.Below(node)) {
    const int t = m.TaxonIndex(name);
    if (t >= 0) inside[t] = true;
  }
  for (std::size_t k = 0; k < m.characters.size(); ++k) {
    const Character& ch = m.characters[k];
    if (ch.tie_break) continue;
    if (a.Changes(node, static_cast<int>(k))) ++e.characters, e.weight += ch.weight;
    // Four-gamete test of the character against the group's split (the
    // archetype stands outside the group in state 0 when the character is
    // directed).
    bool in0 = false, in1 = false, out0 = ch.Directed(), out1 = false;
    for (std::size_t t = 0; t < m.taxa.size(); ++t) {
      const signed char x = ch.states[t];
      if (x < 0) continue;
      (inside[t] ? (x ? in1 : in0) : (x ? out1 : out0)) = true;
    }
    if (in0 && in1 && out0 && out1) ++e.conflicting, e.conflict_weight += ch.weight;
  }
  return e;
}

}  // namespace apograph::lineage
