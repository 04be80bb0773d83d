// Accuracy of the lineage stage over traditions of the shared generator
// (tests/synth/tradition.hpp, the generator every stage is scored on), built
// with -DAPOGRAPH_BENCH=ON:
//   ./build-bench/lineage_accuracy_bench [draws=300] [first_seed=1] [verbose=0]
// With LINEAGE_BENCH_CACHE=folder each draw's characters are written there
// as the pipeline built them and read back on later runs (work on the
// lineage stage alone; stale once anything up to the characters changes).
// With LINEAGE_BENCH_CLAIMS=1 each copy claim is printed with the evidence it
// rests on (ClaimFeatures). With LINEAGE_BENCH_FALSE_CHARS=1 (and verbose) each
// false group is followed by the characters that change above it, with the slip
// class the explainer gave them. BENCH_JOIN=1 joins the repeated slips of
// characters cached before lineage::JoinRepeatedSlips existed (or built with it
// switched off), to compare the two on one cache. With LINEAGE_BENCH_MIX=1
// (and verbose) each missed marked mixture is followed by the slips of its
// exemplars' own lines that it shows and how many stand as characters the
// contamination criteria read (MixtureFeatures). With LINEAGE_BENCH_GROUPS=1
// every group of the first stemma is printed as "GROUP true size length
// characters conflict_weight conflicting true_groups found_groups heaviest
// strong marked" (to see whether the evidence of false
// groups differs from that of true ones); the verbose output names what a false
// group holds (contaminated witnesses, correctors). Each draw is
// synth::DrawTradition(seed, default options): 4 to 15 witnesses, one to three
// tables, lost intermediates, copies of surviving witnesses, contamination,
// correctors, early prints, modern editions (see tests/synth/README.md). The
// whole pipeline runs on each draw with the model *estimated* from the
// witnesses (pipeline::AnalyseTranscriptions, then pipeline::WorkLineage). The
// same seed is drawn a second time with no contamination (share_contaminated =
// 0) to count false alarms.
// Scoring against the draw's key:
//  - groups: synth::Groups; a group is *marked* when some slip of its node
//    is still read by exactly its members (errors_exact >= 1), *twice
//    marked* when two or more of its node's slips are read by two or more of
//    its members and no other witness (errors_some >= 2, as the test does);
//  - normalised Robinson-Foulds: (true groups not found + found groups not
//    true) / (true + found); "best" is the true tree cut down to its marked
//    groups;
//  - direct copies: a claim (not twins left open) is right when its
//    exemplar is the copy's exemplar or second exemplar; the true copies
//    are the surviving witnesses whose exemplar survives; a true copy is
//    *marked* when it still shows two slips its exemplar made and one of
//    its own, or its exemplar's dates lie wholly before its own
//    (MarkedCopy): otherwise no reading tells it from a sibling or from
//    its exemplar;
//  - contaminated witnesses: surviving witnesses with a second exemplar,
//    or whose ancestors up to the first surviving one (included) have one;
//    a witness is found when the report calls it contaminated or names it
//    as one the mixture was handed down to;
//    *marked* when it still shows three or more slips of the second
//    exemplar's own line (MarkedMixture);
//  - correctors: surviving witnesses that check or recompute.
// Goals (issue 11): marked groups recovered >= 0.90; RF within 0.05 of the
// best; copies precision >= 0.9, recall >= 0.8; contamination precision >=
// 0.8, recall >= 0.7; false contamination <= 5% of uncontaminated draws;
// no copy claim against the dates.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <iterator>
#include <set>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "lineage/ancestral.hpp"
#include "pipeline/analysis.hpp"
#include "synth/tradition.hpp"

namespace synth = apograph::synth;
namespace lineage = apograph::lineage;
namespace pipeline = apograph::pipeline;

namespace {

using Sigla = std::vector<std::string>;

lineage::CharacterMatrix Characters(const synth::Tradition& t) {
  std::vector<std::vector<apograph::Transcription>> per_table(t.tables.size());
  for (int node : t.Surviving()) {
    auto tables = t.WitnessTables(node);
    for (std::size_t k = 0; k < tables.size() && k < per_table.size(); ++k)
      per_table[k].push_back(std::move(tables[k]));
  }
  std::vector<lineage::CharacterMatrix> parts;
  for (auto& ts : per_table)
    parts.push_back(pipeline::AnalyseTranscriptions(std::move(ts)).characters);
  return lineage::MergeMatrices(parts);
}

// The cache of characters (LINEAGE_BENCH_CACHE=folder): the characters of
// each draw as the pipeline built them (estimation, collation), so that
// work on the lineage stage alone reruns in seconds. Stale as soon as
// anything before src/lineage/lineage.cpp changes (empty the folder then).
nlohmann::json ToJson(const lineage::CharacterMatrix& m) {
  nlohmann::json j = {{"taxa", m.taxa},
                      {"undetermined", m.undetermined_cells},
                      {"recomputed", m.recomputed},
                      {"departures", m.departure_cells},
                      {"title", m.title}};
  for (const auto& w : m.witnesses) j["witnesses"].push_back({w.siglum, w.date, w.kind});
  j["characters"] = nlohmann::json::array();
  for (const auto& c : m.characters) {
    std::vector<int> states(c.states.begin(), c.states.end());
    j["characters"].push_back({c.label, c.block, c.row_label, c.position, states, c.weight,
                               c.weight_reason, c.omission, static_cast<int>(c.direction),
                               c.base_is_right, c.one_unit, c.carrier_is_right, c.tie_break,
                               c.cause, c.column, c.row, c.rows});
  }
  return j;
}

lineage::CharacterMatrix FromJson(const nlohmann::json& j) {
  lineage::CharacterMatrix m;
  m.taxa = j["taxa"].get<std::vector<std::string>>();
  m.undetermined_cells = j["undetermined"];
  m.recomputed = j["recomputed"].get<std::vector<int>>();
  m.departure_cells = j["departures"].get<std::vector<int>>();
  m.title = j["title"];
  for (const auto& w : j["witnesses"]) {
    apograph::WitnessInfo info;
    info.siglum = w[0], info.date = w[1], info.kind = w[2];
    m.witnesses.push_back(info);
  }
  for (const auto& c : j["characters"]) {
    lineage::Character ch;
    ch.label = c[0], ch.block = c[1], ch.row_label = c[2], ch.position = c[3];
    for (int s : c[4].get<std::vector<int>>()) ch.states.push_back(static_cast<signed char>(s));
    ch.weight = c[5], ch.weight_reason = c[6], ch.omission = c[7];
    ch.direction = static_cast<lineage::Direction>(c[8].get<int>());
    ch.base_is_right = c[9], ch.one_unit = c[10], ch.carrier_is_right = c[11], ch.tie_break = c[12];
    if (c.size() > 16) ch.cause = c[13], ch.column = c[14], ch.row = c[15], ch.rows = c[16];
    m.characters.push_back(std::move(ch));
  }
  return m;
}

// The characters of the draw analysed last (for the verbose output's
// diagnosis of missed copies).
lineage::CharacterMatrix last_matrix;

lineage::LineageReport Analyse(const synth::Tradition& t, std::uint64_t seed, bool clean) {
  const char* cache = std::getenv("LINEAGE_BENCH_CACHE");
  lineage::CharacterMatrix m;
  const std::string path =
      cache ? std::string(cache) + "/" + std::to_string(seed) + (clean ? "-clean" : "") + ".json"
            : "";
  std::ifstream in(path);
  if (cache && in) {
    m = FromJson(nlohmann::json::parse(in));
  } else {
    m = Characters(t);
    if (cache) std::ofstream(path) << ToJson(m);
  }
  if (std::getenv("BENCH_JOIN")) lineage::JoinRepeatedSlips(m);
  last_matrix = m;
  return lineage::AnalyseLineage(m);
}

Sigla Sorted(Sigla s) {
  std::sort(s.begin(), s.end());
  return s;
}

struct Totals {
  int draws = 0;
  long true_groups = 0, marked = 0, recovered = 0, twice = 0, twice_recovered = 0;
  double rf_found = 0, rf_best = 0;
  long claims = 0, claims_right = 0, copies = 0, copies_named = 0, against_dates = 0;
  long marked_copies = 0, marked_copies_named = 0;
  long contaminated = 0, flagged = 0, flagged_right = 0, marked_mixed = 0, marked_mixed_found = 0;
  long correctors = 0, correctors_flagged = 0, correctors_right = 0;
  long marked_correctors = 0, marked_found = 0;
  int clean_draws = 0, clean_false_alarms = 0;
};

double Rf(const std::set<Sigla>& truth, const std::set<Sigla>& found) {
  long miss = 0, extra = 0;
  for (const auto& g : truth) miss += found.count(g) ? 0 : 1;
  for (const auto& g : found) extra += truth.count(g) ? 0 : 1;
  const auto all = truth.size() + found.size();
  return all ? static_cast<double>(miss + extra) / static_cast<double>(all) : 0;
}

bool Mixed(const synth::Tradition& t, int node);

// Why a found group is not a true one, for the verbose output: a member is
// contaminated (and the group without the contaminated members is true or
// a single witness), or a member corrects against the model.
std::string FalseGroupCause(const synth::Tradition& t, const std::set<Sigla>& truth,
                            const Sigla& g) {
  Sigla rest;
  std::string mixed, correctors;
  for (const auto& x : g) {
    int node = -1;
    for (int w : t.Surviving())
      if (t.nodes[static_cast<std::size_t>(w)].name == x) node = w;
    const bool m = node >= 0 && Mixed(t, node);
    if (m)
      mixed += " " + x;
    else
      rest.push_back(x);
    if (node >= 0 &&
        t.nodes[static_cast<std::size_t>(node)].corrector != synth::CorrectorMode::kNone)
      correctors += " " + x;
  }
  std::string out;
  if (!mixed.empty())
    out +=
        " mixed:" + mixed + (rest.size() <= 1 || truth.count(rest) ? " (group true without)" : "");
  if (!correctors.empty()) out += " corrector:" + correctors;
  // The witnesses by which the group differs from the nearest true group,
  // each with what it is (+ in the found group only, - in the true only):
  // the cause is often a witness left out (a corrector placed elsewhere).
  const Sigla* nearest = nullptr;
  std::size_t best = g.size();
  Sigla diff;
  for (const auto& tg : truth) {
    Sigla d;
    std::set_symmetric_difference(g.begin(), g.end(), tg.begin(), tg.end(), std::back_inserter(d));
    if (d.size() < best) best = d.size(), nearest = &tg, diff = d;
  }
  if (nearest) {
    out += " near:";
    for (const auto& x : diff) {
      int node = -1;
      for (int w : t.Surviving())
        if (t.nodes[static_cast<std::size_t>(w)].name == x) node = w;
      const auto& n = t.nodes[static_cast<std::size_t>(node)];
      const bool in = std::binary_search(g.begin(), g.end(), x);
      std::string what = Mixed(t, node) ? "mixed" : "";
      if (n.corrector != synth::CorrectorMode::kNone) what += what.empty() ? "corr" : ",corr";
      if (n.kind != synth::WitnessKind::kManuscript) what += what.empty() ? "print" : ",print";
      out += std::string(" ") + (in ? "+" : "-") + x + (what.empty() ? "" : "(" + what + ")");
    }
  } else {
    out += " near: none";
  }
  return out;
}

// With LINEAGE_BENCH_FALSE_CHARS=1 (and verbose), the characters that
// change on the branch above a false group: what the group rests on.
void FalseGroupCharacters(const lineage::LineageReport& r, const Sigla& g) {
  const auto& s = r.results.front().stemma;
  for (const auto& [group, node] : s.Groups()) {
    if (Sorted(group) != g) continue;
    const auto o = lineage::Orient(last_matrix, s);
    const auto a = lineage::Reconstruct(s, o);
    for (std::size_t k = 0; k < o.characters.size(); ++k) {
      const auto& ch = o.characters[k];
      if (ch.tie_break || !a.Changes(node, static_cast<int>(k))) continue;
      std::string carriers;
      for (std::size_t x = 0; x < ch.states.size(); ++x)
        if (ch.states[x] == 1) carriers += (carriers.empty() ? "" : " ") + o.taxa[x];
      std::printf("      %s w%.1f %s %s carriers (%s)%s [%s]\n", ch.label.c_str(), ch.weight,
                  ch.weight_reason.c_str(), lineage::ToString(ch.direction), carriers.c_str(),
                  ch.one_unit ? " one-unit" : "", ch.cause.c_str());
    }
  }
}

void ScoreGroups(const synth::Tradition& t, const lineage::LineageReport& r, Totals& s,
                 bool verbose) {
  std::set<Sigla> found, truth, marked;
  if (!r.results.empty())
    for (const auto& g : r.results.front().groups) found.insert(Sorted(g.witnesses));
  for (const auto& g : synth::Groups(t)) {
    const Sigla w = Sorted(g.witnesses);
    truth.insert(w);
    const bool hit = found.count(w) > 0;
    if (g.errors_exact >= 1) marked.insert(w), ++s.marked, s.recovered += hit;
    if (g.errors_some >= 2) ++s.twice, s.twice_recovered += hit;
    if (verbose && g.errors_exact >= 1 && !hit) {
      std::printf("  missed {");
      for (const auto& x : w) std::printf(" %s", x.c_str());
      std::printf(" } (%s, %d exact, %d some)\n", g.node.c_str(), g.errors_exact, g.errors_some);
    }
  }
  if (std::getenv("LINEAGE_BENCH_GROUPS") && !r.results.empty()) {
    // Also: the draw's true and found groups, and of the characters that
    // change above the group the heaviest weight and the weight of those
    // of weight 2 or more.
    const auto& st = r.results.front().stemma;
    const auto o = lineage::Orient(last_matrix, st);
    const auto a = lineage::Reconstruct(st, o);
    for (const auto& g : r.results.front().groups) {
      double heaviest = 0, strong = 0;
      for (const auto& [group, node] : st.Groups()) {
        if (Sorted(group) != Sorted(g.witnesses)) continue;
        for (std::size_t k = 0; k < o.characters.size(); ++k) {
          const auto& ch = o.characters[k];
          if (ch.tie_break || !a.Changes(node, static_cast<int>(k))) continue;
          heaviest = std::max(heaviest, ch.weight);
          strong += ch.weight >= 2 ? ch.weight : 0;
        }
      }
      std::printf("GROUP %d %zu %.3f %d %.3f %d %zu %zu %.1f %.1f %d\n",
                  truth.count(Sorted(g.witnesses)) ? 1 : 0, g.witnesses.size(), g.length,
                  g.characters, g.conflict_weight, g.conflicting, truth.size(), found.size(),
                  heaviest, strong, marked.count(Sorted(g.witnesses)) ? 1 : 0);
    }
  }
  if (verbose)
    for (const auto& g : found)
      if (!truth.count(g)) {
        std::printf("  false {");
        for (const auto& x : g) std::printf(" %s", x.c_str());
        std::printf(" }%s\n", FalseGroupCause(t, truth, g).c_str());
        if (std::getenv("LINEAGE_BENCH_FALSE_CHARS")) FalseGroupCharacters(r, g);
      }
  s.true_groups += static_cast<long>(truth.size());
  s.rf_found += Rf(truth, found);
  s.rf_best += Rf(truth, marked);
}

// What the oriented characters say of a missed copy: the exemplar's
// errors the copy holds (of them more than a unit off), reads right,
// cannot be compared; its own; whether the copy or exemplar corrects,
// is contaminated; what the report claims for the copy instead.
std::string WhyMissed(const synth::Tradition& t, const lineage::LineageReport& r, int copy,
                      int exemplar) {
  if (r.results.empty()) return "";
  const auto o = lineage::Orient(last_matrix, r.results.front().stemma);
  const auto& cn = t.nodes[static_cast<std::size_t>(copy)];
  const auto& en = t.nodes[static_cast<std::size_t>(exemplar)];
  const int a = o.TaxonIndex(en.name), b = o.TaxonIndex(cn.name);
  if (a < 0 || b < 0) return "";
  int held = 0, strong = 0, right = 0, right_strong = 0, unreadable = 0, own = 0;
  for (const auto& ch : o.characters) {
    if (!ch.Directed() || ch.weight <= 0 || ch.tie_break) continue;
    const int sa = ch.states[static_cast<std::size_t>(a)],
              sb = ch.states[static_cast<std::size_t>(b)];
    if (sa == 1 && sb == 1) ++held, strong += !ch.one_unit;
    if (sa == 1 && sb == 0) ++right, right_strong += !ch.one_unit;
    if (sa == 1 && sb == -1) ++unreadable;
    if (sa == 0 && sb == 1) ++own;
  }
  std::string out = ": held " + std::to_string(held) + " (" + std::to_string(strong) +
                    " strong), read right " + std::to_string(right) + " (" +
                    std::to_string(right_strong) + " strong), unreadable " +
                    std::to_string(unreadable) + ", own " + std::to_string(own);
  if (cn.corrector != synth::CorrectorMode::kNone) out += "; copy corrects";
  if (en.corrector != synth::CorrectorMode::kNone) out += "; exemplar corrects";
  if (cn.contamination) out += "; copy contaminated";
  for (const auto& c : r.corrections) {
    if (c.witness == cn.name) out += "; copy called corrector";
    if (c.witness == en.name) out += "; exemplar called corrector";
  }
  for (const auto& c : r.copies) {
    if (c.copy == cn.name) out += "; claimed " + c.copy + " < " + c.exemplar;
    if (c.exemplar == cn.name && c.copy == en.name) out += "; reversed";
  }
  for (const auto& u : r.undecided) {
    if (u.what == "copy" && u.text.find(cn.name + " ") != std::string::npos &&
        u.text.find(en.name) != std::string::npos)
      out += "; undecided: " + u.text.substr(0, 90);
  }
  return out;
}

// A copy is *marked* when it still shows two or more slips its exemplar
// made (a run counted once: it descends from the exemplar, not from the
// exemplar's ancestor), and something orients the two: a slip of its own
// still visible, or the exemplar's dates wholly before its own. Otherwise
// no reading tells the copy from a sibling or from its exemplar.
bool MarkedCopy(const synth::Tradition& t, int w) {
  const auto& n = t.nodes[static_cast<std::size_t>(w)];
  const auto& e = t.nodes[static_cast<std::size_t>(n.parent)];
  std::set<std::pair<std::string, int>> runs;
  int from_exemplar = 0, own = 0;
  for (const auto& v : synth::VisibleSlips(t, w)) {
    if (v.slip.run >= 0 && !runs.insert({v.by, v.slip.run}).second) continue;
    from_exemplar += v.by == e.name ? 1 : 0;
    own += v.by == n.name ? 1 : 0;
  }
  return from_exemplar >= 2 && (own >= 1 || e.date.to < n.date.from);
}

// With LINEAGE_BENCH_CLAIMS=1, one line per copy claim: right or wrong,
// and what the oriented characters say of the exemplar (its errors, of
// them more than a unit off; witnesses holding all of them or some) and of
// the claim (errors held, read right, unreadable, filled; claims naming
// the same exemplar). Used to look for what tells wrong claims from right
// ones (DEVELOPERS.md, "Lineage accuracy", sixteenth round).
void ClaimFeatures(const lineage::LineageReport& r, const lineage::CopyCandidate& c, bool right) {
  const auto o = lineage::Orient(last_matrix, r.results.front().stemma);
  const int a = o.TaxonIndex(c.exemplar), b = o.TaxonIndex(c.copy);
  const int n = static_cast<int>(o.taxa.size());
  std::vector<int> holdall(n, 1), holdsome(n, 0);
  int errs = 0, strong = 0;
  for (const auto& ch : o.characters) {
    if (!ch.Directed() || ch.weight <= 0 || ch.tie_break) continue;
    if (ch.states[a] != 1) continue;
    ++errs, strong += !ch.one_unit;
    for (int x = 0; x < n; ++x) {
      if (ch.states[x] == 0) holdall[x] = 0;
      if (ch.states[x] == 1) holdsome[x] = 1;
    }
  }
  int all = 0, partial = 0;
  for (int x = 0; x < n; ++x) {
    if (x == a) continue;
    if (holdall[x] && holdsome[x])
      ++all;
    else if (holdsome[x])
      ++partial;
  }
  int claims_same = 0;
  for (const auto& d : r.copies) claims_same += !d.twins && d.exemplar == c.exemplar;
  // Singular errors (state 1 in one witness only) of every witness: what a
  // witness's own slips number in this tradition.
  std::vector<int> singular(n, 0);
  for (const auto& ch : o.characters) {
    if (!ch.Directed() || ch.weight <= 0 || ch.tie_break) continue;
    int carriers = 0, who = -1;
    for (int x = 0; x < n; ++x)
      if (ch.states[x] == 1) ++carriers, who = x;
    if (carriers == 1) ++singular[who];
  }
  std::vector<int> others;
  for (int x = 0; x < n; ++x)
    if (x != a && x != b) others.push_back(singular[x]);
  std::sort(others.begin(), others.end());
  const int median = others.empty() ? -1 : others[others.size() / 2];
  const int least = others.empty() ? -1 : others.front();
  std::printf(
      "CLAIM %d errs %d strong %d own %d holdall %d partial %d claims_same %d corrected %d "
      "held %d unreadable %d filled %d median_singular %d least_singular %d copy_singular %d "
      "kind %s\n",
      right, errs, strong, c.own_errors, all, partial, claims_same, c.corrected, c.exemplar_errors,
      c.unreadable, c.filled, median, least, singular[b],
      o.witnesses.size() > static_cast<std::size_t>(a) ? o.witnesses[a].kind.c_str() : "?");
}

// How a wrongly claimed copy truly stands to its claimed exemplar: "below"
// (the exemplar is a farther ancestor, through lost copies), "reversed",
// "siblings" (one exemplar, lost or surviving), "cousins" (the nearest
// common ancestor further up), each with the lost copies between.
std::string Relation(const synth::Tradition& t, int copy, int exemplar) {
  auto ancestors = [&](int x) {
    std::vector<int> out;
    for (int i = t.nodes[static_cast<std::size_t>(x)].parent; i >= 0;
         i = t.nodes[static_cast<std::size_t>(i)].parent)
      out.push_back(i);
    return out;
  };
  const auto up_c = ancestors(copy), up_e = ancestors(exemplar);
  for (std::size_t k = 0; k < up_c.size(); ++k)
    if (up_c[k] == exemplar) return "below, " + std::to_string(k) + " between";
  for (std::size_t k = 0; k < up_e.size(); ++k)
    if (up_e[k] == copy) return "reversed, " + std::to_string(k) + " between";
  for (std::size_t a = 0; a < up_c.size(); ++a)
    for (std::size_t b = 0; b < up_e.size(); ++b)
      if (up_c[a] == up_e[b])
        return (a == 0 && b == 0 ? std::string("siblings")
                                 : "cousins " + std::to_string(a) + "/" + std::to_string(b)) +
               (t.nodes[static_cast<std::size_t>(up_c[a])].surviving ? " under a witness" : "");
  return "unrelated";
}

void ScoreCopies(const synth::Tradition& t, const lineage::LineageReport& r, Totals& s,
                 bool verbose) {
  std::set<std::pair<int, int>> named;
  for (const auto& c : r.copies) {
    if (c.twins) continue;
    const int copy = t.Find(c.copy), exemplar = t.Find(c.exemplar);
    if (copy < 0 || exemplar < 0) continue;
    ++s.claims;
    const auto& n = t.nodes[static_cast<std::size_t>(copy)];
    const bool second = n.contamination && n.contamination->second == exemplar;
    const bool right = n.parent == exemplar || second;
    s.claims_right += right;
    if (right) named.insert({copy, exemplar});
    const bool against = n.date.to < t.nodes[static_cast<std::size_t>(exemplar)].date.from;
    s.against_dates += against;
    if (std::getenv("LINEAGE_BENCH_CLAIMS")) ClaimFeatures(r, c, right);
    if (verbose && against) std::printf("  against the dates: %s\n", c.text.c_str());
    if (verbose && !right)
      std::printf("  wrong copy (%s): %s\n", Relation(t, copy, exemplar).c_str(), c.text.c_str());
  }
  for (int w : t.Surviving()) {
    const auto& n = t.nodes[static_cast<std::size_t>(w)];
    if (n.parent <= 0 || !t.nodes[static_cast<std::size_t>(n.parent)].surviving) continue;
    ++s.copies;
    const bool hit = named.count({w, n.parent}) > 0;
    s.copies_named += hit;
    if (MarkedCopy(t, w)) ++s.marked_copies, s.marked_copies_named += hit;
    if (verbose && !hit) {
      const auto& e = t.nodes[static_cast<std::size_t>(n.parent)];
      std::printf("  missed copy%s %s < %s%s\n", MarkedCopy(t, w) ? " (marked)" : "",
                  n.name.c_str(), e.name.c_str(), WhyMissed(t, r, w, n.parent).c_str());
    }
  }
}

// A witness shows a mixture first when it, or a lost ancestor above it
// (up to the first surviving one), took a second exemplar.
bool Mixed(const synth::Tradition& t, int node) {
  for (int i = node; i > 0; i = t.nodes[static_cast<std::size_t>(i)].parent) {
    const auto& n = t.nodes[static_cast<std::size_t>(i)];
    if (n.contamination) return true;
    if (i != node && n.surviving) return false;
  }
  return false;
}

// A mixture is *marked* when the witness still shows three slips or more
// made on the second exemplar's line (the second exemplar and its
// ancestors that are not ancestors of the witness by first exemplars):
// fewer leave nothing any criterion could see (the one-line and two-line
// criteria ask three on a side).
bool MarkedMixture(const synth::Tradition& t, int node) {
  int mixed = -1;
  for (int i = node; i > 0 && mixed < 0; i = t.nodes[static_cast<std::size_t>(i)].parent) {
    if (t.nodes[static_cast<std::size_t>(i)].contamination) mixed = i;
  }
  if (mixed < 0) return false;
  std::set<std::string> first, second;
  for (int i = mixed; i >= 0; i = t.nodes[static_cast<std::size_t>(i)].parent)
    first.insert(t.nodes[static_cast<std::size_t>(i)].name);
  for (int i = t.nodes[static_cast<std::size_t>(mixed)].contamination->second; i >= 0;
       i = t.nodes[static_cast<std::size_t>(i)].parent) {
    if (!first.count(t.nodes[static_cast<std::size_t>(i)].name))
      second.insert(t.nodes[static_cast<std::size_t>(i)].name);
  }
  int n = 0;
  for (const auto& v : synth::VisibleSlips(t, node)) n += second.count(v.by) ? 1 : 0;
  return n >= 3;
}

// The corrections of node `c` that show: the reading it corrected survives
// in another witness's transcription (the same cell), so that a criterion
// can see the corrector read right what its relatives have wrong.
int VisibleCorrections(const synth::Tradition& t, int c) {
  int n = 0;
  for (const auto& fix : t.nodes[static_cast<std::size_t>(c)].corrections) {
    bool seen = false;
    for (int w : t.Surviving()) {
      if (w == c || seen) continue;
      for (const auto& table : t.nodes[static_cast<std::size_t>(w)].transcribed) {
        if (table.text.table_id != fix.table) continue;
        const auto& cols = table.text.columns;
        std::size_t col = 0;
        while (col < cols.size() && cols[col].name != fix.column) ++col;
        for (std::size_t r = 0; r < table.text.rows.size() && col < cols.size(); ++r) {
          if (table.origin[r] != fix.origin_row) continue;
          const auto& cells = table.text.rows[r].cells;
          seen = seen || (col < cells.size() && cells[col].raw == fix.before);
        }
      }
    }
    n += seen ? 1 : 0;
  }
  return n;
}

// With LINEAGE_BENCH_CORRECTORS=1, one line per witness called a corrector
// for its corrections: right or not, and at the errors of a unit that two
// or more of its relatives carry, how many it reads right and how many it
// holds (a checker corrects what lies beyond rounding, and keeps those).
void CorrectorFeatures(const synth::Tradition& t, const lineage::LineageReport& r) {
  const auto& m = last_matrix;
  for (const auto& c : r.corrections) {
    if (c.basis != "corrections") continue;
    const int w = m.TaxonIndex(c.witness);
    const int node = t.Find(c.witness);
    if (w < 0 || node < 0) continue;
    std::vector<int> rel;
    for (const auto& x : c.relatives)
      if (m.TaxonIndex(x) >= 0) rel.push_back(m.TaxonIndex(x));
    int one_right = 0, one_held = 0, big_right = 0, big_held = 0;
    for (const auto& ch : m.characters) {
      if (ch.tie_break || !ch.base_is_right || ch.carrier_is_right) continue;
      int carriers = 0;
      for (int x : rel) carriers += ch.states[static_cast<std::size_t>(x)] == 1;
      if (carriers < 2) continue;
      const int st = ch.states[static_cast<std::size_t>(w)];
      if (st < 0) continue;
      (ch.one_unit ? (st ? one_held : one_right) : (st ? big_held : big_right)) += 1;
    }
    const bool right =
        t.nodes[static_cast<std::size_t>(node)].corrector != synth::CorrectorMode::kNone;
    std::printf("CORR %d one_right %d one_held %d big_right %d big_held %d corrected %d kept %d\n",
                right, one_right, one_held, big_right, big_held, c.corrected, c.kept);
  }
}

// With LINEAGE_BENCH_MIX=1, for a missed marked mixture: the slips of the
// second exemplar's line and of the first exemplar's own line (below the
// two lines' common ancestor) that the witness shows, how many stand as
// characters it carries, and how many of those pass the contamination
// criteria's evidence filter (oriented, weight class 1 or more, not one
// unit), with why the others do not.
void MixtureFeatures(const synth::Tradition& t, int w) {
  const auto& m = last_matrix;
  int mixed = -1;
  for (int i = w; i > 0 && mixed < 0; i = t.nodes[static_cast<std::size_t>(i)].parent)
    if (t.nodes[static_cast<std::size_t>(i)].contamination) mixed = i;
  if (mixed < 0) return;
  std::set<std::string> first, second;
  for (int i = t.nodes[static_cast<std::size_t>(mixed)].parent; i >= 0;
       i = t.nodes[static_cast<std::size_t>(i)].parent)
    first.insert(t.nodes[static_cast<std::size_t>(i)].name);
  std::set<std::string> common;
  for (int i = t.nodes[static_cast<std::size_t>(mixed)].contamination->second; i >= 0;
       i = t.nodes[static_cast<std::size_t>(i)].parent) {
    const auto& nm = t.nodes[static_cast<std::size_t>(i)].name;
    (first.count(nm) ? common : second).insert(nm);
  }
  for (const auto& c : common) first.erase(c);
  const int wi = m.TaxonIndex(t.nodes[static_cast<std::size_t>(w)].name);
  if (wi < 0) return;
  for (int line = 0; line < 2; ++line) {
    const auto& set = line == 0 ? first : second;
    int shown = 0, carried = 0, evidence = 0, tree = 0, light = 0, unit = 0, none = 0;
    std::string where;
    for (const auto& v : synth::VisibleSlips(t, w)) {
      if (!set.count(v.by)) continue;
      ++shown;
      const std::string block = v.slip.table + " " + v.slip.arg;
      const lineage::Character* hit = nullptr;
      for (const auto& ch : m.characters)
        if (ch.block == block && ch.column == v.slip.column &&
            ch.states[static_cast<std::size_t>(wi)] == 1)
          hit = &ch;
      if (!hit) {
        ++none;
        continue;
      }
      ++carried;
      const bool oriented = hit->direction == lineage::Direction::kModel ||
                            hit->direction == lineage::Direction::kMajority;
      const double cls = std::round(hit->weight * 2) / 2;
      if (!oriented)
        ++tree;
      else if (cls < 1)
        ++light;
      else if (hit->one_unit)
        ++unit;
      else
        ++evidence, where += " " + std::to_string(hit->position);
    }
    std::printf(
        "    MIX %s line: shown %d carried %d evidence %d (not oriented %d, light %d, one unit %d, "
        "no character %d) at%s\n",
        line == 0 ? "first" : "second", shown, carried, evidence, tree, light, unit, none,
        where.c_str());
  }
}

void ScoreMixtures(const synth::Tradition& t, const lineage::LineageReport& r, Totals& s,
                   bool verbose) {
  if (std::getenv("LINEAGE_BENCH_CORRECTORS")) CorrectorFeatures(t, r);
  std::set<std::string> flagged, corrected;
  for (const auto& c : r.contamination) {
    flagged.insert(c.witness);
    // "handed down to": the report tells the mixture of these too.
    flagged.insert(c.inherited_by.begin(), c.inherited_by.end());
  }
  for (const auto& c : r.corrections) corrected.insert(c.witness);
  for (int w : t.Surviving()) {
    const auto& n = t.nodes[static_cast<std::size_t>(w)];
    const bool mixed = Mixed(t, w), is_flagged = flagged.count(n.name) > 0;
    s.contaminated += mixed, s.flagged += is_flagged, s.flagged_right += mixed && is_flagged;
    if (mixed && MarkedMixture(t, w)) ++s.marked_mixed, s.marked_mixed_found += is_flagged;
    if (verbose && mixed != is_flagged) {
      std::printf("  contamination %s%s: %s", mixed ? "missed" : "false",
                  mixed && MarkedMixture(t, w) ? " (marked)" : "", n.name.c_str());
      if (n.contamination) {
        const auto& x = *n.contamination;
        std::printf(" (from %s, then %s %s table %d row %d)",
                    t.nodes[static_cast<std::size_t>(n.parent)].name.c_str(),
                    t.nodes[static_cast<std::size_t>(x.second)].name.c_str(),
                    x.between_tables ? "from" : "in", x.table, x.row);
      }
      if (!mixed) {  // what a false flag is: a source of a mixture, a relative of one, a corrector
        for (int v : t.Surviving()) {
          const auto& m = t.nodes[static_cast<std::size_t>(v)];
          if (!m.contamination) continue;
          const int second = m.contamination->second;
          for (int i = second; i >= 0; i = t.nodes[static_cast<std::size_t>(i)].parent) {
            if (i == w) std::printf(" [source of %s's mixture]", m.name.c_str());
          }
          for (int i = w; i >= 0; i = t.nodes[static_cast<std::size_t>(i)].parent) {
            if (i == second && i != w)
              std::printf(" [below the source of %s's mixture]", m.name.c_str());
          }
          if (m.parent == n.parent) std::printf(" [sibling of mixed %s]", m.name.c_str());
          if (m.parent == w) std::printf(" [exemplar of mixed %s]", m.name.c_str());
        }
        if (n.corrector != synth::CorrectorMode::kNone) std::printf(" [corrector]");
        for (const auto& c : r.contamination)
          if (c.witness == n.name) std::printf(" said: %s", c.text.substr(0, 160).c_str());
      }
      std::printf("\n");
      if (mixed && MarkedMixture(t, w) && std::getenv("LINEAGE_BENCH_MIX")) MixtureFeatures(t, w);
    }
    const bool corrector = n.corrector != synth::CorrectorMode::kNone;
    const bool said = corrected.count(n.name) > 0;
    s.correctors += corrector, s.correctors_flagged += said,
        s.correctors_right += corrector && said;
    // Marked: three corrections that show (the least the criteria ask).
    if (corrector && VisibleCorrections(t, w) >= 3) ++s.marked_correctors, s.marked_found += said;
    if (verbose && corrector != said)
      std::printf("  corrector %s: %s (%s, %s %.2f, %zu corrections, exemplar %s %s)\n",
                  corrector ? "missed" : "false", n.name.c_str(), synth::WitnessKindName(n.kind),
                  synth::CorrectorModeName(n.corrector), n.correction_share, n.corrections.size(),
                  t.nodes[static_cast<std::size_t>(n.parent)].name.c_str(),
                  synth::WitnessKindName(t.nodes[static_cast<std::size_t>(n.parent)].kind));
  }
  if (verbose) {
    for (const auto& c : r.contamination) std::printf("  said: %s\n", c.text.c_str());
    for (const auto& u : r.undecided)
      if (u.text.rfind("contamination?", 0) == 0) std::printf("  suspected: %s\n", u.text.c_str());
    for (const auto& c : r.corrections) std::printf("  corrector: %s\n", c.text.c_str());
    if (!r.results.empty())
      std::printf("  found: %s\n", lineage::ToNewick(r.results.front().stemma).c_str());
  }
}

void Draw(std::uint64_t seed, bool verbose, Totals& all) {
  synth::TraditionOptions o;
  const auto t = synth::DrawTradition(seed, o);
  if (verbose)
    std::printf("seed %llu: %zu witnesses, %zu tables; %s\n", static_cast<unsigned long long>(seed),
                t.Surviving().size(), t.tables.size(), synth::Newick(t, false).c_str());
  const auto r = Analyse(t, seed, false);
  ++all.draws;
  ScoreGroups(t, r, all, verbose);
  ScoreCopies(t, r, all, verbose);
  ScoreMixtures(t, r, all, verbose);
  o.share_contaminated = 0;
  const auto clean = Analyse(synth::DrawTradition(seed, o), seed, true);
  ++all.clean_draws;
  all.clean_false_alarms += clean.contamination.empty() ? 0 : 1;
  if (verbose && !clean.contamination.empty())
    std::printf("  FALSE ALARM (clean draw): %s\n", clean.contamination[0].text.c_str());
}

double Share(long a, long b) { return b ? static_cast<double>(a) / static_cast<double>(b) : 0; }

void Print(const Totals& a, unsigned first) {
  std::printf(
      "lineage accuracy: %d draws of synth::DrawTradition (seeds %u to %u), model estimated\n",
      a.draws, first, first + static_cast<unsigned>(a.draws) - 1);
  std::printf("  marked groups recovered      %.3f (%ld of %ld; %ld true groups)  goal >= 0.90\n",
              Share(a.recovered, a.marked), a.recovered, a.marked, a.true_groups);
  std::printf("  twice-marked recovered       %.3f (%ld of %ld)\n",
              Share(a.twice_recovered, a.twice), a.twice_recovered, a.twice);
  std::printf(
      "  normalised RF                %.3f, best the readings allow %.3f  goal: within 0.05\n",
      a.rf_found / a.draws, a.rf_best / a.draws);
  std::printf(
      "  direct copies                precision %.3f (%ld of %ld), recall %.3f (%ld of %ld)\n",
      Share(a.claims_right, a.claims), a.claims_right, a.claims, Share(a.copies_named, a.copies),
      a.copies_named, a.copies);
  std::printf(
      "  marked copies named          %.3f (%ld of %ld: two slips of the exemplar and "
      "one of the copy, or the dates, show)\n",
      Share(a.marked_copies_named, a.marked_copies), a.marked_copies_named, a.marked_copies);
  std::printf(
      "  contaminated witnesses       precision %.3f (%ld of %ld), recall %.3f (%ld of %ld)\n",
      Share(a.flagged_right, a.flagged), a.flagged_right, a.flagged,
      Share(a.flagged_right, a.contaminated), a.flagged_right, a.contaminated);
  std::printf("  marked mixtures found        %.3f (%ld of %ld)\n",
              Share(a.marked_mixed_found, a.marked_mixed), a.marked_mixed_found, a.marked_mixed);
  std::printf("  false contamination          %.3f of uncontaminated draws (%d of %d)\n",
              Share(a.clean_false_alarms, a.clean_draws), a.clean_false_alarms, a.clean_draws);
  std::printf("  copy claims against dates    %ld\n", a.against_dates);
  std::printf(
      "  correctors                   precision %.3f (%ld of %ld), recall %.3f (%ld of %ld)\n",
      Share(a.correctors_right, a.correctors_flagged), a.correctors_right, a.correctors_flagged,
      Share(a.correctors_right, a.correctors), a.correctors_right, a.correctors);
  std::printf("  marked correctors found       %.3f (%ld of %ld: three corrections or more show)\n",
              Share(a.marked_found, a.marked_correctors), a.marked_found, a.marked_correctors);
}

}  // namespace

int main(int argc, char** argv) {
  const int draws = argc > 1 ? std::atoi(argv[1]) : 300;
  const unsigned first = argc > 2 ? static_cast<unsigned>(std::atoi(argv[2])) : 1;
  const bool verbose = argc > 3 && std::atoi(argv[3]) != 0;
  Totals all;
  for (int k = 0; k < draws; ++k) Draw(first + static_cast<unsigned>(k), verbose, all);
  Print(all, first);
  return 0;
}
