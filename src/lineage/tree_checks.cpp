#include "lineage/tree_checks.hpp"

#include <algorithm>
#include <map>

namespace apograph::lineage {
namespace {

// Distinct character patterns with summed weights; masks: 1 = state 0
// possible, 2 = state 1 possible.
struct PatternSet {
  std::map<std::string, int> taxon;
  std::vector<std::vector<unsigned char>> by_taxon;  // [taxon][pattern]
  std::vector<double> weight;
};

PatternSet Patterns(const CharacterMatrix& m, const std::vector<double>& weights) {
  std::map<std::vector<signed char>, double> merged;
  for (std::size_t c = 0; c < m.characters.size(); ++c) {
    const double w = weights.empty() ? m.characters[c].weight : weights[c];
    if (w > 0) merged[m.characters[c].states] += w;
  }
  PatternSet p;
  p.by_taxon.assign(m.taxa.size(), {});
  for (std::size_t t = 0; t < m.taxa.size(); ++t) p.taxon[m.taxa[t]] = static_cast<int>(t);
  for (const auto& [states, w] : merged) {
    p.weight.push_back(w);
    for (std::size_t t = 0; t < m.taxa.size(); ++t) {
      p.by_taxon[t].push_back(states[t] == 1 ? 2 : (states[t] == 0 ? 1 : 3));
    }
  }
  return p;
}

double Free(const std::vector<std::vector<unsigned char>>& kids, std::size_t k,
            unsigned char& out) {
  int zero = 0, one = 0;
  for (const auto& kid : kids) zero += kid[k] & 1, one += (kid[k] >> 1) & 1;
  const int best = std::max(zero, one);
  out = static_cast<unsigned char>((zero == best ? 1 : 0) | (one == best ? 2 : 0));
  return static_cast<int>(kids.size()) - best;
}

// A witness standing at an inner node: its own readings are the node's
// states; every child that cannot have them costs a change.
double FixedNode(const std::vector<std::vector<unsigned char>>& kids,
                 const std::vector<unsigned char>& own, const PatternSet& p,
                 std::vector<unsigned char>& out) {
  out.assign(p.weight.size(), 3);
  double cost = 0;
  for (std::size_t k = 0; k < p.weight.size(); ++k) {
    if (own[k] == 3) {
      cost += p.weight[k] * Free(kids, k, out[k]);
      continue;
    }
    out[k] = own[k];
    for (const auto& kid : kids) cost += (kid[k] & own[k]) ? 0 : p.weight[k];
  }
  return cost;
}

// Fitch's sets for a node with any number of children: the states held by
// the most children; cost = children - that count.
double Node(const Stemma& s, int n, const PatternSet& p, std::vector<unsigned char>& out) {
  std::vector<std::vector<unsigned char>> kids;
  double cost = 0;
  for (int c : s.nodes[n].children) {
    kids.emplace_back();
    cost += Node(s, c, p, kids.back());
  }
  const auto& node = s.nodes[n];
  if (node.witness) {
    auto it = p.taxon.find(node.name);
    if (it == p.taxon.end()) {
    } else if (kids.empty()) {
      out = p.by_taxon[it->second];
      return cost;
    } else {
      return cost + FixedNode(kids, p.by_taxon[it->second], p, out);
    }
  } else if (n == s.root) {
    kids.emplace_back(p.weight.size(), 1);  // the archetype: no errors
  }
  out.assign(p.weight.size(), 3);
  if (kids.empty()) return cost;
  for (std::size_t k = 0; k < p.weight.size(); ++k) cost += p.weight[k] * Free(kids, k, out[k]);
  return cost;
}

double Length(const Stemma& s, const PatternSet& p) {
  std::vector<unsigned char> root;
  return Node(s, s.root, p, root);
}

void Contract(Stemma& s, int n) {
  const int parent = s.nodes[n].parent;
  auto& siblings = s.nodes[parent].children;
  siblings.erase(std::find(siblings.begin(), siblings.end(), n));
  for (int k : s.nodes[n].children) {
    s.nodes[k].length += s.nodes[n].length;
    s.Attach(parent, k);
  }
  s.nodes[n].children.clear();
  s.nodes[n].parent = -1;
}

// The leaf k takes the place of its lost parent.
void Promote(Stemma& s, int k) {
  const int parent = s.nodes[k].parent;
  auto& siblings = s.nodes[parent].children;
  siblings.erase(std::find(siblings.begin(), siblings.end(), k));
  s.nodes[parent].name = s.nodes[k].name;
  s.nodes[parent].witness = true;
  s.nodes[k].parent = -1;
}

}  // namespace

double FitchLength(const Stemma& s, const CharacterMatrix& m, const std::vector<double>& weights) {
  return Length(s, Patterns(m, weights));
}

void KeepSupported(Stemma& s, const CharacterMatrix& m, const std::vector<double>& weights,
                   double min_evidence) {
  const PatternSet p = Patterns(m, weights);
  const double eps = 1e-9;
  double base = Length(s, p);
  for (int n = 0; n < static_cast<int>(s.nodes.size()); ++n) {
    const auto& node = s.nodes[n];
    if (n == s.root || node.witness || node.parent < 0 || node.children.empty()) continue;
    Stemma trial = s;
    Contract(trial, n);
    const double len = Length(trial, p);
    if (len < base + min_evidence - eps) s = std::move(trial), base = len;
  }
  for (int n = 0; n < static_cast<int>(s.nodes.size()); ++n) {
    const auto& node = s.nodes[n];
    if (n == s.root || node.witness || node.parent < 0 || !node.name.empty()) continue;
    for (int k : node.children) {
      if (!s.nodes[k].witness || !s.nodes[k].children.empty()) continue;
      Stemma trial = s;
      Promote(trial, k);
      const double len = Length(trial, p);
      if (len <= base + eps) {
        s = std::move(trial);
        break;
      }
    }
  }
  s.Compact();
}

}  // namespace apograph::lineage
