// What is done to the solver's solution before it is reported: the
// eccentricity shown positive, periodic angles brought into [0, 360), and
// with rounded nodes a pattern search on the cost itself (see fit.cpp).
#include <algorithm>
#include <cmath>
#include <vector>

#include "estimate/fit_problem.hpp"
#include "estimate/fit_solver.hpp"

namespace apograph::estimate::internal {

/// With rounded nodes the cost is flat between the parameter values where a
/// node's rounding changes, and the solver's derivatives (those of the exact
/// nodes) only bring it near the optimum: a pattern search on the cost
/// itself finishes the work (steps from 2 standard errors down to 1/100 of
/// one, each free parameter in turn).
void Polish(FitProblem& problem, double loss_scale, SolveOutcome& best) {
  const std::size_t k = best.x.size();
  std::vector<double> r(problem.size());
  auto cost = [&](const std::vector<double>& x) {
    problem.Residuals(x.data(), r.data());
    return CauchyCost(r.data(), r.size(), loss_scale);
  };
  double c = cost(best.x);
  bool moved = false;
  for (std::size_t j = 0; j < k; ++j) {
    const double var = best.covariance.size() == k * k ? best.covariance[j * k + j] : 0;
    const double sd = var > 0 ? std::sqrt(var) : 1e-6 * std::max(std::fabs(best.x[j]), 1.0);
    for (double step = 2 * sd; step >= 0.01 * sd; step /= 2) {
      for (double dir : {1.0, -1.0}) {
        std::vector<double> x = best.x;
        x[j] += dir * step;
        const double cx = cost(x);
        if (cx < c) {
          c = cx;
          best.x = std::move(x);
          moved = true;
          break;
        }
      }
    }
  }
  if (moved) {
    best.cost = c;
    best.values.clear();  // the summary evaluates at the new point
  }
}

/// An eccentricity toward the apogee fitted negative, shown positive with
/// the apogee turned half a circle: the same geometry (both models with an
/// apogee, true-sun and planet-position, put the centre at e toward it, and
/// (-e, A + 180) gives every value of (e, A); fit_test.cpp checks it), and
/// the form an author gave and the model's range holds. Measured:
/// identify_accuracy_bench seed 489, a planet with e = 1;15 and apogee 55
/// reproduced at 64 of 64 entries was reported as e = -1;15, apogee 235.
void PositiveEccentricity(const model::Model& model, const FitProblem& problem, SolveOutcome& s) {
  std::size_t e = s.x.size(), apogee = s.x.size();
  for (std::size_t j = 0; j < s.x.size(); ++j) {
    const int m = problem.ModelIndex(static_cast<int>(j));
    if (m < 0) continue;
    const auto& spec = model.params()[static_cast<std::size_t>(m)];
    if (spec.role == model::ParamRole::kApogee) apogee = j;
    if (spec.name == "e") e = j;
  }
  if (e == s.x.size() || apogee == s.x.size() || s.x[e] >= 0) return;
  s.x[e] = -s.x[e];
  s.x[apogee] += 180;
  // The derivatives by e change sign: so do e's row and column of the
  // normal matrix and of its inverse (the variances stay).
  const std::size_t k = s.x.size();
  for (std::vector<double>* m : {&s.normal, &s.covariance}) {
    if (m->size() != k * k) continue;
    for (std::size_t i = 0; i < k; ++i) {
      if (i == e) continue;
      (*m)[i * k + e] = -(*m)[i * k + e];
      (*m)[e * k + i] = -(*m)[e * k + i];
    }
  }
}

/// Angles the values depend on only modulo 360 (a radix when the values
/// are reduced, an apogee, an anomaly's radix) brought into [0, 360), so
/// that equal explanations show equal numbers.
void CanonicalAngles(const model::Model& model, const FitProblem& problem,
                     const FitOptions& options, std::vector<double>& x) {
  for (int j = 0; j < static_cast<int>(x.size()); ++j) {
    const int m = problem.ModelIndex(j);
    if (m < 0) continue;
    const auto role = model.params()[static_cast<std::size_t>(m)].role;
    const bool periodic = role == model::ParamRole::kApogee ||
                          role == model::ParamRole::kAnomalyRadix ||
                          (role == model::ParamRole::kRadix && options.modulo_360);
    if (!periodic) continue;
    double& v = x[static_cast<std::size_t>(j)];
    v = std::fmod(v, 360.0);
    if (v < 0) v += 360;
  }
}

}  // namespace apograph::estimate::internal
