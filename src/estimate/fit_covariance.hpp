#pragma once
/// Internal to the estimate stage: the covariance of an estimate when some
/// parameters are not separately determined. The weighted normal matrix
/// J'WJ is scaled to unit diagonal (so that parameters of different units
/// compare) and decomposed; a direction with a relative eigenvalue below
/// kDegenerate is one the entries do not fix: the parameters that move
/// along it are not separable, and the covariance is the pseudo-inverse
/// over the determined directions (finite for every combination the entries
/// do fix, such as the ratio of two parameters that enter only as a ratio).

#include <vector>

namespace apograph::estimate::internal {

/// Relative eigenvalue of the scaled normal matrix below which a direction
/// is not determined. Judgement: a determined parameter of a 360-entry
/// table has relative eigenvalues above 1e-6 even when strongly correlated
/// with another; two parameters that enter only as a ratio give 1e-14 or
/// less (rounding noise).
inline constexpr double kDegenerate = 1e-10;

struct Covariance {
  std::vector<double> matrix;   ///< k x k, row-major (pseudo-inverse when degenerate)
  std::vector<bool> separable;  ///< per free parameter
  bool degenerate = false;      ///< some direction is not determined
};

/// From the k x k normal matrix A (row-major). Empty matrix when A is empty
/// or has a zero diagonal entry (a parameter the entries do not touch at
/// all: not separable).
Covariance CovarianceOf(const std::vector<double>& A, int k);

}  // namespace apograph::estimate::internal
