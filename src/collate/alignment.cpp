#include "collate/alignment.hpp"

#include <algorithm>
#include <limits>
#include <map>
#include <set>

namespace apograph::collate::internal {
namespace {

// Alignment costs. A row whose written argument is the expected one costs
// nothing; a readable but different argument (a miscopied argument) costs
// less than skipping a row in both sequences (1 + 1), so an isolated
// miscopying is kept in place, while a consistent shift (a missing or extra
// row) is cheaper as one skip than as a run of miscopied arguments. The
// values of the row (against the other witnesses) break the remaining ties.
constexpr double kMiscopiedArgument = 0.6;
constexpr double kUnreadableArgument = 0.3;
constexpr double kSkip = 1.0;
constexpr double kValueWeight = 0.5;

std::optional<Sexagesimal> ReadArgument(const Row& row) {
  if (row.argument.state == CellState::kRead) return row.argument.value;
  return std::nullopt;
}

// The most frequent key of a histogram (ties: the smallest key).
template <typename K>
std::optional<K> Mode(const std::map<K, int>& counts) {
  std::optional<K> best;
  int best_n = 0;
  for (const auto& [k, n] : counts) {
    if (n > best_n) best = k, best_n = n;
  }
  return best;
}

using UnitsKey = std::pair<Sexagesimal::Units, int>;  // (units, places) at common places

int CommonPlaces(const std::vector<const Transcription*>& ws) {
  int places = 0;
  for (const auto* w : ws) {
    places = std::max(places, w->argument.places);
    for (const auto& r : w->rows) {
      if (auto a = ReadArgument(r)) places = std::max(places, a->places());
    }
  }
  return places;
}

UnitsKey Key(const Sexagesimal& v, int places) { return {v.Extended(places).units(), places}; }

Sexagesimal FromKey(const UnitsKey& k) { return Sexagesimal::FromUnits(k.first, k.second); }

// Start and step from declarations, else from what the witnesses show;
// none for arguments declared as a list (`step=list`: taken as written).
std::optional<std::pair<Sexagesimal, Sexagesimal>> StartAndStep(
    const std::vector<const Transcription*>& ws, int places) {
  for (const auto* w : ws) {
    if (w->argument.listed) return std::nullopt;
  }
  std::map<std::pair<UnitsKey, UnitsKey>, int> declared;
  for (const auto* w : ws) {
    if (w->argument.start && w->argument.step && !w->argument.step->is_zero()) {
      ++declared[{Key(*w->argument.start, places), Key(*w->argument.step, places)}];
    }
  }
  if (auto d = Mode(declared)) return std::pair{FromKey(d->first), FromKey(d->second)};
  std::map<UnitsKey, int> steps;
  for (const auto* w : ws) {
    for (std::size_t i = 1; i < w->rows.size(); ++i) {
      auto a = ReadArgument(w->rows[i - 1]), b = ReadArgument(w->rows[i]);
      if (a && b && *b > *a) ++steps[Key(*b - *a, places)];
    }
  }
  auto step = Mode(steps);
  if (!step) return std::nullopt;
  const Sexagesimal s = FromKey(*step);
  std::map<UnitsKey, int> starts;
  for (const auto* w : ws) {
    for (std::size_t i = 0; i < w->rows.size(); ++i) {
      if (auto a = ReadArgument(w->rows[i]))
        ++starts[Key(*a - s * static_cast<std::int64_t>(i), places)];
    }
  }
  return std::pair{FromKey(*Mode(starts)), s};
}

}  // namespace

std::vector<Sexagesimal> InferGrid(const std::vector<const Transcription*>& ws) {
  const int places = CommonPlaces(ws);
  const int quorum = ws.size() <= 2 ? 1 : 2;
  std::map<UnitsKey, int> seen;  // distinct arguments, counted once per witness
  std::size_t longest = 0;
  for (const auto* w : ws) {
    std::set<UnitsKey> mine;
    for (const auto& r : w->rows) {
      if (auto a = ReadArgument(r)) mine.insert(Key(*a, places));
    }
    for (const auto& k : mine) ++seen[k];
    longest = std::max(longest, w->rows.size());
  }
  std::vector<Sexagesimal> grid;
  if (auto ss = StartAndStep(ws, places); ss && ss->second > Sexagesimal()) {
    const auto [start, step] = *ss;
    std::int64_t last = static_cast<std::int64_t>(longest) - 1;
    for (const auto& [k, n] : seen) {
      const Sexagesimal off = FromKey(k) - start;
      if (n < quorum || off < Sexagesimal()) continue;
      const auto q = off.Extended(places).units() / step.Extended(places).units();
      const auto rem = off.Extended(places).units() % step.Extended(places).units();
      if (rem == 0 && q < 4 * static_cast<Sexagesimal::Units>(longest) + 8) {
        last = std::max<std::int64_t>(last, static_cast<std::int64_t>(q));
      }
    }
    // Trim grid rows beyond the last argument a quorum read (extra rows).
    std::int64_t quorum_last = -1;
    for (std::int64_t k = 0; k <= last; ++k) {
      auto it = seen.find(Key(start + step * k, places));
      if (it != seen.end() && it->second >= quorum) quorum_last = k;
    }
    if (quorum_last >= 0) last = quorum_last;
    std::size_t unread = 0;
    for (std::int64_t k = 0; k <= last; ++k) {
      grid.push_back(start + step * k);
      unread += !seen.count(Key(grid.back(), places));
    }
    // A step the witnesses seem to show but that leaves a quarter of its
    // rows unread by any of them is not the table's: irregular arguments
    // (1, 2, ... 9, 10, 20, ... days) are taken as written instead of
    // inventing the rows between them (judgement: a real gap of that size
    // in every witness at once would be a lacuna the editor sees anyway).
    const bool declared =
        std::any_of(ws.begin(), ws.end(), [](const Transcription* w) { return w->argument.step; });
    if (declared || unread * 4 <= grid.size()) return grid;
    grid.clear();
  }
  for (const auto& [k, n] : seen) {
    if (n >= quorum) grid.push_back(FromKey(k));
  }
  return grid;
}

RowAlignment AlignRows(const Transcription& w, const std::vector<Sexagesimal>& grid,
                       const ValueCost& value_cost) {
  const int m = static_cast<int>(w.rows.size()), n = static_cast<int>(grid.size());
  const double inf = std::numeric_limits<double>::infinity();
  // cost[i][j]: best cost of aligning the first i witness rows with the first j grid rows.
  std::vector<std::vector<double>> cost(m + 1, std::vector<double>(n + 1, inf));
  std::vector<std::vector<char>> move(m + 1, std::vector<char>(n + 1, 0));
  cost[0][0] = 0;
  auto pair_cost = [&](int i, int j) {
    auto a = ReadArgument(w.rows[i]);
    double c = !a ? kUnreadableArgument : (*a == grid[j] ? 0.0 : kMiscopiedArgument);
    return c + kValueWeight * (value_cost ? value_cost(i, j) : 0.0);
  };
  for (int i = 0; i <= m; ++i) {
    for (int j = 0; j <= n; ++j) {
      if (i > 0 && cost[i - 1][j] + kSkip < cost[i][j])
        cost[i][j] = cost[i - 1][j] + kSkip, move[i][j] = 'x';
      if (j > 0 && cost[i][j - 1] + kSkip < cost[i][j])
        cost[i][j] = cost[i][j - 1] + kSkip, move[i][j] = 'm';
      if (i > 0 && j > 0) {
        const double c = cost[i - 1][j - 1] + pair_cost(i - 1, j - 1);
        if (c <= cost[i][j]) cost[i][j] = c, move[i][j] = 'p';
      }
    }
  }
  RowAlignment out;
  out.grid_to_source.assign(n, -1);
  std::vector<AlignmentNote> notes;
  const std::string& s = w.witness.siglum;
  for (int i = m, j = n; i > 0 || j > 0;) {
    const char mv = move[i][j];
    if (mv == 'p') {
      --i, --j;
      out.grid_to_source[j] = i;
      auto a = ReadArgument(w.rows[i]);
      if (a && !(*a == grid[j])) {
        notes.push_back({s, "miscopied argument", j, i, w.rows[i].line,
                         "argument written " + a->ToString() + " where " + grid[j].ToString() +
                             " is expected (the neighbouring rows fix the place)"});
      }
    } else if (mv == 'x') {
      --i;
      auto a = ReadArgument(w.rows[i]);
      notes.push_back({s, "extra row", -1, i, w.rows[i].line,
                       "extra row (argument written " +
                           (a ? a->ToString() : w.rows[i].argument.raw) +
                           ") has no place among the expected arguments"});
    } else {
      --j;
      notes.push_back({s, "missing row", j, -1, 0,
                       "the row for argument " + grid[j].ToString() + " is missing"});
    }
  }
  std::reverse(notes.begin(), notes.end());
  out.notes = std::move(notes);
  return out;
}

}  // namespace apograph::collate::internal
