// Mean-motion columns by their construction (common practice): by
// multiplying an exact rate, by adding a rounded unit value (so errors grow
// along the table), or from other rounded entries (the 1000-day entry as ten
// times the rounded 100-day entry).
#include <cmath>
#include <map>
#include <string>

#include "table_build.hpp"

namespace apograph::synth::internal {
namespace {

std::string Int(std::int64_t t) { return std::to_string(t); }

// rate x t + radix, rounded by the practice, reduced.
std::int64_t Multiplied(const ColumnKey& c, std::int64_t t) {
  const long double v =
      static_cast<long double>(c.function.Param("rate")) * static_cast<long double>(t);
  return Reduce360(ToUnits(v, c.places, c.practice.rounding), c.places);
}

// Is t = m x 10^k (m in 1..9, k >= 1)? Sets m and the power.
bool DecimalForm(std::int64_t t, std::int64_t& m, std::int64_t& power) {
  power = 1;
  while (t % 10 == 0 && t > 0) {
    t /= 10;
    power *= 10;
  }
  m = t;
  return power >= 10 && m >= 1 && m <= 9;
}

// The motion in t units (no radix) built from rounded entries above a
// threshold: 10^k = 10 x entry 10^(k-1); m x 10^k = m x entry 10^k; the rest
// (and powers of ten up to `exact_up_to`) by multiplication.
std::int64_t FromEntries(const ColumnKey& c, std::int64_t t, std::int64_t exact_up_to,
                         std::map<std::int64_t, std::pair<std::int64_t, std::string>>& memo,
                         std::string& how) {
  if (auto it = memo.find(t); it != memo.end()) {
    how = it->second.second;
    return it->second.first;
  }
  std::int64_t m = 0, power = 0, v = 0;
  if (!DecimalForm(t, m, power) || power <= exact_up_to) {
    v = Multiplied(c, t);
    how = "rate x " + Int(t);
  } else if (m == 1) {
    std::string unused;
    v = Reduce360(10 * FromEntries(c, t / 10, exact_up_to, memo, unused), c.places);
    how = "10 x entry " + Int(t / 10);
  } else {
    std::string unused;
    v = Reduce360(m * FromEntries(c, power, exact_up_to, memo, unused), c.places);
    how = Int(m) + " x entry " + Int(power);
  }
  memo[t] = {v, how};
  return v;
}

}  // namespace

void ComputeMeanMotion(ColumnKey& c, const ArgumentKey& argument) {
  MeanMotionBuild& build = *c.mean_motion;
  const Sexagesimal radix = Sexagesimal::ParseOrThrow(c.function.Find("radix")->text);
  const auto radix_units = static_cast<std::int64_t>(radix.Extended(c.places).units());
  const std::int64_t unit = ToUnits(c.function.Param("rate"), c.places, c.practice.rounding);
  if (build.construction == "addition") build.unit_value = FromUnits(unit, c.places);
  std::map<std::int64_t, std::pair<std::int64_t, std::string>> memo;
  const std::int64_t exact_up_to = build.multiplied_up_to;
  build.how.clear();
  c.exact.clear();
  c.computed.clear();
  for (const auto& a : argument.values) {
    const auto t = static_cast<std::int64_t>(a.IntegerPart());
    std::string how;
    std::int64_t motion = 0;
    if (build.construction == "addition") {
      motion = Reduce360(unit * t, c.places);
      how = Int(t) + " x " + build.unit_value->ToString();
    } else if (build.construction == "from-entries") {
      motion = FromEntries(c, t, exact_up_to, memo, how);
    } else {
      motion = Multiplied(c, t);
      how = "rate x " + Int(t);
    }
    build.how.push_back(how);
    c.computed.push_back(FromUnits(Reduce360(motion + radix_units, c.places), c.places));
    c.exact.push_back(std::fmod(Evaluate(c.function, a.ToDouble()), 360.0));
  }
  c.tabulated = c.computed;
}

}  // namespace apograph::synth::internal
