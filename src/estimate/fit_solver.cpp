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
  std::vector<double> r, r2, J, A, H, g, xt;
  const std::vector<std::size_t>* subset = nullptr;  ///< entries used (all when null)
  std::size_t n = 0;
};

double Step(double x) { return 1e-7 * std::max(std::fabs(x), 1e-2); }

/// Jacobian (forward differences) at x, given the residuals b.r there; the
/// weighted normal matrix A = J'WJ (W: Cauchy weights, used for the
/// covariance), the Newton matrix H with the loss's curvature term (clamped
/// at zero per entry, used for the steps: it converges in a few iterations
/// where plain reweighting crawls) and the gradient g = J'Wr.
void Linearise(FitProblem& p, const std::vector<double>& x, double s, Buffers& b) {
  const std::size_t n = b.n;
  const int k = static_cast<int>(x.size());
  b.xt = x;
  for (int j = 0; j < k; ++j) {
    const double h = Step(x[j]);
    b.xt[j] = x[j] + h;
    p.Residuals(b.xt.data(), b.r2.data(), b.subset);
    b.xt[j] = x[j];
    for (std::size_t i = 0; i < n; ++i) b.J[i * k + j] = (b.r2[i] - b.r[i]) / h;
  }
  std::fill(b.A.begin(), b.A.end(), 0.0);
  std::fill(b.H.begin(), b.H.end(), 0.0);
  std::fill(b.g.begin(), b.g.end(), 0.0);
  const double s2 = s * s;
  for (std::size_t i = 0; i < n; ++i) {
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

/// Levenberg-Marquardt at loss scale s from x (b.r holds the residuals at
/// x on entry and at the result on exit). Returns the cost.
double Minimise(FitProblem& p, std::vector<double>& x, double s, int max_iterations, double tol,
                bool newton, Buffers& b, SolveOutcome& out) {
  const std::size_t n = b.n;
  const int k = static_cast<int>(x.size());
  std::vector<double> trial(k), delta(k), A(static_cast<std::size_t>(k * k));
  double lambda = 1e-6;
  double cost = CauchyCost(b.r.data(), n, s);
  Linearise(p, x, s, b);
  for (int it = 0; it < max_iterations; ++it) {
    ++out.iterations;
    bool improved = false, small = false;
    for (int tries = 0; tries < 8 && !improved; ++tries) {
      A = newton ? b.H : b.A;
      for (int a = 0; a < k; ++a) A[a * k + a] += lambda * std::max(b.A[a * k + a], 1e-12);
      for (int a = 0; a < k; ++a) A[a * k + a] = std::max(A[a * k + a], 1e-3 * b.A[a * k + a]);
      for (int a = 0; a < k; ++a) delta[a] = b.g[a];  // r = target - model, so dr/dx = J
      if (!SolveSmall(A, delta, k)) { lambda *= 10; continue; }
      for (int a = 0; a < k; ++a) trial[a] = x[a] - delta[a];
      p.Residuals(trial.data(), b.r2.data(), b.subset);
      const double c = CauchyCost(b.r2.data(), n, s);
      if (c <= cost) {
        improved = true;
        x = trial;
        std::swap(b.r, b.r2);
        cost = c;
        lambda = std::max(lambda * 0.1, 1e-12);
        // Converged when every step is far below the parameter's own
        // uncertainty (diagonal of (J'WJ)^-1 for unit residual scale).
        small = true;
        for (int a = 0; a < k; ++a) {
          const double sd = 1.0 / std::sqrt(std::max(b.A[a * k + a], 1e-300));
          small = small && std::fabs(delta[a]) <= tol * sd;
        }
      } else {
        lambda *= 10;
      }
    }
    Linearise(p, x, s, b);
    if (!improved || small) {  // no descent left, or a negligible step
      out.converged = true;
      break;
    }
  }
  return cost;
}

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

SolveOutcome SolveFast(FitProblem& p, std::vector<double> x, double s, int max_iterations) {
  const std::size_t n = p.size();
  const int k = static_cast<int>(x.size());
  SolveOutcome out;
  Buffers b{std::vector<double>(n), std::vector<double>(n), std::vector<double>(n * k),
            std::vector<double>(static_cast<std::size_t>(k * k)), std::vector<double>(static_cast<std::size_t>(k * k)),
            std::vector<double>(k), {}, nullptr, n};
  if (k == 0 || n == 0) {
    p.Residuals(x.data(), b.r.data());
    out.x = x;
    out.cost = CauchyCost(b.r.data(), n, s);
    out.converged = true;
    return out;
  }
  // Far from the optimum every residual lies in the Cauchy loss's flat tail:
  // first a pass on a subsample at a scale matched to the residuals, which
  // brings x into the basin cheaply.
  const std::vector<std::size_t> sub = Subsample(n, 40);
  b.subset = &sub;
  b.n = sub.size();
  p.Residuals(x.data(), b.r.data(), b.subset);
  const double wide = Mad(std::vector<double>(b.r.begin(), b.r.begin() + static_cast<std::ptrdiff_t>(b.n)));
  if (wide > 4 * s && n > 2 * sub.size()) Minimise(p, x, wide, max_iterations, 0.3, false, b, out);
  b.subset = nullptr;
  b.n = n;
  p.Residuals(x.data(), b.r.data());
  const double wide_all = Mad(b.r);
  if (wide_all > 4 * s) Minimise(p, x, wide_all, max_iterations, 0.3, false, b, out);
  out.converged = false;
  out.cost = Minimise(p, x, s, max_iterations, 0.01, true, b, out);
  out.x = x;
  out.covariance = Inverse(b.A, k);
  return out;
}

std::vector<std::vector<double>> GridStarts(FitProblem& p, const std::vector<double>& x0, double s,
                                            int count) {
  const int k = static_cast<int>(x0.size());
  const int free_model = static_cast<int>(p.lows().size());
  if (k == 0 || free_model == 0) return {x0};
  // A subsample of at most 40 entries spread over the table.
  const std::vector<std::size_t> sub = Subsample(p.size(), 24);
  std::vector<double> r(sub.size());
  const int per_dim = free_model == 1 ? 16 : free_model == 2 ? 9 : free_model == 3 ? 5 : 3;
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
      std::nth_element(tmp.begin(), tmp.begin() + static_cast<std::ptrdiff_t>(tmp.size() / 2), tmp.end());
      x[k - 1] = tmp[tmp.size() / 2] / std::pow(60.0, p.places(sub[0]));
    }
    p.Residuals(x.data(), r.data(), &sub);
    scored.emplace_back(CauchyCost(r.data(), r.size(), s), x);
  }
  std::sort(scored.begin(), scored.end(), [](const auto& a, const auto& b) { return a.first < b.first; });
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
  if (CauchyCost(r.data(), r.size(), s) <= best * 1.1 + 1e-9 && !near_chosen(x0)) starts.push_back(x0);
  return starts;
}

}  // namespace apograph::estimate::internal
