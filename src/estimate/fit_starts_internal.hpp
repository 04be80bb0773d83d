#pragma once
// Small helpers shared by the two files of fit starts: grid and mean-motion
// starts (fit_starts.cpp) and the starts of tables of positions
// (fit_starts_position.cpp). Not for other files.

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <vector>

#include "estimate/fit_problem.hpp"
#include "model/model.hpp"

namespace apograph::estimate::internal {

/// At most m entries spread evenly over n.
inline std::vector<std::size_t> Spread(std::size_t n, std::size_t m) {
  std::vector<std::size_t> sub;
  const std::size_t step = std::max<std::size_t>(1, n / m);
  for (std::size_t i = 0; i < n; i += step) sub.push_back(i);
  return sub;
}

/// Index in the free vector of the model parameter with `role`, or -1.
inline int FreeIndex(const model::Model& model, const FitProblem& problem, model::ParamRole role,
                     std::size_t free_count) {
  for (int j = 0; j < static_cast<int>(free_count); ++j) {
    const int m = problem.ModelIndex(j);
    if (m >= 0 && model.params()[static_cast<std::size_t>(m)].role == role) return j;
  }
  return -1;
}

inline double Median(std::vector<double> v) {
  std::nth_element(v.begin(), v.begin() + static_cast<std::ptrdiff_t>(v.size() / 2), v.end());
  return v[v.size() / 2];
}

inline double Wrap360(double x) {
  x = std::fmod(x, 360.0);
  return x < 0 ? x + 360 : x;
}

inline double Wrap180(double x) {
  x = Wrap360(x);
  return x > 180 ? x - 360 : x;
}

}  // namespace apograph::estimate::internal
