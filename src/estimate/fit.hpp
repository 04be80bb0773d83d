#pragma once
/// Robust estimation of a model's parameters from a witness's entries.
///
/// Residuals are measured in units of each entry's last place between the
/// model's value under the computing practice (interpolation grid,
/// displacement; truncation counts half a unit low on average) and the
/// tabulated value. Robust by design, in three steps:
///  1. starts that cover each free parameter's historical range (a coarse
///     grid over ParamSpec low..high scored on a subsample), plus starts read
///     off the entries for mean motions (the median local rate) and tables
///     of positions (their harmonics), plus the caller's;
///  2. from each start, a graduated schedule of Cauchy loss scales: first
///     the residuals' robust spread (1.4826 x median absolute deviation),
///     then ever smaller down to ~1 unit, so that gross errors (repetitions,
///     displaced runs, digit slips: up to a fifth of the entries) fall into
///     the loss's flat tail and stop pulling, while a start far off still
///     sees the slope toward the right basin (the Cauchy loss redescends:
///     an entry's influence falls to 0 far out);
///  3. a least-squares refit on the inliers (entries within max(2.5 units,
///     3 robust scales) of the robust estimate), which gives the estimate
///     and its covariance; standard errors are scaled by the inliers' robust
///     scale (1.4826 MAD, at least the rounding's 1/sqrt(12)).
/// Parameters the entries cannot separate (they enter only as a
/// combination) are reported as such, with the combination that is
/// determined when the model names it, never with a standard error of 0.
///
/// Two solvers give the same answer: a small dense Levenberg-Marquardt
/// written for 1-8 parameters (the default; no allocation per iteration) and
/// Ceres Solver with ceres::CauchyLoss and ceres::Covariance (kept as the
/// reference, cross-checked by the tests, and linked only into the tests and
/// benchmarks). See DEVELOPERS notes for the
/// measured speed of each.
///
/// How the fast solver keeps to a few full passes over the entries:
///  - derivatives come with the values in one pass (Model::
///    EvaluateWithGradient: exact for built-in models by dual numbers,
///    forward differences for user formulas);
///  - each grid start is first brought near its optimum on a subsample of
///    40 entries; only starts that reach an optimum not already refined are
///    refined on every entry;
///  - the fit stops when the next Newton step would move no parameter by
///    more than 1/100 of its standard error (without taking it), or when a
///    step lowers the cost by less than 1e-6 of itself;
///  - a model whose residuals still spread over 20 units (1.4826 MAD) after
///    the pass at a scale matched to them is not refined at the scale of 1
///    unit, where every entry lies in the loss's flat tail: that estimate
///    stands, and the robust scale reports how badly the model fits;
///  - with rounded grid nodes (flat cost between the values where a node's
///    rounding changes) a pattern search on the cost finishes the fit.

#include <map>
#include <optional>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "estimate/observations.hpp"
#include "model/model.hpp"

namespace apograph::estimate {

/// kCeres: the reference solver, in programs that call RegisterCeresSolver
/// (the tests and benchmarks; the command-line program links no Ceres).
enum class Solver { kFast, kCeres };

/// Makes Solver::kCeres available: defined in fit_ceres.cpp, which only the
/// test suite and the benchmarks link (CMake target apograph_ceres).
void RegisterCeresSolver();

struct FitOptions {
  model::Practice practice;
  /// Parameters held at a value (`--fix NAME=VALUE`); the others are free.
  std::map<std::string, double> fixed;
  /// Estimate a displacement constant as an extra parameter (the practice's
  /// displacement is then the starting value).
  bool fit_displacement = false;
  /// Compare model and table modulo 360 (mean motions reduced to a circle).
  bool modulo_360 = false;
  double loss_scale = 1.0;  ///< Cauchy scale, units of the last place
  Solver solver = Solver::kFast;
  int max_iterations = 60;
  /// Starting values instead of the grid search (name -> value).
  std::map<std::string, double> start;
  /// Entries farther than this from the model (units) are flagged.
  double tolerance = 1.0;
  /// Step 3 below (the least-squares refit on the inliers). Off: the Cauchy
  /// estimate alone, the loss another program would fit (`fit
  /// --cauchy-only`, for comparisons); standard errors then from the Cauchy
  /// optimum, scaled by the robust scale of every entry.
  bool refit_inliers = true;
};

/// One estimated (or fixed) parameter.
struct FittedParam {
  std::string name;
  std::string unit;
  double value = 0;
  double stderr_ = 0;  ///< 0 for fixed parameters; NaN when not separable
  bool fixed = false;
  /// False when the entries do not fix this parameter apart from another
  /// (only a combination of them): stderr_ is then NaN.
  bool separable = true;
  /// Why a parameter the model frees was held (fixed is then true): the
  /// entries do not determine it, and it stands at the value named here
  /// ("attested: TRADITION", "round, 0 places"); empty otherwise.
  std::string held;
};

/// A combination of parameters that the entries determine although the
/// parameters themselves are not separable.
struct DeterminedCombination {
  std::vector<std::string> params;  ///< the parameters it combines
  std::string text;                 ///< "60 r/(60 + e)"; empty when the model names none
  double value = 0, stderr_ = 0;    ///< NaN when the model names no combination
};

/// One entry after the fit, as `check` lists it.
struct FitEntry {
  std::size_t row = 0;
  int column = 0;
  double arg = 0;
  Sexagesimal tabulated;
  std::optional<Sexagesimal> computed;  ///< after the practice; none where undefined
  double exact = 0;                     ///< model value before rounding (with displacement)
  double diff_units = 0;                ///< tabulated - computed, units of the last place
  double residual = 0;                  ///< tabulated - exact (practice-centred), units
  bool flag = false;                    ///< |diff_units| > tolerance
};

struct FitResult {
  std::string model;
  std::vector<FittedParam> params;  ///< model parameters in model order
  model::Practice practice;         ///< displacement filled in when estimated
  double displacement_stderr = 0;
  int free_parameters = 0;  ///< counted for scoring
  double robust_scale = 0;  ///< 1.4826 MAD of residuals, units
  double cost = 0;          ///< robust cost at the optimum
  int n = 0, exact = 0, within1 = 0, flagged = 0;
  int inliers = 0;  ///< entries the least-squares refit used
  std::vector<FitEntry> entries;
  bool converged = false;
  int iterations = 0;
  /// Combinations determined where parameters are not separable.
  std::vector<DeterminedCombination> combinations;

  /// Value of a parameter by name (fixed or free); throws if unknown.
  double Value(const std::string& name) const;
  std::vector<double> Values() const;
};

/// Fits `model` to the entries `obs` (all from `table`). With no entry the
/// result has n = 0, the defaults as values and converged = false.
FitResult Fit(const model::Model& model, const Transcription& table,
              const std::vector<Observation>& obs, const FitOptions& options);

/// Convenience: fits the named columns (all when empty).
FitResult Fit(const model::Model& model, const Transcription& table,
              const std::vector<int>& columns, const FitOptions& options);

/// Re-evaluates entries, counts and scale for given parameter values (no fit).
void Evaluate(const model::Model& model, const Transcription& table,
              const std::vector<Observation>& obs, const FitOptions& options, FitResult& result);

}  // namespace apograph::estimate
