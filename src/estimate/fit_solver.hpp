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
  /// The weighted normal matrix J'WJ at x (k x k, row-major), whose
  /// inverse is `covariance` (kept to tell parameters the entries cannot
  /// separate); empty when the solver does not give it.
  std::vector<double> normal;
  double cost = 0;
  int iterations = 0;
  bool converged = false;
  /// The residuals stayed wider than every loss scale tried (see Anneal in
  /// fit_solver.cpp): the model does not explain the entries.
  bool hopeless = false;
};

/// Dense Levenberg-Marquardt with Cauchy weights, the Jacobian from
/// FitProblem::Linearise (exact for built-in models); buffers allocated once
/// per call. Approach() then Refine().
SolveOutcome SolveFast(FitProblem& problem, std::vector<double> x, double loss_scale,
                       int max_iterations);

/// SolveFast's first stage: from a start far from the optimum, where every
/// residual lies in the Cauchy loss's flat tail, the graduated schedule of
/// loss scales (from the residuals' robust spread down to `loss_scale`), all
/// on a subsample of at most 40 entries (when the problem has more than
/// twice as many). Brings x close to the optimum cheaply; returns it.
std::vector<double> Approach(FitProblem& problem, std::vector<double> x, double loss_scale,
                             int max_iterations);

/// SolveFast's second stage, on every entry: the same schedule from where
/// Approach left off (usually one step), then converged when the next
/// Newton step would move no parameter by more than 1/100 of its standard
/// error.
SolveOutcome Refine(FitProblem& problem, std::vector<double> x, double loss_scale,
                    int max_iterations);

/// The reference solver: the same problem through Ceres Solver (CauchyLoss,
/// one residual block per entry, ceres::Covariance at the optimum). It lives
/// outside the library (fit_ceres.cpp, linked only into the tests and the
/// benchmarks through RegisterCeresSolver) so that the program loads no
/// Ceres; a program that links it registers it here.
using ReferenceSolver = SolveOutcome (*)(FitProblem& problem, std::vector<double> x,
                                         double loss_scale, int max_iterations);
void SetReferenceSolver(ReferenceSolver solver);
/// Runs the registered reference solver; std::logic_error when the program
/// links none (Solver::kCeres asked of the command-line program).
SolveOutcome SolveReference(FitProblem& problem, std::vector<double> x, double loss_scale,
                            int max_iterations);

/// Inverse of a small symmetric matrix (k x k, row-major); empty when
/// singular.
std::vector<double> Inverse(const std::vector<double>& A, int k);

/// With rounded nodes: a pattern search on the cost itself, each free
/// parameter in turn, after the solver (fit_finish.cpp).
void Polish(FitProblem& problem, double loss_scale, SolveOutcome& best);

/// An eccentricity toward the apogee fitted negative, shown positive with
/// the apogee turned half a circle: the same geometry (fit_finish.cpp).
void PositiveEccentricity(const model::Model& model, const FitProblem& problem, SolveOutcome& s);

/// Angles the values depend on only modulo 360 brought into [0, 360)
/// (fit_finish.cpp).
void CanonicalAngles(const model::Model& model, const FitProblem& problem,
                     const FitOptions& options, std::vector<double>& x);

}  // namespace apograph::estimate::internal
