#include "estimate/derived_columns.hpp"

#include <algorithm>
#include <cmath>
#include <optional>

namespace apograph::estimate {

namespace {

using Values = std::vector<std::optional<Sexagesimal>>;
using Kind = DerivedRelation::Kind;

Values ColumnValues(const Transcription& t, int c) {
  Values v(t.rows.size());
  for (std::size_t r = 0; r < t.rows.size(); ++r) {
    const auto& cells = t.rows[r].cells;
    if (static_cast<std::size_t>(c) < cells.size() &&
        cells[static_cast<std::size_t>(c)].state == CellState::kRead) {
      v[r] = cells[static_cast<std::size_t>(c)].value;
    }
  }
  return v;
}

/// Quadratic smoothing over 7 rows: an estimate of the precise values.
std::vector<double> Smoothed(const Values& v) {
  const std::size_t n = v.size();
  std::vector<double> out(n, std::nan(""));
  // Savitzky-Golay weights for the centre of 7 points, degree 2.
  const double w[7] = {-2, 3, 6, 7, 6, 3, -2};
  for (std::size_t i = 3; i + 3 < n; ++i) {
    double s = 0;
    bool ok = true;
    for (int k = -3; k <= 3 && ok; ++k) {
      const auto& x = v[i + static_cast<std::size_t>(k + 3) - 3];
      ok = x.has_value();
      if (ok) s += w[k + 3] * x->ToDouble();
    }
    if (ok) out[i] = s / 21.0;
  }
  return out;
}

/// The two rows of a difference at row i (earlier, later), or nullopt.
std::optional<std::pair<std::size_t, std::size_t>> Span(std::size_t i, int rows, std::size_t n) {
  const long j = static_cast<long>(i) + rows;
  if (j < 0 || j >= static_cast<long>(n)) return std::nullopt;
  const auto k = static_cast<std::size_t>(j);
  return rows > 0 ? std::make_pair(i, k) : std::make_pair(k, i);
}

/// a x b exactly, when the places allow.
std::optional<Sexagesimal> Product(const Sexagesimal& a, const Sexagesimal& b) {
  if (a.places() + b.places() > Sexagesimal::kMaxPlaces) return std::nullopt;
  if (!(std::fabs(a.ToDouble() * b.ToDouble()) < 1e11)) return std::nullopt;
  return Sexagesimal::FromUnits(a.units() * b.units(), a.places() + b.places());
}

/// The relation on exact entries (tabulated or rounded values) at row i,
/// brought to `places`.
std::optional<Sexagesimal> OnEntries(const Values& s, const Values* s2, std::size_t i,
                                     const DerivedRelation& r, int places, Rounding rounding) {
  std::optional<Sexagesimal> x;
  if (r.kind == Kind::kDifference) {
    const auto span = Span(i, r.rows, s.size());
    if (span && s[span->first] && s[span->second])
      x = r.Wrapped(*s[span->second] - *s[span->first]);
  } else if (s[i] && (*s2)[i]) {
    x = r.kind == Kind::kSum
            ? std::optional(r.other_sign < 0 ? *s[i] - *(*s2)[i] : *s[i] + *(*s2)[i])
            : Product(*s[i], *(*s2)[i]);
    if (x) x = r.Wrapped(*x);
  }
  if (!x) return std::nullopt;
  return (*x * r.multiplier).Divided(r.divisor, places, rounding);
}

std::optional<double> OnExact(const std::vector<double>& p, const std::vector<double>* p2,
                              std::size_t i, const DerivedRelation& r) {
  if (p.size() <= i || (p2 && p2->size() <= i)) return std::nullopt;
  double x = 0;
  if (r.kind == Kind::kDifference) {
    const auto span = Span(i, r.rows, p.size());
    if (!span) return std::nullopt;
    x = r.Wrapped(p[span->second] - p[span->first]);
  } else {
    x = r.Wrapped(r.kind == Kind::kSum ? p[i] + r.other_sign * (*p2)[i] : p[i] * (*p2)[i]);
  }
  if (!std::isfinite(x)) return std::nullopt;
  return x * r.multiplier / r.divisor;
}

/// What the detection reads, per column, once.
struct Columns {
  std::vector<Values> tabulated;
  std::vector<Values> rounded;               ///< empty where unknown
  std::vector<std::vector<double>> precise;  ///< given or smoothed
  /// What a sum adds: the signed values where the column prints magnitudes
  /// (DerivedInputs), else the same as rounded and precise.
  std::vector<Values> rounded_signed;
  std::vector<std::vector<double>> precise_signed;
};

/// Scores one relation for target c from sources s (and s2); fills `d` and
/// returns true when it holds.
bool Test(const Transcription& t, const Columns& cols, int c, int s, int s2,
          const DerivedRelation& r, Rounding rounding, DerivedColumn& d) {
  const Values& target = cols.tabulated[static_cast<std::size_t>(c)];
  const Values& src = cols.tabulated[static_cast<std::size_t>(s)];
  const Values* src2 = s2 >= 0 ? &cols.tabulated[static_cast<std::size_t>(s2)] : nullptr;
  const bool sum = r.kind != Kind::kDifference;
  const auto& rounded = sum ? cols.rounded_signed : cols.rounded;
  const auto& precise = sum ? cols.precise_signed : cols.precise;
  const Values& rnd = rounded[static_cast<std::size_t>(s)];
  const Values* rnd2 = s2 >= 0 ? &rounded[static_cast<std::size_t>(s2)] : nullptr;
  const bool have_rounded = !rnd.empty() && (!rnd2 || !rnd2->empty());
  const auto& pre = precise[static_cast<std::size_t>(s)];
  const auto* pre2 = s2 >= 0 ? &precise[static_cast<std::size_t>(s2)] : nullptr;
  const int places = t.columns[static_cast<std::size_t>(c)].places;
  d = {};
  for (std::size_t i = 0; i < t.rows.size(); ++i) {
    if (!target[i]) continue;
    const auto v = OnEntries(src, src2, i, r, places, rounding);
    const auto p = OnExact(pre, pre2, i, r);
    const auto q = have_rounded ? OnEntries(rnd, rnd2, i, r, places, rounding) : std::nullopt;
    if (!v && !p && !q) continue;
    ++d.rows;
    const bool tab = v && *v == *target[i], rnd = q && *q == *target[i],
               pre = p && Sexagesimal::FromDouble(*p, places, rounding) == *target[i];
    if (!tab) d.mismatched_rows.push_back(i);
    d.matched_tabulated += tab;
    d.matched_rounded += rnd;
    d.matched_precise += pre;
    d.matched_any += tab || rnd || pre;
  }
  const double share = r.kind == Kind::kDifference ? kDifferenceShare : kDerivedShare;
  if (d.rows < 5 || d.matched_any < share * d.rows) return false;
  d.column = c;
  d.source = s;
  d.other = s2;
  d.spec = r;
  d.rounding = rounding;
  return true;
}

/// The basis that reproduces most, in words and as a DerivedBasis.
void NameBasis(DerivedColumn& d) {
  const int t = d.matched_tabulated, q = d.matched_rounded, p = d.matched_precise;
  if (q >= t && q > p) {
    d.best = DerivedBasis::kRounded;
    d.basis = "rounded values";
  } else if (t > p) {
    d.best = q == t ? DerivedBasis::kRounded : DerivedBasis::kOwnEntries;
    d.basis = "tabulated entries";
  } else if (p > t && p > q) {
    d.best = DerivedBasis::kExact;
    d.basis = "precise values";
  } else {
    d.best = DerivedBasis::kRounded;
    d.basis = "cannot tell";
  }
}

/// An example of the relation in exact arithmetic, from the first row it
/// reproduces from the tabulated entries.
std::string Example(const Transcription& t, const Columns& cols, const DerivedColumn& d) {
  if (d.spec.kind != Kind::kDifference) return "";
  const Values& src = cols.tabulated[static_cast<std::size_t>(d.source)];
  const Values& target = cols.tabulated[static_cast<std::size_t>(d.column)];
  for (std::size_t i = 0; i < t.rows.size(); ++i) {
    const auto span = Span(i, d.spec.rows, src.size());
    if (!span || !target[i] || !src[span->first] || !src[span->second]) continue;
    const Sexagesimal diff = *src[span->second] - *src[span->first];
    const int places = t.columns[static_cast<std::size_t>(d.column)].places;
    const Sexagesimal v = (diff * d.spec.multiplier).Divided(d.spec.divisor, places, d.rounding);
    if (!(v == *target[i])) continue;
    std::string s = "row " + std::to_string(i + 1) + ": " + src[span->second]->ToString() + " - " +
                    src[span->first]->ToString() + " = " + diff.ToString();
    if (d.spec.multiplier != 1) s += ", times " + std::to_string(d.spec.multiplier);
    if (d.spec.divisor != 1) s += ", divided by " + std::to_string(d.spec.divisor);
    return s + ": " + v.ToString() + ", as tabulated";
  }
  return "";
}

std::string Evidence(const Transcription& t, const Columns& cols, const DerivedColumn& d) {
  const auto name = [&](int c) { return t.columns[static_cast<std::size_t>(c)].name; };
  std::string s = name(d.column) + " is " + d.relation + " (" +
                  (d.rounding == Rounding::kNearest ? "rounded" : "truncated") + ") at " +
                  std::to_string(d.matched_tabulated) + " of " + std::to_string(d.rows) +
                  " rows from the tabulated entries, ";
  if (d.matched_rounded > 0) s += std::to_string(d.matched_rounded) + " from rounded values, ";
  s += std::to_string(d.matched_precise) + " from precise values: " +
       (d.basis == "cannot tell" ? std::string("the entries cannot tell which")
                                 : "made from the " + d.basis);
  const std::string example = Example(t, cols, d);
  return s + (example.empty() ? "" : "; e.g. " + example);
}

Columns Read(const Transcription& table, const DerivedInputs* inputs) {
  const std::size_t n = table.columns.size();
  Columns cols;
  cols.rounded.resize(n);
  cols.precise.resize(n);
  for (std::size_t s = 0; s < n; ++s) {
    cols.tabulated.push_back(ColumnValues(table, static_cast<int>(s)));
    const bool exact = inputs && s < inputs->exact.size() && !inputs->exact[s].empty();
    cols.precise[s] = exact ? inputs->exact[s] : Smoothed(cols.tabulated[s]);
    if (inputs && s < inputs->rounded.size()) cols.rounded[s] = inputs->rounded[s];
    const bool signed_exact =
        inputs && s < inputs->exact_signed.size() && !inputs->exact_signed[s].empty();
    cols.precise_signed.push_back(signed_exact ? inputs->exact_signed[s] : cols.precise[s]);
    const bool signed_rounded =
        inputs && s < inputs->rounded_signed.size() && !inputs->rounded_signed[s].empty();
    cols.rounded_signed.push_back(signed_rounded ? inputs->rounded_signed[s] : cols.rounded[s]);
  }
  return cols;
}

/// Entries of positions: all in [0, 360), and some step between
/// neighbours crosses the turn (a jump of more than half a turn).
bool Angular(const Values& v) {
  std::optional<Sexagesimal> last;
  bool jump = false;
  const Sexagesimal zero, turn = Sexagesimal::FromUnits(360, 0),
                          half = Sexagesimal::FromUnits(180, 0);
  for (const auto& x : v) {
    if (!x) continue;
    if (*x < zero || !(*x < turn)) return false;
    if (last) {
      const Sexagesimal d = *x > *last ? *x - *last : *last - *x;
      jump = jump || d > half;
    }
    last = x;
  }
  return jump;
}

double StepOf(const Transcription& table) {
  if (table.argument.step) return table.argument.step->ToDouble();
  std::vector<double> args;
  for (std::size_t r = 0; r < table.rows.size() && args.size() < 2; ++r) {
    if (auto a = table.ArgumentInUse(r)) args.push_back(a->ToDouble());
  }
  return args.size() == 2 ? args[1] - args[0] : 1;
}

}  // namespace

std::vector<DerivedRelation> CandidateRelations(double step) {
  std::vector<DerivedRelation> out;
  auto add = [&](int rows, int mul, int div) {
    for (const auto& r : out) {
      if (r.kind == Kind::kDifference && r.rows == rows && r.multiplier * div == mul * r.divisor)
        return;
    }
    out.push_back({Kind::kDifference, rows, mul, div});
  };
  for (int rows : {1, -1, 2, -2, 3, -3, 4, -4, 5, -5, 6, -6, 10, -10, 12, -12}) {
    const int k = std::abs(rows);
    add(rows, 1, 1);
    // Divided by the argument's span (k x step), in its units or in sixtieths.
    const double span = k * step;
    for (double d : {span, span * 60}) {
      if (d >= 1 && d <= 3600 && std::fabs(d - std::round(d)) < 1e-9)
        add(rows, 1, static_cast<int>(std::round(d)));
      if (d > 0 && d < 1 && std::fabs(1 / d - std::round(1 / d)) < 1e-9)
        add(rows, static_cast<int>(std::round(1 / d)), 1);
    }
    if (k > 1) continue;
    for (int f : {2, 3, 4, 5, 6, 10, 12, 15, 20, 30, 60}) add(rows, 1, f);
  }
  for (Kind kind : {Kind::kSum, Kind::kProduct}) {
    for (int div : {1, 60}) out.push_back({kind, 0, 1, div});
  }
  return out;
}

std::vector<DerivedColumn> DetectDerivedColumns(const Transcription& table,
                                                const DerivedInputs* inputs) {
  const int ncol = static_cast<int>(table.columns.size());
  const Columns cols = Read(table, inputs);
  const auto relations = CandidateRelations(StepOf(table));
  std::vector<DerivedColumn> out;
  for (int c = 0; c < ncol; ++c) {
    std::optional<DerivedColumn> best;
    auto score = [](const DerivedColumn& d) {
      return std::max({d.matched_tabulated, d.matched_rounded, d.matched_precise});
    };
    auto consider = [&](int s, int s2, const DerivedRelation& r) {
      for (Rounding rd : {Rounding::kNearest, Rounding::kTruncate}) {
        DerivedColumn d;
        if (Test(table, cols, c, s, s2, r, rd, d) && (!best || score(d) > score(*best))) best = d;
      }
    };
    for (int s = 0; s < ncol; ++s) {
      if (s == c) continue;
      const bool angular = Angular(cols.tabulated[static_cast<std::size_t>(s)]);
      for (const auto& r : relations) {
        if (r.kind == Kind::kDifference) {
          consider(s, -1, r);
          if (!angular) continue;
          DerivedRelation w = r;
          w.wrap_360 = true;
          consider(s, -1, w);
          continue;
        }
        for (int s2 = s + 1; s2 < ncol; ++s2) {
          if (s2 == c) continue;
          consider(s, s2, r);
          if (r.kind != Kind::kSum) continue;
          DerivedRelation w = r;
          w.other_sign = -1;  // true = mean minus the geometric equation
          consider(s, s2, w);
          // A sum of positions (true = mean + equation) is written within
          // the turn.
          if (!(angular || Angular(cols.tabulated[static_cast<std::size_t>(c)]))) continue;
          for (int sign : {1, -1}) {
            w.other_sign = sign;
            w.wrap_360 = true;
            consider(s, s2, w);
          }
        }
      }
    }
    if (!best) continue;
    auto& d = *best;
    const auto name = [&](int k) { return table.columns[static_cast<std::size_t>(k)].name; };
    d.relation = d.spec.Text(name(d.source), d.other >= 0 ? name(d.other) : "");
    NameBasis(d);
    d.evidence = Evidence(table, cols, d);
    out.push_back(d);
  }
  return out;
}

}  // namespace apograph::estimate
