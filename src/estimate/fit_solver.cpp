#include "estimate/fit_solver.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <stdexcept>

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

}  // namespace

std::vector<double> Inverse(const std::vector<double>& A, int k) {
  std::vector<double> inv(static_cast<std::size_t>(k) * static_cast<std::size_t>(k));
  for (int c = 0; c < k; ++c) {
    std::vector<double> e(static_cast<std::size_t>(k), 0.0);
    e[c] = 1;
    if (!SolveSmall(A, e, k)) return {};
    for (int r = 0; r < k; ++r) inv[r * k + c] = e[r];
  }
  return inv;
}

namespace {

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
        A(static_cast<std::size_t>(k) * static_cast<std::size_t>(k)),
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
    if (!improved || before - cost <= kCostTolerance * before) {  // little or no descent left
      if (improved) Normal(k, s, b);
      out.converged = true;
      break;
    }
    Normal(k, s, b);
  }
  return cost;
}

/// Residual spread (1.4826 MAD, units) beyond which a model that still
/// spreads its residuals wider than the loss scale it was just fitted at
/// explains the column so badly that going on to smaller scales (every entry
/// then in the loss's flat tail) would only crawl: that estimate stands, and
/// its robust scale says how bad it is. Judgement: an entry 20 units off is a
/// gross misfit in any table, and a right model's residuals shrink below
/// the scale at every step of the schedule.
constexpr double kHopeless = 20;

/// How much the loss scale shrinks at each step of the schedule (at least).
/// Judgement: a factor of 4 keeps the entries that fit inside the loss's
/// quadratic zone from one step to the next, and takes about 8 steps from a
/// start 10^5 units off down to one unit.
constexpr double kShrink = 4;

/// At most m entries spread evenly over n.
std::vector<std::size_t> Subsample(std::size_t n, std::size_t m) {
  std::vector<std::size_t> sub;
  const std::size_t step = std::max<std::size_t>(1, n / m);
  for (std::size_t i = 0; i < n; i += step) sub.push_back(i);
  return sub;
}

/// 1.4826 x the median absolute value (no floor).
double Mad(const std::vector<double>& r, std::size_t n) {
  std::vector<double> a(r.begin(), r.begin() + static_cast<std::ptrdiff_t>(n));
  for (double& v : a) v = std::fabs(v);
  auto mid = a.begin() + static_cast<std::ptrdiff_t>(a.size() / 2);
  std::nth_element(a.begin(), mid, a.end());
  return a.empty() ? 0 : 1.4826 * *mid;
}

/// The graduated schedule (graduated non-convexity): minimise at a loss
/// scale matched to the residuals' spread (1.4826 MAD, a robust scale), then
/// at ever smaller scales down to `s`: a scale never below 1/kShrink of the
/// one before nor below three times the spread just reached, so that the
/// entries the model fits stay in the loss's quadratic zone while gross
/// errors fall into its flat tail and stop pulling (the Cauchy loss
/// redescends: its influence falls to 0 far out). Each step starts where
/// the last ended, so a start far off (every residual huge) reaches the
/// right basin where the plain loss at one unit would see no slope. Returns
/// false when the model proves hopeless (see kHopeless): x is then the
/// estimate at the last scale tried. On entry b holds the linearisation at
/// x (Buffers::At).
bool Anneal(FitProblem& p, std::vector<double>& x, double s, int max_iterations, double tol,
            Buffers& b, SolveOutcome& out) {
  double sigma = std::max(Mad(b.r, b.n), s);
  while (sigma > s) {
    Minimise(p, x, sigma, max_iterations, 0.3, false, b, out);
    const double spread = Mad(b.r, b.n);
    if (spread > sigma && spread > kHopeless * s) return false;
    sigma = std::max(s, std::min(sigma / kShrink, 3 * spread));
  }
  out.cost = Minimise(p, x, s, max_iterations, tol, true, b, out);
  return true;
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
  Anneal(p, x, s, max_iterations, 0.3, b, ignored);
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
  if (!Anneal(p, x, s, max_iterations, 0.01, b, out)) {
    out.cost = CauchyCost(b.r.data(), n, s);
    out.converged = false;
    out.hopeless = true;
  }
  out.x = x;
  out.covariance = Inverse(b.A, k);
  out.normal = b.A;
  out.values = std::move(b.v);
  return out;
}

SolveOutcome SolveFast(FitProblem& p, std::vector<double> x, double s, int max_iterations) {
  return Refine(p, Approach(p, std::move(x), s, max_iterations), s, max_iterations);
}

namespace {
ReferenceSolver& Registered() {
  static ReferenceSolver solver = nullptr;
  return solver;
}
}  // namespace

void SetReferenceSolver(ReferenceSolver solver) { Registered() = solver; }

SolveOutcome SolveReference(FitProblem& problem, std::vector<double> x, double loss_scale,
                            int max_iterations) {
  if (!Registered()) {
    throw std::logic_error(
        "the reference solver (Ceres) is linked into the tests and benchmarks only");
  }
  return Registered()(problem, std::move(x), loss_scale, max_iterations);
}

}  // namespace apograph::estimate::internal
