// Tables of positions by date (almanacs, ephemerides): a mean motion with the
// periodic corrections of a geometric model added, reduced modulo 360.
//  - true-sun: the mean sun plus the solar equation of the eccentric model;
//  - planet-position: a planet on an epicycle whose centre moves on an
//    eccentric deferent, with its own mean motions in longitude and in
//    anomaly, so that its apparent motion progresses and regresses.
// The argument is the number of days (or of any unit the rates are given
// per) since the epoch at which the radices hold.
#include <cmath>

#include "model/builtin.hpp"

namespace apograph::model::internal {
namespace {

/// radix + rate t reduced into [0, 360), the product and the reduction in
/// long double: rate t reaches 10^4 degrees in a table by days, where a
/// double's last bit is already 2e-12 degrees.
template <typename T>
T MeanLongitude(T radix, T rate, T t) {
  using W = long double;
  return static_cast<T>(ReduceModulo(W(radix) + W(rate) * W(t), W(360)));
}
/// The same with its derivatives (the whole turns removed held fixed).
template <int N>
Dual<N> MeanLongitude(Dual<N> radix, Dual<N> rate, Dual<N> t) {
  using W = long double;
  Dual<N> out(static_cast<double>(ReduceModulo(W(radix.v) + W(rate.v) * W(t.v), W(360))));
  for (int i = 0; i < N; ++i) out.d[i] = radix.d[i] + rate.d[i] * t.v + rate.v * t.d[i];
  return out;
}

/// A longitude `v` (near [0, 360)) reduced modulo `modulus`, or, with a
/// modulus of 0, restored to the whole turns of radix + rate t.
template <typename T>
T Reduced(T v, T radix, T rate, T t, T modulus) {
  if (modulus > T(0)) return ReduceModulo(v, modulus);
  return v + T(360) * floor((radix + rate * t) / T(360));
}

/// True sun: mean longitude m = radix + rate t; mean anomaly a = m - apogee;
/// true longitude m - q(a), q(a) = atan2(e sin a, 60 + e cos a) the solar
/// equation of the eccentric model (subtracted from 0 to 180 of anomaly,
/// added beyond); reduced modulo `modulus` when it is positive.
template <typename T>
T TrueSun(const T* p, T t, T) {
  const T m = MeanLongitude(p[0], p[1], t);
  const T a = m - p[2];
  const T q = Atan2Deg(p[3] * SinDeg(a), T(60) + p[3] * CosDeg(a));
  return Reduced(m - q, p[0], p[1], t, p[4]);
}

/// The solar equation by date: q(a) = atan2(e sin a, 60 + e cos a) at the
/// mean anomaly a = anomaly-radix + anomaly-rate t of day t (the column of
/// equations beside a table of the mean and the true sun); positive while
/// the anomaly is in its first half (the correction is then subtracted).
template <typename T>
T SolarEquationByDate(const T* p, T t, T) {
  const T a = MeanLongitude(p[0], p[1], t);
  return Atan2Deg(p[2] * SinDeg(a), T(60) + p[2] * CosDeg(a));
}

/// Planet on an epicycle: the deferent (radius 60) has its centre D at
/// distance e from the observer toward the apogee A; the epicycle's centre
/// C = D + 60 (cos m, sin m) moves uniformly (mean longitude m = radix +
/// rate t); the planet stands on the epicycle (radius r) at the anomaly
/// g = anomaly-radix + anomaly-rate t counted from the direction D -> C:
/// P = C + r (cos(m + g), sin(m + g)). The position is the direction of P
/// from the observer, reduced modulo `modulus` when it is positive.
template <typename T>
T PlanetPosition(const T* p, T t, T) {
  const T m = MeanLongitude(p[0], p[1], t);
  const T g = MeanLongitude(p[2], p[3], t);
  const T apogee = p[4], e = p[5], r = p[6];
  const T x = e * CosDeg(apogee) + T(60) * CosDeg(m) + r * CosDeg(m + g);
  const T y = e * SinDeg(apogee) + T(60) * SinDeg(m) + r * SinDeg(m + g);
  // The direction relative to m, added to m.
  const T mean_x = CosDeg(m), mean_y = SinDeg(m);
  const T v = m + Atan2Deg(mean_x * y - mean_y * x, mean_x * x + mean_y * y);
  return Reduced(v, p[0], p[1], t, p[7]);
}

ParamSpec Radix(const char* what) {
  return {"radix", "deg", what, 0.0, 0.0, 360.0, ParamRole::kRadix};
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
ModelTraits PositionTraits(std::vector<std::string> words) {
  return {ModelKind::kPosition, false, SignForm::kSigned, std::move(words), {}};
}

// The sun's daily mean motion 0;59,8,19,48 as a starting point (common
// practice; the rate is estimated).
constexpr double kSunPerDay = 59.0 / 60 + 8.0 / 3600 + 19.0 / 216000 + 48.0 / 12960000;

const char kPositionConvention[] =
    "argument: days (or the unit the rates are given per) since the epoch of the radices; the "
    "value is the true longitude reduced modulo `modulus` (0: not reduced); not displaced.";

const BuiltinModel kTrueSun(
    "true-sun",
    "lambda(t) = m - q(m - A), m = radix + rate t the mean sun, q(a) = atan2(e sin a, 60 + e "
    "cos a) the solar equation of the eccentric model with apogee A.",
    kPositionConvention,
    {Radix("mean longitude at the epoch"),
     {"rate", "deg/day", "mean motion per day", kSunPerDay, 0.9, 1.1, ParamRole::kRate},
     {"apogee", "deg", "longitude of the apogee", 65.5, 0.0, 360.0, ParamRole::kApogee},
     {"e", "parts of 60", "eccentricity of the sun's circle", 2.5, 1.0, 4.0},
     Modulus()},
    PositionTraits({"true sun", "sun", "solar"}), APOGRAPH_FORMULA(TrueSun));

const BuiltinModel kSolarEquationByDate(
    "solar-equation-by-date",
    "q(t) = atan2(e sin a, 60 + e cos a), a = anomaly-radix + anomaly-rate t the sun's mean "
    "anomaly on day t: the equation of the eccentric model by date.",
    "argument: days (or the unit the rate is given per) since the epoch; signed: positive "
    "while the anomaly is between 0 and 180 (the correction is then subtracted); tables print "
    "it signed, negated (as the correction) or as magnitudes with a rubric; not displaced.",
    {{"anomaly-radix", "deg", "the sun's mean anomaly at the epoch", 0.0, 0.0, 360.0,
      ParamRole::kAnomalyRadix},
     // The range: any daily mean motion, the slowest planet's to the moon's
     // (13;10 deg/day), since a column of equations by date beside a mean
     // motion of another body on a simple eccentric has the same form
     // (judgement; the sun's range alone set such columns aside).
     {"anomaly-rate", "deg/day", "motion in anomaly per day", kSunPerDay, 0.0, 14.0,
      ParamRole::kAnomalyRate},
     {"e", "parts of 60", "eccentricity of the sun's circle", 2.5, 1.0, 4.0}},
    {ModelKind::kPosition, true, SignForm::kSigned, {"equation", "sun", "solar"}, {}},
    APOGRAPH_FORMULA(SolarEquationByDate));

const BuiltinModel kPlanetPosition(
    "planet-position",
    "The direction of a planet on an epicycle of radius r whose centre moves on a deferent of "
    "radius 60 centred at e from the observer toward the apogee: mean longitude m = radix + "
    "rate t, anomaly g = anomaly-radix + anomaly-rate t from the epicycle's mean apogee.",
    kPositionConvention,
    {Radix("mean longitude of the epicycle's centre at the epoch"),
     {"rate", "deg/day", "mean motion in longitude per day", 0.524, 0.0, 1.2, ParamRole::kRate},
     {"anomaly-radix", "deg", "anomaly at the epoch", 0.0, 0.0, 360.0, ParamRole::kAnomalyRadix},
     // Up to Mercury's 3;6,24 deg/day in anomaly (common practice: the
     // inner planets' anomaly is the synodic motion; 1.2 left Mercury out).
     {"anomaly-rate", "deg/day", "mean motion in anomaly per day", 0.4616, 0.0, 3.3,
      ParamRole::kAnomalyRate},
     {"apogee", "deg", "longitude of the deferent's apogee", 115.5, 0.0, 360.0, ParamRole::kApogee},
     {"e", "parts of 60", "eccentricity of the deferent", 6.0, 0.0, 12.0},
     {"r", "parts of 60", "radius of the epicycle", 39.5, 1.0, 45.0},
     Modulus()},
    PositionTraits({"planet", "almanac", "ephemeris", "position"}),
    APOGRAPH_FORMULA(PlanetPosition));

}  // namespace

const std::vector<const BuiltinModel*>& PositionModels() {
  static const std::vector<const BuiltinModel*> kAll = {&kTrueSun, &kSolarEquationByDate,
                                                        &kPlanetPosition};
  return kAll;
}

}  // namespace apograph::model::internal
