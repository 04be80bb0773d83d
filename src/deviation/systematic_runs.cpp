// One slip repeated over consecutive rows of a column, reported once with a
// reading per row: a place left empty, dropped (the rest moved up), moved
// down or written twice; a place held at one value where it should change (a
// leading place carried over); a constant error. A copyist who makes such a
// slip makes it row after row, so each row does not need its own story (and
// a neighbour's wrong place must not vouch for the next as a "repetition").
#include <algorithm>
#include <cmath>

#include "deviation/explain_internal.hpp"

namespace apograph::deviation::internal {
namespace {

// Judgement: two consecutive rows changed the same way, each beyond the
// author's departure, are one slip repeated rather than two slips that happen
// to agree (slips touch a few percent of the entries, one kind of place slip
// a tenth of those).
constexpr int kMinRows = 2;
// A constant error within the author's departure that the other witnesses
// agree on and this copy does not, this copy reading the model's value: an
// ancestor's error the others inherited. Judgement: over at least three rows
// (the author departs at a few percent of the entries, each row on its own,
// so three equal departures in a row, which a corrector recomputing the
// column would also leave, are rare), on three rows in four. Measured on
// seeds 1-40 of deviation_bench: 3 false flags fewer, nothing lost.
constexpr int kMinSharedRows = 3;
constexpr double kSharedShare = 0.75;

enum class Pattern { kLeading, kEmpty, kHeld, kUp, kDown, kDoubled, kOffset };

struct Transform {
  Pattern pattern = Pattern::kEmpty;
  std::size_t place = 0;
  std::int64_t value = 0;  // kHeld: the value written; kOffset: units added
  bool operator==(const Transform&) const = default;
};

/// The original the copy `c` came from under `t`, its lost places supplied
/// from `e` (the expected reading); nullopt when `c` cannot come from `t`.
std::optional<Sexagesimal> Restore(const Transform& t, const Sexagesimal& c, const Sexagesimal& e,
                                   int places) {
  if (t.pattern == Pattern::kOffset)
    return c - Sexagesimal::FromUnits(static_cast<Sexagesimal::Units>(t.value), places);
  Digits d = ToDigits(c, places);
  const Digits want = ToDigits(e, places);
  const std::size_t n = d.d.size(), p = t.place;
  // An entry of one place (a sine in whole units) may be left empty (written
  // as 0) row after row; the other patterns move or repeat a place among two.
  const bool one_place = t.pattern == Pattern::kLeading || t.pattern == Pattern::kEmpty;
  if (n < (one_place ? 1U : 2U) || want.d.size() != n || p >= n) return std::nullopt;
  switch (t.pattern) {
    case Pattern::kLeading: {  // the first place that is not 0 left empty
      const auto lead = std::find_if(want.d.begin(), want.d.end(), [](auto v) { return v != 0; });
      if (lead == want.d.end()) return std::nullopt;
      const auto q = static_cast<std::size_t>(lead - want.d.begin());
      for (std::size_t j = 0; j <= q; ++j) {
        if (d.d[j] != 0) return std::nullopt;
      }
      d.d[q] = want.d[q];
      break;
    }
    case Pattern::kEmpty:
    case Pattern::kHeld:
      if (d.d[p] != (t.pattern == Pattern::kEmpty ? 0 : t.value)) return std::nullopt;
      d.d[p] = want.d[p];
      break;
    case Pattern::kUp:
      if (p + 1 >= n || d.d[n - 1] != 0) return std::nullopt;
      d.d.insert(d.d.begin() + static_cast<std::ptrdiff_t>(p), want.d[p]);
      d.d.pop_back();
      break;
    case Pattern::kDown:
    case Pattern::kDoubled:
      if (p + 1 >= n) return std::nullopt;
      if (t.pattern == Pattern::kDown ? d.d[p] != 0 : d.d[p] != d.d[p + 1]) return std::nullopt;
      d.d.erase(d.d.begin() + static_cast<std::ptrdiff_t>(p));
      d.d.push_back(want.d[n - 1]);
      break;
    case Pattern::kOffset:
      break;
  }
  return FromDigits(d);
}

struct Run {
  Transform transform;
  std::size_t first = 0, last = 0;
  std::vector<std::size_t> changed;  // rows the slip changed
  int deviant = 0;                   // of them, beyond the author's departure
  std::vector<std::size_t> gaps;     // rows within the run it does not explain
  bool Gap(std::size_t r) const { return std::find(gaps.begin(), gaps.end(), r) != gaps.end(); }
};

struct Scan {
  const Transcription& table;
  const ColumnValues& values;
  const ExplainOptions& options;
  const ColumnContext& column;
  int places;

  std::optional<Sexagesimal> Copy(std::size_t r) const {
    const Cell& cell = table.rows[r].cells[static_cast<std::size_t>(values.column)];
    if (cell.state != CellState::kRead || !cell.value || r >= values.computed.size() ||
        !values.computed[r])
      return std::nullopt;
    return AtPlaces(*cell.value, places);
  }
  Sexagesimal Expected(std::size_t r) const {
    return column.tradition_reading[r] ? *column.tradition_reading[r]
                                       : AtPlaces(*values.computed[r], places);
  }
  /// The restored reading of row r under t when it fits (the original within
  /// the author's departure of the model, or the tradition's reading).
  std::optional<Sexagesimal> Fits(const Transform& t, std::size_t r) const {
    const auto copy = Copy(r);
    if (!copy) return std::nullopt;
    // A constant error within the author's departure tells from his reading
    // only by the other witnesses: where they read this copy's value too,
    // nothing says it is wrong. Else a run seeded where the others share an
    // ancestor's constant error grew over the whole column onto the copy
    // that escaped it (seeds 1-40 of deviation_bench: 288 false flags as
    // "one constant error", 21 with this; DEVELOPERS.md, ninth round).
    if (t.pattern == Pattern::kOffset && std::llabs(t.value) <= column.author.typical &&
        column.consensus[r] && *column.consensus[r] == *copy)
      return std::nullopt;
    auto restored = Restore(t, *copy, Expected(r), places);
    if (!restored) return std::nullopt;
    if (column.tradition_reading[r] && *restored == *column.tradition_reading[r]) return restored;
    // In units, not the column's grid steps (see MeasureColumn's tradition
    // reading): a branch's one-step constant error is no author's departure.
    const int k = UnitsOff(DiffUnits(*restored, *values.computed[r], places), options.tolerance);
    if (k > column.author.typical) return std::nullopt;
    return restored;
  }
  /// This copy departs from the reading the other witnesses agree on (within
  /// the author's departure) and lies further from the model than it: the
  /// copy's slip, though not every other witness contradicts it (a branch
  /// sharing an ancestor's run reads it too). Seeds 1-40 of deviation_bench:
  /// constant runs caught 854 -> 893 of 908, rightly named 701 -> 770,
  /// precision unchanged (DEVELOPERS.md, tenth round).
  bool OffTradition(std::size_t r) const {
    const auto copy = Copy(r);
    if (!copy || !column.tradition_reading[r]) return false;
    const auto off = [&](const Sexagesimal& v) {
      return UnitsOff(DiffUnits(v, *values.computed[r], places), options.tolerance);
    };
    return off(*copy) > off(*column.tradition_reading[r]);
  }
  /// The transforms a deviant row is consistent with.
  std::vector<Transform> Seeds(std::size_t r) const {
    std::vector<Transform> out;
    const auto copy = Copy(r);
    if (!copy) return out;
    const Digits d = ToDigits(*copy, places);
    if (Fits({Pattern::kLeading, 0, 0}, r)) out.push_back({Pattern::kLeading, 0, 0});
    for (std::size_t p = 0; p < d.d.size(); ++p) {
      for (Pattern pattern :
           {Pattern::kEmpty, Pattern::kHeld, Pattern::kUp, Pattern::kDown, Pattern::kDoubled}) {
        Transform t{pattern, p, pattern == Pattern::kHeld ? d.d[p] : 0};
        if (pattern == Pattern::kHeld && d.d[p] == 0) continue;  // that is kEmpty
        if (Fits(t, r)) out.push_back(t);
      }
    }
    const auto units =
        static_cast<std::int64_t>(std::llround(DiffUnits(*copy, Expected(r), places)));
    // A constant error: beyond the author's departure, or within it where the
    // other witnesses read otherwise (then it is not the author's).
    if (units != 0 &&
        (std::llabs(units) > column.author.typical || column.contradicted[r] || OffTradition(r)))
      out.push_back({Pattern::kOffset, 0, units});
    return out;
  }
  /// Row r is a slip the transform explains: it fits, changes the copy and
  /// is beyond the author's departure or off the other witnesses' reading.
  bool Deviant(const Transform& t, std::size_t r) const {
    const auto fit = Fits(t, r);
    return fit && *fit != *Copy(r) &&
           (column.deviant[r] || column.contradicted[r] || OffTradition(r));
  }
  /// Grows [first, last] over the rows the transform fits, then over one row
  /// it does not fit (left blank, illegible or miscopied besides) when the
  /// row beyond it is a slip of the run. Judgement: a copyist carrying a
  /// constant error goes on carrying it past an entry he spoiled otherwise;
  /// two separate slips of the same kind two rows apart are far rarer. Only
  /// past two changed rows, so two isolated slips never make a run.
  void Extend(Run& run, const std::vector<bool>& claimed) const {
    const auto& t = run.transform;
    const std::size_t n = table.rows.size();
    const auto free_fit = [&](std::size_t r) { return !claimed[r] && Fits(t, r).has_value(); };
    for (bool jumped = true; jumped;) {
      while (run.first > 0 && free_fit(run.first - 1)) --run.first;
      while (run.last + 1 < n && free_fit(run.last + 1)) ++run.last;
      jumped = false;
      if (ChangedIn(run) < kMinRows) break;
      if (run.first >= 2 && !claimed[run.first - 2] && Deviant(t, run.first - 2)) {
        run.first -= 2;
        run.gaps.push_back(run.first + 1);
        jumped = true;
      }
      if (run.last + 2 < n && !claimed[run.last + 2] && Deviant(t, run.last + 2)) {
        run.last += 2;
        run.gaps.push_back(run.last - 1);
        jumped = true;
      }
    }
  }
  int ChangedIn(const Run& run) const {
    int k = 0;
    for (std::size_t r = run.first; r <= run.last; ++r) {
      const auto fit = Fits(run.transform, r);
      k += fit && *fit != *Copy(r);
    }
    return k;
  }
  Run Grow(const Transform& t, std::size_t seed, const std::vector<bool>& claimed) const {
    Run run{t, seed, seed, {}, 0, {}};
    Extend(run, claimed);
    for (std::size_t r = run.first; r <= run.last; ++r) {
      const auto fit = Fits(t, r);
      if (!fit || *fit == *Copy(r)) continue;
      run.changed.push_back(r);
      // A row counts when beyond the author's departure, or off the reading
      // the other witnesses agree on.
      run.deviant += column.deviant[r] || column.contradicted[r] || OffTradition(r);
    }
    if (!run.changed.empty()) {
      run.first = run.changed.front();
      run.last = run.changed.back();
    }
    return run;
  }
  /// The rows of a constant error within the author's departure where this
  /// copy reads the model's value and the other witnesses agree on that
  /// value shifted by the constant: an ancestor's constant error they share,
  /// this copy keeping the author's reading. Empty unless most of the run
  /// looks so (the others' shift constant, this copy on the model).
  std::vector<std::size_t> SharedShift(const Run& run) const {
    const auto& t = run.transform;
    if (t.pattern != Pattern::kOffset || std::llabs(t.value) > column.author.typical ||
        static_cast<int>(run.changed.size()) < kMinSharedRows)
      return {};
    std::vector<std::size_t> on_model;
    int shifted = 0;
    for (std::size_t r : run.changed) {
      const auto copy = Copy(r);
      const auto restored = Fits(t, r);
      shifted += column.consensus[r] && restored && *column.consensus[r] == *restored;
      if (UnitsOff(DiffUnits(*copy, *values.computed[r], places), options.tolerance) == 0)
        on_model.push_back(r);
    }
    const auto n = static_cast<double>(run.changed.size());
    if (static_cast<double>(on_model.size()) < kSharedShare * n ||
        static_cast<double>(shifted) < kSharedShare * n)
      return {};
    return on_model;
  }
};

std::string Span(const Finding& f, const Run& run) {
  if (!run.gaps.empty())
    return std::to_string(f.cells.size()) + " entries (" + f.cells.front().arg + " to " +
           f.cells.back().arg + ", " + std::to_string(run.gaps.size()) +
           (run.gaps.size() == 1 ? " entry" : " entries") + " between them miscopied otherwise)";
  return std::to_string(f.cells.size()) + " consecutive entries (" + f.cells.front().arg + " to " +
         f.cells.back().arg + ")";
}

std::string Describe(const Run& run, const Finding& f, const std::string& unit, bool tradition) {
  const auto& t = run.transform;
  const std::string place = PlaceName(static_cast<int>(t.place), unit);
  const std::string next = PlaceName(static_cast<int>(t.place + 1), unit);
  const std::string from = tradition ? "the other witnesses" : "the model";
  switch (t.pattern) {
    case Pattern::kLeading:
      return "the leading place left empty (written as 0) in " + Span(f, run) +
             ": one slip repeated row after row; each entry's leading place supplied from " + from;
    case Pattern::kEmpty:
      return "the " + place + " left empty (written as 0) in " + Span(f, run) +
             ": one slip repeated row after row; each entry's " + place + " supplied from " + from;
    case Pattern::kHeld:
      return "the " + place + " written as " + std::to_string(t.value) + " throughout " +
             Span(f, run) + ", where " + from +
             " changes them: a place carried over from row to row; each entry's " + place +
             " restored from " + from;
    case Pattern::kUp:
      return "the " + place + " omitted in " + Span(f, run) + " and the " + next +
             " moved up into their place: one slip repeated row after row; the " + place +
             " restored from " + from;
    case Pattern::kDown:
      return "the places from the " + place + " moved down one in " + Span(f, run) + " (" + place +
             " written as " + next +
             "): one slip repeated row after row; the lost last place "
             "supplied from " +
             from;
    case Pattern::kDoubled:
      return "the " + place + " written twice in " + Span(f, run) +
             ", pushing the following places down: one slip repeated row after row; the lost "
             "last place supplied from " +
             from;
    case Pattern::kOffset:
      break;
  }
  return "every entry of " + Span(f, run) + " departs from " + from + " by " +
         SignedUnits(static_cast<double>(t.value)) +
         ": one constant error over the run; each entry restored by removing it";
}

Finding RunFinding(const Scan& s, const Run& run) {
  Finding f = NewFinding(s.table, s.values, s.places);
  bool tradition = false;
  for (std::size_t r : run.changed) {
    f.cells.push_back(MakeCell(s.table, s.values, r, s.places));
    f.cells.back().emendation = s.Fits(run.transform, r);
    tradition = tradition || s.column.tradition_reading[r].has_value();
  }
  Explanation e;
  e.cls = SlipClass::kSystematic;
  // Judgement, as for displaced runs: each row beyond the third makes chance
  // less likely still.
  e.score = std::min(0.97, 0.8 + 0.05 * (static_cast<double>(run.changed.size()) - kMinRows));
  e.emendation = f.cells.front().emendation;
  e.evidence =
      Describe(run, f, s.table.columns[static_cast<std::size_t>(s.values.column)].unit, tradition);
  f.explanations = {e};
  return f;
}

bool Better(const Run& a, const Run& b) {
  if (a.deviant != b.deviant) return a.deviant > b.deviant;
  if (a.changed.size() != b.changed.size()) return a.changed.size() > b.changed.size();
  return static_cast<int>(a.transform.pattern) < static_cast<int>(b.transform.pattern);
}

}  // namespace

std::vector<Finding> SystematicRuns(const Transcription& table, const ColumnValues& values,
                                    const ExplainOptions& options, const ColumnContext& column,
                                    std::vector<bool>& claimed) {
  const int places = table.columns[static_cast<std::size_t>(values.column)].places;
  const Scan scan{table, values, options, column, places};
  std::vector<Run> runs;
  for (std::size_t r = 0; r < table.rows.size(); ++r) {
    if (claimed[r] || (!column.deviant[r] && !column.contradicted[r] && !scan.OffTradition(r)))
      continue;
    for (const auto& t : scan.Seeds(r)) {
      const bool grown = std::any_of(runs.begin(), runs.end(), [&](const Run& o) {
        return o.transform == t && o.first <= r && r <= o.last;
      });
      if (grown) continue;
      Run run = scan.Grow(t, r, claimed);
      if (static_cast<int>(run.changed.size()) >= kMinRows && run.deviant >= 2)
        runs.push_back(std::move(run));
    }
  }
  std::stable_sort(runs.begin(), runs.end(), Better);
  std::vector<Finding> out;
  for (const auto& run : runs) {
    bool free = true;
    for (std::size_t r = run.first; r <= run.last; ++r) free = free && (!claimed[r] || run.Gap(r));
    if (!free) continue;
    if (const auto keep = scan.SharedShift(run); !keep.empty()) {
      // Not this copy's slip: its readings of the model's value are kept
      // (not flagged one by one as against the tradition); the rest of the
      // run is explained row by row.
      for (std::size_t r : keep) claimed[r] = true;
      continue;
    }
    for (std::size_t r = run.first; r <= run.last; ++r) claimed[r] = claimed[r] || !run.Gap(r);
    out.push_back(RunFinding(scan, run));
  }
  return out;
}

}  // namespace apograph::deviation::internal
