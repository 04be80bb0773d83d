// Contamination: a witness whose errors side with two lines in stretches of
// their own, or with one relative in one stretch only (one_line.cpp), or
// that holds a line's common errors in one part only (line_join.cpp)
// (relations.hpp: FindContamination, MaskSecondaryExemplar).
#include "lineage/relations.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <optional>
#include <sstream>
#include <string>

#include "lineage/contamination_internal.hpp"

namespace apograph::lineage {
namespace contamination {

// A character's weight class (characters.hpp: 0.5, 1, 2, 3) before the
// share each corrector's tie-break took off it (corrections.hpp: 1/128 per
// corrector), which would otherwise drop every common slip a corrector
// reads right below 1.
double ClassWeight(const Character& ch) { return std::round(ch.weight * 2) / 2; }

// Only characters whose direction comes from the model or the majority
// count: a tree's orientation (Direction::kTree) follows the first,
// possibly mis-rooted stemma, and a wrong tree makes characters it
// oriented look like errors of two lines.
bool Evidence(const Character& ch) {
  const bool oriented = ch.direction == Direction::kModel || ch.direction == Direction::kMajority;
  return oriented && ClassWeight(ch) >= 1 && !ch.one_unit && !ch.tie_break;
}

// C's errors in usable characters (indices). Errors in neighbouring rows
// carried by the same witnesses count once (one slip of the eye can spoil
// two rows).
std::vector<std::size_t> ErrorsOf(const CharacterMatrix& m, int c) {
  std::vector<std::size_t> out;
  for (std::size_t k = 0; k < m.characters.size(); ++k) {
    const Character& ch = m.characters[k];
    if (!Evidence(ch) || ch.states[c] != 1) continue;
    if (!out.empty()) {
      const Character& last = m.characters[out.back()];
      if (ch.position - last.position <= 1 && ch.states == last.states) continue;
    }
    out.push_back(k);
  }
  return out;
}

// Witnesses holding every one of C's errors where they can be read (two or
// more): its descendants.
std::vector<bool> Descendants(const CharacterMatrix& m, int c, const std::vector<std::size_t>& e) {
  std::vector<bool> out(m.taxa.size(), false);
  for (std::size_t x = 0; x < m.taxa.size(); ++x) {
    int held = 0;
    bool all = static_cast<int>(x) != c;
    for (std::size_t k : e) {
      all = all && m.characters[k].states[x] != 0;
      held += m.characters[k].states[x] == 1 ? 1 : 0;
    }
    out[x] = all && held >= 2;
  }
  return out;
}

struct Side {
  double weight = 0;
  int count = 0;
};

// One of C's errors that sides with x (0) or y (1) against the other.
struct Sided {
  std::size_t character = 0;
  int side = 0;
  double weight = 0;
  int stretch = 0;  // the side of the stretch it lies in (Stretches)
};

struct PairEvidence {
  int x = -1, y = -1;
  std::vector<Sided> errors;  // in table order
  Side with_x, with_y;        // inside stretches of their own side
  Side misfits;               // errors inside a stretch of the other side
  Side raw_x, raw_y;          // every error siding with x, with y, wherever it lies
  bool local_copy = false;    // a relative copied C where C seems to follow it (LocalCopy)
  // Changes of side between neighbouring errors in the labelling.
  int Changes() const {
    int changes = 0;
    for (std::size_t i = 1; i < errors.size(); ++i)
      changes += errors[i].stretch != errors[i - 1].stretch ? 1 : 0;
    return changes;
  }
  // One change of exemplar and no error against it (relations.hpp,
  // kCleanSwitchSlips): the weaker side may show one slip fewer.
  bool CleanSwitch() const {
    return Changes() == 1 && misfits.count == 0 && !local_copy &&
           std::max(with_x.count, with_y.count) >= kMinSideSlips + 1;
  }
  int SlipsNeeded() const { return CleanSwitch() ? kCleanSwitchSlips : kMinSideSlips; }
  bool Separated() const {
    return misfits.count <= std::min(with_x.count, with_y.count) / kMisfitsPerStretchError;
  }
  // Weight of the weaker side, when the criterion holds (relations.hpp).
  double Score() const {
    const int need = SlipsNeeded();
    if (with_x.count < need || with_y.count < need || !Separated()) return 0;
    return std::min(with_x.weight, with_y.weight);
  }
  // Why a pair falls short of the criterion, for the editor ("" when the
  // two sets are mixed along the table, which the text says).
  std::string Shortfall(double min_evidence) const {
    if (!Separated()) return "";
    std::ostringstream out;
    if (std::min(with_x.count, with_y.count) < SlipsNeeded()) {
      out << std::min(with_x.count, with_y.count) << " slips on the weaker side, " << SlipsNeeded()
          << " needed";
    } else {
      out << "weight " << std::min(with_x.weight, with_y.weight) << " on the weaker side, "
          << min_evidence << " needed";
    }
    return out.str();
  }
  // Two lines without the stretches: worth telling the editor as a
  // question (kSuspectedContaminationEvidence), never called.
  double Loose() const {
    return raw_x.count >= 2 && raw_y.count >= 2 ? std::min(raw_x.weight, raw_y.weight) : 0;
  }
};

// The labelling of the sided errors by at most kMaxStretchChanges + 1
// stretches that leaves the least weight inside a stretch of the other
// side (dynamic programming over the errors in table order).
void Stretches(PairEvidence& p) {
  const std::size_t n = p.errors.size();
  if (n == 0) return;
  constexpr int kStates = 2 * (kMaxStretchChanges + 1);  // (changes so far, side)
  constexpr double kNone = 1e300;
  std::vector<std::array<double, kStates>> cost(n);
  std::vector<std::array<int, kStates>> from(n);
  for (std::size_t i = 0; i < n; ++i) {
    for (int st = 0; st < kStates; ++st) {
      const int changes = st / 2, side = st % 2;
      const double own = p.errors[i].side == side ? 0 : p.errors[i].weight;
      double best = i == 0 && changes == 0 ? 0 : kNone;
      int arg = -1;
      if (i > 0) {
        best = cost[i - 1][st], arg = st;  // the stretch goes on
        if (changes > 0) {
          const int prev = 2 * (changes - 1) + (1 - side);  // a new stretch begins here
          if (cost[i - 1][prev] < best) best = cost[i - 1][prev], arg = prev;
        }
      }
      cost[i][st] = best >= kNone ? kNone : best + own;
      from[i][st] = arg;
    }
  }
  int st = 0;
  for (int k = 1; k < kStates; ++k) st = cost[n - 1][k] < cost[n - 1][st] ? k : st;
  for (std::size_t i = n; i-- > 0;) {
    p.errors[i].stretch = st % 2;
    st = from[i][st];
  }
  for (const auto& e : p.errors) {
    Side& s = e.side != e.stretch ? p.misfits : (e.side == 0 ? p.with_x : p.with_y);
    s.weight += e.weight, ++s.count;
    Side& raw = e.side == 0 ? p.raw_x : p.raw_y;
    raw.weight += e.weight, ++raw.count;
  }
}

// Whether, in the part of the table from `from` to `to` (positions), r
// holds every one of c's errors it can be read at (two or more) while c
// lacks some of r's: r was copied from c there (c's exemplar, or a witness
// that turned to c), which also makes c share r's errors there. Returns
// the number of r's errors there that c lacks (0: not copied so).
int CopiedFrom(const CharacterMatrix& m, int c, int r, int from, int to) {
  int c_errors = 0, lacked = 0;
  bool r_holds = true;
  for (const Character& ch : m.characters) {
    if (ch.position < from || ch.position > to || !Evidence(ch)) continue;
    const signed char sc = ch.states[c], sr = ch.states[r];
    if (sc == 1 && sr >= 0) ++c_errors, r_holds = r_holds && sr == 1;
    if (sr == 1 && sc == 0) ++lacked;
  }
  return c_errors >= 2 && r_holds ? lacked : 0;
}

// The first stretch of `out` following its second relative where that
// relative holds every one of c's errors (two or more) while c lacks some
// of its (CopiedFrom): the relative copied c in that part, and c is its
// source, not its copy (relations.hpp, FindContamination).
// `relative` is -1 when there is none; `lacked` counts the relative's
// errors there that c reads right.
struct Source {
  int relative = -1, lacked = 0;
  std::string first_row, last_row;
};
Source CopiedInStretch(const CharacterMatrix& m, int c, const Contamination& out) {
  Source s;
  for (const auto& seg : out.segments) {
    const int r = m.TaxonIndex(seg.relative);
    if (r < 0 || seg.relative != out.secondary) continue;
    s.lacked = CopiedFrom(m, c, r, seg.first_position, seg.last_position);
    if (s.lacked == 0) continue;
    s.relative = r, s.first_row = seg.first_row, s.last_row = seg.last_row;
    return s;
  }
  return Source{};
}

// A clean switch (one change) whose relative on either side was copied
// from c in its part of the table: the errors c "shares" there are c's
// own, handed down, not a second exemplar's (relations.hpp,
// kCleanSwitchSlips). The rows between the two stretches belong to
// neither.
bool LocalCopy(const CharacterMatrix& m, int c, const PairEvidence& p) {
  std::size_t cut = 1;
  while (cut < p.errors.size() && p.errors[cut].stretch == p.errors[cut - 1].stretch) ++cut;
  if (cut >= p.errors.size()) return false;
  const int last_first = m.characters[p.errors[cut - 1].character].position;
  const int first_second = m.characters[p.errors[cut].character].position;
  const int before = p.errors.front().stretch == 0 ? p.x : p.y;
  const int after = before == p.x ? p.y : p.x;
  return CopiedFrom(m, c, before, std::numeric_limits<int>::min(), last_first) > 0 ||
         CopiedFrom(m, c, after, first_second, std::numeric_limits<int>::max()) > 0;
}

PairEvidence Sides(const CharacterMatrix& m, int c, int x, int y,
                   const std::vector<std::size_t>& e) {
  PairEvidence p;
  p.x = x, p.y = y;
  for (std::size_t k : e) {
    const auto& s = m.characters[k].states;
    const int side = s[x] == 1 && s[y] == 0 ? 0 : (s[y] == 1 && s[x] == 0 ? 1 : -1);
    if (side < 0) continue;
    const double w = ClassWeight(m.characters[k]);
    const int at = m.characters[k].position;
    if (!p.errors.empty() && p.errors.back().side == side &&
        at - m.characters[p.errors.back().character].position <= kSameSlipRows) {
      p.errors.back().weight = std::max(p.errors.back().weight, w);  // one slip over a run
      continue;
    }
    p.errors.push_back({k, side, w, 0});
  }
  Stretches(p);
  // LocalCopy reads every character: only where the clean switch can
  // matter (the weaker side short of kMinSideSlips, the stronger side long
  // enough); elsewhere CleanSwitch changes nothing.
  const int weaker = std::min(p.with_x.count, p.with_y.count);
  const int stronger = std::max(p.with_x.count, p.with_y.count);
  if (p.Changes() == 1 && p.misfits.count == 0 && weaker < kMinSideSlips &&
      stronger >= kMinSideSlips + 1)
    p.local_copy = LocalCopy(m, c, p);
  return p;
}

PairEvidence BestPair(const CharacterMatrix& m, int c, const std::vector<std::size_t>& e,
                      bool loose = false) {
  const auto below = Descendants(m, c, e);
  const int n = static_cast<int>(m.taxa.size());
  PairEvidence best;
  for (int x = 0; x < n; ++x) {
    if (x == c || below[x]) continue;
    for (int y = x + 1; y < n; ++y) {
      if (y == c || below[y]) continue;
      PairEvidence p = Sides(m, c, x, y, e);
      const bool better = loose ? p.Loose() > best.Loose() : p.Score() > best.Score();
      if (better) best = std::move(p);
    }
  }
  return best;
}

void Describe(const CharacterMatrix& m, int c, const PairEvidence& p, Contamination& out) {
  // The exemplar is the relative the witness follows where the text
  // begins (the first error in table order): a copyist begins with one
  // exemplar and turns to another. Measured on the lineage benchmark
  // (seeds 1-100, cached characters), against the relative followed for
  // more weight: groups recovered 0.789 -> 0.840, RF 0.376 -> 0.347.
  const bool x_first =
      p.errors.empty() ? p.with_x.weight >= p.with_y.weight : p.errors.front().stretch == 0;
  out.witness = m.taxa[c];
  out.primary = m.taxa[x_first ? p.x : p.y];
  out.secondary = m.taxa[x_first ? p.y : p.x];
  out.primary_evidence = x_first ? p.with_x.weight : p.with_y.weight;
  out.secondary_evidence = x_first ? p.with_y.weight : p.with_x.weight;
  for (const auto& e : p.errors) {  // in table order
    const Character& ch = m.characters[e.character];
    const std::string& relative = m.taxa[e.stretch == 0 ? p.x : p.y];
    if (out.segments.empty() || out.segments.back().relative != relative) {
      ContaminationSegment seg;
      seg.relative = relative;
      seg.first_row = ch.row_label;
      seg.first_position = ch.position;
      out.segments.push_back(seg);
    }
    auto& seg = out.segments.back();
    seg.last_row = ch.row_label;
    seg.last_position = ch.position;
    const int fits = e.side == e.stretch ? 1 : 0;
    seg.shared += fits;
    seg.against += fits;
  }
  std::ostringstream text;
  text << out.witness << " follows ";
  for (std::size_t i = 0; i < out.segments.size(); ++i) {
    const auto& seg = out.segments[i];
    text << (i == 0 ? "" : (i + 1 == out.segments.size() ? " and " : ", ")) << seg.relative
         << " in rows " << seg.first_row
         << (seg.first_row == seg.last_row ? "" : " to " + seg.last_row);
  }
  text << " (" << out.witness << " shares " << p.raw_x.count << " errors with " << m.taxa[p.x]
       << " that " << m.taxa[p.y] << " lacks, and " << p.raw_y.count << " with " << m.taxa[p.y]
       << " that " << m.taxa[p.x] << " lacks";
  if (!p.Separated())
    text << ", the two sets mixed along the table";
  else
    text << ", each set in stretches of its own";
  if (p.Score() > 0 && p.misfits.count > 0)
    text << " but " << p.misfits.count << " (chance agreements, as a rule)";
  text << "; copied along one line it could share only one of these sets); rows between the "
       << "stretches cannot be assigned";
  out.text = text.str();
}

// Whether d's evidence errors are also c's (c descends from d).
// A copy may lack a few (FindCopies): at most one in kErrorsPerLackedError.
bool Holds(const CharacterMatrix& m, int c, int d) {
  int held = 0, lacking = 0;
  for (std::size_t k : ErrorsOf(m, d)) {
    held += m.characters[k].states[c] == 1 ? 1 : 0;
    lacking += m.characters[k].states[c] == 0 ? 1 : 0;
  }
  return held >= 2 && lacking * kErrorsPerLackedError <= held;
}

// d's evidence errors that c reads right (where c can be read).
int Lacked(const CharacterMatrix& m, int c, int d) {
  int lacking = 0;
  for (std::size_t k : ErrorsOf(m, d)) lacking += m.characters[k].states[c] == 0 ? 1 : 0;
  return lacking;
}

}  // namespace contamination

using namespace contamination;

std::vector<Contamination> FindContamination(const CharacterMatrix& m, double min_evidence,
                                             std::vector<Contamination>* suspected) {
  std::vector<Contamination> found;
  std::vector<int> who;
  std::vector<PairEvidence> pairs;
  if (m.taxa.size() < 3) return found;
  for (int c = 0; c < static_cast<int>(m.taxa.size()); ++c) {
    const auto e = ErrorsOf(m, c);
    const PairEvidence p = BestPair(m, c, e);
    if (p.Score() < min_evidence) {
      const PairEvidence q = suspected ? BestPair(m, c, e, true) : PairEvidence{};
      if (suspected && q.Loose() >= std::min(min_evidence, kSuspectedContaminationEvidence)) {
        Contamination weak;
        Describe(m, c, q, weak);
        weak.secondary_evidence = std::min(q.raw_x.weight, q.raw_y.weight);
        weak.shortfall = q.Shortfall(min_evidence);
        suspected->push_back(std::move(weak));
      }
      continue;
    }
    Contamination out;
    Describe(m, c, p, out);
    // The second relative holding every one of C's errors in its stretch,
    // and more, copied C there: C is its source, not its copy.
    const Source src = CopiedInStretch(m, c, out);
    if (src.relative >= 0) {
      if (suspected) {
        const std::string& r = m.taxa[static_cast<std::size_t>(src.relative)];
        out.text += "; but in rows " + src.first_row + " to " + src.last_row + " " + r +
                    " holds every error of " + out.witness + "'s there and " +
                    std::to_string(src.lacked) + " more of its own: " + r + " more likely copied " +
                    out.witness + " there, and " + out.witness + " is not called contaminated";
        out.direction_refused = true;
        suspected->push_back(std::move(out));
      }
      continue;
    }
    found.push_back(std::move(out));
    who.push_back(c);
    pairs.push_back(p);
  }
  // A witness that names a contaminated one as a relative, with a weaker
  // mixture, is explained by it: it is one of its exemplars (it shares its
  // own errors with its copy), or of the line the copyist changed to (its
  // errors side with the copy in the stretch taken from that line).
  // Strongest mixtures first.
  std::vector<std::size_t> order(found.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  // Of two witnesses that name each other, one that cannot descend from the
  // other (wholly older by its dates, or a manuscript beside a modern
  // edition) cannot have turned to the other's readings: the later one
  // changed exemplar (a copyist turns to a book that exists), so the older
  // one's mixture goes after it, whatever their weights.
  // Whether found[i] names found[j] as one of its two relatives.
  const auto names = [&](std::size_t i, std::size_t j) {
    return pairs[i].x == who[j] || pairs[i].y == who[j];
  };
  std::vector<bool> older_of_pair(found.size(), false);
  for (std::size_t i = 0; i < found.size(); ++i) {
    for (std::size_t j = 0; j < found.size(); ++j) {
      if (i != j && names(i, j) && names(j, i) && CannotDescend(m, who[i], who[j]))
        older_of_pair[i] = true;
    }
  }
  std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
    if (older_of_pair[a] != older_of_pair[b]) return static_cast<bool>(older_of_pair[b]);
    return pairs[a].Score() > pairs[b].Score();
  });
  std::vector<bool> drop(found.size(), false);
  for (std::size_t k = 0; k < order.size(); ++k) {
    const std::size_t i = order[k];
    for (std::size_t l = 0; l < k; ++l) {
      const std::size_t j = order[l];
      if (!drop[j] && names(i, j)) drop[i] = true;
    }
  }
  for (std::size_t i = found.size(); i-- > 0;) {
    if (!drop[i]) continue;
    found.erase(found.begin() + static_cast<long>(i));
    who.erase(who.begin() + static_cast<long>(i));
    pairs.erase(pairs.begin() + static_cast<long>(i));
  }
  std::vector<Contamination> kept;
  for (std::size_t i = 0; i < found.size(); ++i) {
    int from = -1;
    for (std::size_t j = 0; j < found.size(); ++j) {
      if (i != j && Holds(m, who[i], who[j])) from = static_cast<int>(j);
    }
    // Each may hold the other's errors but for a few (a copy may lack one
    // in kErrorsPerLackedError): the copy is the one lacking fewer.
    if (from >= 0 && (!Holds(m, who[from], who[i]) ||
                      Lacked(m, who[i], who[from]) < Lacked(m, who[from], who[i]))) {
      found[from].inherited_by.push_back(found[i].witness);
      continue;
    }
    kept.push_back(found[i]);
  }
  for (auto& k : kept) {  // inherited_by was filled on `found`
    for (const auto& f : found) {
      if (f.witness == k.witness) k.inherited_by = f.inherited_by;
    }
  }
  AddOneLine(m, found, kept);
  std::vector<std::string> named;
  for (const auto& f : found) {
    named.push_back(f.witness);
    named.insert(named.end(), f.inherited_by.begin(), f.inherited_by.end());
  }
  for (const auto& k : kept) named.push_back(k.witness);
  AddLineJoin(m, named, kept);
  return kept;
}

namespace {

// The witness and those it handed its mixture down to (they follow the same
// exemplars in the same stretches).
std::vector<std::string> Witnesses(const Contamination& c) {
  std::vector<std::string> out{c.witness};
  out.insert(out.end(), c.inherited_by.begin(), c.inherited_by.end());
  return out;
}

// Whether x holds t's errors where t follows c's first relative (the
// stretches not the secondary's), as Holds asks of all of them.
bool HoldsFirst(const CharacterMatrix& m, const Contamination& c, int x, int t) {
  int held = 0, lacking = 0;
  for (std::size_t k : ErrorsOf(m, t)) {
    const Character& ch = m.characters[k];
    if (NearestSegment(c, ch.position)->relative == c.secondary) continue;
    held += ch.states[static_cast<std::size_t>(x)] == 1 ? 1 : 0;
    lacking += ch.states[static_cast<std::size_t>(x)] == 0 ? 1 : 0;
  }
  return lacking * kErrorsPerLackedError <= held;
}

}  // namespace

const ContaminationSegment* NearestSegment(const Contamination& c, int position) {
  const ContaminationSegment* nearest = nullptr;
  int gap = 0;
  for (const auto& seg : c.segments) {
    const int d = position < seg.first_position  ? seg.first_position - position
                  : position > seg.last_position ? position - seg.last_position
                                                 : 0;
    if (!nearest || d < gap) nearest = &seg, gap = d;
  }
  return nearest;
}

CharacterMatrix MaskSecondaryExemplar(const CharacterMatrix& m,
                                      const std::vector<Contamination>& cs) {
  CharacterMatrix out = m;
  for (const auto& c : cs) {
    for (const auto& w : Witnesses(c)) {
      const int t = m.TaxonIndex(w);
      if (t < 0 || c.segments.empty()) continue;
      // The witness and those that hold its errors (its copies): a reading
      // only they carry did not come from the second exemplar. A copy
      // holds them where the witness follows its first exemplar too: the
      // second exemplar's line holds them only where the witness follows
      // it, and when that part is the larger, lacking the others reads as
      // a copyist's mending (seed 20 of the benchmark).
      std::vector<bool> family(m.taxa.size(), false);
      for (int x = 0; x < static_cast<int>(m.taxa.size()); ++x)
        family[static_cast<std::size_t>(x)] = x == t || (Holds(m, x, t) && HoldsFirst(m, c, x, t));
      for (std::size_t k = 0; k < out.characters.size(); ++k) {
        auto& ch = out.characters[k];
        bool own = false;
        for (std::size_t x = 0; x < m.taxa.size(); ++x) {
          if (m.characters[k].states[x] != 1) continue;
          own = family[x];
          if (!own) break;
        }
        if (own) continue;
        if (NearestSegment(c, ch.position)->relative == c.secondary) ch.states[t] = -1;
      }
    }
  }
  return out;
}

}  // namespace apograph::lineage
