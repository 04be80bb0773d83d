#include "estimate/fit_covariance.hpp"

#include <algorithm>
#include <cmath>

namespace apograph::estimate::internal {
namespace {

/// Eigen-decomposition of a small symmetric matrix by cyclic Jacobi
/// rotations: eigenvalues in `values`, eigenvectors as the columns of `V`.
void Jacobi(std::vector<double> A, int k, std::vector<double>& values, std::vector<double>& V) {
  V.assign(static_cast<std::size_t>(k) * static_cast<std::size_t>(k), 0.0);
  for (int i = 0; i < k; ++i) V[i * k + i] = 1;
  for (int sweep = 0; sweep < 60; ++sweep) {
    double off = 0;
    for (int p = 0; p < k; ++p)
      for (int q = p + 1; q < k; ++q) off += A[p * k + q] * A[p * k + q];
    if (off < 1e-30) break;
    for (int p = 0; p < k; ++p) {
      for (int q = p + 1; q < k; ++q) {
        if (std::fabs(A[p * k + q]) < 1e-300) continue;
        const double theta = (A[q * k + q] - A[p * k + p]) / (2 * A[p * k + q]);
        const double t = (theta >= 0 ? 1 : -1) / (std::fabs(theta) + std::sqrt(theta * theta + 1));
        const double c = 1 / std::sqrt(t * t + 1), s = t * c;
        for (int r = 0; r < k; ++r) {  // A <- A J
          const double a = A[r * k + p], b = A[r * k + q];
          A[r * k + p] = c * a - s * b;
          A[r * k + q] = s * a + c * b;
        }
        for (int r = 0; r < k; ++r) {  // A <- J' A
          const double a = A[p * k + r], b = A[q * k + r];
          A[p * k + r] = c * a - s * b;
          A[q * k + r] = s * a + c * b;
        }
        for (int r = 0; r < k; ++r) {
          const double a = V[r * k + p], b = V[r * k + q];
          V[r * k + p] = c * a - s * b;
          V[r * k + q] = s * a + c * b;
        }
      }
    }
  }
  values.resize(static_cast<std::size_t>(k));
  for (int i = 0; i < k; ++i) values[i] = A[i * k + i];
}

}  // namespace

Covariance CovarianceOf(const std::vector<double>& A, int k) {
  Covariance out;
  if (k == 0 || A.size() != static_cast<std::size_t>(k) * static_cast<std::size_t>(k)) return out;
  out.separable.assign(static_cast<std::size_t>(k), true);
  std::vector<double> d(static_cast<std::size_t>(k));
  for (int i = 0; i < k; ++i) {
    d[i] = A[i * k + i] > 0 ? 1 / std::sqrt(A[i * k + i]) : 0;
    if (d[i] == 0) out.separable[i] = false, out.degenerate = true;
  }
  std::vector<double> S(A.size());
  for (int i = 0; i < k; ++i)
    for (int j = 0; j < k; ++j) S[i * k + j] = A[i * k + j] * d[i] * d[j];
  std::vector<double> values, V;
  Jacobi(S, k, values, V);
  const double top = std::max(*std::max_element(values.begin(), values.end()), 1e-300);
  out.matrix.assign(A.size(), 0.0);
  for (int e = 0; e < k; ++e) {
    if (values[e] < kDegenerate * top) {
      out.degenerate = true;
      // Parameters that move along this direction are not separable.
      for (int i = 0; i < k; ++i) {
        if (std::fabs(V[i * k + e]) > 0.05) out.separable[i] = false;
      }
      continue;
    }
    for (int i = 0; i < k; ++i)
      for (int j = 0; j < k; ++j) out.matrix[i * k + j] += V[i * k + e] * V[j * k + e] / values[e];
  }
  for (int i = 0; i < k; ++i)
    for (int j = 0; j < k; ++j) out.matrix[i * k + j] *= d[i] * d[j];
  return out;
}

}  // namespace apograph::estimate::internal
