#include "estimate/fit.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include "estimate/fit_covariance.hpp"
#include "estimate/fit_solver.hpp"
#include "estimate/fit_starts.hpp"

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

/// The combinations the model names whose parameters are all free and not
/// separable, with their values and errors (delta method on the
/// pseudo-inverse covariance, by central differences).
void Combinations(const model::Model& model, internal::FitProblem& problem,
                  const std::vector<double>& x, const internal::Covariance& cov, double scale,
                  FitResult& result) {
  const int k = static_cast<int>(x.size());
  for (const auto& c : model.traits().combinations) {
    bool involved = false;
    for (const auto& p : result.params) {
      for (const auto& name : c.params) involved = involved || (p.name == name && !p.separable);
    }
    if (!involved || !c.value) continue;
    std::vector<double> full = problem.Expand(x.data());
    DeterminedCombination d{c.params, c.text, c.value(full.data()), 0};
    std::vector<double> g(static_cast<std::size_t>(k), 0.0);
    for (int j = 0; j < k; ++j) {
      const int m = problem.ModelIndex(j);
      if (m < 0) continue;
      const double h = 1e-6 * std::max(std::fabs(full[m]), 1.0);
      std::vector<double> up = full, down = full;
      up[m] += h;
      down[m] -= h;
      g[j] = (c.value(up.data()) - c.value(down.data())) / (2 * h);
    }
    double var = 0;
    for (int i = 0; i < k; ++i)
      for (int j = 0; j < k; ++j) var += g[i] * cov.matrix[i * k + j] * g[j];
    d.stderr_ = std::sqrt(std::max(var, 0.0)) * scale;
    result.combinations.push_back(d);
  }
  problem.Expand(x.data());
}

/// Parameters with standard errors from the normal matrix at the optimum
/// (scaled by `scale`, units); parameters the entries cannot separate get
/// NaN and the model's combinations are reported instead.
void FillParams(const model::Model& model, internal::FitProblem& problem,
                const internal::SolveOutcome& s, double scale, FitResult& result) {
  const auto& specs = model.params();
  const auto& full = problem.Expand(s.x.data());
  result.params.clear();
  for (std::size_t j = 0; j < specs.size(); ++j) {
    result.params.push_back({specs[j].name, specs[j].unit, full[j], 0, true, true});
  }
  const int k = problem.num_free();
  const internal::Covariance cov = internal::CovarianceOf(s.normal, k);
  const double nan = std::numeric_limits<double>::quiet_NaN();
  for (int j = 0; j < k; ++j) {
    const bool known = !cov.matrix.empty() && cov.separable[static_cast<std::size_t>(j)];
    const double var = known
                           ? cov.matrix[static_cast<std::size_t>(j) * static_cast<std::size_t>(k) +
                                        static_cast<std::size_t>(j)]
                           : nan;
    const double se = std::sqrt(std::max(var, 0.0)) * scale;
    const int m = problem.ModelIndex(j);
    if (m >= 0) {
      auto& p = result.params[static_cast<std::size_t>(m)];
      p.fixed = false;
      p.separable = known;
      p.stderr_ = known ? se : nan;
    } else {
      result.displacement_stderr = known ? se : nan;
    }
  }
  result.free_parameters = k;
  if (cov.degenerate && !cov.matrix.empty()) Combinations(model, problem, s.x, cov, scale, result);
}

/// Every start solved in full (the reference solver); the best.
internal::SolveOutcome SolveEach(internal::FitProblem& problem,
                                 const std::vector<std::vector<double>>& starts,
                                 const FitOptions& options) {
  internal::SolveOutcome best;
  best.cost = std::numeric_limits<double>::infinity();
  for (const auto& start : starts) {
    auto s = internal::SolveReference(problem, start, options.loss_scale, options.max_iterations);
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

/// A table of positions' solution lies far outside its model's ranges (an
/// eccentricity of -200 parts, a radius of -130): further from the range
/// than its width (judgement: a negative eccentricity with the apogee
/// turned half a circle is the same geometry, and rates a little outside
/// the range occur; such figures are geometry no table was computed
/// with). Angles are periodic and not judged.
bool FarOutside(const model::Model& model, const internal::FitProblem& problem,
                const std::vector<double>& x) {
  for (std::size_t j = 0; j < problem.lows().size() && j < x.size(); ++j) {
    const int m = problem.ModelIndex(static_cast<int>(j));
    if (m < 0) continue;
    const auto role = model.params()[static_cast<std::size_t>(m)].role;
    if (role == model::ParamRole::kRadix || role == model::ParamRole::kApogee ||
        role == model::ParamRole::kAnomalyRadix)
      continue;
    const double lo = problem.lows()[j], hi = problem.highs()[j], w = hi - lo;
    if (x[j] < lo - w || x[j] > hi + w) return true;
  }
  return false;
}

/// The fast solver: every start brought near its optimum on a subsample,
/// then refined on every entry unless it came to an optimum already refined
/// (several grid starts usually share one basin).
internal::SolveOutcome SolveDistinct(internal::FitProblem& problem,
                                     const std::vector<std::vector<double>>& starts,
                                     const FitOptions& options, const model::Model& model,
                                     bool dedupe) {
  std::vector<internal::SolveOutcome> done;
  std::size_t best = 0;
  for (const auto& start : starts) {
    const std::vector<double> near =
        internal::Approach(problem, start, options.loss_scale, options.max_iterations);
    // A table of positions' starts are few and read off the entries: each
    // is refined (over a short arc the standard errors are large, and the
    // basins 10 of them apart differ).
    bool seen = false;
    for (const auto& d : done) seen = seen || (dedupe && SameOptimum(near, d, 10));
    if (seen) continue;
    done.push_back(internal::Refine(problem, near, options.loss_scale, options.max_iterations));
    // Of a table of positions' solutions, those within the model's ranges
    // first (see FarOutside).
    const auto rank = [&](const internal::SolveOutcome& o) {
      return std::make_pair(!dedupe && FarOutside(model, problem, o.x), o.cost);
    };
    if (rank(done.back()) < rank(done[best])) best = done.size() - 1;
  }
  if (done.empty()) return {};
  return std::move(done[best]);
}

/// The options with what the model implies: a model reduced modulo a circle
/// (a positive modulus) is compared modulo 360. Throws for a fixed
/// parameter the model does not have.
FitOptions Prepared(const model::Model& model, const FitOptions& given) {
  FitOptions options = given;
  if (const int m = model.ParamIndex(model::ParamRole::kModulus); m >= 0) {
    const auto& spec = model.params()[static_cast<std::size_t>(m)];
    auto f = options.fixed.find(spec.name);
    const double modulus = f != options.fixed.end() ? f->second : spec.default_value;
    options.modulo_360 = options.modulo_360 || modulus > 0;
  }
  for (const auto& [name, v] : options.fixed) {
    if (model.ParamIndex(name) < 0)
      throw std::invalid_argument("model " + model.name() + " has no parameter " + name);
  }
  return options;
}

/// Where the solver starts: the caller's start alone when given; otherwise
/// the start read off the entries for a mean motion or a table of
/// positions, then the grid's (see fit_starts.hpp).
std::vector<std::vector<double>> Starts(const model::Model& model, internal::FitProblem& problem,
                                        const std::vector<Observation>& obs,
                                        const FitOptions& options, const std::vector<double>& x0) {
  if (!options.start.empty()) return {x0};
  std::vector<std::vector<double>> starts;
  if (auto p = internal::PositionStarts(model, problem, obs, x0); !p.empty()) {
    starts = std::move(p);
  } else if (problem.modulo()) {
    if (auto mm = internal::MeanMotionStart(model, problem, obs, x0); !mm.empty())
      starts.push_back(std::move(mm));
  }
  if (model.traits().kind != model::ModelKind::kPosition || starts.empty()) {
    for (auto& g : internal::GridStarts(problem, x0, options.loss_scale, 2))
      starts.push_back(std::move(g));
  }
  return starts;
}

/// Entries within this many units of the robust estimate, at least, are
/// inliers for the least-squares refit. Judgement: an entry rounded by the
/// author lies within half a unit, one of the author's departures within
/// one or two; a copyist's slip of a digit or a place is further off.
constexpr double kInlierUnits = 2.5;
/// ... or within this many robust scales (for models that do not reproduce
/// the entries to a unit). Judgement, the usual rejection rule.
constexpr double kInlierScales = 3;

/// The least-squares refit on the inliers of `best` (see fit.hpp), with the
/// scale its standard errors take: the inliers' robust scale (1.4826 MAD,
/// at least the rounding's 1/sqrt(12); for rounded entries about 0.37
/// units, which the calibration test in tests/estimate/fit_test.cpp finds
/// right for rounding errors, deterministic as they are). Returns false (nothing changed) for a
/// hopeless fit or when too few entries remain.
bool RefitInliers(const model::Model& model, const Transcription& table,
                  const std::vector<Observation>& obs, const FitOptions& options,
                  internal::FitProblem& problem, internal::SolveOutcome& best, double& scale,
                  int& inliers) {
  const std::size_t n = obs.size();
  std::vector<double> r(n);
  problem.Residuals(best.x.data(), r.data());
  const double robust = internal::RobustScale(r);
  scale = robust;
  inliers = static_cast<int>(n);
  if (best.hopeless || best.x.empty() || !options.refit_inliers) return false;
  const double limit = std::max(kInlierUnits, kInlierScales * robust);
  std::vector<Observation> kept;
  kept.reserve(n);
  for (std::size_t i = 0; i < n; ++i) {
    if (std::fabs(r[i]) <= limit) kept.push_back(obs[i]);
  }
  if (kept.size() < best.x.size() + 2) return false;
  FitOptions ls = options;
  ls.loss_scale = 1e6;  // Cauchy at this scale is least squares for residuals of a few units
  internal::FitProblem on(model, table, kept, ls);
  internal::SolveOutcome refit = options.solver == Solver::kCeres
                                     ? internal::SolveReference(on, best.x, ls.loss_scale, 20)
                                     : internal::Refine(on, best.x, ls.loss_scale, 20);
  if (options.solver == Solver::kCeres && !refit.covariance.empty())
    refit.normal = internal::Inverse(refit.covariance, static_cast<int>(best.x.size()));
  r.resize(kept.size());
  on.Residuals(refit.x.data(), r.data());
  scale = internal::RobustScale(r);
  inliers = static_cast<int>(kept.size());
  best.x = refit.x;
  best.normal = refit.normal;
  best.covariance = refit.covariance;
  best.values.clear();  // the summary evaluates every entry at the new point
  best.iterations += refit.iterations;
  return true;
}

/// The free parameter of `model` with `role`, or null when the model has
/// none or it is held.
const model::ParamSpec* FreeOfRole(const model::Model& model, const FitOptions& options,
                                   model::ParamRole role) {
  const int i = model.ParamIndex(role);
  if (i < 0) return nullptr;
  const auto& spec = model.params()[static_cast<std::size_t>(i)];
  return options.fixed.count(spec.name) ? nullptr : &spec;
}

/// Free vector `x` of `from` carried to `to` by parameter name (the
/// parameters `to` holds dropped, those `from` held at `to`'s start).
std::vector<double> Carried(const model::Model& model, const internal::FitProblem& from,
                            const std::vector<double>& x, const internal::FitProblem& to,
                            const FitOptions& to_options) {
  FitOptions o = to_options;
  for (int j = 0; j < static_cast<int>(x.size()); ++j) {
    const int i = from.ModelIndex(j);
    if (i >= 0) o.start[model.params()[static_cast<std::size_t>(i)].name] = x[j];
  }
  for (const auto& [name, v] : to_options.fixed) o.start.erase(name);
  return to.Start(o);
}

/// The solution `x` of `problem` has an epicycle within its range (r at
/// least the model's lowest, in size): a radius of a few thousandths of a
/// part follows the rounding of a mean motion's entries (seed 673 of
/// identify_accuracy_bench: a mean motion named a planet with r =
/// 0.00016, five entries more exact than the mean motion).
bool WithEpicycle(const model::Model& model, const internal::FitProblem& problem,
                  const std::vector<double>& x) {
  for (int j = 0; j < static_cast<int>(x.size()); ++j) {
    const int i = problem.ModelIndex(j);
    if (i < 0) continue;
    const auto& spec = model.params()[static_cast<std::size_t>(i)];
    if (spec.name == "r") return std::fabs(x[static_cast<std::size_t>(j)]) >= spec.low;
  }
  return false;
}

/// A planet's start on a circular deferent: the starts solved with the
/// eccentricity held at 0 (and the apogee, which then computes nothing,
/// at its default), the best of them freed from there. Near e = 0 the
/// apogee turns freely and the free fit's steps wander along the ridge of
/// the two rates over a short arc into another basin (identify_accuracy_bench
/// seed 94, a planet with e = 0 over 117 days: the free fit ended at e =
/// 0;49 with its rates 4 and 6% off, 58 of 117 entries exact; from the circular
/// start, 101, the author's rates within about 1%). Empty for other models,
/// when e or the apogee is held, for a column of equations (a planet's
/// seven parameters mimic an equation by date, and the circular fit made
/// one rank first: tests/estimate/robust_identify_test.cpp), or when the
/// circular fit has no epicycle.
std::vector<double> CircularStart(const model::Model& model, const Transcription& table,
                                  const std::vector<Observation>& obs, const FitOptions& options,
                                  const internal::FitProblem& problem,
                                  const std::vector<std::vector<double>>& starts) {
  if (model.traits().kind != model::ModelKind::kPosition || starts.empty() ||
      !internal::Longitudes(obs))
    return {};
  const model::ParamSpec* apogee = FreeOfRole(model, options, model::ParamRole::kApogee);
  if (!apogee || !FreeOfRole(model, options, model::ParamRole::kAnomalyRate) ||
      model.ParamIndex("e") < 0 || options.fixed.count("e"))
    return {};
  FitOptions held = options;
  held.fixed["e"] = 0;
  held.fixed[apogee->name] = apogee->default_value;
  internal::FitProblem circular(model, table, obs, held);
  std::vector<std::vector<double>> from;
  for (const auto& x : starts) from.push_back(Carried(model, problem, x, circular, held));
  const internal::SolveOutcome best = SolveDistinct(circular, from, held, model, false);
  if (best.x.empty() || !WithEpicycle(model, circular, best.x)) return {};
  FitOptions freed = options;
  freed.start["e"] = 0;
  freed.start[apogee->name] = apogee->default_value;
  return Carried(model, circular, best.x, problem, freed);
}

}  // namespace

FitResult Fit(const model::Model& model, const Transcription& table,
              const std::vector<Observation>& obs, const FitOptions& given) {
  const FitOptions options = Prepared(model, given);
  internal::FitProblem problem(model, table, obs, options);
  FitResult result;
  result.model = model.name();
  result.practice = options.practice;
  const std::vector<double> x0 = problem.Start(options);
  if (obs.empty()) {  // nothing to estimate from: the defaults, said to be unconverged
    internal::SolveOutcome none;
    none.x = x0;
    FillParams(model, problem, none, 0, result);
    return result;
  }
  auto starts = Starts(model, problem, obs, options, x0);
  if (auto c = CircularStart(model, table, obs, options, problem, starts); !c.empty())
    starts.push_back(std::move(c));
  internal::SolveOutcome best =
      options.solver == Solver::kCeres
          ? SolveEach(problem, starts, options)
          : SolveDistinct(problem, starts, options, model,
                          model.traits().kind != model::ModelKind::kPosition);
  if (best.x.empty()) best.x = x0;
  double scale = 0;
  RefitInliers(model, table, obs, options, problem, best, scale, result.inliers);
  internal::PositiveEccentricity(model, problem, best);
  internal::CanonicalAngles(model, problem, options, best.x);
  if (options.practice.round_nodes && options.practice.grid > 0)
    internal::Polish(problem, options.loss_scale, best);
  result.cost = best.cost;
  result.converged = best.converged;
  result.iterations = best.iterations;
  Summarise(problem, obs, options, best.x.data(), result, &best.values);
  FillParams(model, problem, best, scale, result);
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
