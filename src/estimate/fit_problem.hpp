#pragma once
/// Internal to the estimate stage: a fitting problem prepared once (per-entry
/// contexts, scales, practice offsets) so that residual evaluation inside the
/// solvers allocates nothing.

#include <cstddef>
#include <cstdint>
#include <optional>
#include <vector>

#include "estimate/fit.hpp"

namespace apograph::estimate::internal {

class FitProblem {
 public:
  FitProblem(const model::Model& model, const Transcription& table,
             const std::vector<Observation>& obs, const FitOptions& options);

  std::size_t size() const { return entries_.size(); }
  int num_free() const {
    return static_cast<int>(free_index_.size()) + (fit_displacement_ ? 1 : 0);
  }
  const std::vector<double>& lows() const { return lows_; }
  const std::vector<double>& highs() const { return highs_; }
  /// Starting free vector from defaults, options.start and the practice.
  std::vector<double> Start(const FitOptions& options) const;

  /// Residual of entry i, units of its last place (tabulated - model,
  /// centred for truncation, wrapped modulo 360 when asked). `x` is the free
  /// vector. Not thread-safe (uses a scratch parameter vector).
  double Residual(std::size_t i, const double* x);
  /// All residuals; `subset` limits to some entries (then r has subset size).
  void Residuals(const double* x, double* r, const std::vector<std::size_t>* subset = nullptr);
  /// Residuals r, their Jacobian J (row-major, num_free() columns, dr/dx)
  /// and the model's values v (as Value) in one pass: built-in models give
  /// exact derivatives at about the cost of a value. `subset` as above.
  void Linearise(const double* x, double* r, double* J, double* v,
                 const std::vector<std::size_t>* subset = nullptr);
  /// The model's value at entry i under the practice, with displacement.
  double Value(std::size_t i, const double* x);
  /// The residual of entry i when the model's value (as from Value) is v.
  double ResidualOf(std::size_t i, double v) const;
  /// Parameters never estimated unless the user frees them by --start: the
  /// modulus of the mean-motion and position models (a convention, not a
  /// quantity).
  static bool IsStructural(const model::ParamSpec& spec) {
    return spec.role == model::ParamRole::kModulus;
  }
  /// The value of a model parameter the options hold (for a free one, the
  /// value of the last vector expanded).
  double Held(std::size_t model_index) const { return full_[model_index]; }
  /// Full model parameter vector for a free vector.
  const std::vector<double>& Expand(const double* x);
  double Displacement(const double* x) const;
  /// Index in the model's parameters of free parameter j (-1: displacement).
  int ModelIndex(int j) const;
  int places(std::size_t i) const { return entries_[i].places; }
  /// Residuals wrap modulo 360.
  bool modulo() const { return modulo_; }
  /// The practice (without the displacement, which is added separately).
  const model::Practice& practice() const { return practice_; }

 private:
  struct Entry {
    model::RowContext ctx;
    double target = 0;  ///< tabulated units + truncation offset
    double tab = 0;     ///< tabulated value as a double
    double scale = 1;   ///< 60^places
    int places = 0;
  };
  double ModelValue(const Entry& e);
  /// Linearise by forward differences of the wrapped residuals: for models
  /// without exact derivatives compared modulo 360, whose values jump by a
  /// whole turn at a wrap.
  void LineariseByDifferences(const double* x, double* r, double* J, double* v,
                              const std::vector<std::size_t>* subset);

  const model::Model& model_;
  model::Practice practice_;  ///< without displacement (added here)
  std::vector<Entry> entries_;
  std::vector<int> free_index_;
  std::vector<double> full_;
  std::vector<double> gradient_;  ///< scratch, one per free model parameter
  std::vector<double> lows_, highs_;
  bool fit_displacement_ = false;
  bool modulo_ = false;
  double displacement_ = 0;
};

/// The units of Sexagesimal::FromDouble(value, places, rounding), by the
/// same long-double scaling and rounding, when they fit comfortably in 64
/// bits (so that a summary of 360 entries does not spend its time in
/// 128-bit conversions); nullopt otherwise.
std::optional<std::int64_t> BroughtUnits(double value, int places, Rounding rounding);

/// Cauchy robust cost sum s^2 log(1 + r^2/s^2).
double CauchyCost(const double* r, std::size_t n, double s);
/// 1.4826 x median absolute residual, floored at the rounding spread 1/sqrt(12).
double RobustScale(std::vector<double> residuals);

}  // namespace apograph::estimate::internal
