// The one-line criterion of contamination (relations.hpp): a witness that
// shares errors with one relative in one stretch only, and elsewhere has no
// surviving relative while that relative's line goes on.
#include <algorithm>
#include <cmath>
#include <optional>
#include <sstream>

#include "lineage/contamination_internal.hpp"

namespace apograph::lineage::contamination {
namespace {

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
  for (const auto& ch : m.characters) {
    if (ch.states[o.c] != 1 || !Evidence(ch)) continue;
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
  // The relative followed where the text begins is the exemplar (as for
  // two lines, relations.cpp Describe); X when nothing of C precedes.
  const bool x_first = out.segments.empty() || out.segments.front().relative == m.taxa[o.x];
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

}  // namespace

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

}  // namespace apograph::lineage::contamination
