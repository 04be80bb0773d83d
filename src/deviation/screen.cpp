#include "deviation/screen.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace apograph::deviation {
namespace {

constexpr double kFloorScatter = 0.5;  // rounding alone scatters entries by this much

double Median(std::vector<double> v) {
  if (v.empty()) return 0;
  std::nth_element(v.begin(), v.begin() + static_cast<std::ptrdiff_t>(v.size() / 2), v.end());
  return v[v.size() / 2];
}

/// Weighted least-squares quadratic through (x, y); returns its value at 0.
std::optional<double> QuadraticAtZero(const std::vector<double>& x, const std::vector<double>& y,
                                      const std::vector<double>& w) {
  double s[5] = {0, 0, 0, 0, 0}, t[3] = {0, 0, 0};
  for (std::size_t i = 0; i < x.size(); ++i) {
    double p = w[i];
    for (int k = 0; k < 5; ++k, p *= x[i]) s[k] += p;
    t[0] += w[i] * y[i];
    t[1] += w[i] * y[i] * x[i];
    t[2] += w[i] * y[i] * x[i] * x[i];
  }
  // Solve [[s0 s1 s2][s1 s2 s3][s2 s3 s4]] a = t by Cramer's rule.
  auto det3 = [](double a, double b, double c, double d, double e, double f, double g, double h,
                 double i) {
    return a * (e * i - f * h) - b * (d * i - f * g) + c * (d * h - e * g);
  };
  const double d = det3(s[0], s[1], s[2], s[1], s[2], s[3], s[2], s[3], s[4]);
  if (std::fabs(d) < 1e-9) return std::nullopt;
  return det3(t[0], s[1], s[2], t[1], s[2], s[3], t[2], s[3], s[4]) / d;
}

/// Each point's residual against the weighted quadratic (a huge value when
/// the weights leave too few points).
std::vector<double> Residuals(const std::vector<double>& xs, const std::vector<double>& ys,
                              const std::vector<double>& w) {
  std::vector<double> out;
  for (std::size_t m = 0; m < xs.size(); ++m) {
    std::vector<double> shifted = xs;
    for (auto& v : shifted) v -= xs[m];
    auto at = QuadraticAtZero(shifted, ys, w);
    out.push_back(at ? ys[m] - *at : 1e300);
  }
  return out;
}

/// Robust local fit at row i from rows within the window (row i left out).
std::optional<double> LocalFit(const std::vector<std::optional<double>>& y, std::size_t i,
                               int half) {
  std::vector<double> xs, ys;
  for (int k = -half; k <= half; ++k) {
    const std::ptrdiff_t j = static_cast<std::ptrdiff_t>(i) + k;
    if (k == 0 || j < 0 || j >= static_cast<std::ptrdiff_t>(y.size()) ||
        !y[static_cast<std::size_t>(j)])
      continue;
    xs.push_back(k);
    ys.push_back(*y[static_cast<std::size_t>(j)]);
  }
  if (xs.size() < 4) return std::nullopt;
  // Start from the curve that leaves out the single neighbour, or the pair of
  // adjacent neighbours, whose omission fits the rest best (least median of
  // residuals): one or two slips nearby cannot pull it.
  std::vector<double> w(xs.size(), 1.0);
  double best = INFINITY;
  for (std::size_t a = 0; a <= xs.size(); ++a) {
    for (std::size_t len = 1; len <= 2; ++len) {
      std::vector<double> trial(xs.size(), 1.0);
      for (std::size_t m = a; m < a + len && m < xs.size(); ++m) trial[m] = 0;
      std::vector<double> abs;
      for (double r : Residuals(xs, ys, trial)) abs.push_back(std::fabs(r));
      const double med = Median(abs);
      if (med < best) {
        best = med;
        w = trial;
      }
    }
  }
  // Then Tukey's biweight, a few rounds.
  for (int iter = 0; iter < 3; ++iter) {
    const auto res = Residuals(xs, ys, w);
    std::vector<double> abs;
    for (double r : res) abs.push_back(std::fabs(r));
    const double scale = std::max(kFloorScatter, 1.4826 * Median(abs));
    for (std::size_t m = 0; m < xs.size(); ++m) {
      const double u = res[m] / (4.685 * scale);
      w[m] = std::fabs(u) >= 1 ? 0 : (1 - u * u) * (1 - u * u);
    }
  }
  return QuadraticAtZero(xs, ys, w);
}

std::string ArgText(const Transcription& t, std::size_t row) {
  if (!t.rows[row].argument.raw.empty()) return t.rows[row].argument.raw;
  if (auto e = t.ExpectedArgument(row)) return e->ToString();
  return "row " + std::to_string(row + 1);
}

std::string SecondDifferences(const std::vector<std::optional<double>>& y, std::size_t i) {
  std::string out;
  for (std::ptrdiff_t j = static_cast<std::ptrdiff_t>(i) - 1;
       j <= static_cast<std::ptrdiff_t>(i) + 1; ++j) {
    if (j < 1 || j + 1 >= static_cast<std::ptrdiff_t>(y.size())) continue;
    const auto a = y[static_cast<std::size_t>(j - 1)], b = y[static_cast<std::size_t>(j)],
               c = y[static_cast<std::size_t>(j + 1)];
    if (!a || !b || !c) continue;
    char buf[32];
    std::snprintf(buf, sizeof buf, "%+g", std::round(*c - 2 * *b + *a));
    out += (out.empty() ? "" : ", ") + std::string(buf);
  }
  return out;
}

/// A column's readings in units of its last place, unwrapped across a mean
/// motion's 360 (nullopt where nothing is read).
std::vector<std::optional<double>> UnwrappedUnits(const Transcription& table, std::size_t col,
                                                  double scale) {
  const double turn = 360 * scale;
  std::vector<std::optional<double>> y(table.rows.size());
  double offset = 0, last = NAN;
  for (std::size_t r = 0; r < y.size(); ++r) {
    const Cell& c = table.rows[r].cells[col];
    if (c.state != CellState::kRead || !c.value) continue;
    double v = c.value->ToDouble() * scale;
    if (std::isfinite(last) && std::fabs(v + offset - last) > turn / 2)
      offset += v + offset < last ? turn : -turn;
    y[r] = v + offset;
    last = *y[r];
  }
  return y;
}

/// A suspect at row r with what the witness shows there, nothing judged yet.
Suspect SuspectAt(const Transcription& table, int column, std::size_t r) {
  const auto col = static_cast<std::size_t>(column);
  const Cell& c = table.rows[r].cells[col];
  Suspect s;
  s.column = column;
  s.column_name = table.columns[col].name;
  s.row = r;
  s.arg = ArgText(table, r);
  s.tabulated = c.raw.empty() && c.value ? c.value->ToString() : c.raw;
  return s;
}

/// Each suspect the script's slips explain, explained against the curve
/// (`against`: the curve where suspect, the reading elsewhere).
void AttachExplanations(const Transcription& table, const ColumnValues& against,
                        const NumeralScript& script, std::vector<Suspect>& out) {
  ExplainOptions eo;
  eo.tolerance = 1;  // the curve is only an estimate of the original
  eo.max_shift = 0;  // runs need a model; the curve follows a slid run
  for (const auto& f : ExplainColumn(table, against, script, eo)) {
    // Only slips that reach the curve are worth showing without a model.
    const SlipClass best = f.best().cls;
    if (best == SlipClass::kUnexplained || best == SlipClass::kComputational) continue;
    for (auto& s : out) {
      if (s.row == f.cells.front().row) s.explanations = f.explanations;
    }
  }
}

}  // namespace

std::vector<Suspect> ScreenColumn(const Transcription& table, int column,
                                  const NumeralScript* script, const ScreenOptions& options) {
  const auto col = static_cast<std::size_t>(column);
  const int places = table.columns.at(col).places;
  const double scale = std::pow(60.0, places);
  const std::size_t n = table.rows.size();
  const std::vector<std::optional<double>> y = UnwrappedUnits(table, col, scale);
  std::vector<std::optional<double>> fit(n);
  std::vector<double> abs;
  for (std::size_t r = 0; r < n; ++r) {
    if (!y[r]) continue;
    fit[r] = LocalFit(y, r, options.half_window);
    if (fit[r]) abs.push_back(std::fabs(*y[r] - *fit[r]));
  }
  const double scatter = std::max(kFloorScatter, 1.4826 * Median(abs));
  const double limit = std::max(options.threshold * scatter, options.min_units);

  std::vector<Suspect> out;
  ColumnValues against;  // the curve where suspect, the reading elsewhere
  against.column = column;
  against.computed.assign(n, std::nullopt);
  for (std::size_t r = 0; r < n; ++r) {
    const Cell& c = table.rows[r].cells[col];
    Suspect s = SuspectAt(table, column, r);
    if (c.state != CellState::kRead) {
      s.diff_units = NAN;
      s.score = 1;
      s.evidence =
          std::string(c.state == CellState::kBlank ? "nothing written" : "not fully readable") +
          " in the witness";
      out.push_back(std::move(s));
      continue;
    }
    if (!y[r]) continue;
    against.computed[r] = c.value;
    if (!fit[r]) continue;
    const double res = *y[r] - *fit[r];
    if (std::fabs(res) <= limit) continue;
    const double back = *fit[r] - (*y[r] - c.value->ToDouble() * scale);  // undo the unwrapping
    s.expected =
        Sexagesimal::FromUnits(static_cast<Sexagesimal::Units>(std::llround(back)), places);
    s.diff_units = res;
    s.score = std::fabs(res) / (std::fabs(res) + options.threshold * scatter);
    char buf[160];
    std::snprintf(buf, sizeof buf,
                  "the entry stands %+.1f units off the smooth curve through its neighbours "
                  "(%s expected; the column's scatter is %.1f units)",
                  res, s.expected->ToString().c_str(), scatter);
    s.evidence = buf;
    const std::string dd = SecondDifferences(y, r);
    if (!dd.empty()) s.evidence += "; second differences around it: " + dd;
    against.computed[r] = s.expected;
    out.push_back(std::move(s));
  }
  if (script) AttachExplanations(table, against, *script, out);
  return out;
}

}  // namespace apograph::deviation
