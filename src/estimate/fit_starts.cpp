#include "estimate/fit_starts.hpp"

#include <algorithm>
#include <cmath>
#include <functional>
#include <numbers>
#include <utility>

#include "estimate/fit_solver.hpp"
#include "estimate/fit_starts_internal.hpp"

namespace apograph::estimate::internal {
namespace {

/// Grid points per free parameter, by the number of free model parameters
/// (judgement: about 12 to 250 points in all, each a pass over 24 entries).
int PointsPerDimension(int free_model) {
  return free_model == 1 ? 12 : free_model == 2 ? 9 : free_model == 3 ? 5 : 3;
}

/// What one grid point is scored on.
struct Sample {
  std::vector<std::size_t> rows;
  std::vector<double> scales;  ///< 60^places of each entry
  std::vector<double> r;       ///< scratch residuals
};

/// The robust cost at x on the sample; with a displacement (the last free
/// parameter beyond the model's), it is first set to its best value given
/// the others (the median residual).
double ScorePoint(FitProblem& p, std::vector<double>& x, Sample& s, double loss_scale) {
  const int k = static_cast<int>(x.size());
  const int free_model = static_cast<int>(p.lows().size());
  if (k == free_model) {
    p.Residuals(x.data(), s.r.data(), &s.rows);
    return CauchyCost(s.r.data(), s.r.size(), loss_scale);
  }
  x[k - 1] = 0;
  p.Residuals(x.data(), s.r.data(), &s.rows);
  std::vector<double> tmp(s.r);
  std::nth_element(tmp.begin(), tmp.begin() + static_cast<std::ptrdiff_t>(tmp.size() / 2),
                   tmp.end());
  x[k - 1] = tmp[tmp.size() / 2] / s.scales[0];
  if (p.modulo()) {
    p.Residuals(x.data(), s.r.data(), &s.rows);
  } else {  // a displacement d moves every residual by d 60^places: no second pass
    for (std::size_t i = 0; i < s.rows.size(); ++i) s.r[i] -= x[k - 1] * s.scales[i];
  }
  return CauchyCost(s.r.data(), s.r.size(), loss_scale);
}

/// Every grid point with its cost, best first.
std::vector<std::pair<double, std::vector<double>>> ScoreGrid(FitProblem& p,
                                                              const std::vector<double>& x0,
                                                              Sample& s, double loss_scale) {
  const int free_model = static_cast<int>(p.lows().size());
  const int per_dim = PointsPerDimension(free_model);
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
    const double c = ScorePoint(p, x, s, loss_scale);
    scored.emplace_back(c, x);
  }
  std::sort(scored.begin(), scored.end(),
            [](const auto& a, const auto& b) { return a.first < b.first; });
  return scored;
}

/// x lies within one grid cell of a start already chosen.
bool NearChosen(const FitProblem& p, const std::vector<std::vector<double>>& starts,
                const std::vector<double>& x) {
  const int free_model = static_cast<int>(p.lows().size());
  const int per_dim = PointsPerDimension(free_model);
  for (const auto& c : starts) {
    bool near = true;
    for (int j = 0; j < free_model; ++j)
      near = near && std::fabs(x[j] - c[j]) <= 1.01 * (p.highs()[j] - p.lows()[j]) / per_dim;
    if (near) return true;
  }
  return false;
}

}  // namespace

std::vector<std::vector<double>> GridStarts(FitProblem& p, const std::vector<double>& x0,
                                            double loss_scale, int count) {
  const int free_model = static_cast<int>(p.lows().size());
  if (x0.empty() || free_model == 0 || p.size() == 0) return {x0};
  Sample s;
  s.rows = Spread(p.size(), 24);
  s.r.resize(s.rows.size());
  for (std::size_t i : s.rows) s.scales.push_back(std::pow(60.0, p.places(i)));
  const auto scored = ScoreGrid(p, x0, s, loss_scale);
  // The best grid point, then others whose subsample cost is close to it
  // (rival basins), then the caller's start when it is competitive.
  std::vector<std::vector<double>> starts;
  const double best = scored.front().first;
  for (const auto& [c, v] : scored) {
    if (static_cast<int>(starts.size()) >= count || c > best * 1.1 + 1e-9) break;
    if (!NearChosen(p, starts, v)) starts.push_back(v);
  }
  std::vector<double> x = x0;
  if (ScorePoint(p, x, s, loss_scale) <= best * 1.1 + 1e-9 && !NearChosen(p, starts, x0))
    starts.push_back(x0);
  return starts;
}

std::vector<double> MeanMotionStart(const model::Model& model, const FitProblem& problem,
                                    const std::vector<Observation>& obs, std::vector<double> x) {
  const int rate = FreeIndex(model, problem, model::ParamRole::kRate, x.size());
  const int radix = FreeIndex(model, problem, model::ParamRole::kRadix, x.size());
  if (rate < 0 || obs.size() < 3) return {};
  std::vector<double> rates;
  for (std::size_t i = 1; i < obs.size(); ++i) {
    const double da = obs[i].arg - obs[i - 1].arg;
    if (obs[i].column != obs[i - 1].column || !(da > 0)) continue;
    const double dv =
        std::fmod(obs[i].value.ToDouble() - obs[i - 1].value.ToDouble() + 720.0, 360.0);
    rates.push_back(dv / da);
  }
  if (rates.size() < 2) return {};
  x[static_cast<std::size_t>(rate)] = Median(rates);
  if (radix >= 0) {
    std::vector<double> radices;
    for (const auto& o : obs)
      radices.push_back(Wrap360(o.value.ToDouble() - x[static_cast<std::size_t>(rate)] * o.arg));
    x[static_cast<std::size_t>(radix)] = Median(radices);
  }
  return x;
}

}  // namespace apograph::estimate::internal
