#include "lineage/lineage.hpp"

#include <random>

#include "lineage/neighbour_joining.hpp"

namespace apograph::lineage {

const char* ToString(Method method) {
  return method == Method::kNeighbourJoining ? "nj" : "parsimony";
}

namespace {

Stemma RunMethod(const CharacterMatrix& m, Method method, const std::vector<double>& weights,
                 const ParsimonyOptions& p) {
  if (method == Method::kNeighbourJoining) return NeighbourJoiningStemma(m, weights);
  return Parsimony(m, p, weights).stemma;
}

}  // namespace

std::map<Group, double> Bootstrap(const CharacterMatrix& m, Method method, int replicates,
                                  unsigned seed, const ParsimonyOptions& parsimony) {
  std::map<Group, double> support;
  if (replicates <= 0 || m.characters.empty()) return support;
  std::vector<std::string> blocks;
  std::vector<int> block_of;
  std::map<std::string, int> index;
  for (const auto& ch : m.characters) {
    auto [it, added] = index.emplace(ch.block, static_cast<int>(blocks.size()));
    if (added) blocks.push_back(ch.block);
    block_of.push_back(it->second);
  }
  ParsimonyOptions fast = parsimony;
  fast.exact_limit = 0;
  fast.starts = 1;
  std::mt19937 rng(seed);
  std::uniform_int_distribution<int> pick(0, static_cast<int>(blocks.size()) - 1);
  for (int r = 0; r < replicates; ++r) {
    std::vector<int> drawn(blocks.size(), 0);
    for (std::size_t k = 0; k < blocks.size(); ++k) ++drawn[pick(rng)];
    std::vector<double> weights(m.characters.size());
    for (std::size_t c = 0; c < m.characters.size(); ++c)
      weights[c] = m.characters[c].weight * drawn[block_of[c]];
    const Stemma s = RunMethod(m, method, weights, fast);
    for (const auto& [g, node] : s.Groups()) support[g] += 1.0 / replicates;
  }
  return support;
}

void AnnotateSupport(Stemma& s, const std::map<Group, double>& support) {
  for (const auto& [g, node] : s.Groups()) {
    auto it = support.find(g);
    s.nodes[node].support = it == support.end() ? 0.0 : it->second;
  }
}

LineageReport AnalyseLineage(const CharacterMatrix& m, const LineageOptions& o) {
  LineageReport r;
  r.witnesses = m.taxa;
  r.characters = static_cast<int>(m.characters.size());
  r.undetermined_cells = m.undetermined_cells;
  for (Method method : o.methods) {
    MethodResult res;
    res.method = method;
    if (method == Method::kParsimony) {
      res.parsimony = Parsimony(m, o.parsimony);
      res.stemma = res.parsimony->stemma;
      res.parsimony->stemma = Stemma{};
    } else {
      res.stemma = NeighbourJoiningStemma(m);
    }
    if (o.bootstrap > 0)
      AnnotateSupport(res.stemma, Bootstrap(m, method, o.bootstrap, o.seed, o.parsimony));
    for (const auto& [g, node] : res.stemma.Groups()) {
      res.groups.push_back({g, res.stemma.nodes[node].support, res.stemma.nodes[node].length});
    }
    r.results.push_back(std::move(res));
  }
  r.copies = FindCopies(m);
  r.contamination = FindContamination(m);
  return r;
}

nlohmann::json ToJson(const LineageReport& r) {
  using nlohmann::json;
  json out = {{"witnesses", r.witnesses},
              {"characters", r.characters},
              {"undetermined_cells", r.undetermined_cells}};
  out["results"] = json::array();
  for (const auto& res : r.results) {
    json j = {{"method", ToString(res.method)}, {"newick", ToNewick(res.stemma)}};
    j["groups"] = json::array();
    for (const auto& g : res.groups) {
      j["groups"].push_back({{"witnesses", g.witnesses},
                             {"support", g.support ? json(*g.support) : json(nullptr)},
                             {"length", g.length}});
    }
    if (res.parsimony) {
      j["length"] = res.parsimony->length;
      j["exact_search"] = res.parsimony->exact;  // `exact` counts entries elsewhere
      j["search"] = res.parsimony->search;
    }
    out["results"].push_back(j);
  }
  if (!out["results"].empty()) {  // the first method's tree at the top level too
    for (const char* key : {"method", "newick", "groups"}) out[key] = out["results"][0][key];
  }
  out["copies"] = json::array();
  for (const auto& c : r.copies) {
    out["copies"].push_back({{"copy", c.copy},
                             {"exemplar", c.exemplar},
                             {"exemplar_errors", c.exemplar_errors},
                             {"own_errors", c.own_errors},
                             {"unreadable", c.unreadable},
                             {"filled", c.filled},
                             {"twins", c.twins},
                             {"text", c.text}});
  }
  out["contamination"] = json::array();
  for (const auto& c : r.contamination) {
    json segs = json::array();
    for (const auto& s : c.segments) {
      segs.push_back({{"relative", s.relative},
                      {"first_row", s.first_row},
                      {"last_row", s.last_row},
                      {"shared", s.shared},
                      {"against", s.against}});
    }
    out["contamination"].push_back({{"witness", c.witness}, {"text", c.text}, {"segments", segs}});
  }
  return out;
}

}  // namespace apograph::lineage
