// The line-join criterion of contamination (relations.hpp): a witness that
// holds the common errors of two relatives in one part of the table only.
#include <algorithm>
#include <optional>
#include <sstream>

#include "lineage/contamination_internal.hpp"

namespace apograph::lineage::contamination {
namespace {

// The common errors of x and z where c can be read, in table order, with
// whether c holds each; neighbours (kSameSlipRows) that c holds alike count
// once (a run of a column shifted, read differently by a few relatives).
struct LineErrors {
  std::vector<std::size_t> characters;
  std::vector<bool> held;
};

// Each witness's evidence errors (indices of characters, in table order).
using ErrorLists = std::vector<std::vector<std::size_t>>;

ErrorLists EvidenceErrors(const CharacterMatrix& m) {
  ErrorLists out(m.taxa.size());
  for (std::size_t k = 0; k < m.characters.size(); ++k) {
    const Character& ch = m.characters[k];
    if (!Evidence(ch)) continue;
    for (std::size_t t = 0; t < m.taxa.size(); ++t)
      if (ch.states[t] == 1) out[t].push_back(k);
  }
  return out;
}

// The errors x and z have in common (both lists in table order), where c
// can be read.
LineErrors Common(const CharacterMatrix& m, int c, const std::vector<std::size_t>& ex,
                  const std::vector<std::size_t>& ez) {
  LineErrors out;
  auto i = ex.begin(), j = ez.begin();
  while (i != ex.end() && j != ez.end()) {
    if (*i < *j) {
      ++i;
      continue;
    }
    if (*j < *i) {
      ++j;
      continue;
    }
    const std::size_t k = *i;
    ++i, ++j;
    const Character& ch = m.characters[k];
    if (ch.states[c] < 0) continue;
    const bool held = ch.states[c] == 1;
    if (!out.characters.empty() && out.held.back() == held &&
        ch.position - m.characters[out.characters.back()].position <= kSameSlipRows)
      continue;
    out.characters.push_back(k);
    out.held.push_back(held);
  }
  return out;
}

struct Join {
  int c = -1, x = -1, z = -1;
  LineErrors line;
  int held = 0, lacked = 0;  // c's share of the line: held anywhere, lacked at one end
  bool lacked_first = true;  // the lacked run opens the table (c joins the line later)
  double chance = 1;
};

// Chance that, the held errors spread at random over the line's errors,
// `lacked` of them at one end (either) are all lacked: hypergeometric.
double EndChance(int all, int lacked, int held) {
  double p = 2;
  for (int i = 0; i < held; ++i)
    p *= static_cast<double>(all - lacked - i) / static_cast<double>(all - i);
  return p;
}

Join Measure(const CharacterMatrix& m, const ErrorLists& errors, int c, int x, int z) {
  Join j;
  j.c = c, j.x = x, j.z = z;
  j.line = Common(m, c, errors[x], errors[z]);
  const auto& h = j.line.held;
  const auto lead = std::find(h.begin(), h.end(), true) - h.begin();
  const auto trail = std::find(h.rbegin(), h.rend(), true) - h.rbegin();
  j.held = static_cast<int>(std::count(h.begin(), h.end(), true));
  j.lacked_first = lead >= trail;
  j.lacked = static_cast<int>(std::max(lead, trail));
  if (j.held >= kMinSideSlips && j.lacked >= kMinSideSlips)
    j.chance = EndChance(static_cast<int>(h.size()), j.lacked, j.held);
  return j;
}

// Only relatives sharing kMinSideSlips of c's errors can make a line c
// holds in part (its held errors are common to all three): the pairs are
// drawn from those, which keeps the search near linear in the witnesses
// when most are unrelated to c.
std::optional<Join> JoinOf(const CharacterMatrix& m, const ErrorLists& errors, int c,
                           const std::vector<bool>& skip) {
  const auto below = Descendants(m, c, ErrorsOf(m, c));
  std::vector<bool> mine(m.characters.size(), false);
  for (std::size_t k : errors[static_cast<std::size_t>(c)]) mine[k] = true;
  std::vector<int> near;
  for (int x = 0; x < static_cast<int>(m.taxa.size()); ++x) {
    const auto ux = static_cast<std::size_t>(x);
    if (x == c || below[ux] || skip[ux]) continue;
    const auto shared =
        std::count_if(errors[ux].begin(), errors[ux].end(), [&](std::size_t k) { return mine[k]; });
    if (shared >= kMinSideSlips) near.push_back(x);
  }
  std::optional<Join> best;
  for (std::size_t a = 0; a < near.size(); ++a) {
    for (std::size_t b = a + 1; b < near.size(); ++b) {
      Join j = Measure(m, errors, c, near[a], near[b]);
      if (j.chance <= kJoinChance && (!best || j.chance < best->chance)) best = std::move(j);
    }
  }
  return best;
}

// The line's errors in the stretch where c follows the line (`held`) or
// reads right throughout (the lacked run at one end), as [from, to).
std::pair<std::size_t, std::size_t> Range(const Join& j, bool held) {
  const auto n = j.line.characters.size(), lacked = static_cast<std::size_t>(j.lacked);
  const std::size_t cut = j.lacked_first ? lacked : n - lacked;
  const bool before = held != j.lacked_first;  // the stretch before the cut
  return before ? std::pair{std::size_t{0}, cut} : std::pair{cut, n};
}

// Labels of the line's errors in a stretch that c holds (or lacks), a few,
// for the text.
std::string Readings(const CharacterMatrix& m, const Join& j, bool held) {
  constexpr int kShown = 4;  // judgement: enough to check by eye, the count says the rest
  const auto [from, to] = Range(j, held);
  std::string out;
  int shown = 0, all = 0;
  for (std::size_t i = from; i < to; ++i) {
    if (j.line.held[i] != held) continue;
    if (shown++ < kShown)
      out += (out.empty() ? "" : "; ") + m.characters[j.line.characters[i]].label;
    ++all;
  }
  return all > kShown ? out + "; ..." : out;
}

ContaminationSegment Stretch(const CharacterMatrix& m, const Join& j, bool held,
                             const std::string& relative) {
  ContaminationSegment s;
  s.relative = relative;
  const auto [from, to] = Range(j, held);
  const Character& a = m.characters[j.line.characters[from]];
  const Character& b = m.characters[j.line.characters[to - 1]];
  s.first_row = a.row_label, s.last_row = b.row_label;
  s.first_position = a.position, s.last_position = b.position;
  for (std::size_t i = from; i < to; ++i) s.shared += j.line.held[i] ? 1 : 0;
  s.against = s.shared;
  return s;
}

Contamination Describe(const CharacterMatrix& m, const Join& j) {
  Contamination out;
  out.witness = m.taxa[j.c];
  const std::string line = m.taxa[j.x] + " and " + m.taxa[j.z];
  const ContaminationSegment follows = Stretch(m, j, true, m.taxa[j.x]);
  const ContaminationSegment other = Stretch(m, j, false, "");  // a line of its own
  out.segments = j.lacked_first ? std::vector{other, follows} : std::vector{follows, other};
  out.primary = out.segments.front().relative;
  out.secondary = out.segments.back().relative;
  out.primary_evidence = out.secondary_evidence = j.held;
  std::ostringstream text;
  text << out.witness << " shares " << j.held << " errors of " << line << " in rows "
       << follows.first_row << " to " << follows.last_row << " (" << Readings(m, j, true)
       << ") but reads right at all " << j.lacked << " of theirs in rows " << other.first_row
       << " to " << other.last_row << " (" << Readings(m, j, false)
       << "): copied along one line it would hold their common errors throughout or nowhere; "
       << "it follows their line in one part only";
  out.text = text.str();
  return out;
}

// A witness holding the errors of one flagged before it descends from it
// and shows its mixture: it is told as inheriting it (relations.hpp), not
// flagged again.
bool Inherits(const CharacterMatrix& m, int c, std::vector<Contamination>& kept) {
  for (auto& k : kept) {
    const int f = m.TaxonIndex(k.witness);
    if (f < 0 || f == c || !Holds(m, c, f)) continue;
    if (std::find(k.inherited_by.begin(), k.inherited_by.end(), m.taxa[c]) == k.inherited_by.end())
      k.inherited_by.push_back(m.taxa[c]);
    return true;
  }
  return false;
}

}  // namespace

void AddLineJoin(const CharacterMatrix& m, const std::vector<std::string>& named,
                 std::vector<Contamination>& kept) {
  std::vector<bool> skip(m.taxa.size(), false);
  for (std::size_t w = 0; w < m.taxa.size(); ++w)
    skip[w] = std::find(named.begin(), named.end(), m.taxa[w]) != named.end();
  const ErrorLists errors = EvidenceErrors(m);
  std::vector<Join> joins;
  for (int c = 0; c < static_cast<int>(m.taxa.size()); ++c) {
    if (skip[static_cast<std::size_t>(c)]) continue;
    if (auto j = JoinOf(m, errors, c, skip)) joins.push_back(std::move(*j));
  }
  std::sort(joins.begin(), joins.end(),
            [](const Join& a, const Join& b) { return a.chance < b.chance; });
  std::vector<int> flagged;
  for (const Join& j : joins) {
    bool explained = false;  // by one flagged here: a relative of the line, or an exemplar
    for (int f : flagged) explained = explained || f == j.x || f == j.z || Holds(m, j.c, f);
    if (explained || Inherits(m, j.c, kept)) continue;
    flagged.push_back(j.c);
    kept.push_back(Describe(m, j));
  }
}

}  // namespace apograph::lineage::contamination
