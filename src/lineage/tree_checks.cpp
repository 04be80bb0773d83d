#include "lineage/tree_checks.hpp"

#include <algorithm>
#include <deque>
#include <initializer_list>
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

// Fitch's sets of every node of one stemma, kept so that a trial change
// (a group contracted, a node moved, a witness promoted) recomputes only the
// nodes above the change: the length of a trial costs the depth of the
// tree, not its size. Computing every node for every trial made the checks
// of a 100-witness tree of 5,586 characters take minutes (lineage_bench;
// DEVELOPERS.md). Sets are masks per pattern (1 = state 0 possible, 2 =
// state 1 possible); a node with any number of children takes the states
// held by the most children, at a cost of children - that count; a witness
// standing at an inner node keeps its own readings, and every child that
// cannot have them costs a change; the archetype counts as a child of the
// root (the base reading where it is known).
class FitchCache {
 public:
  explicit FitchCache(const PatternSet& p) : p_(p) {}

  /// The length of `s`, every node computed and kept.
  double Build(const Stemma& s) {
    sets_.assign(s.nodes.size(), {});
    set_of_.assign(s.nodes.size(), nullptr);
    subtree_.assign(s.nodes.size(), 0);
    own_.assign(s.nodes.size(), 0);
    dirty_.assign(s.nodes.size(), 0);
    building_ = true;
    const double len = Eval(s, s.root).cost;
    building_ = false;
    return len;
  }

  /// The length of `trial`: the stemma last built with the children (or
  /// the kind) of the nodes `changed` altered, no node added.
  double Trial(const Stemma& trial, std::initializer_list<int> changed) {
    std::vector<int> marked;
    for (int c : changed) {
      if (c >= 0 && dirty_[c] != kChanged) dirty_[c] = kChanged, marked.push_back(c);
      for (int x = c >= 0 ? trial.nodes[c].parent : -1; x >= 0 && !dirty_[x];
           x = trial.nodes[x].parent)
        dirty_[x] = kAbove, marked.push_back(x);
    }
    used_ = 0;
    const double len = Eval(trial, trial.root).cost;
    for (int x : marked) dirty_[x] = 0;
    return len;
  }

 private:
  using Set = std::vector<unsigned char>;
  struct Result {
    const Set* set;
    double cost;  // of the subtree
    bool same;    // the set is the one last built
  };
  // A node whose children or kind the trial altered, and one above it.
  static constexpr char kChanged = 2, kAbove = 1;

  Result Eval(const Stemma& s, int n) {
    if (!building_ && !dirty_[n]) return {set_of_[n], subtree_[n], true};
    const auto& node = s.nodes[n];
    std::vector<const Set*> kids;
    kids.reserve(node.children.size() + 1);
    double cost = 0;
    bool same = true;
    for (int c : node.children) {
      const Result r = Eval(s, c);
      kids.push_back(r.set);
      cost += r.cost;
      same = same && r.same;
    }
    // Above the change, a node whose children kept their sets keeps its own.
    if (!building_ && dirty_[n] == kAbove && same) return {set_of_[n], cost + own_[n], true};
    const Set* own = nullptr;
    if (node.witness) {
      auto it = p_.taxon.find(node.name);
      if (it != p_.taxon.end()) own = &p_.by_taxon[it->second];
    } else if (n == s.root) {
      kids.push_back(&p_.root);
    }
    const Set* out = nullptr;
    double changes = 0;
    if (own && kids.empty()) {
      out = own;
    } else {
      Set& buffer = Buffer(n);
      changes = Combine(kids, own, buffer);
      out = &buffer;
    }
    cost += changes;
    if (building_) set_of_[n] = out, subtree_[n] = cost, own_[n] = changes;
    return {out, cost, !building_ && *out == *set_of_[n]};
  }

  Set& Buffer(int n) {
    if (building_) return sets_[n];
    if (used_ == scratch_.size()) scratch_.emplace_back();
    return scratch_[used_++];
  }

  // The node's set into `out`; returns the changes at the node.
  double Combine(const std::vector<const Set*>& kids, const Set* own, Set& out) {
    const std::size_t patterns = p_.weight.size();
    out.assign(patterns, 3);
    if (kids.empty()) return 0;
    zero_.assign(patterns, 0);
    one_.assign(patterns, 0);
    for (const Set* kid : kids) {
      const unsigned char* k = kid->data();
      for (std::size_t i = 0; i < patterns; ++i) zero_[i] += k[i] & 1, one_[i] += k[i] >> 1;
    }
    const int n = static_cast<int>(kids.size());
    double cost = 0;
    for (std::size_t i = 0; i < patterns; ++i) {
      const int z = zero_[i], o = one_[i];
      const unsigned char fixed = own ? (*own)[i] : 3;
      if (fixed == 3) {
        const int best = std::max(z, o);
        out[i] = static_cast<unsigned char>((z == best ? 1 : 0) | (o == best ? 2 : 0));
        cost += p_.weight[i] * (n - best);
      } else {
        out[i] = fixed;
        cost += p_.weight[i] * (n - (fixed == 1 ? z : o));
      }
    }
    return cost;
  }

  const PatternSet& p_;
  std::vector<Set> sets_;
  std::vector<const Set*> set_of_;
  std::vector<double> subtree_;
  std::vector<double> own_;  // the changes at each node
  std::vector<char> dirty_;
  std::deque<Set> scratch_;  // trial sets: a deque keeps them in place as it grows
  std::size_t used_ = 0;
  std::vector<int> zero_, one_;
  bool building_ = false;
};

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
void Regraft(Stemma& s, FitchCache& fitch, double& base, const std::vector<int>& moved) {
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
        const int from = s.nodes[n].parent;
        Move(trial, n, t);
        const double len = fitch.Trial(trial, {from, s.nodes[from].parent, t});
        if (len < best - eps) best = len, best_n = n, best_target = t;
      }
    }
    if (best_n < 0) return;
    Move(s, best_n, best_target);
    base = fitch.Build(s);
  }
}

}  // namespace

double FitchLength(const Stemma& s, const CharacterMatrix& m, const std::vector<double>& weights) {
  const PatternSet p = Patterns(m, weights);
  return FitchCache(p).Build(s);
}

void KeepSupported(Stemma& s, const CharacterMatrix& m, const std::vector<double>& weights,
                   double min_evidence) {
  const PatternSet p = Patterns(m, weights);
  const double eps = 1e-9;
  FitchCache fitch(p);
  double base = fitch.Build(s);
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
      const double len = fitch.Trial(trial, {node.parent});
      if (len < base + min_evidence - eps && (best < 0 || len < best_len))
        best = n, best_len = len, best_trial = std::move(trial);
    }
    if (best < 0) break;
    for (int k : s.nodes[best].children) moved.push_back(k);
    s = std::move(best_trial);
    base = fitch.Build(s);
  }
  Regraft(s, fitch, base, moved);
  for (int n = 0; n < static_cast<int>(s.nodes.size()); ++n) {
    const auto& node = s.nodes[n];
    if (n == s.root || node.witness || node.parent < 0 || !node.name.empty()) continue;
    for (int k : node.children) {
      if (!s.nodes[k].witness || !s.nodes[k].children.empty() || !MayStandAbove(s, m, k)) continue;
      Stemma trial = s;
      Promote(trial, k);
      const double len = fitch.Trial(trial, {n});
      if (len <= base + eps) {
        s = std::move(trial);
        fitch.Build(s);  // `base` stays: each promotion is weighed against the tree regrafted
        break;
      }
    }
  }
  s.Compact();
}

}  // namespace apograph::lineage
