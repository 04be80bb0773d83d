// Mean motions: radix plus rate times the argument, reduced modulo 360 (or by
// another modulus, or not at all). One model per unit of the argument so that
// the rate's default and search range fit the table.
#include <cmath>

#include "model/builtin.hpp"

namespace apograph::model::internal {
namespace {

/// m(t) = radix + rate * t, reduced into [0, modulus) when modulus > 0. The
/// product and the reduction are done in long double whatever T is: rate * t
/// reaches 10^6 degrees in year tables, where a double's last bit is already
/// 10^-10 degrees.
template <typename T>
T MeanMotion(const T* p, T t, T) {
  using W = long double;
  const W v = W(p[0]) + W(p[1]) * W(t);
  return static_cast<T>(p[2] > T(0) ? ReduceModulo(v, W(p[2])) : v);
}

/// The same with its derivatives: the value as above (long double inside),
/// and on the piece where it stands (the whole moduli removed held fixed)
/// d/d radix = 1, d/d rate = t, d/d modulus = -(whole moduli removed). Exact,
/// where forward differences would jump by a whole modulus at a wrap.
template <int N>
Dual<N> MeanMotionDual(const Dual<N>* p, Dual<N> t, Dual<N>) {
  using W = long double;
  const W v = W(p[0].v) + W(p[1].v) * W(t.v);
  const bool reduce = p[2].v > 0;
  const W r = reduce ? ReduceModulo(v, W(p[2].v)) : v;
  const double turns = reduce ? static_cast<double>(std::round((v - r) / W(p[2].v))) : 0.0;
  Dual<N> out(static_cast<double>(r));
  for (int i = 0; i < N; ++i)
    out.d[i] = p[0].d[i] + p[1].d[i] * t.v + p[1].v * t.d[i] - turns * p[2].d[i];
  return out;
}

/// Every instantiation, the dual numbers by MeanMotionDual.
#define APOGRAPH_MEAN_MOTION \
  &MeanMotion<double>, &MeanMotion<long double>, &MeanMotionDual<1>, &MeanMotionDual<2>

ParamSpec Radix() {
  return {"radix", "deg", "value at argument 0 (the epoch)", 0.0, 0.0, 360.0, ParamRole::kRadix};
}
ParamSpec Rate(const char* unit, double def, double high) {
  return {"rate", unit, "mean motion per unit of the argument", def, 0.0, high, ParamRole::kRate};
}
ParamSpec Modulus() {
  return {"modulus",
          "deg",
          "reduce modulo this (360 usual; 0: no reduction)",
          360.0,
          0.0,
          360.0,
          ParamRole::kModulus};
}
/// The words of a table's kind, title or argument that name the unit.
ModelTraits Traits(std::vector<std::string> words) {
  return {ModelKind::kMeanMotion, false, SignForm::kSigned, std::move(words), {}};
}

const char kFormula[] = "m(t) = radix + rate * t, reduced into [0, modulus) when modulus > 0.";
const char kConvention[] =
    "argument: %; the value is reduced modulo `modulus` (set it to 0 for a table of "
    "accumulated motion); not displaced (the radix plays that part).";

std::string Convention(const std::string& unit) {
  std::string s = kConvention;
  return s.replace(s.find('%'), 1, unit);
}

// Default rates are the sun's (0;59,8,19,48 per day), as a starting point.
constexpr double kSunPerDay = 59.0 / 60 + 8.0 / 3600 + 19.0 / 216000 + 48.0 / 12960000;

const BuiltinModel kDays("mean-motion", kFormula, Convention("days"),
                         {Radix(), Rate("deg/day", kSunPerDay, 15.0), Modulus()}, Traits({"day"}),
                         APOGRAPH_MEAN_MOTION);
const BuiltinModel kMonths("mean-motion-months", kFormula,
                           Convention("months (of the table's calendar; the rate is per month)"),
                           {Radix(), Rate("deg/month", 30 * kSunPerDay, 360.0), Modulus()},
                           Traits({"month"}), APOGRAPH_MEAN_MOTION);
const BuiltinModel kYears("mean-motion-years", kFormula,
                          Convention("single years (the rate is per year, usually the excess "
                                     "over whole turns)"),
                          {Radix(), Rate("deg/year", 365 * kSunPerDay, 360.0), Modulus()},
                          Traits({"expanded", "single year", "year"}), APOGRAPH_MEAN_MOTION);
const BuiltinModel kCollected("mean-motion-collected", kFormula,
                              Convention("collected years, the number of years of the group "
                                         "(20, 40, 60 ...; the rate is per year)"),
                              {Radix(), Rate("deg/year", 365 * kSunPerDay, 360.0), Modulus()},
                              Traits({"collected"}), APOGRAPH_MEAN_MOTION);

}  // namespace

const std::vector<const BuiltinModel*>& MeanMotionModels() {
  static const std::vector<const BuiltinModel*> kAll = {&kDays, &kMonths, &kYears, &kCollected};
  return kAll;
}

}  // namespace apograph::model::internal
