// The reference solver: the same robust problem through Ceres Solver.
#include "estimate/fit.hpp"
#include "estimate/fit_solver.hpp"

#include <ceres/ceres.h>

namespace apograph::estimate::internal {
namespace {

/// One entry's residual with a forward-difference Jacobian (the model is a
/// black box behind the Model interface).
class EntryCost final : public ceres::CostFunction {
 public:
  EntryCost(FitProblem& problem, std::size_t index, int k)
      : problem_(problem), index_(index), k_(k) {
    set_num_residuals(1);
    mutable_parameter_block_sizes()->push_back(k);
  }
  bool Evaluate(double const* const* parameters, double* residuals,
                double** jacobians) const override {
    const double* x = parameters[0];
    residuals[0] = problem_.Residual(index_, x);
    if (jacobians && jacobians[0]) {
      std::vector<double> xt(x, x + k_);
      for (int j = 0; j < k_; ++j) {
        const double h = 1e-7 * std::max(std::fabs(x[j]), 1e-2);
        xt[j] = x[j] + h;
        jacobians[0][j] = (problem_.Residual(index_, xt.data()) - residuals[0]) / h;
        xt[j] = x[j];
      }
    }
    return true;
  }

 private:
  FitProblem& problem_;
  std::size_t index_;
  int k_;
};

}  // namespace

SolveOutcome SolveCeres(FitProblem& p, std::vector<double> x, double s, int max_iterations) {
  SolveOutcome out;
  const int k = static_cast<int>(x.size());
  ceres::Problem::Options po;
  po.loss_function_ownership = ceres::DO_NOT_TAKE_OWNERSHIP;
  ceres::Problem problem(po);
  ceres::CauchyLoss loss(s);
  if (k == 0) {
    out.x = x;
    out.converged = true;
    return out;
  }
  for (std::size_t i = 0; i < p.size(); ++i) {
    problem.AddResidualBlock(new EntryCost(p, i, k), &loss, x.data());
  }
  ceres::Solver::Options options;
  options.max_num_iterations = max_iterations;
  options.linear_solver_type = ceres::DENSE_QR;
  options.num_threads = 1;
  options.logging_type = ceres::SILENT;
  ceres::Solver::Summary summary;
  ceres::Solve(options, &problem, &summary);
  out.x = x;
  out.cost = summary.final_cost;
  out.iterations = static_cast<int>(summary.iterations.size());
  out.converged = summary.termination_type == ceres::CONVERGENCE;
  ceres::Covariance::Options co;
  co.algorithm_type = ceres::DENSE_SVD;
  co.null_space_rank = -1;
  ceres::Covariance covariance(co);
  std::vector<std::pair<const double*, const double*>> blocks{{x.data(), x.data()}};
  if (covariance.Compute(blocks, &problem)) {
    out.covariance.assign(static_cast<std::size_t>(k) * static_cast<std::size_t>(k), 0.0);
    covariance.GetCovarianceBlock(x.data(), x.data(), out.covariance.data());
  }
  return out;
}

}  // namespace apograph::estimate::internal

namespace apograph::estimate {
void RegisterCeresSolver() { internal::SetReferenceSolver(&internal::SolveCeres); }
}  // namespace apograph::estimate
