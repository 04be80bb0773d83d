// The solar equation: the eccentric model and the concentric deferent with an
// epicycle, which agree when the conditions of equivalence hold (epicycle
// radius = eccentricity, the sun turning on the epicycle against the
// deferent's sense at the same rate).
#include <cmath>

#include "model/builtin.hpp"

namespace apograph::model::internal {
namespace {

/// Eccentric: q(a) = atan2(e sin a, 60 + e cos a), a the mean anomaly from the
/// apogee (positive from 0 to 180, negative beyond: the signed form; the
/// tables conventionally give the amount). Greatest where the true anomaly
/// is 90: asin(e/60).
template <typename T>
T SolarEccentric(const T* p, T a, T) {
  return Atan2Deg(p[0] * SinDeg(a), T(60) + p[0] * CosDeg(a));
}

/// Concentric with epicycle, computed from the figure rather than the
/// closed form: the epicycle's centre E stands at 60 (cos a, sin a); the sun
/// stands on the epicycle at the epicyclic anomaly g = -a from E's apogee,
/// i.e. at E + r (cos(a + g), sin(a + g)). The equation is the angle between
/// the mean direction a and the true direction of the sun.
template <typename T>
T SolarEpicycle(const T* p, T a, T) {
  const T g = -a;
  const T x = T(60) * CosDeg(a) + p[0] * CosDeg(a + g);
  const T y = T(60) * SinDeg(a) + p[0] * SinDeg(a + g);
  // Angle from the true direction back to the mean direction, in (-180, 180].
  const T mean_x = CosDeg(a), mean_y = SinDeg(a);
  return Atan2Deg(mean_y * x - mean_x * y, mean_x * x + mean_y * y);
}

const char kEquationConvention[] =
    "argument: the mean anomaly in degrees from the apogee; the table gives the amount of the "
    "equation: q(360 - a) = q(a), whether it is subtracted (0..180) or added (180..360) is the "
    "table's rubric; not displaced.";

const BuiltinModel kSolarEccentric(
    "solar-eccentric",
    "q(a) = atan2(e sin a, 60 + e cos a): the eccentric model with eccentricity e on a radius "
    "of 60; greatest equation asin(e/60).",
    kEquationConvention, {{"e", "parts of 60", "eccentricity of the sun's circle", 2.5, 1.0, 4.0}},
    FunctionTraits(true, SignForm::kMagnitude, {"sun", "solar"}), APOGRAPH_FORMULA(SolarEccentric));
const BuiltinModel kSolarEpicycle(
    "solar-epicycle",
    "The concentric deferent of radius 60 carrying an epicycle of radius r on which the sun "
    "turns against the deferent's sense at the same rate; identical to solar-eccentric with "
    "e = r.",
    kEquationConvention, {{"r", "parts of 60", "radius of the sun's epicycle", 2.5, 1.0, 4.0}},
    FunctionTraits(true, SignForm::kMagnitude, {"sun", "solar"}), APOGRAPH_FORMULA(SolarEpicycle));

}  // namespace

const std::vector<const BuiltinModel*>& SolarModels() {
  static const std::vector<const BuiltinModel*> kAll = {&kSolarEccentric, &kSolarEpicycle};
  return kAll;
}

}  // namespace apograph::model::internal
