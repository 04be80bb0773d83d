#pragma once
/// Internal: the two solvers behind Fit().

#include <vector>

#include "estimate/fit_problem.hpp"

namespace apograph::estimate::internal {

struct SolveOutcome {
  std::vector<double> x;
  std::vector<double> covariance;  ///< k x k, row-major, unit residual variance
  double cost = 0;
  int iterations = 0;
  bool converged = false;
};

/// Dense Levenberg-Marquardt with Cauchy weights (iteratively reweighted),
/// forward-difference Jacobian; buffers allocated once per call.
SolveOutcome SolveFast(FitProblem& problem, std::vector<double> x, double loss_scale,
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
