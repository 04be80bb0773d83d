#include "lineage/neighbour_joining.hpp"

#include "lineage/tree_checks.hpp"

#include <algorithm>
#include <functional>
#include <limits>

namespace apograph::lineage {

DistanceMatrix ErrorDistances(const CharacterMatrix& m, const std::vector<double>& weights) {
  const std::size_t n = m.taxa.size() + 1;  // last: the archetype
  DistanceMatrix d(n, std::vector<double>(n, 0));
  double total = 0;
  std::vector<std::vector<double>> known(n, std::vector<double>(n, 0));
  for (std::size_t c = 0; c < m.characters.size(); ++c) {
    const auto& ch = m.characters[c];
    const double w = weights.empty() ? ch.weight : weights[c];
    if (w <= 0) continue;
    total += w;
    auto state = [&](std::size_t i) -> int {
      return i + 1 == n ? (ch.Directed() ? 0 : -1) : ch.states[i];
    };
    for (std::size_t i = 0; i < n; ++i) {
      const int si = state(i);
      if (si < 0) continue;
      for (std::size_t j = i + 1; j < n; ++j) {
        const int sj = state(j);
        if (sj < 0) continue;
        known[i][j] += w;
        if (si != sj) d[i][j] += w;
      }
    }
  }
  for (std::size_t i = 0; i < n; ++i) {
    for (std::size_t j = i + 1; j < n; ++j) {
      const double scaled = known[i][j] > 0 ? d[i][j] * total / known[i][j] : total;
      d[i][j] = d[j][i] = scaled;
    }
  }
  return d;
}

UnrootedTree NeighbourJoining(const DistanceMatrix& input) {
  const int n = static_cast<int>(input.size());
  UnrootedTree t;
  t.node_count = n;
  std::vector<int> active(n);  // node id of each active cluster
  for (int i = 0; i < n; ++i) active[i] = i;
  DistanceMatrix d = input;
  while (active.size() > 2) {
    const int r = static_cast<int>(active.size());
    std::vector<double> sum(r, 0);
    for (int i = 0; i < r; ++i) {
      for (int j = 0; j < r; ++j) sum[i] += d[i][j];
    }
    int bi = 0, bj = 1;
    double best = std::numeric_limits<double>::infinity();
    for (int i = 0; i < r; ++i) {
      for (int j = i + 1; j < r; ++j) {
        const double q = (r - 2) * d[i][j] - sum[i] - sum[j];
        if (q < best - 1e-12) best = q, bi = i, bj = j;
      }
    }
    const double li = 0.5 * d[bi][bj] + (sum[bi] - sum[bj]) / (2.0 * (r - 2));
    const double lj = d[bi][bj] - li;
    const int u = t.node_count++;
    t.edges.push_back({active[bi], u, li});
    t.edges.push_back({active[bj], u, lj});
    // Distances of the new node replace row bi; row bj is removed.
    std::vector<double> du(r);
    for (int k = 0; k < r; ++k) du[k] = 0.5 * (d[bi][k] + d[bj][k] - d[bi][bj]);
    for (int k = 0; k < r; ++k) d[bi][k] = d[k][bi] = du[k];
    d[bi][bi] = 0;
    active[bi] = u;
    for (auto& row : d) row.erase(row.begin() + bj);
    d.erase(d.begin() + bj);
    active.erase(active.begin() + bj);
  }
  if (active.size() == 2) t.edges.push_back({active[0], active[1], d[0][1]});
  return t;
}

Stemma RootAt(const UnrootedTree& t, const std::vector<std::string>& names, int root) {
  std::vector<std::vector<std::pair<int, double>>> adj(t.node_count);
  for (const auto& e : t.edges) {
    adj[e.a].push_back({e.b, e.length});
    adj[e.b].push_back({e.a, e.length});
  }
  Stemma s;
  std::function<int(int, int, double)> build = [&](int v, int from, double len) {
    StemmaNode node;
    if (v < static_cast<int>(names.size())) node.name = names[v];
    node.witness = v < static_cast<int>(names.size()) && v != root;
    node.length = std::max(0.0, len);
    const int id = s.Add(node);
    for (const auto& [w, l] : adj[v]) {
      if (w != from) s.Attach(id, build(w, v, l));
    }
    return id;
  };
  s.root = build(root, -1, 0);
  return s;
}

Stemma NeighbourJoiningStemma(const CharacterMatrix& m, const std::vector<double>& weights) {
  const DistanceMatrix d = ErrorDistances(m, weights);
  std::vector<std::string> names = m.taxa;
  names.push_back(kArchetype);
  Stemma s = RootAt(NeighbourJoining(d), names, static_cast<int>(m.taxa.size()));
  KeepSupported(s, m, weights);
  return s;
}

}  // namespace apograph::lineage
