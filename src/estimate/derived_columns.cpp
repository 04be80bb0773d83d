#include "estimate/derived_columns.hpp"

#include <algorithm>
#include <cmath>
#include <optional>

namespace apograph::estimate {

namespace {

using Values = std::vector<std::optional<Sexagesimal>>;

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

struct Relation {
  std::string name;
  int offset;  // +1: next row minus this; -1: this minus previous; 0: sum
  int divisor;
};

/// Target brought from an exact source relation value.
std::optional<Sexagesimal> FromTabulated(const Values& s, const Values* s2, std::size_t i,
                                         const Relation& r, int places, Rounding rounding) {
  std::optional<Sexagesimal> x;
  if (r.offset == 0) {
    if (s[i] && (*s2)[i]) x = *s[i] + *(*s2)[i];
  } else {
    const std::size_t a = r.offset > 0 ? i : i - 1, b = r.offset > 0 ? i + 1 : i;
    if ((r.offset > 0 || i > 0) && b < s.size() && s[a] && s[b]) x = *s[b] - *s[a];
  }
  if (!x) return std::nullopt;
  return x->Divided(r.divisor, places, rounding);
}

std::optional<double> FromPrecise(const std::vector<double>& p, const std::vector<double>* p2,
                                  std::size_t i, const Relation& r) {
  double x = 0;
  if (r.offset == 0) {
    x = p[i] + (*p2)[i];
  } else {
    const std::size_t a = r.offset > 0 ? i : i - 1, b = r.offset > 0 ? i + 1 : i;
    if (!(r.offset > 0 || i > 0) || b >= p.size()) return std::nullopt;
    x = p[b] - p[a];
  }
  if (!std::isfinite(x)) return std::nullopt;
  return x / r.divisor;
}

std::vector<Relation> Relations() {
  std::vector<Relation> out = {{"difference to the next row", 1, 1},
                               {"difference from the previous row", -1, 1}};
  for (int k : {2, 3, 4, 5, 6, 10, 12, 15, 20, 30, 60}) {
    out.push_back({"1/" + std::to_string(k) + " of the difference to the next row", 1, k});
    out.push_back({"1/" + std::to_string(k) + " of the difference from the previous row", -1, k});
  }
  return out;
}

/// Scores one relation for target c; fills `d` and returns true when it holds.
bool Test(const Transcription& t, int c, int s, int s2, const Relation& r, Rounding rounding,
          const std::vector<std::vector<double>>& precise, DerivedColumn& d) {
  const Values target = ColumnValues(t, c), src = ColumnValues(t, s);
  const Values src2 = s2 >= 0 ? ColumnValues(t, s2) : Values{};
  const int places = t.columns[static_cast<std::size_t>(c)].places;
  d = {};
  for (std::size_t i = 0; i < t.rows.size(); ++i) {
    if (!target[i]) continue;
    const auto v = FromTabulated(src, s2 >= 0 ? &src2 : nullptr, i, r, places, rounding);
    if (!v) continue;
    ++d.rows;
    if (*v == *target[i]) {
      ++d.matched_tabulated;
      if (d.evidence.empty() && r.divisor > 1) {
        const auto& a = r.offset > 0 ? src[i] : src[i - 1];
        const auto& b = r.offset > 0 ? src[i + 1] : src[i];
        d.evidence = "row " + std::to_string(i + 1) + ": (" + b->ToString() + " - " +
                     a->ToString() + ") / " + std::to_string(r.divisor) + " = " +
                     (*b - *a).ToString() + " / " + std::to_string(r.divisor) + " = " +
                     v->ToString() + ", as tabulated";
      }
    } else {
      d.mismatched_rows.push_back(i);
    }
    const auto p = FromPrecise(precise[static_cast<std::size_t>(s)],
                               s2 >= 0 ? &precise[static_cast<std::size_t>(s2)] : nullptr, i, r);
    if (p && Sexagesimal::FromDouble(*p, places, rounding) == *target[i]) ++d.matched_precise;
  }
  if (d.rows < 3 || std::max(d.matched_tabulated, d.matched_precise) * 10 < d.rows * 8)
    return false;
  d.column = c;
  d.source = s;
  d.other = s2;
  d.relation = r.name;
  d.divisor = r.divisor;
  d.rounding = rounding;
  d.basis = d.matched_tabulated > d.matched_precise   ? "tabulated entries"
            : d.matched_precise > d.matched_tabulated ? "precise values"
                                                      : "cannot tell";
  return true;
}

}  // namespace

std::vector<DerivedColumn> DetectDerivedColumns(const Transcription& table,
                                                const std::vector<std::vector<double>>* given) {
  const int ncol = static_cast<int>(table.columns.size());
  std::vector<std::vector<double>> precise(static_cast<std::size_t>(ncol));
  for (int s = 0; s < ncol; ++s) {
    const bool have = given && static_cast<std::size_t>(s) < given->size() &&
                      !(*given)[static_cast<std::size_t>(s)].empty();
    precise[static_cast<std::size_t>(s)] =
        have ? (*given)[static_cast<std::size_t>(s)] : Smoothed(ColumnValues(table, s));
  }
  std::vector<DerivedColumn> out;
  for (int c = 0; c < ncol; ++c) {
    std::optional<DerivedColumn> best;
    auto consider = [&](int s, int s2, const Relation& r) {
      for (Rounding rd : {Rounding::kNearest, Rounding::kTruncate}) {
        DerivedColumn d;
        if (Test(table, c, s, s2, r, rd, precise, d) &&
            (!best || std::max(d.matched_tabulated, d.matched_precise) >
                          std::max(best->matched_tabulated, best->matched_precise)))
          best = d;
      }
    };
    for (int s = 0; s < ncol; ++s) {
      if (s == c) continue;
      for (const auto& r : Relations()) consider(s, -1, r);
      for (int s2 = s + 1; s2 < ncol; ++s2) {
        if (s2 != c) consider(s, s2, {"sum", 0, 1});
      }
    }
    if (best) {
      auto& d = *best;
      const std::string rel =
          d.relation == "sum"
              ? "the sum of " + table.columns[static_cast<std::size_t>(d.source)].name + " and " +
                    table.columns[static_cast<std::size_t>(d.other)].name
              : d.relation + " of " + table.columns[static_cast<std::size_t>(d.source)].name;
      d.evidence = table.columns[static_cast<std::size_t>(c)].name + " is " + rel + " (" +
                   (d.rounding == Rounding::kNearest ? "rounded" : "truncated") + ") at " +
                   std::to_string(d.matched_tabulated) + " of " + std::to_string(d.rows) +
                   " rows from the tabulated entries, " + std::to_string(d.matched_precise) +
                   " from precise values: " +
                   (d.basis == "cannot tell" ? std::string("the entries cannot tell which")
                                             : "made from the " + d.basis) +
                   (d.evidence.empty() ? "" : "; e.g. " + d.evidence);
      out.push_back(d);
    }
  }
  return out;
}

}  // namespace apograph::estimate
