#include "lineage/rooting.hpp"

#include <algorithm>
#include <functional>
#include <vector>

#include "lineage/ancestral.hpp"

namespace apograph::lineage {

bool RootEvidence::Directed() const { return model + majority >= kMinRootEvidence; }

std::string RootEvidence::Basis() const {
  if (!Directed()) return "midpoint";
  return model >= majority ? "model" : "majority";
}

RootEvidence CountRootEvidence(const CharacterMatrix& m) {
  RootEvidence e;
  for (const auto& ch : m.characters) {
    if (std::count(ch.states.begin(), ch.states.end(), 1) < 2) continue;
    if (ch.direction == Direction::kModel)
      e.model += ch.weight;
    else if (ch.direction == Direction::kMajority)
      e.majority += ch.weight;
    else
      e.undirected += ch.weight;
  }
  return e;
}

CharacterMatrix CheckMajorities(const CharacterMatrix& m, const Stemma& first,
                                const CharacterMatrix& tree_matrix) {
  if (CountRootEvidence(m).model < kMinRootEvidence || first.root < 0) return m;
  CharacterMatrix out = m;
  const AncestralStates a = Reconstruct(first, tree_matrix);
  const auto& lines = first.nodes[static_cast<std::size_t>(first.root)].children;
  for (std::size_t k = 0; k < out.characters.size(); ++k) {
    Character& ch = out.characters[k];
    if (ch.direction != Direction::kMajority) continue;
    int against = 0, with = 0;  // lines reading only the other reading, only the majority's
    for (int c : lines) {
      const unsigned char set = a.sets[static_cast<std::size_t>(c)][k];
      against += set == 2 ? 1 : 0;
      with += set == 1 ? 1 : 0;
    }
    if (against >= kLinesAgainstMajority && with <= 1) ch.direction = Direction::kNone;
  }
  return out;
}

namespace {

struct Graph {
  std::vector<std::vector<std::pair<int, double>>> adj;
  void Link(int a, int b, double w) {
    adj[a].push_back({b, w});
    adj[b].push_back({a, w});
  }
};

// The stemma without its archetype, as an unrooted tree over its nodes.
Graph Unroot(const Stemma& s) {
  Graph g;
  g.adj.resize(s.nodes.size());
  for (std::size_t n = 0; n < s.nodes.size(); ++n) {
    const int p = s.nodes[n].parent;
    if (p >= 0 && p != s.root) g.Link(p, static_cast<int>(n), s.nodes[n].length);
  }
  const auto& top = s.nodes[s.root].children;
  if (top.size() == 2) {
    g.Link(top[0], top[1], s.nodes[top[0]].length + s.nodes[top[1]].length);
  } else if (top.size() > 2) {
    for (int c : top) g.Link(s.root, c, s.nodes[c].length);  // the root stays as a lost node
  }
  return g;
}

// Farthest witness from `from`, with the path to it.
std::pair<int, double> Farthest(const Stemma& s, const Graph& g, int from,
                                std::vector<int>& previous) {
  previous.assign(g.adj.size(), -1);
  std::vector<double> dist(g.adj.size(), -1);
  std::vector<int> stack{from};
  dist[from] = 0;
  int best = from;
  while (!stack.empty()) {
    const int v = stack.back();
    stack.pop_back();
    if (s.nodes[v].witness && dist[v] > dist[best]) best = v;
    for (const auto& [w, len] : g.adj[v]) {
      if (dist[w] >= 0) continue;
      dist[w] = dist[v] + len;
      previous[w] = v;
      stack.push_back(w);
    }
  }
  return {best, dist[best]};
}

}  // namespace

void RootAtMidpoint(Stemma& s) {
  if (s.root < 0 || s.nodes[s.root].children.empty()) return;
  Graph g = Unroot(s);
  int start = -1;
  for (std::size_t n = 0; n < s.nodes.size() && start < 0; ++n) {
    if (s.nodes[n].witness && !g.adj[n].empty()) start = static_cast<int>(n);
  }
  if (start < 0) return;
  std::vector<int> previous;
  const int u = Farthest(s, g, start, previous).first;
  const auto [v, length] = Farthest(s, g, u, previous);
  if (length <= 0) return;
  // Walk back from v to the midpoint.
  double walked = 0;
  int a = v;
  while (previous[a] >= 0) {
    const int b = previous[a];
    double edge = 0;
    for (const auto& [w, len] : g.adj[a]) edge = w == b ? len : edge;
    if (walked + edge >= length / 2) {
      const double x = length / 2 - walked;  // from a toward b
      Stemma out;
      StemmaNode root;
      root.name = kArchetype;
      out.root = out.Add(root);
      std::function<void(int, int, int, double)> copy = [&](int node, int from, int parent,
                                                            double len) {
        StemmaNode n = s.nodes[node];
        n.parent = -1;
        n.children.clear();
        n.length = len;
        n.support.reset();
        if (node == s.root) n.name.clear();  // the old root: now a lost node
        const int id = out.Add(n);
        out.Attach(parent, id);
        for (const auto& [w, l] : g.adj[node]) {
          if (w != from) copy(w, node, id, l);
        }
      };
      copy(a, b, out.root, x);
      copy(b, a, out.root, edge - x);
      s = std::move(out);
      s.Compact();
      return;
    }
    walked += edge;
    a = b;
  }
}

}  // namespace apograph::lineage
