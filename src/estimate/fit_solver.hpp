#pragma once
/// Internal: the two solvers behind Fit().

#include <vector>

#include "estimate/fit_problem.hpp"

namespace apograph::estimate::internal {

struct SolveOutcome {
  std::vector<double> x;
  std::vector<double> covariance;  ///< k x k, row-major, unit residual variance
  /// The model's value (FitProblem::Value) at x for every entry, when the
  /// solver has them (saves the summary a pass); empty otherwise.
  std::vector<double> values;
  double cost = 0;
  int iterations = 0;
  bool converged = false;
};

/// Dense Levenberg-Marquardt with Cauchy weights, the Jacobian from
/// FitProblem::Linearise (exact for built-in models); buffers allocated once
/// per call. Approach() then Refine().
SolveOutcome SolveFast(FitProblem& problem, std::vector<double> x, double loss_scale,
                       int max_iterations);

/// SolveFast's first stage: from a start far from the optimum, where every
/// residual lies in the Cauchy loss's flat tail, a few steps at a scale
/// matched to the residuals, then at `loss_scale`, all on a subsample of at
/// most 40 entries (when the problem has more than twice as many). Brings x
/// close to the optimum cheaply; returns it.
std::vector<double> Approach(FitProblem& problem, std::vector<double> x, double loss_scale,
                             int max_iterations);

/// SolveFast's second stage, on every entry: converged when the next Newton
/// step would move no parameter by more than 1/100 of its standard error.
SolveOutcome Refine(FitProblem& problem, std::vector<double> x, double loss_scale,
                    int max_iterations);

/// The same problem through Ceres (CauchyLoss, one residual block per entry)
/// with ceres::Covariance at the optimum.
SolveOutcome SolveCeres(FitProblem& problem, std::vector<double> x, double loss_scale,
                        int max_iterations);

/// Coarse search over the free parameters' ranges on a subsample; returns up
/// to `count` distinct starting vectors, best first.
std::vector<std::vector<double>> GridStarts(FitProblem& problem, const std::vector<double>& x0,
                                            double loss_scale, int count);

}  // namespace apograph::estimate::internal
