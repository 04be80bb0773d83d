#include "lineage/relations.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <optional>
#include <sstream>

namespace apograph::lineage {

namespace {

bool Usable(const Character& ch) { return ch.Directed() && ch.weight > 0 && !ch.tie_break; }

// Whether b cannot be a copy of a because of the dates or the kinds.
bool Anachronism(const CharacterMatrix& m, int a, int b) {
  if (m.witnesses.size() != m.taxa.size()) return false;
  const WitnessInfo &wa = m.witnesses[a], &wb = m.witnesses[b];
  const auto da = wa.Dates(), db = wb.Dates();
  if (da && db && db->WhollyBefore(*da)) return true;
  return wa.Kind() == WitnessKind::kModernEdition && wb.Kind() != WitnessKind::kModernEdition;
}

// Whether a's dates lie wholly before b's.
bool Older(const CharacterMatrix& m, int a, int b) {
  if (m.witnesses.size() != m.taxa.size()) return false;
  const auto da = m.witnesses[a].Dates(), db = m.witnesses[b].Dates();
  return da && db && da->WhollyBefore(*db);
}

std::string DateOf(const CharacterMatrix& m, int t) {
  return m.witnesses.size() == m.taxa.size() ? m.witnesses[t].date : "";
}

// `strong`: the exemplar's errors found in the copy that are more than a
// unit off (one-unit differences arise independently too often to show a copy).
CopyCandidate Compare(const CharacterMatrix& m, int a, int b, bool corrector, bool& contained,
                      int& strong) {
  int weak = 0;
  CopyCandidate c;
  c.exemplar = m.taxa[a];
  c.copy = m.taxa[b];
  contained = true;
  for (const auto& ch : m.characters) {
    if (!Usable(ch)) continue;
    const int sa = ch.states[a], sb = ch.states[b];
    if (sa == 1) {
      if (sb == 1)
        ++c.exemplar_errors;
      else if (sb == -1)
        ++c.unreadable;
      else if (ch.omission)
        ++c.filled;
      else if (corrector && ch.base_is_right)
        ++c.corrected;
      else
        contained = false;
    } else if (sa == 0 && sb == 1) {
      ++c.own_errors;
    }
    if (sa == 1 && sb == 1 && ch.one_unit) ++weak;
  }
  strong = c.exemplar_errors - weak;
  return c;
}

std::string CopyText(const CharacterMatrix& m, const CopyCandidate& c) {
  std::ostringstream o;
  if (c.twins) {
    o << c.copy << " and " << c.exemplar << " carry the same " << c.exemplar_errors
      << " errors: one may be a copy of the other, or both of a lost exemplar";
  } else if (c.dated) {
    o << c.copy << " may be a copy of " << c.exemplar << ": they carry the same "
      << c.exemplar_errors << " errors and " << c.exemplar << " is the older";
  } else {
    o << c.copy << " may be a copy of " << c.exemplar << ": " << c.copy << " has all "
      << c.exemplar_errors << " of " << c.exemplar << "'s errors and " << c.own_errors
      << " of its own";
  }
  if (c.corrected) {
    o << "; " << c.copy << " reads the recomputed value at " << c.corrected << " of them (it "
      << "corrects against the model)";
  }
  if (c.filled) {
    o << "; " << c.copy << " fills in " << c.filled << (c.filled == 1 ? " entry " : " entries ")
      << c.exemplar << " leaves blank";
  }
  if (c.unreadable) {
    o << " (at " << c.unreadable << " more of " << c.exemplar << "'s errors " << c.copy
      << " cannot be compared: illegible there, or with an error of its own)";
  }
  const std::string da = DateOf(m, m.TaxonIndex(c.exemplar)), db = DateOf(m, m.TaxonIndex(c.copy));
  if (!da.empty() && !db.empty())
    o << " [dates: " << c.exemplar << " " << da << ", " << c.copy << " " << db << "]";
  return o.str();
}

}  // namespace

std::vector<CopyCandidate> FindCopies(const CharacterMatrix& m,
                                      const std::vector<std::string>& correctors, int min_errors) {
  std::vector<CopyCandidate> out;
  const int n = static_cast<int>(m.taxa.size());
  for (int b = 0; b < n; ++b) {
    const bool corrector =
        std::find(correctors.begin(), correctors.end(), m.taxa[b]) != correctors.end();
    std::optional<CopyCandidate> best;
    for (int a = 0; a < n; ++a) {
      if (a == b || Anachronism(m, a, b)) continue;
      bool contained = false;
      int strong = 0;
      CopyCandidate c = Compare(m, a, b, corrector, contained, strong);
      if (!contained || strong < min_errors) continue;
      if (c.own_errors == 0) {
        bool back = false;  // does a hold all of b's errors too?
        int ignored = 0;
        Compare(m, b, a, false, back, ignored);
        if (back && Older(m, a, b)) {
          c.dated = true;
        } else if (back && !Older(m, b, a)) {
          c.twins = true;
        }
      }
      if (!best || c.exemplar_errors > best->exemplar_errors) best = c;
    }
    // Twins are reported once, from the side of the first; a witness
    // whose closest relative is its twin is no candidate copy of another.
    if (best && best->twins && m.TaxonIndex(best->exemplar) < b) continue;
    if (best) {
      best->text = CopyText(m, *best);
      out.push_back(*best);
    }
  }
  std::stable_sort(out.begin(), out.end(), [](const CopyCandidate& x, const CopyCandidate& y) {
    return x.exemplar_errors > y.exemplar_errors;
  });
  return out;
}

std::vector<std::string> CopiesRefusedByDates(const CharacterMatrix& m, int min_errors) {
  std::vector<std::string> out;
  const int n = static_cast<int>(m.taxa.size());
  for (int b = 0; b < n; ++b) {
    for (int a = 0; a < n; ++a) {
      if (a == b || !Anachronism(m, a, b)) continue;
      bool contained = false;
      int strong = 0;
      const CopyCandidate c = Compare(m, a, b, false, contained, strong);
      if (!contained || strong < min_errors || c.own_errors == 0) continue;
      out.push_back(m.taxa[b] + " holds all " + std::to_string(c.exemplar_errors) + " of " +
                    m.taxa[a] + "'s errors, but cannot be its copy: " + m.taxa[b] + " (" +
                    m.witnesses[b].date + ", " + m.witnesses[b].kind + ") is older than " +
                    m.taxa[a] + " (" + m.witnesses[a].date + ", " + m.witnesses[a].kind +
                    "); both may descend from a lost exemplar");
    }
  }
  return out;
}

namespace {

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

// Errors siding with the same relative within this many rows of each
// other count as one slip (a run of a column shifted by a unit, an eye
// skipping down a few rows): judgement from the generator's runs of slips,
// checked on the uncontaminated draws of the lineage benchmark (seeds 1-40:
// four false alarms of the kind before, see DEVELOPERS.md).
constexpr int kSameSlipRows = 3;
// Slips (as counted above) on each side. Measured on the lineage benchmark
// (seeds 1-40 with and without contamination): two gave false alarms on 3
// of 40 uncontaminated draws and 6 of 10 flagged witnesses right; three
// give 1 of 40 and 5 of 6.
constexpr int kMinSideSlips = 3;

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
  // Weight of the weaker side, when the criterion holds (relations.hpp).
  double Score() const {
    if (with_x.count < kMinSideSlips || with_y.count < kMinSideSlips) return 0;
    const int minority = std::min(with_x.count, with_y.count);
    if (misfits.count > minority / kMisfitsPerStretchError) return 0;
    return std::min(with_x.weight, with_y.weight);
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

PairEvidence Sides(const CharacterMatrix& m, int x, int y, const std::vector<std::size_t>& e) {
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
      PairEvidence p = Sides(m, x, y, e);
      const bool better = loose ? p.Loose() > best.Loose() : p.Score() > best.Score();
      if (better) best = std::move(p);
    }
  }
  return best;
}

void Describe(const CharacterMatrix& m, int c, const PairEvidence& p, Contamination& out) {
  const bool x_first = p.with_x.weight >= p.with_y.weight;
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
  if (p.Score() <= 0)
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

// The one-line criterion (relations.hpp): C shares errors with X in one
// stretch only, and where it does not, C has no relative at all while X's
// line goes on (or, where they share, C holds X's errors more fully than X
// holds C's: C is below X there).
struct OneLine {
  int c = -1, x = -1;
  double chance = 1;  // (shared + 1) (1 - gap / union)^shared
  int shared = 0, gap = 0, all = 0;
  int first = 0, last = 0;  // positions of the stretch without shared errors
};

bool Holder(const CharacterMatrix& m, std::size_t k, int t, const std::vector<bool>& skip) {
  for (std::size_t w = 0; w < m.taxa.size(); ++w) {
    if (static_cast<int>(w) != t && !skip[w] && m.characters[k].states[w] == 1) return true;
  }
  return false;
}

// The errors of c and x (both legible), neighbours carried alike counted once.
std::vector<std::size_t> UnionErrors(const CharacterMatrix& m, int c, int x) {
  std::vector<std::size_t> out;
  for (std::size_t k = 0; k < m.characters.size(); ++k) {
    const Character& ch = m.characters[k];
    const int a = ch.states[c], b = ch.states[x];
    if (!Evidence(ch) || a < 0 || b < 0 || (a == 0 && b == 0)) continue;
    if (!out.empty()) {
      const Character& last = m.characters[out.back()];
      if (ch.position - last.position <= kSameSlipRows && ch.states[c] == last.states[c] &&
          ch.states[x] == last.states[x])
        continue;
    }
    out.push_back(k);
  }
  return out;
}

OneLine Gap(const CharacterMatrix& m, int c, int x) {
  OneLine o;
  o.c = c, o.x = x;
  const auto u = UnionErrors(m, c, x);
  o.all = static_cast<int>(u.size());
  int run = 0, start = 0;
  for (std::size_t i = 0; i <= u.size(); ++i) {
    const bool shared =
        i < u.size() && m.characters[u[i]].states[c] == 1 && m.characters[u[i]].states[x] == 1;
    if (i < u.size() && !shared) {
      if (run++ == 0) start = static_cast<int>(i);
      continue;
    }
    o.shared += shared ? 1 : 0;
    if (run > o.gap) {
      o.gap = run;
      o.first = m.characters[u[static_cast<std::size_t>(start)]].position;
      o.last = m.characters[u[static_cast<std::size_t>(start + run - 1)]].position;
    }
    run = 0;
  }
  if (o.shared >= kOneLineShared && o.all > 0)
    o.chance = (o.shared + 1) * std::pow(1.0 - static_cast<double>(o.gap) / o.all, o.shared);
  return o;
}

// Errors of t inside (or outside) the stretch held by some witness not skipped.
int Related(const CharacterMatrix& m, int t, const OneLine& o, bool inside,
            const std::vector<bool>& skip, int* total = nullptr) {
  int n = 0, all = 0;
  for (std::size_t k : ErrorsOf(m, t)) {
    const int at = m.characters[k].position;
    if ((at >= o.first && at <= o.last) != inside) continue;
    ++all;
    n += Holder(m, k, t, skip) ? 1 : 0;
  }
  if (total) *total = all;
  return n;
}

// Share of a's errors outside the stretch that b holds (where b is legible).
double HeldOutside(const CharacterMatrix& m, int a, int b, const OneLine& o) {
  int held = 0, legible = 0;
  for (std::size_t k : ErrorsOf(m, a)) {
    const int at = m.characters[k].position, s = m.characters[k].states[b];
    if ((at >= o.first && at <= o.last) || s < 0) continue;
    ++legible;
    held += s == 1 ? 1 : 0;
  }
  return legible ? static_cast<double>(held) / legible : 0;
}

// Whether c errs inside the stretch at most kOneLineRateRatio times as
// often (per row) as outside it: a copy of a lost line errs more there,
// but a witness with hundreds of errors in one table differs by something
// systematic (a script misread, a column recomputed), not by its exemplar.
bool SteadyRate(const CharacterMatrix& m, int c, const OneLine& o, int inside) {
  int lo = o.first, hi = o.last, outside = 0;
  for (std::size_t k : ErrorsOf(m, c)) {
    const int at = m.characters[k].position;
    lo = std::min(lo, at), hi = std::max(hi, at);
    outside += at < o.first || at > o.last ? 1 : 0;
  }
  const double rows_in = o.last - o.first + 1,
               rows_out = std::max(1, hi - lo + 1 - (o.last - o.first + 1));
  return inside / rows_in <= kOneLineRateRatio * std::max(outside, 1) / rows_out;
}

std::optional<OneLine> OneLineOf(const CharacterMatrix& m, int c) {
  const auto below_c = Descendants(m, c, ErrorsOf(m, c));
  std::optional<OneLine> best;
  for (int x = 0; x < static_cast<int>(m.taxa.size()); ++x) {
    if (x == c || below_c[x]) continue;
    const auto below_x = Descendants(m, x, ErrorsOf(m, x));
    if (below_x[c]) continue;
    const OneLine o = Gap(m, c, x);
    if (o.chance > kOneLineChance || (best && best->chance <= o.chance)) continue;
    std::vector<bool> skip(m.taxa.size());
    for (std::size_t w = 0; w < skip.size(); ++w) skip[w] = below_c[w] || below_x[w];
    skip[c] = skip[x] = true;
    int c_inside = 0;
    const int c_related = Related(m, c, o, true, skip, &c_inside);
    if (c_inside < kMinSideSlips || c_related * kMisfitsPerStretchError > c_inside) continue;
    if (!SteadyRate(m, c, o, c_inside)) continue;
    const bool x_goes_on = Related(m, x, o, true, skip) >= kMinSideSlips - 1;
    if (!x_goes_on && HeldOutside(m, x, c, o) <= HeldOutside(m, c, x, o)) continue;
    best = o;
  }
  return best;
}

Contamination DescribeOneLine(const CharacterMatrix& m, const OneLine& o) {
  Contamination out;
  out.witness = m.taxa[o.c];
  const std::string lost = "";  // a line with no surviving witness
  ContaminationSegment in, before, after;
  in.relative = lost, in.first_position = o.first, in.last_position = o.last;
  int min_at = o.first, max_at = o.last;
  for (const auto& ch : m.characters) {
    if (ch.states[o.c] != 1 || !Evidence(ch)) continue;
    min_at = std::min(min_at, ch.position), max_at = std::max(max_at, ch.position);
    const bool inside = ch.position >= o.first && ch.position <= o.last;
    if (inside && in.first_row.empty()) in.first_row = ch.row_label;
    if (inside) in.last_row = ch.row_label;
    ContaminationSegment& s = ch.position < o.first ? before : after;
    if (inside) continue;
    if (s.first_row.empty()) s.first_row = ch.row_label, s.first_position = ch.position;
    s.last_row = ch.row_label, s.last_position = ch.position;
    const bool shared = ch.states[o.x] == 1;
    s.shared += shared ? 1 : 0, s.against += shared ? 1 : 0;
  }
  before.relative = after.relative = m.taxa[o.x];
  for (auto* s : {&before, &in, &after}) {
    if (!s->first_row.empty()) out.segments.push_back(*s);
  }
  const int inside_rows = o.last - o.first, outside_rows = max_at - min_at - inside_rows;
  const bool x_first = outside_rows >= inside_rows;
  out.primary = x_first ? m.taxa[o.x] : lost;
  out.secondary = x_first ? lost : m.taxa[o.x];
  out.primary_evidence = out.secondary_evidence = o.shared;
  std::ostringstream text;
  text << out.witness << " shares " << o.shared << " errors with " << m.taxa[o.x]
       << " but none in rows " << in.first_row << " to " << in.last_row << " (" << o.gap
       << " errors of the two there), where " << out.witness
       << " shares no error with any surviving witness: it follows " << m.taxa[o.x]
       << "'s line in one part and, in the other, a line with no surviving witness (or the "
       << "archetype's own)";
  out.text = text.str();
  return out;
}

// Witnesses the one-line criterion flags, beyond those of two lines: not
// one already found or inheriting a mixture, not one whose relative is
// contaminated (its mixture explains the stretch), and not a witness that
// holds the errors of one flagged here (it inherits the mixture).
void AddOneLine(const CharacterMatrix& m, const std::vector<Contamination>& found,
                std::vector<Contamination>& kept) {
  std::vector<std::string> named;
  for (const auto& f : found) {
    named.push_back(f.witness);
    named.insert(named.end(), f.inherited_by.begin(), f.inherited_by.end());
  }
  auto is_named = [&](const std::string& s) {
    return std::find(named.begin(), named.end(), s) != named.end();
  };
  std::vector<std::pair<OneLine, Contamination>> one;
  for (int c = 0; c < static_cast<int>(m.taxa.size()); ++c) {
    if (is_named(m.taxa[c])) continue;
    const auto o = OneLineOf(m, c);
    if (o && !is_named(m.taxa[o->x])) one.emplace_back(*o, DescribeOneLine(m, *o));
  }
  std::sort(one.begin(), one.end(),
            [](const auto& a, const auto& b) { return a.first.chance < b.first.chance; });
  std::vector<int> flagged;
  for (auto& [o, c] : one) {
    bool inherits = false;
    for (int f : flagged) inherits = inherits || o.x == f || Holds(m, o.c, f);
    if (inherits) continue;
    flagged.push_back(o.c);
    kept.push_back(std::move(c));
  }
}

}  // namespace

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
        suspected->push_back(std::move(weak));
      }
      continue;
    }
    Contamination out;
    Describe(m, c, p, out);
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
  std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
    return pairs[a].Score() > pairs[b].Score();
  });
  std::vector<bool> drop(found.size(), false);
  for (std::size_t k = 0; k < order.size(); ++k) {
    const std::size_t i = order[k];
    for (std::size_t l = 0; l < k; ++l) {
      const std::size_t j = order[l];
      if (!drop[j] && (pairs[i].x == who[j] || pairs[i].y == who[j])) drop[i] = true;
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
    if (from >= 0 && !Holds(m, who[from], who[i])) {
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
  return kept;
}

CharacterMatrix MaskSecondaryExemplar(const CharacterMatrix& m,
                                      const std::vector<Contamination>& cs) {
  CharacterMatrix out = m;
  for (const auto& c : cs) {
    const int t = m.TaxonIndex(c.witness);
    if (t < 0 || c.segments.empty()) continue;
    for (auto& ch : out.characters) {
      const ContaminationSegment* nearest = nullptr;
      int gap = 0;
      for (const auto& seg : c.segments) {
        const int d = ch.position < seg.first_position  ? seg.first_position - ch.position
                      : ch.position > seg.last_position ? ch.position - seg.last_position
                                                        : 0;
        if (!nearest || d < gap) nearest = &seg, gap = d;
      }
      if (nearest->relative == c.secondary) ch.states[t] = -1;
    }
  }
  return out;
}

}  // namespace apograph::lineage
