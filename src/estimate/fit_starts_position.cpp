// Starts for tables of positions: a mean longitude from the column's slope,
// an equation's harmonic read as an eccentric or an epicycle, and for a
// planet a scan with its rates tied to the mean sun (fit_starts.hpp,
// PositionStarts).
#include <algorithm>
#include <cmath>
#include <functional>
#include <numbers>
#include <utility>

#include "estimate/fit_solver.hpp"
#include "estimate/fit_starts.hpp"
#include "estimate/fit_starts_internal.hpp"

namespace apograph::estimate::internal {

namespace {

/// Least squares for the coefficients of `basis` (functions of t) in
/// y ~ sum c_j basis_j(t); the residual sum of squares in `rss`. Empty when
/// singular.
template <typename Basis>
std::vector<double> LeastSquares(const std::vector<double>& t, const std::vector<double>& y, int k,
                                 Basis basis, double* rss) {
  std::vector<double> A(static_cast<std::size_t>(k) * static_cast<std::size_t>(k), 0.0),
      b(static_cast<std::size_t>(k));
  std::vector<double> row(static_cast<std::size_t>(k));
  for (std::size_t i = 0; i < t.size(); ++i) {
    basis(t[i], row.data());
    for (int a = 0; a < k; ++a) {
      b[a] += row[a] * y[i];
      for (int c = 0; c < k; ++c) A[a * k + c] += row[a] * row[c];
    }
  }
  const std::vector<double> inv = Inverse(A, k);
  if (inv.empty()) return {};
  std::vector<double> c(static_cast<std::size_t>(k), 0.0);
  for (int a = 0; a < k; ++a)
    for (int j = 0; j < k; ++j) c[a] += inv[a * k + j] * b[j];
  double s = 0;
  for (std::size_t i = 0; i < t.size(); ++i) {
    basis(t[i], row.data());
    double f = 0;
    for (int a = 0; a < k; ++a) f += c[a] * row[a];
    s += (y[i] - f) * (y[i] - f);
  }
  if (rss) *rss = s;
  return c;
}

constexpr double kDeg = std::numbers::pi / 180;

/// The entries of one column as (argument, longitude unwrapped by steps of
/// less than half a turn), in argument order.
void Unwrapped(const std::vector<Observation>& obs, std::vector<double>& t,
               std::vector<double>& u) {
  std::vector<std::pair<double, double>> pts;
  for (const auto& o : obs) pts.emplace_back(o.arg, o.value.ToDouble());
  std::sort(pts.begin(), pts.end());
  for (std::size_t i = 0; i < pts.size(); ++i) {
    t.push_back(pts[i].first);
    u.push_back(i == 0 ? pts[i].second : u.back() + Wrap180(pts[i].second - pts[i - 1].second));
  }
}

/// A harmonic a sin(w) + b cos(w) of a longitude, as an amplitude in
/// parts of 60 (60 sin of the greatest angle) and a phase: the angle w0 for
/// which the term is A sin(w + w0).
std::pair<double, double> Harmonic(double a, double b) {
  const double amplitude = std::min(std::hypot(a, b), 80.0);
  return {60 * std::sin(amplitude * kDeg), std::atan2(b, a) / kDeg};
}

/// Sets free parameter `role` of x to v when it is free.
void SetRole(const model::Model& m, const FitProblem& p, std::vector<double>& x,
             model::ParamRole role, double v) {
  const int j = FreeIndex(m, p, role, x.size());
  if (j >= 0) x[static_cast<std::size_t>(j)] = v;
}

/// Sets the free parameter named `name` (the geometric quantities e and r).
void SetNamed(const model::Model& m, const FitProblem& p, std::vector<double>& x, const char* name,
              double v) {
  for (int j = 0; j < static_cast<int>(x.size()); ++j) {
    const int i = p.ModelIndex(j);
    if (i >= 0 && m.params()[static_cast<std::size_t>(i)].name == name)
      x[static_cast<std::size_t>(j)] = v;
  }
}

/// The frequency (deg per unit of the argument) in [low, high] whose
/// harmonic, with a straight line, leaves the smallest residual (steps of
/// at most 20 degrees of phase over the span).
double BestFrequency(const std::vector<double>& t, const std::vector<double>& u, double t0,
                     double low, double high) {
  const double span = std::max(t.back() - t.front(), 1.0);
  const double step = std::min(20.0 / span, std::max((high - low) / 50, 1e-6));
  double best = 0, best_rss = INFINITY;
  for (double f = std::max(low, step); f <= high; f += step) {
    double rss = 0;
    const auto c = LeastSquares(
        t, u, 4,
        [&](double x, double* r) {
          r[0] = 1, r[1] = x - t0, r[2] = std::sin(f * x * kDeg), r[3] = std::cos(f * x * kDeg);
        },
        &rss);
    if (!c.empty() && rss < best_rss) best_rss = rss, best = f;
  }
  return best;
}

/// What a table of positions' model has, by role.
struct PositionShape {
  bool trend = false;        ///< a mean motion in longitude (kRate)
  bool centre = false;       ///< an apogee: the equation of centre at the mean motion's rate
  bool anomaly = false;      ///< a motion in anomaly (kAnomalyRate)
  double low = 0, high = 0;  ///< the rate in anomaly's range
};

PositionShape ShapeOf(const model::Model& m, const FitProblem& p, std::size_t free) {
  PositionShape s;
  s.trend = FreeIndex(m, p, model::ParamRole::kRate, free) >= 0;
  s.centre = FreeIndex(m, p, model::ParamRole::kApogee, free) >= 0;
  s.anomaly = FreeIndex(m, p, model::ParamRole::kAnomalyRate, free) >= 0;
  const int a = m.ParamIndex(model::ParamRole::kAnomalyRate);
  if (a >= 0) {
    s.low = m.params()[static_cast<std::size_t>(a)].low;
    s.high = m.params()[static_cast<std::size_t>(a)].high;
  }
  return s;
}

/// The anomaly's harmonic read as an epicycle (or an equation by date):
/// the radius (or eccentricity), and the anomaly at the epoch; for
/// magnitudes, the harmonic at twice the rate, two phases 180 apart.
std::vector<std::pair<double, double>> AnomalyStarts(double a, double b, bool magnitude) {
  if (!magnitude) {
    const auto [r, g0] = Harmonic(a, b);
    return {{r, Wrap360(g0)}};
  }
  // |E sin g| ~ 2E/pi - (4E/3pi) cos 2g: the harmonic A cos(F t - psi) with
  // 2 g0 + 180 = -psi.
  const double amplitude = std::hypot(a, b) * 3 * std::numbers::pi / 4;
  const double psi = std::atan2(a, b) / kDeg;
  const double g0 = Wrap360((-psi - 180) / 2);
  const double r = 60 * std::sin(std::min(amplitude, 80.0) * kDeg);
  return {{r, g0}, {r, Wrap360(g0 + 180)}};
}

/// Starts an equation by date takes from ScanEquation (judgement: the
/// best basin and one rival, as GridStarts keeps two).
constexpr std::size_t kEquationStarts = 2;

/// A harmonic a sin(f t) + b cos(f t) at rate f, and the median distance
/// of every entry from it.
struct EquationGuess {
  double f = 0, a = 0, b = 0, score = INFINITY;
};

/// The harmonic at rate `f` (no line: an equation by date has none) fitted
/// to the entries, then refitted on those within three robust scales of it
/// (the usual rejection rule: up to a fifth of the entries may be a
/// copyist's slips).
EquationGuess FitEquation(const std::vector<double>& t, const std::vector<double>& u, double f) {
  EquationGuess q{f};
  const auto basis = [f](double v, double* r) {
    r[0] = std::sin(f * v * kDeg), r[1] = std::cos(f * v * kDeg);
  };
  std::vector<double> kt = t, ku = u, d(t.size());
  for (int pass = 0; pass < 2; ++pass) {
    const auto c = LeastSquares(kt, ku, 2, basis, nullptr);
    if (c.empty()) return q;
    q.a = c[0], q.b = c[1];
    for (std::size_t i = 0; i < t.size(); ++i) {
      double r[2];
      basis(t[i], r);
      d[i] = std::fabs(u[i] - q.a * r[0] - q.b * r[1]);
    }
    q.score = Median(d);
    kt.clear(), ku.clear();
    for (std::size_t i = 0; i < t.size(); ++i) {
      if (d[i] <= 3 * 1.4826 * q.score) kt.push_back(t[i]), ku.push_back(u[i]);
    }
    if (kt.size() < 4) return q;
  }
  return q;
}

/// Starts of an equation by date (a model with a rate in anomaly and no
/// mean motion): the rates in [low, high] whose harmonic (FitEquation)
/// leaves the smallest median distance, at most `most`, each the best of
/// its own basin (a local minimum over the scan). Over an arc of a few
/// tens of degrees of anomaly the curvature fixes the rate (a sine's second
/// derivative is -f^2 times its value); a harmonic with a line beside it
/// follows such an arc at almost any rate (measured on the shared
/// generator: 8 equations by date on seeds 1-600 and 1201-1500, arcs of 10
/// to 60 degrees, fitted at rates of 8 to 24 deg/day for 0;2 to 0;37).
/// The rates: the phase over the span from 2 degrees (below that an arc
/// shows no curvature) up by a tenth at a time, steps of at most 20
/// degrees of phase (as BestFrequency), so that slow rates over a short
/// span are not skipped.
std::vector<EquationGuess> ScanEquation(const std::vector<double>& t, const std::vector<double>& u,
                                        double low, double high, std::size_t most) {
  const double span = std::max(t.back() - t.front(), 1.0);
  std::vector<EquationGuess> scan;
  for (double f = std::max(low, 2.0 / span); f <= high; f += std::min(0.1 * f, 20.0 / span))
    scan.push_back(FitEquation(t, u, f));
  std::vector<EquationGuess> minima;
  for (std::size_t k = 0; k < scan.size(); ++k) {
    const bool left = k == 0 || scan[k].score <= scan[k - 1].score;
    const bool right = k + 1 == scan.size() || scan[k].score <= scan[k + 1].score;
    if (left && right && std::isfinite(scan[k].score)) minima.push_back(scan[k]);
  }
  std::sort(minima.begin(), minima.end(),
            [](const EquationGuess& a, const EquationGuess& b) { return a.score < b.score; });
  if (minima.size() > most) minima.resize(most);
  return minima;
}

/// Degrees beyond which no equation by date goes (judgement: the sun's and
/// the moon's greatest equations are about 2;23 and 5;1 degrees, common
/// practice; the margin leaves room for other bodies on a simple
/// eccentric).
constexpr double kLargestEquation = 10;

/// The mean sun's daily motion, 0;59,8,19,48 deg/day (common practice).
constexpr double kMeanSun = 59.0 / 60 + 8.0 / 3600 + 19.0 / 216000 + 48.0 / 12960000;

/// A start of the tied scan: rate in anomaly, the epicycle's radius, the
/// anomaly at the first argument, the mean longitude there, and the median
/// distance (degrees) of the entries from what these compute.
struct EpicycleGuess {
  double f = 0, r = 0, g = 0, radix = 0, score = INFINITY;
};

/// The median distance of the entries (sample `rows`) from the planet with
/// no eccentricity, mean longitude at t0 set to the entries' median.
double ScoreEpicycle(const std::vector<double>& t, const std::vector<double>& u,
                     const std::vector<std::size_t>& rows, double rate, EpicycleGuess& q,
                     std::vector<double>& y) {
  const double t0 = t.front();
  for (std::size_t k = 0; k < rows.size(); ++k) {
    const std::size_t i = rows[k];
    const double g = (q.g + q.f * (t[i] - t0)) * kDeg;
    y[k] = u[i] - rate * (t[i] - t0) - std::atan2(q.r * std::sin(g), 60 + q.r * std::cos(g)) / kDeg;
  }
  q.radix = Median(y);
  for (double& v : y) v = std::fabs(v - q.radix);
  return q.score = Median(y);
}

/// Radii of the epicycle tried by the tied scan (parts of 60; judgement:
/// the planets' epicycles run from about 6 to 45, steps of a few parts).
constexpr double kScanRadii[] = {3, 6, 9, 12, 16, 20, 25, 30, 35, 40, 45};

/// `q` brought to the bottom of its basin by a pattern search on the same
/// score (steps from half the scan's down to 1/128 of them).
void RefineGuess(const std::vector<double>& t, const std::vector<double>& u,
                 const std::vector<std::size_t>& rows, double low, double high, double step,
                 const std::function<double(double)>& rate_of, bool held_r, EpicycleGuess& q) {
  std::vector<double> y(rows.size());
  double df = step / 2, dr = 2, dg = 5;
  for (int round = 0; round < 7; ++round, df /= 2, dr /= 2, dg /= 2) {
    for (int pass = 0; pass < 3; ++pass) {
      bool moved = false;
      for (int j = 0; j < 3; ++j) {
        if (j == 1 && held_r) continue;
        for (double dir : {1.0, -1.0}) {
          EpicycleGuess x = q;
          (j == 0 ? x.f : j == 1 ? x.r : x.g) += dir * (j == 0 ? df : j == 1 ? dr : dg);
          if (x.f < low || x.f > high || x.r < 1 || x.r > 59) continue;
          if (ScoreEpicycle(t, u, rows, rate_of(x.f), x, y) < q.score) q = x, moved = true;
        }
      }
      if (!moved) break;
    }
  }
}

/// The three best guesses over a grid of the rate in anomaly (its range,
/// steps moving the phase at most 5 degrees over the span, at most 150
/// rates; judgement), the radius (kScanRadii) and the anomaly at the start
/// (steps of 10 degrees), each refined: the planet itself computed (no
/// eccentricity), not a harmonic, since a large epicycle's equation is far
/// from one harmonic, and over a span shorter than its period a harmonic
/// of almost any rate follows the entries. A radius the fit holds (`held_r`,
/// NaN when free) is the only one tried: the rates and the anomaly that go
/// with it lie elsewhere on the ridge than those of the nearest radius of
/// the scan.
std::vector<EpicycleGuess> ScanEpicycle(const std::vector<double>& t, const std::vector<double>& u,
                                        double low, double high,
                                        const std::function<double(double)>& rate_of,
                                        double held_r) {
  const double span = std::max(t.back() - t.front(), 1.0);
  const double step = std::max(5.0 / span, (high - low) / 150);
  const std::vector<std::size_t> rows = Spread(t.size(), 40);
  std::vector<double> y(rows.size());
  std::vector<EpicycleGuess> best;  // the best at each rate
  for (double f = std::max(low, step / 2); f <= high; f += step) {
    EpicycleGuess b;
    const bool held = std::isfinite(held_r);
    for (double r : held ? std::vector<double>{held_r}
                         : std::vector<double>(std::begin(kScanRadii), std::end(kScanRadii))) {
      for (double g = 0; g < 360; g += 10) {
        EpicycleGuess q{f, r, g};
        if (ScoreEpicycle(t, u, rows, rate_of(f), q, y) < b.score) b = q;
      }
    }
    best.push_back(b);
  }
  const auto by_score = [](const EpicycleGuess& a, const EpicycleGuess& b) {
    return a.score < b.score;
  };
  std::sort(best.begin(), best.end(), by_score);
  if (best.size() > 3) best.resize(3);
  for (EpicycleGuess& b : best)
    RefineGuess(t, u, rows, low, high, step, rate_of, std::isfinite(held_r), b);
  std::sort(best.begin(), best.end(), by_score);
  return best;
}

/// The start of a guess of the scan, its anomaly and longitude at t0 brought
/// to the epoch (small eccentricity).
std::vector<double> GuessStart(const model::Model& model, const FitProblem& problem,
                               const PositionShape& shape, std::vector<double> x, double t0,
                               double rate, const EpicycleGuess& q) {
  SetRole(model, problem, x, model::ParamRole::kRate, rate);
  SetRole(model, problem, x, model::ParamRole::kRadix, Wrap360(q.radix - rate * t0));
  if (shape.centre) SetNamed(model, problem, x, "e", 1.0);
  SetNamed(model, problem, x, "r", q.r);
  SetRole(model, problem, x, model::ParamRole::kAnomalyRate, q.f);
  SetRole(model, problem, x, model::ParamRole::kAnomalyRadix, Wrap360(q.g - q.f * t0));
  return x;
}

/// The epicycle's radius when the fit holds it, else NaN.
double HeldRadius(const model::Model& m, const FitProblem& p) {
  const int i = m.ParamIndex("r");
  if (i < 0) return NAN;
  for (int j = 0; j < p.num_free(); ++j) {
    if (p.ModelIndex(j) == i) return NAN;
  }
  return p.Held(static_cast<std::size_t>(i));
}

/// Starts for a planet with its rates tied as the planetary models tie them
/// (common practice): an inner planet's mean longitude moves with the mean
/// sun, an outer planet's motions in longitude and in anomaly add up to the
/// mean sun's. With the rate in longitude given by the rate in anomaly, the
/// entries less that line are one harmonic (the epicycle): for each tie the
/// rate in anomaly whose harmonic leaves the smallest residual, and the two
/// best of a scan computing the planet itself (ScanEpicycle). The free
/// line and harmonic (PositionStarts) cannot separate the two over a span
/// shorter than the anomaly's period, nor follow a large epicycle (Venus,
/// Mars), whose equation is far from one harmonic; nor can the harmonic
/// alone over a short arc (measured on the shared generator, seeds 1..600:
/// 11 of 44 planets' longitudes refused with the harmonic alone, none
/// with the scan).
std::vector<std::vector<double>> TiedStarts(const model::Model& model, const FitProblem& problem,
                                            const std::vector<double>& t,
                                            const std::vector<double>& u,
                                            const PositionShape& shape,
                                            const std::vector<double>& x) {
  const double t0 = t.front(), span = std::max(t.back() - t0, 1.0);
  const double step = std::min(5.0 / span, std::max((shape.high - shape.low) / 200, 1e-6));
  std::vector<std::vector<double>> out;
  for (bool inner : {true, false}) {
    const auto rate_of = [&](double f) { return inner ? kMeanSun : kMeanSun - f; };
    double best_rss = INFINITY, best_f = 0;
    std::vector<double> best_c;
    for (double f = std::max(shape.low, step); f <= (inner ? shape.high : kMeanSun); f += step) {
      std::vector<double> y(u.size());
      for (std::size_t i = 0; i < u.size(); ++i) y[i] = u[i] - rate_of(f) * (t[i] - t0);
      double rss = 0;
      const auto c = LeastSquares(
          t, y, 3,
          [&](double v, double* r) {
            r[0] = 1, r[1] = std::sin(f * v * kDeg), r[2] = std::cos(f * v * kDeg);
          },
          &rss);
      if (!c.empty() && rss < best_rss) best_rss = rss, best_f = f, best_c = c;
    }
    if (best_c.empty()) continue;
    std::vector<double> y = x;
    SetRole(model, problem, y, model::ParamRole::kRate, rate_of(best_f));
    SetRole(model, problem, y, model::ParamRole::kRadix, Wrap360(best_c[0] - rate_of(best_f) * t0));
    if (shape.centre) SetNamed(model, problem, y, "e", 1.0);
    const auto [r, g0] = AnomalyStarts(best_c[1], best_c[2], false).front();
    SetNamed(model, problem, y, "r", std::max(r, 1.0));
    SetRole(model, problem, y, model::ParamRole::kAnomalyRate, best_f);
    SetRole(model, problem, y, model::ParamRole::kAnomalyRadix, g0);
    out.push_back(std::move(y));
    // The two best of the scan computing the planet (see ScanEpicycle).
    const auto guesses = ScanEpicycle(t, u, shape.low, inner ? shape.high : kMeanSun, rate_of,
                                      HeldRadius(model, problem));
    for (std::size_t k = 0; k < guesses.size() && k < 2; ++k)
      out.push_back(GuessStart(model, problem, shape, x, t0, rate_of(guesses[k].f), guesses[k]));
  }
  return out;
}

}  // namespace

bool Longitudes(const std::vector<Observation>& obs) {
  return std::none_of(obs.begin(), obs.end(),
                      [](const Observation& o) { return o.value.negative(); }) &&
         std::any_of(obs.begin(), obs.end(),
                     [](const Observation& o) { return o.value.ToDouble() > kLargestEquation; });
}

std::vector<std::vector<double>> PositionStarts(const model::Model& model,
                                                const FitProblem& problem,
                                                const std::vector<Observation>& obs,
                                                const std::vector<double>& x0) {
  if (model.traits().kind != model::ModelKind::kPosition || obs.size() < 8) return {};
  std::vector<double> t, u;
  Unwrapped(obs, t, u);
  const model::SignForm sign = model.ResolvedSign(problem.practice().sign);
  if (sign == model::SignForm::kNegated)
    for (double& v : u) v = -v;
  const bool magnitude = sign == model::SignForm::kMagnitude;
  const PositionShape shape = ShapeOf(model, problem, x0.size());
  const double t0 = t.front();
  double rss = 0;
  const auto line = LeastSquares(
      t, u, 2, [&](double x, double* r) { r[0] = 1, r[1] = x - t0; }, &rss);
  if (line.empty()) return {};
  const double rate = shape.trend ? line[1] : 0;
  const double m = magnitude ? 2 : 1;
  const double f = shape.anomaly ? BestFrequency(t, u, t0, m * shape.low, m * shape.high) : 0;
  // Line, the harmonic at the rate in longitude (eccentricity, apogee) and
  // the harmonic at the rate in anomaly (the epicycle, or the equation).
  auto fit = [&](bool centre) {
    const int k = 2 + (centre ? 2 : 0) + (shape.anomaly ? 2 : 0);
    return LeastSquares(
        t, u, k,
        [&](double x, double* r) {
          r[0] = 1, r[1] = x - t0;
          int j = 2;
          if (centre) r[j++] = std::sin(rate * x * kDeg), r[j++] = std::cos(rate * x * kDeg);
          if (shape.anomaly) r[j++] = std::sin(f * x * kDeg), r[j++] = std::cos(f * x * kDeg);
        },
        &rss);
  };
  auto c = fit(shape.centre);
  // Over a short span the harmonic at the mean motion's rate is nearly a
  // straight line: the full basis is then ill-conditioned and its line
  // meaningless (a rate of -917 deg/day from 91 days of a planet). The line
  // and the anomaly alone then give the rates, with a small eccentricity.
  bool centre = shape.centre;
  if (centre && (c.empty() || std::fabs(c[1] - line[1]) > 0.2 * std::fabs(line[1]) + 0.01)) {
    centre = false;
    c = fit(false);
  }
  if (c.empty()) return {};
  std::vector<double> x = x0;
  const double radix = Wrap360(c[0] - c[1] * t0);
  SetRole(model, problem, x, model::ParamRole::kRate, c[1]);
  SetRole(model, problem, x, model::ParamRole::kRadix, radix);
  int j = 2;
  if (centre) {
    // The equation of centre: -(e/60) sin(m - A) in radians, with m = rate t
    // + radix: a sin(rate t) + b cos(rate t) = -E sin(rate t + radix - A).
    const auto [e, phase] = Harmonic(-c[j], -c[j + 1]);
    SetNamed(model, problem, x, "e", std::max(e, 0.1));
    SetRole(model, problem, x, model::ParamRole::kApogee, Wrap360(radix - phase));
    j += 2;
  } else if (shape.centre) {
    SetNamed(model, problem, x, "e", 1.0);
  }
  if (!shape.anomaly) return {x};
  // The epicycle (or the equation by date): +(r/60) sin(g), g = f t + g0.
  std::vector<std::vector<double>> out;
  // Longitudes are never negative, and a column that stays within
  // kLargestEquation of 0 is an equation by date (a planet's seven
  // parameters, its rates tied, mimic one): no tied starts there.
  if (shape.trend && !magnitude && Longitudes(obs))
    out = TiedStarts(model, problem, t, u, shape, x);
  // An equation by date with no displacement: its harmonic alone. A
  // magnitude that keeps one sign over the span is the signed equation or
  // its negation, which the harmonic cannot tell apart (the eccentric's
  // equation is steeper near the perigee than near the apogee): both.
  if (!shape.trend && !shape.centre && x.size() == problem.lows().size()) {
    for (const auto& q : ScanEquation(t, u, shape.low, shape.high, kEquationStarts)) {
      const auto [e, g0] = Harmonic(q.a, q.b);
      for (double turn : magnitude ? std::vector<double>{0, 180} : std::vector<double>{0}) {
        std::vector<double> y = x;
        SetNamed(model, problem, y, "e", std::max(e, 1.0));
        SetRole(model, problem, y, model::ParamRole::kAnomalyRate, q.f);
        SetRole(model, problem, y, model::ParamRole::kAnomalyRadix, Wrap360(g0 + turn));
        out.push_back(std::move(y));
      }
    }
  }
  for (const auto& [r, g0] : AnomalyStarts(c[j], c[j + 1], magnitude)) {
    std::vector<double> y = x;
    SetNamed(model, problem, y, shape.trend ? "r" : "e", std::max(r, 1.0));
    SetRole(model, problem, y, model::ParamRole::kAnomalyRate, f / m);
    SetRole(model, problem, y, model::ParamRole::kAnomalyRadix, g0);
    out.push_back(std::move(y));
  }
  return out;
}

}  // namespace apograph::estimate::internal
