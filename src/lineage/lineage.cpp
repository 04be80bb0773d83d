#include "lineage/lineage.hpp"

#include <algorithm>
#include <cmath>
#include <random>
#include <sstream>

#include "lineage/ancestral.hpp"
#include "lineage/copy_placement.hpp"
#include "lineage/mixture_direction.hpp"
#include "lineage/neighbour_joining.hpp"
#include "lineage/tree_checks.hpp"

namespace apograph::lineage {

const char* ToString(Method method) {
  return method == Method::kNeighbourJoining ? "nj" : "parsimony";
}

Stemma BuildStemma(const CharacterMatrix& m, Method method, const std::vector<double>& weights,
                   const ParsimonyOptions& p) {
  Stemma s = method == Method::kNeighbourJoining ? NeighbourJoiningStemma(m, weights)
                                                 : Parsimony(m, p, weights).stemma;
  if (!CountRootEvidence(m).Directed()) {
    RootAtMidpoint(s);
    KeepSupported(s, m, weights);
  }
  return s;
}

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
    const Stemma s = BuildStemma(m, method, weights, fast);
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

namespace {

bool Informative(const Character& ch) {
  const auto ones = std::count(ch.states.begin(), ch.states.end(), 1);
  const auto zeros = std::count(ch.states.begin(), ch.states.end(), 0) + (ch.Directed() ? 1 : 0);
  return ones >= 2 && zeros >= 2;
}

std::string GroupName(const Group& g) {
  std::string out = "{";
  for (std::size_t k = 0; k < g.size(); ++k) out += (k ? " " : "") + g[k];
  return out + "}";
}

std::string Number(double x) {
  std::ostringstream o;
  o << std::round(x * 100) / 100;
  return o.str();
}

MethodResult RunMethod(const CharacterMatrix& m, Method method, const LineageOptions& o) {
  MethodResult res;
  res.method = method;
  if (method == Method::kParsimony) {
    res.parsimony = Parsimony(m, o.parsimony);
    res.stemma = res.parsimony->stemma;
    res.parsimony->stemma = Stemma{};
    if (!CountRootEvidence(m).Directed()) {
      RootAtMidpoint(res.stemma);
      KeepSupported(res.stemma, m);
    }
  } else {
    res.stemma = BuildStemma(m, method, {}, o.parsimony);
  }
  return res;
}

void DescribeGroups(const CharacterMatrix& m, const LineageOptions& o, MethodResult& res) {
  if (o.bootstrap > 0)
    AnnotateSupport(res.stemma, Bootstrap(m, res.method, o.bootstrap, o.seed, o.parsimony));
  const CharacterMatrix oriented = Orient(m, res.stemma);
  const AncestralStates states = Reconstruct(res.stemma, oriented);
  for (const auto& [g, node] : res.stemma.Groups()) {
    const GroupEvidence e = EvidenceFor(res.stemma, node, oriented, states);
    res.groups.push_back({g, res.stemma.nodes[node].support, res.stemma.nodes[node].length,
                          e.characters, e.conflicting, e.conflict_weight});
  }
}

// The matrix the tree is built on. Where the model directs enough
// characters to place the archetype, a majority directs nothing: at a
// cell no model judged, the reading most witnesses share may be the error
// of a large group (five of eight witnesses in one lost copy's line), and
// taken as the archetype's it puts the other witnesses, which kept the
// right reading, into a group of their own. Such characters still split
// the witnesses (undirected). Measured on the lineage benchmark (seeds
// 1-100, characters cached): groups recovered 0.783 -> 0.789, RF 0.386 ->
// 0.376 (with kMinGroupEvidence 1).
CharacterMatrix ForTree(const CharacterMatrix& m) {
  if (CountRootEvidence(m).model < kMinRootEvidence) return m;
  CharacterMatrix out = m;
  for (auto& ch : out.characters) {
    if (ch.direction == Direction::kMajority) ch.direction = Direction::kNone;
  }
  return out;
}

void Undecide(LineageReport& r, std::string what, std::string text) {
  r.undecided.push_back({std::move(what), std::move(text)});
}

// Informative weight below which the report says the evidence is too
// little to decide a stemma: judgement, two groups of two common slips
// each (twice the former threshold for keeping a group, tree_checks.hpp).
constexpr double kMinStemmaEvidence = 3;

void EvidenceNotes(const CharacterMatrix& m, LineageReport& r) {
  double informative = 0;
  int count = 0;
  std::vector<bool> placed(m.taxa.size(), false);
  for (const auto& ch : m.characters) {
    if (ch.tie_break || !Informative(ch)) continue;
    informative += ch.weight, ++count;
    for (std::size_t t = 0; t < m.taxa.size(); ++t) placed[t] = placed[t] || ch.states[t] == 1;
  }
  if (m.taxa.size() >= 3 && informative < kMinStemmaEvidence) {
    Undecide(r, "evidence",
             "too little evidence to decide a stemma: " + std::to_string(count) +
                 " characters shared by two or more witnesses (weight " + Number(informative) +
                 "); the tree below is what they allow, not a finding");
  }
  if (!r.root.Directed()) {
    Undecide(r, "root",
             "no reading could be called the archetype's (no model and no clear majority at "
             "the cells that group witnesses): the tree was found unrooted and rooted at the "
             "midpoint of its longest path; where the root stands is a convention, not evidence");
  }
  for (std::size_t t = 0; t < m.taxa.size() && m.taxa.size() >= 3; ++t) {
    if (!placed[t])
      Undecide(r, "witness",
               m.taxa[t] +
                   " shares no reading with another witness that the rest lack: its "
                   "place in the stemma is undecided");
  }
}

void GroupNotes(LineageReport& r) {
  if (r.results.empty()) return;
  for (const auto& g : r.results.front().groups) {
    const double support = g.length;
    if (g.conflict_weight >= support && g.conflicting > 0) {
      Undecide(r, "group",
               GroupName(g.witnesses) + " rests on " + std::to_string(g.characters) +
                   " characters (weight " + Number(support) + ") while " +
                   std::to_string(g.conflicting) + " (weight " + Number(g.conflict_weight) +
                   ") contradict it: the evidence conflicts");
    } else if (g.support && *g.support < 0.5) {
      Undecide(r, "group",
               GroupName(g.witnesses) + " appears in only " +
                   std::to_string(std::lround(*g.support * 100)) + "% of the bootstrap replicates");
    }
  }
}

}  // namespace

LineageReport AnalyseLineage(const CharacterMatrix& raw, const LineageOptions& o) {
  LineageReport r;
  r.title = raw.title;
  r.witnesses = raw.taxa;
  r.witness_info = raw.witnesses;
  r.characters = static_cast<int>(raw.characters.size());
  r.undetermined_cells = raw.undetermined_cells;
  r.root = CountRootEvidence(raw);
  r.bootstrap = o.bootstrap;
  const Method first = o.methods.empty() ? Method::kParsimony : o.methods.front();
  // 1-2: correctors set aside, a first stemma; contamination read off it.
  const CharacterMatrix first_corrected = MaskCorrections(raw, FindCorrections(raw));
  const Stemma s0 = BuildStemma(ForTree(first_corrected), first, {}, o.parsimony);
  // The majorities the first stemma contradicts left undirected; the
  // correctors found again on what is left.
  const CharacterMatrix m = CheckMajorities(raw, s0, ForTree(first_corrected));
  const CharacterMatrix corrected = MaskCorrections(m, FindCorrections(m));
  CharacterMatrix oriented = Orient(corrected, s0);
  if (!r.root.Directed()) {  // a midpoint root orients nothing reliably
    for (auto& ch : oriented.characters) {
      if (ch.direction == Direction::kTree) ch.direction = Direction::kNone;
    }
  }
  std::vector<Contamination> suspected;
  r.contamination = FindContamination(oriented, kMinContaminationEvidence, &suspected);
  // Of a witness and its two relatives, the one whose division at the
  // stretches shortens the stemma most changed exemplar (mixture_direction.hpp).
  std::vector<Contamination> refused;
  r.contamination = KeepDividingWitnesses(ForTree(corrected), r.contamination, &refused);
  for (const auto& c : refused) Undecide(r, "witness", "contamination? " + c.text);
  for (const auto& c : suspected) {
    Undecide(r, "witness",
             "contamination? " + c.text +
                 (c.direction_refused ? ""
                                      : "; too little to call it" +
                                            (c.shortfall.empty() ? "" : " (" + c.shortfall + ")")));
  }
  // A suspected mixture, too, is placed by the relative it follows first
  // when it also shares more with that one (otherwise the order tells
  // nothing): its readings where it follows the other are set aside for
  // the tree, the correctors and the copies, as for a called one (nothing
  // is called; the note above tells the editor). Two lines of errors in
  // one witness pull it between them whether or not they are called.
  // Measured on the lineage benchmark (cached characters): seeds 1-100
  // groups 0.840 -> 0.871, RF 0.343 -> 0.322; seeds 101-174 groups 0.835
  // -> 0.848, RF 0.348 -> 0.320.
  std::vector<Contamination> mixtures = r.contamination;
  for (const auto& c : suspected) {
    if (c.primary_evidence >= c.secondary_evidence) mixtures.push_back(c);
  }
  // One refused because a relative's division explains more is set aside
  // alike: its two sets of errors still pull it between two lines.
  // Measured (DEVELOPERS.md, "Lineage accuracy", seventeenth round): not
  // set aside, groups 0.884 -> 0.871 on seeds 1-100, 0.841 -> 0.832 on
  // 201-300.
  mixtures.insert(mixtures.end(), refused.begin(), refused.end());
  const CharacterMatrix unmixed = MaskSecondaryExemplar(m, mixtures);
  // 3: correctors, once the contaminated witnesses follow one exemplar.
  r.corrections = FindCorrections(unmixed);
  const CharacterMatrix masked = MaskCorrections(unmixed, r.corrections);
  // 4: the stemmata.
  const CharacterMatrix for_tree = ForTree(masked);
  for (Method method : o.methods) {
    MethodResult res = RunMethod(for_tree, method, o);
    r.results.push_back(std::move(res));
  }
  // 5: copies, then the exemplars drawn above them.
  std::vector<std::string> correctors;
  for (const auto& c : r.corrections) correctors.push_back(c.witness);
  if (!r.results.empty()) {
    const CharacterMatrix final_oriented = Orient(unmixed, r.results.front().stemma);
    std::vector<std::string> tied;
    r.copies = AdjacentCopies(r.results.front().stemma, final_oriented, correctors, tied);
    for (const auto& text : tied) Undecide(r, "copy", text);
    for (const auto& text : CopiesRefusedByDates(final_oriented)) Undecide(r, "copy", text);
  }
  ReviseByExemplars(r.corrections, r.copies);
  if (!r.results.empty())
    ReviseByGroups(r.corrections, r.results.front().stemma,
                   Orient(unmixed, r.results.front().stemma));
  for (auto& res : r.results) {
    PlaceExemplars(res.stemma, r.copies);
    DescribeGroups(for_tree, o, res);
  }
  EvidenceNotes(masked, r);
  GroupNotes(r);
  for (const auto& c : r.copies) {
    if (c.twins) Undecide(r, "copy", c.text + "; the dates do not tell which");
  }
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
                             {"length", g.length},
                             {"characters", g.characters},
                             {"conflicting", g.conflicting}});
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
  out["support"] = {{"basis", r.bootstrap > 0 ? "bootstrap" : "characters"},
                    {"replicates", r.bootstrap}};
  out["root"] = {{"basis", r.root.Basis()},
                 {"model", r.root.model},
                 {"majority", r.root.majority},
                 {"undirected", r.root.undirected}};
  out["undecided"] = json::array();
  for (const auto& u : r.undecided)
    out["undecided"].push_back({{"what", u.what}, {"text", u.text}});
  out["copies"] = json::array();
  for (const auto& c : r.copies) {
    out["copies"].push_back({{"copy", c.copy},
                             {"exemplar", c.exemplar},
                             {"exemplar_errors", c.exemplar_errors},
                             {"own_errors", c.own_errors},
                             {"unreadable", c.unreadable},
                             {"filled", c.filled},
                             {"corrected", c.corrected},
                             {"twins", c.twins},
                             {"dated", c.dated},
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
    out["contamination"].push_back({{"witness", c.witness},
                                    {"primary", c.primary},
                                    {"secondary", c.secondary},
                                    {"text", c.text},
                                    {"segments", segs},
                                    {"inherited_by", c.inherited_by}});
  }
  out["corrections"] = json::array();
  for (const auto& c : r.corrections) {
    out["corrections"].push_back({{"witness", c.witness},
                                  {"corrected", c.corrected},
                                  {"kept", c.kept},
                                  {"relatives", c.relatives},
                                  {"basis", c.basis},
                                  {"text", c.text}});
  }
  return out;
}

}  // namespace apograph::lineage
