#include "lineage/corrections.hpp"

#include <algorithm>
#include <bit>
#include <cstdint>
#include <optional>
#include <sstream>

#include "lineage/contamination_internal.hpp"

namespace apograph::lineage {
namespace {

bool RightReading(const Character& ch, int t) { return ch.base_is_right && ch.states[t] == 0; }

bool Placing(const Character& ch) {
  return ch.direction == Direction::kModel && !ch.one_unit && ch.weight >= 1 && !ch.tie_break;
}

// The other witnesses carrying character k.
std::vector<int> Carriers(const Character& ch, int except) {
  std::vector<int> out;
  for (std::size_t t = 0; t < ch.states.size(); ++t) {
    if (ch.states[t] == 1 && static_cast<int>(t) != except) out.push_back(static_cast<int>(t));
  }
  return out;
}

// Witnesses as bits, to test two characters for compatibility quickly.
using Bits = std::vector<std::uint64_t>;

void Set(Bits& b, std::size_t t) { b[t / 64] |= std::uint64_t{1} << (t % 64); }
void Clear(Bits& b, std::size_t t) { b[t / 64] &= ~(std::uint64_t{1} << (t % 64)); }
bool Meet(const Bits& a, const Bits& b) {
  for (std::size_t i = 0; i < a.size(); ++i) {
    if ((a[i] & b[i]) != 0) return true;
  }
  return false;
}

// A placing character as the witnesses that carry it and those that read
// its base.
struct Split {
  const Character* character;
  Bits ones, zeros;
};

Split MakeSplit(const Character& ch, std::size_t taxa) {
  Split s{&ch, Bits((taxa + 63) / 64, 0), Bits((taxa + 63) / 64, 0)};
  for (std::size_t t = 0; t < ch.states.size(); ++t) {
    if (ch.states[t] == 1) Set(s.ones, t);
    if (ch.states[t] == 0) Set(s.zeros, t);
  }
  return s;
}

std::vector<Split> Splits(const CharacterMatrix& m) {
  std::vector<Split> out;
  for (const auto& ch : m.characters) {
    if (Placing(ch)) out.push_back(MakeSplit(ch, m.taxa.size()));
  }
  return out;
}

// Witnesses in both sets.
int Common(const Bits& a, const Bits& b) {
  int n = 0;
  for (std::size_t i = 0; i < a.size(); ++i) n += std::popcount(a[i] & b[i]);
  return n;
}

// Whether the error `k` arose above the shared error `l` of W (W carries
// l and reads k right): another carrier of l carries k (l arose inside k's
// group; its carriers that lack k descend from W, or corrected too), and so
// does a witness that can be read at l and lacks it (k's group is the
// larger one). `own_group`: more of l's other carriers that can be read at
// k carry it than lack it, so that k is above the group l places W in, not
// an error of a subgroup that W's line never had (its right reading there
// is then simply the archetype's, retained by its own line). As sets of
// witnesses, W being among l's carriers and k's right readers.
bool Encloses(const Split& l, const Split& k, bool own_group) {
  if (!Meet(k.ones, l.ones) || !Meet(k.ones, l.zeros)) return false;
  return !own_group || Common(l.ones, k.ones) > Common(l.ones, k.zeros) - 1;
}

// Two errors directed by the model (the archetype reads neither) cannot
// both have arisen once on one tree when each has a carrier the other
// lacks and they share one (the three-gamete test).
bool Conflict(const Split& a, const Split& b) {
  return Meet(a.ones, b.ones) && Meet(a.ones, b.zeros) && Meet(a.zeros, b.ones);
}

// The weight of the placing errors that conflict with error `k` once
// witness w is counted among its carriers: a correction explains k only if
// k and w together make a group of the tree (k arose above w, which read it
// right again); when they do not, k's carriers made the same slip
// independently, and w's right reading is the archetype's.
double ConflictsWith(const Character& k, int w, const std::vector<Split>& splits,
                     std::size_t taxa) {
  Split joined = MakeSplit(k, taxa);
  Set(joined.ones, static_cast<std::size_t>(w));
  Clear(joined.zeros, static_cast<std::size_t>(w));
  double weight = 0;
  for (const auto& s : splits) {
    if (s.character != &k && Conflict(joined, s)) weight += s.character->weight;
  }
  return weight;
}

Correction Examine(const CharacterMatrix& m, int w, const std::vector<Split>& splits,
                   bool own_group = false) {
  Correction c;
  c.witness = m.taxa[w];
  const auto uw = static_cast<std::size_t>(w);
  std::vector<const Split*> placing;  // W's shared errors (`splits` are m's placing characters)
  for (const auto& l : splits) {
    if (l.character->states[uw] != 1) continue;
    Bits others = l.ones;
    Clear(others, uw);
    if (std::none_of(others.begin(), others.end(), [](std::uint64_t x) { return x != 0; }))
      continue;
    ++c.kept;
    placing.push_back(&l);
  }
  std::vector<bool> relative(m.taxa.size(), false);
  // W's descendants (they hold its errors, and neither their dates nor
  // their kind forbid it): an error one of them carries and W lacks arose
  // after W was written; W's right reading there is the one it had, not a
  // correction. (Seed 147 of the lineage benchmark: F, the exemplar of B,
  // read right B's errors that B's copy G shares, and was called a
  // corrector in place of G, which corrects F's.) Measured on seeds 1-300
  // (DEVELOPERS.md, "Lineage accuracy", seventeenth round): correctors
  // called 180 -> 177, right 135 -> 135; groups 837 -> 839 of 963; copies
  // precision 0.872 -> 0.879.
  std::vector<bool> descendant(m.taxa.size(), false);
  for (int x = 0; x < static_cast<int>(m.taxa.size()); ++x)
    descendant[static_cast<std::size_t>(x)] =
        x != w && contamination::Holds(m, x, w) && !CannotDescend(m, x, w);
  for (const auto& k : splits) {
    const Character& ch = *k.character;
    if (!RightReading(ch, w)) continue;
    bool later = false;
    for (int t : Carriers(ch, w)) later = later || descendant[static_cast<std::size_t>(t)];
    if (later) continue;
    double inside = 0;
    int count = 0;
    bool before = false, after = false;
    for (const Split* l : placing) {
      if (!Encloses(*l, k, own_group)) continue;
      inside += l->character->weight, ++count;
      before = before || l->character->position <= ch.position;
      after = after || l->character->position >= ch.position;
    }
    if (inside < kMinPlacingWeight || count < 2 || !before || !after) continue;
    if (ConflictsWith(ch, w, splits, m.taxa.size()) > kMaxConflictShare * inside) continue;
    ++c.corrected, c.weight += ch.weight;
    for (int t : Carriers(ch, w)) relative[t] = true;
  }
  for (std::size_t t = 0; t < m.taxa.size(); ++t) {
    if (relative[t]) c.relatives.push_back(m.taxa[t]);
  }
  return c;
}

bool Corrects(const Correction& c) {
  return c.corrected >= kMinCorrections && c.weight >= kMinCorrectionWeight;
}

bool Recomputes(const Correction& c) {
  return c.recomputed >= kMinRecomputed && 4 * c.recomputed >= 3 * c.departures;
}

std::string SetAside() {
  return ". Later correction is not descent: its right readings are set aside and it is placed by "
         "its errors";
}

std::string Text(const Correction& c) {
  std::ostringstream o;
  if (Corrects(c)) {
    o << c.witness << " corrects " << c.corrected << " entries that its group (";
    for (std::size_t i = 0; i < c.relatives.size(); ++i) o << (i ? " " : "") << c.relatives[i];
    o << ") has wrong: it shares " << c.kept << " errors with the group, yet reads the model's "
      << "value there";
  }
  if (Recomputes(c)) {
    o << (Corrects(c) ? "; it" : c.witness) << " reads the recomputed value at " << c.recomputed
      << " of the " << c.departures << " entries where the others keep a value a unit off (the "
      << "author's own): it recomputed the table";
  }
  if (!Corrects(c) && !Recomputes(c)) {
    o << c.witness << " is a modern edition: modern editors correct against the model, so its "
      << "agreement with the model is taken as theirs";
    if (c.corrected) o << " (it reads right " << c.corrected << " errors of its group)";
  }
  o << SetAside();
  return o.str();
}

}  // namespace

bool ShowsCorrection(const Correction& c) { return Corrects(c) || Recomputes(c); }

void ReviseByExemplars(std::vector<Correction>& corrections,
                       const std::vector<CopyCandidate>& copies) {
  std::vector<std::string> set_aside;
  for (const auto& c : corrections) set_aside.push_back(c.witness);
  std::vector<Correction> kept;
  for (auto& c : corrections) {
    const auto copy = std::find_if(copies.begin(), copies.end(), [&](const CopyCandidate& x) {
      return !x.twins && x.copy == c.witness;
    });
    const bool own = ShowsCorrection(c);
    if (copy == copies.end() || (own && copy->corrected >= kMinCorrections)) {
      kept.push_back(std::move(c));
      continue;
    }
    // It keeps its exemplar's errors but for fewer than kMinCorrections
    // (the slips of a transcription or of text recognition, which no copy
    // inherits, make a few).
    const bool faithful = copy->corrected < kMinCorrections;
    const bool from_corrector =
        std::find(set_aside.begin(), set_aside.end(), copy->exemplar) != set_aside.end();
    if (faithful && (!own || from_corrector)) continue;  // its right readings are its exemplar's
    if (!own) {  // a modern edition that reads right its exemplar's errors: the evidence, said
      c.corrected = copy->corrected;
      c.relatives = {copy->exemplar};
      c.basis = "exemplar";
      c.text = c.witness + " is a modern edition and reads the model's value at " +
               std::to_string(copy->corrected) + " of the errors of " + copy->exemplar +
               ", its exemplar: it corrects against the model" + SetAside();
    }
    kept.push_back(std::move(c));
  }
  corrections = std::move(kept);
}

void ReviseByGroups(std::vector<Correction>& corrections, const Stemma& stemma,
                    const CharacterMatrix& m) {
  std::vector<Correction> kept;
  for (auto& c : corrections) {
    const int t = m.TaxonIndex(c.witness);
    const int node = FindWitness(stemma, c.witness);
    if (c.basis != "kind" || t < 0 || node < 0 || stemma.nodes[node].parent < 0) {
      kept.push_back(std::move(c));
      continue;
    }
    std::vector<int> group;
    for (const auto& s : stemma.Below(stemma.nodes[node].parent)) {
      const int x = m.TaxonIndex(s);
      if (x >= 0 && x != t) group.push_back(x);
    }
    int corrected = 0, held = 0;
    for (const auto& ch : m.characters) {
      if (!Placing(ch) || !ch.base_is_right || ch.states[t] < 0) continue;
      int carriers = 0, legible = 0;
      for (int x : group) {
        const auto st = ch.states[static_cast<std::size_t>(x)];
        legible += st >= 0, carriers += st == 1;
      }
      if (legible == 0 || carriers < legible) continue;
      (ch.states[t] == 1 ? held : corrected) += 1;
    }
    if (corrected < kMinCorrections && held >= kMinCorrections) continue;  // a faithful edition
    kept.push_back(std::move(c));
  }
  corrections = std::move(kept);
}

std::vector<Correction> FindCorrections(const CharacterMatrix& m) {
  std::vector<Correction> out;
  if (m.taxa.size() < 3) return out;
  // Recomputing witnesses first; then correctors one at a time, the
  // strongest first, each set aside before the next is looked for (a
  // corrector's right readings make its relatives look like correctors).
  // A witness whose corrections are mostly against its own group (see
  // kOwnGroupShare) goes before one whose are not: two incompatible sets
  // of errors read right by two witnesses (seed 36 of the benchmark: E
  // lacks D F K's errors, D and K lack E F's) are explained by one
  // corrector, and it is the one whose other errors place it inside the
  // group it reads right.
  CharacterMatrix current = m;
  for (int w = 0; w < static_cast<int>(m.taxa.size()); ++w) {
    Correction c;
    c.witness = m.taxa[w];
    if (static_cast<std::size_t>(w) < m.recomputed.size()) {
      c.recomputed = m.recomputed[w];
      c.departures = m.departure_cells[w];
    }
    c.modern_edition =
        m.witnesses.size() == m.taxa.size() && m.witnesses[w].Kind() == WitnessKind::kModernEdition;
    if (Recomputes(c) || c.modern_edition) out.push_back(std::move(c));
  }
  current = MaskCorrections(m, out);
  for (;;) {
    const std::vector<Split> splits = Splits(current);
    std::optional<Correction> best;
    bool best_own = false;
    for (int w = 0; w < static_cast<int>(m.taxa.size()); ++w) {
      const bool done = std::any_of(out.begin(), out.end(),
                                    [&](const Correction& c) { return c.witness == m.taxa[w]; });
      if (done) continue;
      Correction c = Examine(current, w, splits);
      if (!Corrects(c)) continue;
      const bool own = Examine(current, w, splits, true).weight >= kOwnGroupShare * c.weight;
      if (!best || (own && !best_own) || (own == best_own && c.weight > best->weight))
        best = std::move(c), best_own = own;
    }
    if (!best) break;
    current = MaskCorrections(current, {*best});
    out.push_back(std::move(*best));
  }
  const std::vector<Split> splits = Splits(current);
  for (auto& c : out) {
    const int w = m.TaxonIndex(c.witness);
    if (!Corrects(c)) {  // a recomputing witness: its corrections counted for the report
      const Correction e = Examine(current, w, splits);
      c.corrected = e.corrected, c.weight = e.weight, c.kept = e.kept, c.relatives = e.relatives;
    }
    if (static_cast<std::size_t>(w) < m.recomputed.size()) {
      c.recomputed = m.recomputed[w];
      c.departures = m.departure_cells[w];
    }
    c.basis = Corrects(c) ? "corrections" : (Recomputes(c) ? "recomputed" : "kind");
    c.text = Text(c);
  }
  return out;
}

CharacterMatrix MaskCorrections(const CharacterMatrix& m, const std::vector<Correction>& cs) {
  CharacterMatrix out = m;
  std::vector<bool> corrector(m.taxa.size(), false);
  for (const auto& c : cs) {
    const int t = m.TaxonIndex(c.witness);
    if (t >= 0) corrector[t] = true;
  }
  // A rounding difference only correctors carry is their own recomputing;
  // one a copyist carries too came down from an exemplar (a slip of a unit
  // that no recomputation shows), and stays.
  for (auto& ch : out.characters) {
    if (!ch.carrier_is_right) continue;
    bool own = true;
    for (std::size_t t = 0; t < ch.states.size(); ++t)
      own = own && (ch.states[t] != 1 || corrector[t]);
    if (!own) continue;
    for (auto& x : ch.states) x = x == 1 ? -1 : x;
  }
  for (const auto& c : cs) {
    const int t = m.TaxonIndex(c.witness);
    if (t < 0) continue;
    std::vector<Character> ties;
    for (auto& ch : out.characters) {
      if (!RightReading(ch, t)) continue;
      if (ch.tie_break) {
        // Another corrector's tie-break: this one's right reading is set
        // aside there too, not copied again (a copy of a copy weighs
        // kCorrectorTieBreak squared, and copying them doubled the matrix
        // with every corrector: 2^n characters for n correctors).
        ch.weight *= 1 - kCorrectorTieBreak;
        ch.states[t] = -1;
        continue;
      }
      ties.push_back(ch);
      ties.back().weight = ch.weight * kCorrectorTieBreak;
      ties.back().tie_break = true;
      ch.weight *= 1 - kCorrectorTieBreak;
      ch.states[t] = -1;
    }
    out.characters.insert(out.characters.end(), ties.begin(), ties.end());
  }
  return out;
}

}  // namespace apograph::lineage
