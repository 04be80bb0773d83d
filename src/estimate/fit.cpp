#include "estimate/fit.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include "estimate/fit_solver.hpp"

namespace apograph::estimate {

double FitResult::Value(const std::string& name) const {
  for (const auto& p : params) {
    if (p.name == name) return p.value;
  }
  throw std::out_of_range("no parameter " + name);
}

std::vector<double> FitResult::Values() const {
  std::vector<double> v;
  for (const auto& p : params) v.push_back(p.value);
  return v;
}

namespace {

void FillEntry(FitEntry& e, const Observation& o, double exact, const FitOptions& options) {
  e.row = o.row;
  e.column = o.column;
  e.arg = o.arg;
  e.tabulated = o.value;
  e.exact = exact;
  const int p = options.practice.places ? std::min(*options.practice.places, o.places) : o.places;
  if (!std::isfinite(exact) || std::fabs(exact) > 1e11) {
    e.computed = std::nullopt;
    e.diff_units = std::numeric_limits<double>::quiet_NaN();
    e.flag = true;
    return;
  }
  const auto units = internal::BroughtUnits(exact, p, options.practice.rounding);
  Sexagesimal c = units ? Sexagesimal::FromUnits(*units, p)
                        : Sexagesimal::FromDouble(exact, p, options.practice.rounding);
  if (p != o.places) c = c.Extended(o.places);
  if (options.modulo_360) c = c.Modulo(360);
  e.computed = c;
  if (units && p == o.places && !options.modulo_360 && std::fabs(o.units) < 0x1p52) {
    e.diff_units = o.units - static_cast<double>(*units);  // = DiffUnits, exactly
    e.flag = std::fabs(e.diff_units) > options.tolerance;
    return;
  }
  e.diff_units = DiffUnits(o.value, *e.computed, o.places);
  if (options.modulo_360) {
    const double full = 360.0 * std::pow(60.0, o.places);
    e.diff_units -= full * std::round(e.diff_units / full);
  }
  e.flag = std::fabs(e.diff_units) > options.tolerance;
}

/// Entries, counts and robust scale at the free vector x (`values`: the
/// model's values there when the solver has them, else computed here).
void Summarise(internal::FitProblem& problem, const std::vector<Observation>& obs,
               const FitOptions& options, const double* x, FitResult& result,
               const std::vector<double>* values = nullptr) {
  result.entries.assign(obs.size(), {});
  result.n = static_cast<int>(obs.size());
  result.exact = result.within1 = result.flagged = 0;
  std::vector<double> residuals(obs.size());
  const bool have = values && values->size() == obs.size();
  for (std::size_t i = 0; i < obs.size(); ++i) {
    FitEntry& e = result.entries[i];
    const double v = have ? (*values)[i] : problem.Value(i, x);
    FillEntry(e, obs[i], v, options);
    e.residual = residuals[i] = problem.ResidualOf(i, v);
    if (!std::isfinite(e.diff_units)) {
      ++result.flagged;
      continue;
    }
    result.exact += e.diff_units == 0;
    result.within1 += std::fabs(e.diff_units) <= 1;
    result.flagged += e.flag;
  }
  result.robust_scale = internal::RobustScale(residuals);
}

void FillParams(const model::Model& model, internal::FitProblem& problem,
                const internal::SolveOutcome& s, double scale, FitResult& result) {
  const auto& specs = model.params();
  const auto& full = problem.Expand(s.x.data());
  result.params.clear();
  for (std::size_t j = 0; j < specs.size(); ++j) {
    result.params.push_back({specs[j].name, specs[j].unit, full[j], 0, true});
  }
  const int k = problem.num_free();
  for (int j = 0; j < k; ++j) {
    const double var = s.covariance.empty() ? std::numeric_limits<double>::quiet_NaN()
                                            : s.covariance[static_cast<std::size_t>(j * k + j)];
    const double se = std::sqrt(std::max(var, 0.0)) * scale;
    const int m = problem.ModelIndex(j);
    if (m >= 0) {
      result.params[static_cast<std::size_t>(m)].fixed = false;
      result.params[static_cast<std::size_t>(m)].stderr_ = se;
    } else {
      result.displacement_stderr = se;
    }
  }
  result.free_parameters = k;
}

/// Every start solved in full (the reference solver); the best.
internal::SolveOutcome SolveEach(internal::FitProblem& problem,
                                 const std::vector<std::vector<double>>& starts,
                                 const FitOptions& options) {
  internal::SolveOutcome best;
  best.cost = std::numeric_limits<double>::infinity();
  for (const auto& start : starts) {
    auto s = internal::SolveCeres(problem, start, options.loss_scale, options.max_iterations);
    if (s.cost < best.cost) best = std::move(s);
  }
  return best;
}

/// x lies within `many` standard errors of the solution s in every free
/// parameter (so that refining it would land on s again).
bool SameOptimum(const std::vector<double>& x, const internal::SolveOutcome& s, double many) {
  const std::size_t k = x.size();
  if (s.covariance.size() != k * k) return false;
  for (std::size_t j = 0; j < k; ++j) {
    const double sd = std::sqrt(std::max(s.covariance[j * k + j], 0.0));
    if (!(std::fabs(x[j] - s.x[j]) <= many * sd)) return false;
  }
  return true;
}

/// The fast solver: every start brought near its optimum on a subsample,
/// then refined on every entry unless it came to an optimum already refined
/// (several grid starts usually share one basin).
/// A start for a mean motion read off the entries themselves. Its cost
/// modulo 360 has a basin far narrower than any grid over the rate's range
/// (at 3 places, 1e-6 deg a day is 9 units after 40 days), so the grid alone
/// misses it. The rate: the median of the local rates between neighbouring
/// entries (each step taken modulo 360, as a table never advances a whole
/// turn between rows); the radix: the median of entry - rate x argument.
/// Empty when the model has no free rate or there are too few entries.
std::vector<double> MeanMotionStart(const model::Model& model, internal::FitProblem& problem,
                                    const std::vector<Observation>& obs, std::vector<double> x) {
  int rate = -1, radix = -1;
  for (int j = 0; j < static_cast<int>(x.size()); ++j) {
    const int m = problem.ModelIndex(j);
    if (m >= 0 && model.params()[static_cast<std::size_t>(m)].name == "rate") rate = j;
    if (m >= 0 && model.params()[static_cast<std::size_t>(m)].name == "radix") radix = j;
  }
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
  std::nth_element(rates.begin(), rates.begin() + static_cast<std::ptrdiff_t>(rates.size() / 2),
                   rates.end());
  x[static_cast<std::size_t>(rate)] = rates[rates.size() / 2];
  if (radix >= 0) {
    std::vector<double> radices;
    for (const auto& o : obs) {
      radices.push_back(std::fmod(
          o.value.ToDouble() - x[static_cast<std::size_t>(rate)] * o.arg + 3600.0 * 360.0, 360.0));
    }
    std::nth_element(radices.begin(),
                     radices.begin() + static_cast<std::ptrdiff_t>(radices.size() / 2),
                     radices.end());
    x[static_cast<std::size_t>(radix)] = radices[radices.size() / 2];
  }
  return x;
}

internal::SolveOutcome SolveDistinct(internal::FitProblem& problem,
                                     const std::vector<std::vector<double>>& starts,
                                     const FitOptions& options) {
  std::vector<internal::SolveOutcome> done;
  std::size_t best = 0;
  for (const auto& start : starts) {
    const std::vector<double> near =
        internal::Approach(problem, start, options.loss_scale, options.max_iterations);
    bool seen = false;
    for (const auto& d : done) seen = seen || SameOptimum(near, d, 10);
    if (seen) continue;
    done.push_back(internal::Refine(problem, near, options.loss_scale, options.max_iterations));
    if (done.back().cost < done[best].cost) best = done.size() - 1;
  }
  if (done.empty()) return {};
  return std::move(done[best]);
}

/// With rounded nodes the cost is flat between the parameter values where a
/// node's rounding changes, and the solver's derivatives (those of the exact
/// nodes) only bring it near the optimum: a pattern search on the cost
/// itself finishes the work (steps from 2 standard errors down to 1/100 of
/// one, each free parameter in turn).
void Polish(internal::FitProblem& problem, double loss_scale, internal::SolveOutcome& best) {
  const std::size_t k = best.x.size();
  std::vector<double> r(problem.size());
  auto cost = [&](const std::vector<double>& x) {
    problem.Residuals(x.data(), r.data());
    return internal::CauchyCost(r.data(), r.size(), loss_scale);
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

}  // namespace

FitResult Fit(const model::Model& model, const Transcription& table,
              const std::vector<Observation>& obs, const FitOptions& given) {
  FitOptions options = given;
  // A model reduced modulo a circle is compared modulo 360.
  if (const int m = model.ParamIndex("modulus"); m >= 0) {
    auto f = options.fixed.find("modulus");
    const double modulus = f != options.fixed.end()
                               ? f->second
                               : model.params()[static_cast<std::size_t>(m)].default_value;
    options.modulo_360 = options.modulo_360 || modulus > 0;
  }
  for (const auto& [name, v] : options.fixed) {
    bool known = false;
    for (const auto& p : model.params()) known = known || p.name == name;
    if (!known) throw std::invalid_argument("model " + model.name() + " has no parameter " + name);
  }
  internal::FitProblem problem(model, table, obs, options);
  FitResult result;
  result.model = model.name();
  result.practice = options.practice;
  const std::vector<double> x0 = problem.Start(options);
  std::vector<std::vector<double>> starts =
      options.start.empty() ? internal::GridStarts(problem, x0, options.loss_scale, 2)
                            : std::vector<std::vector<double>>{x0};
  if (options.start.empty() && problem.modulo()) {
    if (auto mm = MeanMotionStart(model, problem, obs, x0); !mm.empty())
      starts.insert(starts.begin(), mm);
  }
  internal::SolveOutcome best = options.solver == Solver::kCeres
                                    ? SolveEach(problem, starts, options)
                                    : SolveDistinct(problem, starts, options);
  if (best.x.empty()) best.x = x0;
  if (options.practice.round_nodes && options.practice.grid > 0)
    Polish(problem, options.loss_scale, best);
  result.cost = best.cost;
  result.converged = best.converged;
  result.iterations = best.iterations;
  Summarise(problem, obs, options, best.x.data(), result, &best.values);
  FillParams(model, problem, best, result.robust_scale, result);
  result.practice.displacement = problem.Displacement(best.x.data());
  return result;
}

FitResult Fit(const model::Model& model, const Transcription& table,
              const std::vector<int>& columns, const FitOptions& options) {
  return Fit(model, table, CollectObservations(table, columns), options);
}

void Evaluate(const model::Model& model, const Transcription& table,
              const std::vector<Observation>& obs, const FitOptions& options, FitResult& result) {
  FitOptions o = options;
  o.fit_displacement = false;
  o.practice = result.practice;
  for (const auto& p : result.params) o.fixed[p.name] = p.value;
  internal::FitProblem problem(model, table, obs, o);
  Summarise(problem, obs, o, nullptr, result);
}

}  // namespace apograph::estimate
