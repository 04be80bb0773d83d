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
  std::vector<unsigned char> root;                   // the archetype: state 0 (directed) or either
  std::vector<double> weight;
};

PatternSet Patterns(const CharacterMatrix& m, const std::vector<double>& weights) {
  std::map<std::pair<bool, std::vector<signed char>>, double> merged;
  for (std::size_t c = 0; c < m.characters.size(); ++c) {
    const double w = weights.empty() ? m.characters[c].weight : weights[c];
    if (w > 0) merged[{m.characters[c].Directed(), m.characters[c].states}] += w;
  }
  PatternSet p;
  p.by_taxon.assign(m.taxa.size(), {});
  for (std::size_t t = 0; t < m.taxa.size(); ++t) p.taxon[m.taxa[t]] = static_cast<int>(t);
  for (const auto& [key, w] : merged) {
    const auto& [directed, states] = key;
    p.weight.push_back(w);
    p.root.push_back(directed ? 1 : 3);
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
    kids.push_back(p.root);  // the archetype: the base reading where it is known
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

// Whether witness k may stand at its lost parent, above the others there:
// not a modern edition above older kinds, not later than any of them, and
// legible at most of the readings that arose below that node (a witness
// whose readings were set aside has nothing to show it is their exemplar).
bool MayStandAbove(const Stemma& s, const CharacterMatrix& m, int k) {
  const int t = m.TaxonIndex(s.nodes[k].name);
  if (t < 0) return false;
  const bool info = m.witnesses.size() == m.taxa.size();
  const int parent = s.nodes[k].parent;
  std::vector<int> others;
  for (const auto& name : s.Below(parent)) {
    const int o = m.TaxonIndex(name);
    if (o < 0 || o == t) continue;
    others.push_back(o);
    if (!info) continue;
    const auto& w = m.witnesses[t];
    const auto& x = m.witnesses[o];
    if (w.Kind() == WitnessKind::kModernEdition && x.Kind() != WitnessKind::kModernEdition)
      return false;
    const auto dw = w.Dates(), dx = x.Dates();
    if (dw && dx && dx->WhollyBefore(*dw)) return false;
  }
  int below = 0, legible = 0;
  for (const auto& ch : m.characters) {
    bool arose = false;
    for (int o : others) arose = arose || ch.states[o] == 1;
    if (!arose) continue;
    ++below;
    legible += ch.states[t] >= 0 ? 1 : 0;
  }
  return 2 * legible >= below;
}

bool InSubtree(const Stemma& s, int root, int n) {
  for (int x = n; x >= 0; x = s.nodes[x].parent) {
    if (x == root) return true;
  }
  return false;
}

void Move(Stemma& s, int n, int target) {
  const int old = s.nodes[n].parent;
  auto& siblings = s.nodes[old].children;
  siblings.erase(std::find(siblings.begin(), siblings.end(), n));
  s.Attach(target, n);
  if (old != s.root && !s.nodes[old].witness && s.nodes[old].children.size() == 1)
    Contract(s, old);  // a lost copy with one line left adds nothing
}

// Contracting a weak group leaves its members where it stood; a witness or
// a group may fit better under another lost copy (or the archetype). Each
// of them (`moved`: the members of the contracted groups, nothing else, as
// the rest stands where the search put it) is moved where the tree gets
// shortest, until nothing improves. Trying every node instead made the
// step cost nodes squared times the tree's length (over an hour at 100
// witnesses with many slips, lineage_bench).
void Regraft(Stemma& s, const PatternSet& p, double& base, const std::vector<int>& moved) {
  const double eps = 1e-9;
  for (int round = 0; round < 4 && !moved.empty(); ++round) {
    double best = base;
    int best_n = -1, best_target = -1;
    for (int n : moved) {
      if (n == s.root || s.nodes[n].parent < 0) continue;
      for (int t = 0; t < static_cast<int>(s.nodes.size()); ++t) {
        const bool lost = t == s.root || !s.nodes[t].witness;
        if (!lost || (s.nodes[t].parent < 0 && t != s.root)) continue;
        if (t == s.nodes[n].parent || InSubtree(s, n, t)) continue;
        Stemma trial = s;
        Move(trial, n, t);
        const double len = Length(trial, p);
        if (len < best - eps) best = len, best_n = n, best_target = t;
      }
    }
    if (best_n < 0) return;
    Move(s, best_n, best_target);
    base = best;
  }
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
  std::vector<int> moved;  // the members of the groups contracted
  // The least supported group goes first, one at a time: contracting a
  // group inside another first would make the outer one look weaker than
  // it is.
  for (;;) {
    int best = -1;
    double best_len = 0;
    Stemma best_trial;
    for (int n = 0; n < static_cast<int>(s.nodes.size()); ++n) {
      const auto& node = s.nodes[n];
      if (n == s.root || node.witness || node.parent < 0 || node.children.empty()) continue;
      Stemma trial = s;
      Contract(trial, n);
      const double len = Length(trial, p);
      if (len < base + min_evidence - eps && (best < 0 || len < best_len))
        best = n, best_len = len, best_trial = std::move(trial);
    }
    if (best < 0) break;
    for (int k : s.nodes[best].children) moved.push_back(k);
    s = std::move(best_trial);
    base = best_len;
  }
  Regraft(s, p, base, moved);
  for (int n = 0; n < static_cast<int>(s.nodes.size()); ++n) {
    const auto& node = s.nodes[n];
    if (n == s.root || node.witness || node.parent < 0 || !node.name.empty()) continue;
    for (int k : node.children) {
      if (!s.nodes[k].witness || !s.nodes[k].children.empty() || !MayStandAbove(s, m, k)) continue;
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
