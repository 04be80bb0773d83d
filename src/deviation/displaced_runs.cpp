// Runs of consecutive entries of one column slid by one or more rows (the
// copyist's eye skipped or repeated a line): found as runs where the copy's
// entry of row i is the model's value of row i+k, and reported once.
#include <algorithm>
#include <cmath>

#include "deviation/explain_internal.hpp"

namespace apograph::deviation::internal {
namespace {

struct RunCandidate {
  std::size_t first = 0, last = 0;
  int shift = 0;
  int deviant = 0;
  std::vector<bool> slipped;  // per row of the run: a slip of its own on top of the slide
};

/// Two numbers of one place written alike but for one slip of the pen: one
/// decimal digit changed, or the two digits swapped ("03" for "30").
bool OneDigitApart(std::int64_t a, std::int64_t b) {
  if (a == b || a < 0 || b < 0 || a > 99 || b > 99) return false;
  return a / 10 == b / 10 || a % 10 == b % 10 || (a / 10 == b % 10 && a % 10 == b / 10);
}

/// `a` and `b` agree at every place but one, where they are one digit apart.
bool OneSlipApart(const Digits& a, const Digits& b) {
  if (a.negative != b.negative || a.d.size() != b.d.size()) return false;
  int differ = 0;
  for (std::size_t p = 0; p < a.d.size(); ++p) {
    if (a.d[p] == b.d[p]) continue;
    if (++differ > 1 || !OneDigitApart(a.d[p], b.d[p])) return false;
  }
  return differ == 1;
}

struct RunScan {
  const Transcription& table;
  const ColumnValues& values;
  const ExplainOptions& options;
  const ColumnContext& column;
  const DiffColumn& diffs;
  int places;

  const std::optional<Sexagesimal>& Value(std::size_t r) const {
    return table.rows[r].cells[static_cast<std::size_t>(values.column)].value;
  }
  /// The copy's reading is the other witnesses' too.
  bool AsOthers(std::size_t r) const {
    return column.consensus[r] && Value(r) && AtPlaces(*Value(r), places) == *column.consensus[r];
  }
  /// The others agree on another reading.
  bool Contradicted(std::size_t r) const {
    return column.consensus[r] && Value(r) && AtPlaces(*Value(r), places) != *column.consensus[r];
  }
  /// Off the model; a small departure the others read too is the author's.
  bool Deviant(std::size_t r) const {
    if (!std::isfinite(column.departure[r])) return false;
    const int k = UnitsOff(column.departure[r], options.tolerance);
    return k > 0 && !(AsOthers(r) && k <= column.author.typical);
  }
  bool Match(std::size_t r, int k) const {
    const std::ptrdiff_t j = static_cast<std::ptrdiff_t>(r) + k;
    if (j < 0 || j >= static_cast<std::ptrdiff_t>(values.computed.size())) return false;
    const auto& c = values.computed[static_cast<std::size_t>(j)];
    if (!std::isfinite(diffs.diff[r]) || !c) return false;
    const auto& others = column.consensus[static_cast<std::size_t>(j)];
    if (others && AtPlaces(*Value(r), places) == *others) return true;
    const double off = std::fabs(DiffUnits(*Value(r), *c, places));
    if (off <= options.tolerance + 1e-9) return true;
    // The author's departure at row j (up to computational_units): near
    // enough when the rows differ by much more than it (judgement: five
    // times), so the slide still shows.
    const auto& own = values.computed[r];
    const double step = own ? std::fabs(DiffUnits(*c, *own, places)) : 0;
    const double departure = std::floor(options.computational_units);
    return off <= options.tolerance + departure + 1e-9 && step >= 5 * (departure + 1);
  }
  /// The reading row r + k should have: the other witnesses' or the model's.
  std::optional<Sexagesimal> Target(std::size_t r, int k) const {
    const std::ptrdiff_t j = static_cast<std::ptrdiff_t>(r) + k;
    if (j < 0 || j >= static_cast<std::ptrdiff_t>(values.computed.size())) return std::nullopt;
    if (const auto& others = column.consensus[static_cast<std::size_t>(j)]) return *others;
    if (const auto& c = values.computed[static_cast<std::size_t>(j)]) return c->Rounded(places);
    return std::nullopt;
  }
  /// A deviant entry one slip of the pen from the value of row r + k, and
  /// not one slip from its own row's value: the slide and a slip of its own
  /// (copied twice, slips compound).
  bool NearMatch(std::size_t r, int k) const {
    if (!Value(r) || !Deviant(r) || !values.computed[r]) return false;  // Target(r, 0) exists
    const auto target = Target(r, k);
    if (!target) return false;
    const Digits copy = ToDigits(*Value(r), places);
    return OneSlipApart(copy, ToDigits(*target, places)) &&
           !OneSlipApart(copy, ToDigits(*Target(r, 0), places));
  }
  /// Rows of the run whose entry is exactly the reading row r + shift
  /// should have (the other witnesses' or the model's): the slide's own
  /// evidence, its values taken from the column itself.
  int SlideExact(const RunCandidate& run) const {
    int exact = 0;
    for (std::size_t r = run.first; r <= run.last; ++r) {
      const auto target = Target(r, run.shift);
      exact += Value(r) && target && AtPlaces(*Value(r), places) == *target;
    }
    return exact;
  }
  /// The units every row of the run departs from its own row's reading by,
  /// when that is one and the same constant in every row (one place changed
  /// by the same amount: a constant error fits the run exactly); else 0.
  std::int64_t ConstantOffset(const RunCandidate& run) const {
    std::int64_t constant = 0;
    for (std::size_t r = run.first; r <= run.last; ++r) {
      const auto own = Target(r, 0);
      if (!Value(r) || !own) return 0;
      const double d = DiffUnits(*Value(r), *own, places);
      const auto units = static_cast<std::int64_t>(std::llround(d));
      if (std::fabs(d - static_cast<double>(units)) > 1e-9 || units == 0) return 0;
      if (r != run.first && units != constant) return 0;
      constant = units;
    }
    return constant;
  }
  /// Rows next to the run, on either side, that the constant error fits
  /// exactly (this copy reads its own row's reading plus `constant`, off the
  /// model or the others' reading) and the slide does not: the constant error
  /// then explains every row the slide does and these besides.
  int ConstantBeyond(const RunCandidate& run, std::int64_t constant) const {
    const auto fits = [&](std::ptrdiff_t r) {
      if (r < 0 || r >= static_cast<std::ptrdiff_t>(table.rows.size())) return false;
      const auto row = static_cast<std::size_t>(r);
      const auto own = Target(row, 0);
      if (!Value(row) || !own || Match(row, run.shift) || !(Deviant(row) || Contradicted(row)))
        return false;
      const double d = DiffUnits(*Value(row), *own, places);
      return std::fabs(d - static_cast<double>(constant)) <= 1e-9;
    };
    int beyond = 0;
    for (auto r = static_cast<std::ptrdiff_t>(run.first) - 1; fits(r); --r) ++beyond;
    for (auto r = static_cast<std::ptrdiff_t>(run.last) + 1; fits(r); ++r) ++beyond;
    return beyond;
  }
  void Collect(int k, std::vector<RunCandidate>& out) const {
    const std::size_t n = table.rows.size();
    for (std::size_t i = 0; i < n;) {
      if (!Match(i, k) && !NearMatch(i, k)) {
        ++i;
        continue;
      }
      std::size_t j = i;
      while (j + 1 < n && (Match(j + 1, k) || NearMatch(j + 1, k))) ++j;
      std::size_t a = i, b = j;
      while (a < b && !Deviant(a)) ++a;
      while (b > a && !Deviant(b)) --b;
      RunCandidate run{a, b, k, 0, {}};
      int exact = 0;
      for (std::size_t r = a; r <= b; ++r) {
        run.deviant += Deviant(r);
        run.slipped.push_back(!Match(r, k));
        exact += !run.slipped.back();
      }
      // Judgement: a slide shows in rows that match exactly; rows with a slip
      // of their own may join it, but a run needs at least one exact row and,
      // when any row has its own slip, three rows, so that two chance
      // near-misses never make a slide.
      const bool any_slip = static_cast<std::size_t>(exact) < b - a + 1;
      if (b > a && run.deviant >= 2 && exact >= 1 && (!any_slip || b - a >= 2))
        out.push_back(std::move(run));
      i = j + 1;
    }
  }
};

std::string SlippedClause(const std::vector<std::string>& args) {
  if (args.empty()) return "";
  std::string list;
  for (const auto& a : args) list += (list.empty() ? "" : ", ") + a;
  return "; besides the slide, " + list +
         (args.size() == 1 ? " has a slip of one digit of its own"
                           : " have a slip of one digit of their own") +
         " (restored from the other witnesses or the model)";
}

std::string RowsWord(int k) {
  return std::abs(k) == 1 ? "one row" : std::to_string(std::abs(k)) + " rows";
}

Finding RunFinding(const RunScan& s, const RunCandidate& run) {
  Finding f = NewFinding(s.table, s.values, s.places);
  bool small = true;
  int sign = 0, supplied = 0;
  std::vector<std::string> slipped_rows;
  double low = 1e300, high = -1e300;
  for (std::size_t r = run.first; r <= run.last; ++r) {
    f.cells.push_back(MakeCell(s.table, s.values, r, s.places));
    const std::ptrdiff_t from = static_cast<std::ptrdiff_t>(r) - run.shift;
    auto& cell = f.cells.back();
    const bool in_run = from >= static_cast<std::ptrdiff_t>(run.first) &&
                        from <= static_cast<std::ptrdiff_t>(run.last);
    if (in_run && !run.slipped[static_cast<std::size_t>(from) - run.first]) {
      cell.emendation = s.Value(static_cast<std::size_t>(from))->Rounded(s.places);
    } else if (auto original = s.column.Original(r, s.values, s.options, s.places)) {
      cell.emendation = original;
      ++supplied;
    }
    if (run.slipped[r - run.first]) slipped_rows.push_back(cell.arg);
    if (s.Deviant(r)) {
      const double d = s.column.departure[r];
      low = std::min(low, d);
      high = std::max(high, d);
      small = small && std::fabs(d) <= s.options.computational_units + 1e-9;
      small = small && !s.Contradicted(r);  // the others read otherwise: not the author's
      const int sg = d > 0 ? 1 : -1;
      if (sign == 0) sign = sg;
      small = small && sg == sign;
    }
  }
  const auto& first = f.cells.front();
  const auto& last = f.cells.back();
  const std::size_t to_first = run.first + static_cast<std::size_t>(run.shift);
  const std::size_t to_last = run.last + static_cast<std::size_t>(run.shift);
  Explanation e;
  e.cls = SlipClass::kDisplacedRun;
  // Judgement: two rows that match their neighbours' model values could be
  // chance in a slowly changing column; each further row makes it less so.
  e.score = std::min(0.97, 0.8 + 0.05 * (run.deviant - 2));
  e.emendation = first.emendation;
  e.evidence = "the entries of " + first.arg + " to " + last.arg + " are the model's values of " +
               MakeCell(s.table, s.values, to_first, s.places).arg + " to " +
               MakeCell(s.table, s.values, to_last, s.places).arg + ": the copyist's eye slid " +
               RowsWord(run.shift) + (run.shift > 0 ? " ahead" : " behind") +
               " (eye-skip); each entry is restored to its own row" +
               (supplied ? " (" + std::to_string(supplied) + " supplied from the model)" : "") +
               SlippedClause(slipped_rows);
  // Judgement: each row that needs a slip of its own on top of the slide
  // makes the slide a little less certain.
  e.score -= 0.1 * static_cast<double>(slipped_rows.size());
  // A constant small offset is as well explained by the author's computation
  // as by a slide; offsets that vary row by row but match the neighbouring
  // rows exactly are the slide's signature.
  if (small && high - low < 1 - 1e-9) {
    Explanation comp;
    comp.cls = SlipClass::kComputational;
    comp.score = 0.85;  // judgement: the author's run is the likelier story (see above)
    comp.evidence =
        "every entry of " + first.arg + " to " + last.arg + " departs from the model by at most " +
        std::to_string(static_cast<int>(s.options.computational_units)) +
        " units, all of one sign: in a slowly changing column the author's computation and a "
        "slide of " +
        RowsWord(run.shift) + " look alike; keep the readings unless other witnesses differ";
    e.score *= 0.6;
    f.explanations = {comp, e};
    for (auto& c : f.cells) c.emendation.reset();
  } else {
    f.explanations = {e};
  }
  return f;
}

/// Both a slide and a constant error fit every row exactly (a column that
/// grows by the same amount row after row): the same restored values either
/// way; the editor is told the other explanation fits too.
void AddConstantAlternative(Finding& f, std::int64_t constant) {
  if (f.explanations.front().cls != SlipClass::kDisplacedRun) return;
  Explanation alt;
  alt.cls = SlipClass::kSystematic;
  alt.score = f.explanations.front().score * 0.9;  // judgement: ranked below the slide
  alt.emendation = f.explanations.front().emendation;
  alt.evidence = "equally, every entry of " + f.cells.front().arg + " to " + f.cells.back().arg +
                 " departs from its own row's reading by " +
                 SignedUnits(static_cast<double>(constant)) +
                 ": one constant error over the run fits every row as exactly as the slide, "
                 "with the same restored values";
  f.explanations.push_back(alt);
}

}  // namespace

std::vector<Finding> DisplacedRuns(const Transcription& table, const ColumnValues& values,
                                   const ExplainOptions& options, const ColumnContext& column,
                                   std::vector<bool>& claimed) {
  const int places = table.columns[static_cast<std::size_t>(values.column)].places;
  RunScan scan{table, values, options, column, column.diffs, places};
  std::vector<RunCandidate> candidates;
  for (int k = 1; k <= options.max_shift; ++k) {
    scan.Collect(k, candidates);
    scan.Collect(-k, candidates);
  }
  std::stable_sort(candidates.begin(), candidates.end(),
                   [](const RunCandidate& a, const RunCandidate& b) {
                     if (a.deviant != b.deviant) return a.deviant > b.deviant;
                     return std::abs(a.shift) < std::abs(b.shift);
                   });
  std::vector<Finding> out;
  for (const auto& run : candidates) {
    bool free = true;
    for (std::size_t r = run.first; r <= run.last; ++r) free = free && !claimed[r];
    if (!free) continue;
    // Judgement: a run that a constant error fits exactly in every row, and
    // a slide only in some (its values near, not equal to, the neighbouring
    // readings), is the constant error's: a slide copies the column's own
    // entries. Left to SystematicRuns. Seeds 1-40 of deviation_bench:
    // DEVELOPERS.md, eleventh round.
    const std::int64_t constant = scan.ConstantOffset(run);
    const int slide_exact = scan.SlideExact(run);
    const auto rows = static_cast<int>(run.last - run.first + 1);
    if (constant != 0 && slide_exact < rows) continue;
    // Judgement, the same evidence further: a constant error that fits the
    // slide's rows exactly and rows beyond them that the slide does not is
    // one story for all of them, where the slide needs a slip of its own
    // for each further row (a column growing by one unit a row, one unit
    // short over six rows: the slide fits the middle four). Seeds 1-40 of
    // deviation_bench: DEVELOPERS.md, fourteenth round.
    if (constant != 0 && scan.ConstantBeyond(run, constant) > 0) continue;
    for (std::size_t r = run.first; r <= run.last; ++r) claimed[r] = true;
    out.push_back(RunFinding(scan, run));
    if (constant != 0) AddConstantAlternative(out.back(), constant);
  }
  return out;
}

}  // namespace apograph::deviation::internal
