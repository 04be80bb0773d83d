#pragma once
/// Internal to the model library (and its tests): the shape every built-in
/// model shares, and trigonometry in degrees for double and long double.
///
/// Each formula is written once as a template so that the tests can evaluate
/// it in long double beside the double used everywhere else and bound the
/// difference (see tests/model/precision_test.cpp), and so that it can be
/// evaluated with dual numbers (dual.hpp) for exact derivatives. Formulas
/// call the <cmath> functions unqualified (sin, not std::sin): the
/// using-declarations below find the standard ones for double and long
/// double, and argument-dependent lookup finds Dual's.

#include <cmath>
#include <limits>
#include <numbers>
#include <string>
#include <vector>

#include "model/dual.hpp"
#include "model/model.hpp"

namespace apograph::model::internal {

using std::acos;
using std::asin;
using std::atan;
using std::atan2;
using std::cos;
using std::fabs;
using std::floor;
using std::fmod;
using std::sin;
using std::sqrt;

/// Radians per degree at precision T (a plain number for dual numbers).
template <typename T>
constexpr ScalarOf<T> kRadian = std::numbers::pi_v<ScalarOf<T>> / ScalarOf<T>(180);

/// The "undefined here" value of a formula.
template <typename T>
T NotANumber() {
  return T(std::numeric_limits<ScalarOf<T>>::quiet_NaN());
}

/// x reduced exactly (fmod is exact) into (-180, 180], so that large
/// arguments lose no accuracy before the conversion to radians.
template <typename T>
T Reduce180(T x) {
  T r = fmod(x, T(360));
  if (r > T(180)) r -= T(360);
  if (r <= T(-180)) r += T(360);
  return r;
}

/// sin of x degrees with full relative accuracy near every zero: the
/// argument is folded into [0, 90] by exact subtractions in degrees (180 - r
/// and 90 - r are exact there), then the radian function is taken on at
/// most 45 degrees.
template <typename T>
T SinDeg(T x) {
  T r = Reduce180(x);
  const T sign = r < T(0) ? T(-1) : T(1);
  r = fabs(r);
  if (r > T(90)) r = T(180) - r;
  if (r <= T(45)) return sign * sin(r * kRadian<T>);
  return sign * cos((T(90) - r) * kRadian<T>);
}
/// cos of x degrees, folded the same way.
template <typename T>
T CosDeg(T x) {
  const T r = fabs(Reduce180(x));
  if (r <= T(45)) return cos(r * kRadian<T>);
  if (r <= T(135)) return sin((T(90) - r) * kRadian<T>);
  return -cos((T(180) - r) * kRadian<T>);
}
template <typename T>
T TanDeg(T x) {
  return SinDeg(x) / CosDeg(x);
}
template <typename T>
T AsinDeg(T x) {
  return asin(x) / kRadian<T>;
}
template <typename T>
T AcosDeg(T x) {
  return acos(x) / kRadian<T>;
}
template <typename T>
T AtanDeg(T x) {
  return atan(x) / kRadian<T>;
}
template <typename T>
T Atan2Deg(T y, T x) {
  return atan2(y, x) / kRadian<T>;
}

/// x reduced into [0, m).
template <typename T>
T ReduceModulo(T x, T m) {
  T r = fmod(x, m);
  return r < T(0) ? r + m : r;
}

/// A formula: parameters in declaration order, the row argument and the
/// column argument (0 when the table has none).
template <typename T>
using Formula = T (*)(const T* params, T arg, T arg2);

/// A built-in model: metadata plus one formula at two precisions and, for
/// formulas written for it, with dual numbers of one and two derivatives.
/// The formula gives the signed value (as the geometry has it); the sign
/// form a row asks for (RowContext::sign, kConventional resolved by the
/// traits) is applied to it and to its derivatives.
class BuiltinModel final : public Model {
 public:
  BuiltinModel(std::string name, std::string description, std::string convention,
               std::vector<ParamSpec> params, ModelTraits traits, Formula<double> f,
               Formula<long double> fl, Formula<Dual<1>> f1 = nullptr,
               Formula<Dual<2>> f2 = nullptr)
      : name_(std::move(name)),
        description_(std::move(description)),
        convention_(std::move(convention)),
        params_(std::move(params)),
        traits_(std::move(traits)),
        f_(f),
        fl_(fl),
        f1_(f1),
        f2_(f2) {}

  const std::string& name() const override { return name_; }
  const std::string& description() const override { return description_; }
  const std::string& convention() const override { return convention_; }
  const std::vector<ParamSpec>& params() const override { return params_; }
  const ModelTraits& traits() const override { return traits_; }
  double Evaluate(const std::vector<double>& p, const RowContext& row) const override;
  /// Exact derivatives by dual numbers when the formula has them (forward
  /// differences otherwise, as for every model).
  double EvaluateWithGradient(const std::vector<double>& p, const RowContext& row,
                              const std::vector<int>& wrt, double* gradient) const override;
  /// Whether EvaluateWithGradient is exact (dual numbers) here.
  bool HasExactGradient() const { return f1_ && f2_ && params_.size() <= kDualParameterLimit; }
  bool ExactGradient() const override { return HasExactGradient(); }
  /// The same formula in long double in the conventional sign form (for
  /// the precision tests).
  long double EvaluateLong(const std::vector<long double>& p, long double arg,
                           long double arg2 = 0) const;

 private:
  std::string name_, description_, convention_;
  std::vector<ParamSpec> params_;
  ModelTraits traits_;
  Formula<double> f_;
  Formula<long double> fl_;
  Formula<Dual<1>> f1_;
  Formula<Dual<2>> f2_;
};

/// Every instantiation of one formula template, for the constructor above.
#define APOGRAPH_FORMULA(fn) &fn<double>, &fn<long double>, &fn<Dual<1>>, &fn<Dual<2>>
/// Only double and long double: for a formula that cannot take dual numbers
/// (its derivatives are then taken by forward differences).
#define APOGRAPH_FORMULA_PLAIN(fn) &fn<double>, &fn<long double>

/// Traits of a function of the argument: `signed_values` when the formula
/// goes negative, `conventional` the form meant when the practice does not
/// say, and the words of a table's kind that name it.
inline ModelTraits FunctionTraits(bool signed_values, SignForm conventional,
                                  std::vector<std::string> kind_words) {
  return {ModelKind::kFunction, signed_values, conventional, std::move(kind_words), {}};
}

// Each family file defines its list (`TrigModels()` ...); builtin_models.cpp
// declares and concatenates them (the one registry of built-in models).
/// Every built-in model with its long-double form.
std::vector<const BuiltinModel*> AllBuiltinModels();

}  // namespace apograph::model::internal
