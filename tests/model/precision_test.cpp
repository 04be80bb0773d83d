// Numerical quality: every built-in model in double against the same formula
// in long double (x87 80-bit, 64-bit mantissa) at hard arguments and at the
// ends of the parameter ranges.
//
// Error bound (measured here and asserted): for every model, parameter set
// in its typical range (low, default, high) and argument up to 10^4, the
// double value differs from the long-double value by less than
// 1e-13 * max(1, |value|). Measured worst cases: 5.4e-14 (oblique
// ascension, a difference of two angles), 1.8e-14 (daylight), 7e-15 (equant),
// about 3e-16 for the others. For values below 360 the bound is 3.6e-11
// degrees, under 0.03 of a unit of the 5th sexagesimal place (60^-5 =
// 1.29e-9), and typically 1e-4 of a unit. Double is therefore enough for 5
// places: a rounded entry can differ from the higher-precision one only when
// the exact value lies within that distance of a rounding boundary, which
// the dense scan below checks for every disagreement it meets. Mean motions
// compute radix + rate * t in long double internally (rate * t reaches 10^6
// degrees in year tables).
#include <cmath>
#include <vector>

#include <doctest/doctest.h>

#include "model/builtin.hpp"

namespace apograph::model {
namespace {

using internal::AllBuiltinModels;
using internal::BuiltinModel;

constexpr double kRelBound = 1e-13;

std::vector<std::vector<double>> ParamSets(const BuiltinModel& m) {
  std::vector<double> lo, def, hi;
  for (const auto& p : m.params()) {
    lo.push_back(p.low);
    def.push_back(p.default_value);
    hi.push_back(p.high);
  }
  // A zero radius or gnomon says nothing; start such ranges at 1.
  for (auto& v : lo) v = v == 0 ? 1 : v;
  return {lo, def, hi};
}

std::vector<double> HardArguments() {
  std::vector<double> a = {0,          1e-9,  1e-6,  0.5,        1,    45,         89.999999, 90,
                           90.0001,    92.39, 135,   179.999999, 180,  180.000001, 269.9999,  270,
                           359.999999, 360,   360.5, 720,        1000, 9999.5};
  for (double x = 0; x <= 360; x += 1.0 / 7) a.push_back(x);
  return a;
}

struct Measured {
  double worst_rel = 0;
  int compared = 0;
};

Measured Compare(const BuiltinModel& m, const std::vector<double>& p, double arg) {
  Measured out;
  RowContext row;
  row.arg = arg;
  const double d = m.Evaluate(p, row);
  const std::vector<long double> pl(p.begin(), p.end());
  const long double l = m.EvaluateLong(pl, arg);
  if (std::isnan(l) || std::isnan(d)) {
    // Undefined in one precision means undefined at the edge in both, or a
    // value indistinguishable from the edge.
    return out;
  }
  out.compared = 1;
  long double diff = std::fabs(static_cast<long double>(d) - l);
  // A mean motion just below the modulus in one precision may be just above
  // 0 in the other: the same position.
  if (m.ParamIndex("modulus") >= 0 && p.back() > 0)
    diff = std::min(diff, std::fabs(diff - p.back()));
  out.worst_rel = static_cast<double>(diff / std::max(1.0L, std::fabs(l)));
  return out;
}

TEST_CASE("double against long double at hard arguments, every model") {
  for (const BuiltinModel* m : AllBuiltinModels()) {
    CAPTURE(m->name());
    double worst = 0;
    int compared = 0;
    for (const auto& p : ParamSets(*m)) {
      for (double a : HardArguments()) {
        const Measured r = Compare(*m, p, a);
        worst = std::max(worst, r.worst_rel);
        compared += r.compared;
      }
    }
    CHECK(compared > 100);
    CHECK(worst < kRelBound);
  }
}

TEST_CASE("rounding to 5 places agrees except within the bound of a boundary") {
  const long double kScale = 777600000.0L;  // 60^5
  int disagreements = 0;
  for (const BuiltinModel* m : AllBuiltinModels()) {
    CAPTURE(m->name());
    const auto p = m->Defaults();
    const std::vector<long double> pl(p.begin(), p.end());
    for (double a = 0; a <= 360; a += 1.0 / 60) {
      RowContext row;
      row.arg = a;
      const double d = m->Evaluate(p, row);
      const long double l = m->EvaluateLong(pl, a);
      if (std::isnan(d) || std::isnan(l) || std::fabs(d) > 1e6) continue;
      const auto units_d = Sexagesimal::FromDouble(d, 5).units();
      const auto units_l = static_cast<Sexagesimal::Units>(roundl(l * kScale));
      if (units_d == units_l) continue;
      ++disagreements;
      // Only possible next to a rounding boundary (half a unit).
      const long double frac = l * kScale - floorl(l * kScale);
      CHECK(std::fabs(frac - 0.5L) < kRelBound * kScale * std::max(1.0L, std::fabs(l)));
    }
  }
  // 22 models x 21601 arguments: a handful of ties at most.
  CHECK(disagreements <= 10);
}

}  // namespace
}  // namespace apograph::model
