#include "lineage/parsimony.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <memory>
#include <numeric>
#include <random>

#include "lineage/fitch_tree.hpp"
#include "lineage/tree_checks.hpp"

namespace apograph::lineage {
namespace {

using internal::FitchTree;
using internal::Patterns;

constexpr double kWeightScale = 1024;  // weights are kept as integers of 1/1024 units

// Taxon 0 is the archetype (state 0 where the character is directed, either
// state where it is not); taxon i+1 is matrix taxon i.
struct Compressed {
  Patterns informative;
  Patterns all;
  std::int64_t constant = 0;  // length of the characters left out of the search
};

Patterns Pack(const std::vector<std::pair<std::vector<signed char>, std::int64_t>>& rows,
              int taxa) {
  Patterns p;
  p.taxa = taxa;
  p.count = static_cast<int>(rows.size());
  p.words = std::max(1, (p.count + 63) / 64);
  p.weight.assign(static_cast<std::size_t>(p.words) * 64, 0);
  // Padding bits are "either state" so they never cost a step.
  p.zero.assign(static_cast<std::size_t>(taxa) * p.words, ~0ULL);
  p.one.assign(static_cast<std::size_t>(taxa) * p.words, ~0ULL);
  for (int k = 0; k < p.count; ++k) {
    p.weight[k] = rows[k].second;
    const std::uint64_t bit = 1ULL << (k % 64);
    for (int t = 0; t < taxa; ++t) {
      const signed char s = rows[k].first[t];
      auto& z = p.zero[static_cast<std::size_t>(t) * p.words + k / 64];
      auto& o = p.one[static_cast<std::size_t>(t) * p.words + k / 64];
      if (s == 1) z &= ~bit;
      if (s == 0) o &= ~bit;
    }
  }
  return p;
}

Compressed Compress(const CharacterMatrix& m, const std::vector<double>& weights) {
  const int taxa = static_cast<int>(m.taxa.size()) + 1;
  std::map<std::vector<signed char>, std::int64_t> merged;
  for (std::size_t c = 0; c < m.characters.size(); ++c) {
    const double w = weights.empty() ? m.characters[c].weight : weights[c];
    const auto iw = static_cast<std::int64_t>(std::llround(w * kWeightScale));
    if (iw <= 0) continue;
    std::vector<signed char> s(taxa, m.characters[c].Directed() ? 0 : -1);
    std::copy(m.characters[c].states.begin(), m.characters[c].states.end(), s.begin() + 1);
    merged[s] += iw;
  }
  Compressed out;
  std::vector<std::pair<std::vector<signed char>, std::int64_t>> all, informative;
  for (const auto& [s, w] : merged) {
    all.emplace_back(s, w);
    const auto ones = std::count(s.begin(), s.end(), 1), zeros = std::count(s.begin(), s.end(), 0);
    if (ones >= 2 && zeros >= 2)
      informative.emplace_back(s, w);
    else if (ones >= 1 && zeros >= 1)
      out.constant += w;
  }
  out.informative = Pack(informative, taxa);
  out.all = Pack(all, taxa);
  return out;
}

// Witnesses (taxa 1..n) by decreasing weighted error count.
std::vector<int> ErrorOrder(const CharacterMatrix& m, const std::vector<double>& weights) {
  std::vector<double> load(m.taxa.size(), 0);
  for (std::size_t c = 0; c < m.characters.size(); ++c) {
    for (std::size_t t = 0; t < m.taxa.size(); ++t) {
      if (m.characters[c].states[t] == 1)
        load[t] += weights.empty() ? m.characters[c].weight : weights[c];
    }
  }
  std::vector<int> order(m.taxa.size());
  std::iota(order.begin(), order.end(), 1);
  std::stable_sort(order.begin(), order.end(),
                   [&](int a, int b) { return load[a - 1] > load[b - 1]; });
  return order;
}

void StepwiseAddition(FitchTree& t, const std::vector<int>& order, std::int64_t& examined) {
  t.Start(order[0], order[1]);
  for (std::size_t k = 2; k < order.size(); ++k) {
    int best_y = -1;
    std::int64_t best = 0;
    for (int y : t.Branches()) {
      t.Insert(order[k], y);
      ++examined;
      if (best_y < 0 || t.Length() < best) best = t.Length(), best_y = y;
      t.Remove(order[k]);
    }
    t.Insert(order[k], best_y);
  }
}

bool SprRound(FitchTree& t, std::int64_t& examined) {
  bool improved = false;
  for (int x : t.Branches()) {
    if (t.Parent(x) <= 0) continue;  // the whole tree under the archetype stays
    const std::int64_t before = t.Length();
    const int sibling = t.Remove(x);
    int best_y = sibling;
    std::int64_t best = before;
    for (int y : t.Branches()) {
      if (y == sibling) continue;
      t.Insert(x, y);
      ++examined;
      if (t.Length() < best) best = t.Length(), best_y = y;
      t.Remove(x);
    }
    t.Insert(x, best_y);
    if (best < before) improved = true;
  }
  return improved;
}

std::unique_ptr<FitchTree> Heuristic(const Patterns& p, std::vector<int> order,
                                     const ParsimonyOptions& o, std::int64_t& examined) {
  std::unique_ptr<FitchTree> best;
  std::mt19937 rng(o.seed);
  for (int start = 0; start < std::max(1, o.starts); ++start) {
    if (start > 0) std::shuffle(order.begin(), order.end(), rng);
    auto t = std::make_unique<FitchTree>(p);
    StepwiseAddition(*t, order, examined);
    while (SprRound(*t, examined)) {
    }
    if (!best || t->Length() < best->Length()) best = std::move(t);
  }
  return best;
}

struct BranchAndBound {
  const Patterns& p;
  std::vector<int> order;
  std::vector<std::int64_t> bound;  // bound[k]: at least this much more for taxa order[k..]
  std::int64_t best;
  std::unique_ptr<FitchTree> best_tree;
  std::int64_t examined = 0;

  // A character that does not vary among the taxa placed so far (and the
  // archetype) but varies once all are placed costs at least one more step.
  void Bounds() {
    bound.assign(order.size() + 1, 0);
    for (std::size_t k = 0; k <= order.size(); ++k) {
      for (int c = 0; c < p.count; ++c) {
        const std::uint64_t bit = 1ULL << (c % 64);
        auto definite = [&](int t, int state) {
          const auto& other = state == 1 ? p.zero : p.one;
          return !(other[static_cast<std::size_t>(t) * p.words + c / 64] & bit);
        };
        bool placed0 = definite(0, 0), placed1 = definite(0, 1), all0 = placed0, all1 = placed1;
        for (std::size_t i = 0; i < order.size(); ++i) {
          const bool d0 = definite(order[i], 0), d1 = definite(order[i], 1);
          if (i < k) placed0 |= d0, placed1 |= d1;
          all0 |= d0, all1 |= d1;
        }
        if (!(placed0 && placed1) && all0 && all1) bound[k] += p.weight[c];
      }
    }
  }

  void Search(FitchTree& t, std::size_t k) {
    for (int y : t.Branches()) {
      t.Insert(order[k], y);
      ++examined;
      const std::int64_t len = t.Length();
      if (len + bound[k + 1] < best) {
        if (k + 1 == order.size()) {
          best = len;
          best_tree = std::make_unique<FitchTree>(t);
        } else {
          Search(t, k + 1);
        }
      }
      t.Remove(order[k]);
    }
  }
};

Stemma ToStemma(const FitchTree& topology, const Patterns& all, const CharacterMatrix& m,
                const std::vector<double>& weights) {
  const auto& taxa = m.taxa;
  FitchTree full(all);
  full.CopyTopology(topology);
  const auto lengths = full.BranchLengths();
  Stemma s;
  StemmaNode root;
  root.name = kArchetype;
  s.root = s.Add(root);
  std::vector<std::pair<int, int>> stack{{full.RootChild(), s.root}};
  while (!stack.empty()) {
    const auto [n, parent] = stack.back();
    stack.pop_back();
    StemmaNode node;
    node.length = static_cast<double>(lengths[n]) / kWeightScale;
    if (full.IsLeaf(n)) node.name = taxa[n - 1], node.witness = true;
    const int id = s.Add(node);
    s.Attach(parent, id);
    if (!full.IsLeaf(n)) {
      stack.push_back({full.Right(n), id});
      stack.push_back({full.Left(n), id});
    }
  }
  KeepSupported(s, m, weights);
  return s;
}

Stemma Trivial(const CharacterMatrix& m, const std::vector<double>& weights) {
  Stemma s;
  StemmaNode root;
  root.name = kArchetype;
  s.root = s.Add(root);
  for (std::size_t t = 0; t < m.taxa.size(); ++t) {
    StemmaNode leaf;
    leaf.name = m.taxa[t];
    leaf.witness = true;
    for (std::size_t c = 0; c < m.characters.size(); ++c) {
      if (m.characters[c].states[t] == 1)
        leaf.length += weights.empty() ? m.characters[c].weight : weights[c];
    }
    s.Attach(s.root, s.Add(leaf));
  }
  return s;
}

}  // namespace

ParsimonyResult Parsimony(const CharacterMatrix& m, const ParsimonyOptions& o,
                          const std::vector<double>& weights) {
  ParsimonyResult r;
  if (m.taxa.size() < 2) {
    r.stemma = Trivial(m, weights);
    r.exact = true;
    r.search = "trivial";
    for (const auto& n : r.stemma.nodes) r.length += n.length;
    return r;
  }
  const Compressed c = Compress(m, weights);
  const std::vector<int> order = ErrorOrder(m, weights);
  auto tree = Heuristic(c.informative, order, o, r.trees_examined);
  r.search = "stepwise addition + SPR";
  if (static_cast<int>(m.taxa.size()) <= o.exact_limit && m.taxa.size() >= 3) {
    BranchAndBound bb{c.informative, order, {}, tree->Length(), nullptr, 0};
    bb.Bounds();
    FitchTree t(c.informative);
    t.Start(order[0], order[1]);
    bb.Search(t, 2);
    if (bb.best_tree) tree = std::move(bb.best_tree);
    r.trees_examined += bb.examined;
    r.exact = true;
    r.search = "branch-and-bound";
  } else if (m.taxa.size() == 2) {
    r.exact = true;
  }
  r.length = static_cast<double>(tree->Length() + c.constant) / kWeightScale;
  r.stemma = ToStemma(*tree, c.all, m, weights);
  return r;
}

}  // namespace apograph::lineage
