// The table-switch criterion of contamination (relations.hpp): a witness
// that takes whole tables from a second exemplar, told by the errors of
// its two relatives it holds in some tables and lacks in the others.
#include <algorithm>
#include <cmath>
#include <optional>
#include <sstream>
#include <string>

#include "lineage/contamination_internal.hpp"

namespace apograph::lineage::contamination {
namespace {

// The table of a character: its block up to the first space ("t2 81").
std::string TableOf(const Character& ch) { return ch.block.substr(0, ch.block.find(' ')); }

// Per character, the index of its table in table order (0, 1, ...; the
// characters themselves need not be in table order).
std::vector<int> TableIndex(const CharacterMatrix& m, int* tables) {
  std::vector<std::pair<int, std::string>> first;  // (first position, table)
  for (const Character& ch : m.characters) {
    const std::string t = TableOf(ch);
    auto it =
        std::find_if(first.begin(), first.end(), [&](const auto& f) { return f.second == t; });
    if (it == first.end())
      first.emplace_back(ch.position, t);
    else
      it->first = std::min(it->first, ch.position);
  }
  std::sort(first.begin(), first.end());
  std::vector<int> out(m.characters.size(), 0);
  for (std::size_t k = 0; k < m.characters.size(); ++k) {
    const std::string t = TableOf(m.characters[k]);
    out[k] = static_cast<int>(
        std::find_if(first.begin(), first.end(), [&](const auto& f) { return f.second == t; }) -
        first.begin());
  }
  *tables = static_cast<int>(first.size());
  return out;
}

// The errors of r that o can be read at and lacks (r's line against o's),
// where c can be read, per table: how many, and how many c holds.
// Neighbours (kSameSlipRows) that c reads alike count once.
struct PerTable {
  std::vector<int> errors, held;
};

// Whether a witness besides r carries the reading: r's own errors (its
// copyist's slips) tell nothing of c's ancestry and would dilute the test.
bool Shared(const Character& ch, int r) {
  for (std::size_t t = 0; t < ch.states.size(); ++t)
    if (static_cast<int>(t) != r && ch.states[t] == 1) return true;
  return false;
}

PerTable Distinct(const CharacterMatrix& m, const std::vector<int>& table, int tables, int c, int r,
                  int o, const std::vector<std::size_t>& of_r) {
  PerTable out{std::vector<int>(static_cast<std::size_t>(tables), 0),
               std::vector<int>(static_cast<std::size_t>(tables), 0)};
  int last_position = 0;
  int last_held = -1;
  for (std::size_t k : of_r) {
    const Character& ch = m.characters[k];
    if (ch.states[o] != 0 || ch.states[c] < 0 || !Shared(ch, r)) continue;
    const int held = ch.states[c] == 1 ? 1 : 0;
    if (held == last_held && ch.position - last_position <= kSameSlipRows) continue;
    last_held = held, last_position = ch.position;
    const auto t = static_cast<std::size_t>(table[k]);
    ++out.errors[t];
    out.held[t] += held;
  }
  return out;
}

int Sum(const std::vector<int>& v, int from, int to) {
  int s = 0;
  for (int t = from; t < to; ++t) s += v[static_cast<std::size_t>(t)];
  return s;
}

// Chance that, `held` of `all` errors held at random, all fall among the
// `within` of one part: hypergeometric.
double AllWithin(int all, int within, int held) {
  double p = 1;
  for (int i = 0; i < held; ++i)
    p *= static_cast<double>(within - i) / static_cast<double>(all - i);
  return p;
}

struct Switch {
  int c = -1, x = -1, y = -1;  // c follows x in the tables before `at`, y from `at` on
  int at = 0;
  int held_x = 0, lacked_x = 0, held_y = 0, lacked_y = 0;
  double chance = 1;
};

// Both homogeneity tests at one boundary: x's errors c holds all before
// it (and lacks after), y's all after it (and lacks before); Fisher's
// combination of the two chances.
std::optional<Switch> At(const PerTable& dx, const PerTable& dy, int tables, int at) {
  Switch s;
  s.at = at;
  s.held_x = Sum(dx.held, 0, at);
  s.held_y = Sum(dy.held, at, tables);
  if (Sum(dx.held, at, tables) > 0 || Sum(dy.held, 0, at) > 0) return std::nullopt;
  if (s.held_x < kTableSwitchFirstSlips || s.held_y < kMinSideSlips) return std::nullopt;
  const int nx = Sum(dx.errors, 0, tables), ny = Sum(dy.errors, 0, tables);
  s.lacked_x = Sum(dx.errors, at, tables);
  s.lacked_y = Sum(dy.errors, 0, at);
  const double p =
      AllWithin(nx, nx - s.lacked_x, s.held_x) * AllWithin(ny, ny - s.lacked_y, s.held_y);
  s.chance = p <= 0 ? 0 : p * (1 - std::log(p));
  return s;
}

std::optional<Switch> SwitchOf(const CharacterMatrix& m, const std::vector<int>& table, int tables,
                               int c, const std::vector<bool>& skip) {
  const auto below = Descendants(m, c, ErrorsOf(m, c));
  std::vector<std::vector<std::size_t>> errors(m.taxa.size());
  std::vector<int> near;
  for (int x = 0; x < static_cast<int>(m.taxa.size()); ++x) {
    const auto ux = static_cast<std::size_t>(x);
    if (x == c || below[ux] || skip[ux]) continue;
    errors[ux] = ErrorsOf(m, x);
    const auto shared = std::count_if(errors[ux].begin(), errors[ux].end(), [&](std::size_t k) {
      return m.characters[k].states[c] == 1;
    });
    if (shared >= kTableSwitchFirstSlips) near.push_back(x);
  }
  std::optional<Switch> best;
  for (int x : near) {
    for (int y : near) {
      if (x == y) continue;
      const PerTable dx = Distinct(m, table, tables, c, x, y, errors[static_cast<std::size_t>(x)]);
      const PerTable dy = Distinct(m, table, tables, c, y, x, errors[static_cast<std::size_t>(y)]);
      for (int at = 1; at < tables; ++at) {
        auto s = At(dx, dy, tables, at);
        if (!s || s->chance > kTableSwitchChance || (best && best->chance <= s->chance)) continue;
        s->c = c, s->x = x, s->y = y;
        best = s;
      }
    }
  }
  return best;
}

ContaminationSegment Tables(const CharacterMatrix& m, const std::vector<int>& table, int from,
                            int to, const std::string& relative, int shared) {
  ContaminationSegment s;
  s.relative = relative;
  s.shared = s.against = shared;
  bool first = true;
  for (std::size_t k = 0; k < m.characters.size(); ++k) {
    if (table[k] < from || table[k] >= to) continue;
    const Character& ch = m.characters[k];
    if (first || ch.position < s.first_position)
      s.first_row = ch.row_label, s.first_position = ch.position;
    if (first || ch.position > s.last_position)
      s.last_row = ch.row_label, s.last_position = ch.position;
    first = false;
  }
  return s;
}

Contamination Describe(const CharacterMatrix& m, const std::vector<int>& table, int tables,
                       const Switch& s) {
  Contamination out;
  out.witness = m.taxa[s.c];
  out.primary = m.taxa[s.x];
  out.secondary = m.taxa[s.y];
  out.primary_evidence = s.held_x;
  out.secondary_evidence = s.held_y;
  out.segments = {Tables(m, table, 0, s.at, out.primary, s.held_x),
                  Tables(m, table, s.at, tables, out.secondary, s.held_y)};
  const auto& a = out.segments[0];
  const auto& b = out.segments[1];
  std::ostringstream text;
  text << out.witness << " follows " << out.primary << " in rows " << a.first_row << " to "
       << a.last_row << " and " << out.secondary << " in rows " << b.first_row << " to "
       << b.last_row << " (a change of exemplar between tables: it shares " << s.held_x
       << " errors with " << out.primary << " that " << out.secondary << " lacks, all before, and "
       << "lacks its " << s.lacked_x << " after; it shares " << s.held_y << " with "
       << out.secondary << " that " << out.primary << " lacks, all after, and lacks its "
       << s.lacked_y << " before; chance " << s.chance << " on one line)";
  out.text = text.str();
  return out;
}

// A witness holding the errors of one flagged before it descends from it
// and shows its mixture: told as inheriting it, not flagged again.
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

void AddTableSwitch(const CharacterMatrix& m, const std::vector<std::string>& named,
                    std::vector<Contamination>& kept) {
  int tables = 0;
  const std::vector<int> table = TableIndex(m, &tables);
  if (tables < 2) return;
  std::vector<bool> skip(m.taxa.size(), false);
  for (std::size_t w = 0; w < m.taxa.size(); ++w)
    skip[w] = std::find(named.begin(), named.end(), m.taxa[w]) != named.end();
  std::vector<Switch> switches;
  for (int c = 0; c < static_cast<int>(m.taxa.size()); ++c) {
    if (skip[static_cast<std::size_t>(c)]) continue;
    if (auto s = SwitchOf(m, table, tables, c, skip)) switches.push_back(*s);
  }
  std::sort(switches.begin(), switches.end(),
            [](const Switch& a, const Switch& b) { return a.chance < b.chance; });
  std::vector<int> flagged;
  for (const Switch& s : switches) {
    bool explained = false;  // by one flagged here: a relative, or an exemplar
    for (int f : flagged) explained = explained || f == s.x || f == s.y || Holds(m, s.c, f);
    if (explained || Inherits(m, s.c, kept)) continue;
    flagged.push_back(s.c);
    kept.push_back(Describe(m, table, tables, s));
  }
}

}  // namespace apograph::lineage::contamination
