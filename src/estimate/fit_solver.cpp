#include "estimate/fit_solver.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

namespace apograph::estimate::internal {
namespace {

/// Solves the k x k system A d = b in place by Cholesky with a fallback to
/// Gaussian elimination; false when singular.
bool SolveSmall(std::vector<double> A, std::vector<double>& b, int k) {
  for (int c = 0; c < k; ++c) {
    int p = c;
    for (int r = c + 1; r < k; ++r) {
      if (std::fabs(A[r * k + c]) > std::fabs(A[p * k + c])) p = r;
    }
    if (std::fabs(A[p * k + c]) < 1e-300) return false;
    if (p != c) {
      for (int j = 0; j < k; ++j) std::swap(A[c * k + j], A[p * k + j]);
      std::swap(b[c], b[p]);
    }
    for (int r = c + 1; r < k; ++r) {
      const double f = A[r * k + c] / A[c * k + c];
      for (int j = c; j < k; ++j) A[r * k + j] -= f * A[c * k + j];
      b[r] -= f * b[c];
    }
  }
  for (int c = k - 1; c >= 0; --c) {
    double s = b[c];
    for (int j = c + 1; j < k; ++j) s -= A[c * k + j] * b[j];
    b[c] = s / A[c * k + c];
  }
  return true;
}

/// Inverse of a small symmetric matrix (empty when singular).
std::vector<double> Inverse(const std::vector<double>& A, int k) {
  std::vector<double> inv(static_cast<std::size_t>(k * k));
  for (int c = 0; c < k; ++c) {
    std::vector<double> e(static_cast<std::size_t>(k), 0.0);
    e[c] = 1;
    if (!SolveSmall(A, e, k)) return {};
    for (int r = 0; r < k; ++r) inv[r * k + c] = e[r];
  }
  return inv;
}

struct Buffers {
  std::vector<double> r, r2, J, J2, v, v2, A, H, g, trial, delta, M;
  const std::vector<std::size_t>* subset = nullptr;  ///< entries used (all when null)
  std::size_t n = 0;

  Buffers(std::size_t entries, int k)
      : r(entries),
        r2(entries),
        J(entries * static_cast<std::size_t>(k)),
        J2(J.size()),
        v(entries),
        v2(entries),
        A(static_cast<std::size_t>(k * k)),
        H(A.size()),
        g(static_cast<std::size_t>(k)),
        trial(g.size()),
        delta(g.size()),
        M(A.size()) {}
  /// Residuals, Jacobian and values at x over the current entries.
  void At(FitProblem& p, const std::vector<double>& x) {
    p.Linearise(x.data(), r.data(), J.data(), v.data(), subset);
  }
};

/// From the residuals b.r and Jacobian b.J: the weighted normal matrix
/// A = J'WJ (W: Cauchy weights, used for the covariance), the Newton matrix
/// H with the loss's curvature term (clamped at zero per entry, used for the
/// steps: it converges in a few iterations where plain reweighting crawls)
/// and the gradient g = J'Wr.
void Normal(int k, double s, Buffers& b) {
  std::fill(b.A.begin(), b.A.end(), 0.0);
  std::fill(b.H.begin(), b.H.end(), 0.0);
  std::fill(b.g.begin(), b.g.end(), 0.0);
  const double s2 = s * s;
  for (std::size_t i = 0; i < b.n; ++i) {
    const double w = 1.0 / (1.0 + b.r[i] * b.r[i] / s2);
    const double h = std::max(w * (1.0 - 2.0 * b.r[i] * b.r[i] * w / s2), 0.0);
    const double* Ji = &b.J[i * k];
    for (int a = 0; a < k; ++a) {
      b.g[a] += w * Ji[a] * b.r[i];
      for (int c = 0; c <= a; ++c) {
        b.A[a * k + c] += w * Ji[a] * Ji[c];
        b.H[a * k + c] += h * Ji[a] * Ji[c];
      }
    }
  }
  for (int a = 0; a < k; ++a) {
    for (int c = a + 1; c < k; ++c) {
      b.A[a * k + c] = b.A[c * k + a];
      b.H[a * k + c] = b.H[c * k + a];
    }
  }
}

/// The step for damping lambda into b.delta (x - delta is the trial);
/// false when the system is singular.
bool StepFor(int k, double lambda, bool newton, Buffers& b) {
  b.M = newton ? b.H : b.A;
  for (int a = 0; a < k; ++a) b.M[a * k + a] += lambda * std::max(b.A[a * k + a], 1e-12);
  for (int a = 0; a < k; ++a) b.M[a * k + a] = std::max(b.M[a * k + a], 1e-3 * b.A[a * k + a]);
  for (int a = 0; a < k; ++a) b.delta[a] = b.g[a];  // r = target - model, so dr/dx = J
  return SolveSmall(b.M, b.delta, k);
}

/// Every component of b.delta is below tol times the parameter's own
/// uncertainty (diagonal of (J'WJ)^-1 for unit residual scale).
bool Negligible(int k, double tol, const Buffers& b) {
  for (int a = 0; a < k; ++a) {
    const double sd = 1.0 / std::sqrt(std::max(b.A[a * k + a], 1e-300));
    if (!(std::fabs(b.delta[a]) <= tol * sd)) return false;
  }
  return true;
}

/// Relative decrease of the cost below which a step counts as the last (as
/// Ceres Solver's function tolerance): a wrong model's long flat valley would
/// otherwise use every iteration allowed.
constexpr double kCostTolerance = 1e-6;

/// Levenberg-Marquardt at loss scale s from x. On entry b holds residuals,
/// Jacobian and values at x (Buffers::At); on exit the same at the result,
/// with A, H and g made there. Stops when the undamped step from the current
/// point is negligible (tol standard errors), without taking it, when no
/// step descends, or when a step lowers the cost by less than
/// kCostTolerance of itself. Returns the cost.
double Minimise(FitProblem& p, std::vector<double>& x, double s, int max_iterations, double tol,
                bool newton, Buffers& b, SolveOutcome& out) {
  const int k = static_cast<int>(x.size());
  double lambda = 1e-6;
  double cost = CauchyCost(b.r.data(), b.n, s);
  Normal(k, s, b);
  for (int it = 0; it < max_iterations; ++it) {
    ++out.iterations;
    const double before = cost;
    if (StepFor(k, 0, newton, b) && Negligible(k, tol, b)) {
      out.converged = true;
      break;
    }
    bool improved = false;
    for (int tries = 0; tries < 8 && !improved; ++tries) {
      if (!StepFor(k, lambda, newton, b)) {
        lambda *= 10;
        continue;
      }
      for (int a = 0; a < k; ++a) b.trial[a] = x[a] - b.delta[a];
      p.Linearise(b.trial.data(), b.r2.data(), b.J2.data(), b.v2.data(), b.subset);
      const double c = CauchyCost(b.r2.data(), b.n, s);
      if (c <= cost) {
        improved = true;
        x = b.trial;
        std::swap(b.r, b.r2);
        std::swap(b.J, b.J2);
        std::swap(b.v, b.v2);
        cost = c;
        lambda = std::max(lambda * 0.1, 1e-12);
      } else {  // damp: at once to a tenth of the step's scale, then by tens
        lambda = std::max(lambda * 10, 0.1);
      }
    }
    if (!improved ||
        before - cost <= kCostTolerance * before) {  // no descent left, or too little to matter
      if (improved) Normal(k, s, b);
      out.converged = true;
      break;
    }
    Normal(k, s, b);
  }
  return cost;
}

/// Residual spread (1.4826 MAD, units) after the wide-scale pass beyond
/// which the model explains the column so badly that refining at the loss
/// scale of ~1 unit (every entry then in the loss's flat tail) would only
/// crawl: the wide-scale estimate stands (its robust scale says how bad).
constexpr double kHopeless = 20;

/// At most m entries spread evenly over n.
std::vector<std::size_t> Subsample(std::size_t n, std::size_t m) {
  std::vector<std::size_t> sub;
  const std::size_t step = std::max<std::size_t>(1, n / m);
  for (std::size_t i = 0; i < n; i += step) sub.push_back(i);
  return sub;
}

/// 1.4826 x the median absolute value (no floor).
double Mad(std::vector<double> r) {
  for (double& v : r) v = std::fabs(v);
  auto mid = r.begin() + static_cast<std::ptrdiff_t>(r.size() / 2);
  std::nth_element(r.begin(), mid, r.end());
  return r.empty() ? 0 : 1.4826 * *mid;
}

}  // namespace

std::vector<double> Approach(FitProblem& p, std::vector<double> x, double s, int max_iterations) {
  const std::size_t n = p.size();
  const int k = static_cast<int>(x.size());
  const std::vector<std::size_t> sub = Subsample(n, 40);
  if (k == 0 || n <= 2 * sub.size()) return x;
  Buffers b(sub.size(), k);
  b.subset = &sub;
  b.n = sub.size();
  b.At(p, x);
  SolveOutcome ignored;
  const double wide = Mad(std::vector<double>(b.r.begin(), b.r.end()));
  if (wide > 4 * s) {
    Minimise(p, x, wide, max_iterations, 0.3, false, b, ignored);
    if (Mad(b.r) > kHopeless * s) return x;
  }
  Minimise(p, x, s, max_iterations, 0.3, true, b, ignored);
  return x;
}

SolveOutcome Refine(FitProblem& p, std::vector<double> x, double s, int max_iterations) {
  const std::size_t n = p.size();
  const int k = static_cast<int>(x.size());
  SolveOutcome out;
  Buffers b(n, k);
  b.n = n;
  b.At(p, x);
  if (k == 0 || n == 0) {
    out.x = x;
    out.cost = CauchyCost(b.r.data(), n, s);
    out.converged = true;
    out.values = std::move(b.v);
    return out;
  }
  const double wide_all = Mad(b.r);
  if (wide_all > 4 * s) {
    out.cost = Minimise(p, x, wide_all, max_iterations, 0.3, false, b, out);
    const double spread = Mad(b.r);
    if (spread > kHopeless * s) {  // every entry in the loss's tail: s measures nothing
      out.cost = CauchyCost(b.r.data(), n, s);
      out.x = x;
      out.covariance = Inverse(b.A, k);
      out.values = std::move(b.v);
      return out;
    }
  }
  out.converged = false;
  out.cost = Minimise(p, x, s, max_iterations, 0.01, true, b, out);
  out.x = x;
  out.covariance = Inverse(b.A, k);
  out.values = std::move(b.v);
  return out;
}

SolveOutcome SolveFast(FitProblem& p, std::vector<double> x, double s, int max_iterations) {
  return Refine(p, Approach(p, std::move(x), s, max_iterations), s, max_iterations);
}

std::vector<std::vector<double>> GridStarts(FitProblem& p, const std::vector<double>& x0, double s,
                                            int count) {
  const int k = static_cast<int>(x0.size());
  const int free_model = static_cast<int>(p.lows().size());
  if (k == 0 || free_model == 0) return {x0};
  // A subsample of at most 40 entries spread over the table.
  const std::vector<std::size_t> sub = Subsample(p.size(), 24);
  std::vector<double> r(sub.size()), scales(sub.size());
  for (std::size_t i = 0; i < sub.size(); ++i) scales[i] = std::pow(60.0, p.places(sub[i]));
  const double scale0 = scales[0];
  const int per_dim = free_model == 1 ? 12 : free_model == 2 ? 9 : free_model == 3 ? 5 : 3;
  std::size_t total = 1;
  for (int j = 0; j < free_model; ++j) total *= static_cast<std::size_t>(per_dim);
  std::vector<std::pair<double, std::vector<double>>> scored;
  std::vector<double> x = x0;
  for (std::size_t idx = 0; idx < total && idx < 20000; ++idx) {
    std::size_t rem = idx;
    for (int j = 0; j < free_model; ++j) {
      const double t = (static_cast<double>(rem % per_dim) + 0.5) / per_dim;
      rem /= per_dim;
      x[j] = p.lows()[j] + t * (p.highs()[j] - p.lows()[j]);
    }
    if (k > free_model) {  // displacement: its best value given the others
      x[k - 1] = 0;
      p.Residuals(x.data(), r.data(), &sub);
      std::vector<double> tmp(r);
      std::nth_element(tmp.begin(), tmp.begin() + static_cast<std::ptrdiff_t>(tmp.size() / 2),
                       tmp.end());
      const double median = tmp[tmp.size() / 2];
      x[k - 1] = median / scale0;
      if (p.modulo()) {
        p.Residuals(x.data(), r.data(), &sub);
      } else {  // a displacement d moves every residual by d 60^places: no second pass
        for (std::size_t i = 0; i < sub.size(); ++i) r[i] -= x[k - 1] * scales[i];
      }
    } else {
      p.Residuals(x.data(), r.data(), &sub);
    }
    scored.emplace_back(CauchyCost(r.data(), r.size(), s), x);
  }
  std::sort(scored.begin(), scored.end(),
            [](const auto& a, const auto& b) { return a.first < b.first; });
  // The best grid point, then others whose subsample cost is close to it
  // (rival basins), then the caller's start when it is competitive.
  std::vector<std::vector<double>> starts;
  const double best = scored.front().first;
  auto near_chosen = [&](const std::vector<double>& v) {
    for (const auto& c : starts) {
      bool near = true;
      for (int j = 0; j < free_model; ++j) {
        near = near && std::fabs(v[j] - c[j]) <= 1.01 * (p.highs()[j] - p.lows()[j]) / per_dim;
      }
      if (near) return true;
    }
    return false;
  };
  for (const auto& [c, v] : scored) {
    if (static_cast<int>(starts.size()) >= count || c > best * 1.1 + 1e-9) break;
    if (!near_chosen(v)) starts.push_back(v);
  }
  p.Residuals(x0.data(), r.data(), &sub);
  if (CauchyCost(r.data(), r.size(), s) <= best * 1.1 + 1e-9 && !near_chosen(x0))
    starts.push_back(x0);
  return starts;
}

}  // namespace apograph::estimate::internal
