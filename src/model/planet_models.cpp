// Equations of the planets and the moon: the equation of anomaly on an
// epicycle (at mean, greatest and least distance), the equation of centre
// with an equant, and the moon's first anomaly.
#include <cmath>
#include <limits>

#include "model/builtin.hpp"

namespace apograph::model::internal {
namespace {

/// The angle at the observer subtended by a body on an epicycle of radius r
/// whose centre stands at distance d: atan2(r sin g, d + r cos g).
template <typename T>
T EpicycleAngle(T r, T d, T g) {
  return Atan2Deg(r * SinDeg(g), d + r * CosDeg(g));
}

template <typename T>
T EpicycleMean(const T* p, T g, T) {
  return EpicycleAngle(p[0], T(60), g);
}
template <typename T>
T EpicycleGreatest(const T* p, T g, T) {
  return EpicycleAngle(p[0], T(60) + p[1], g);
}
template <typename T>
T EpicycleLeast(const T* p, T g, T) {
  return EpicycleAngle(p[0], T(60) - p[1], g);
}

/// Equation of centre with an equant. The observer O at the origin, the
/// apsidal line along +x; the deferent's centre D at (e, 0), the equant Q at
/// (2e, 0). The epicycle's centre C lies on the deferent (radius 60 about D)
/// where the direction from Q makes the mean centre k with the apsidal line:
/// C = Q + t (cos k, sin k) with |C - D| = 60, so
/// t = -e cos k + sqrt(3600 - e^2 sin^2 k). The equation is the angle at C
/// between O and Q, i.e. k minus the true direction of C from O.
template <typename T>
T EquantCentre(const T* p, T k, T) {
  const T e = p[0];
  const T c = CosDeg(k), s = SinDeg(k);
  const T disc = T(3600) - e * e * s * s;
  if (disc < T(0)) return NotANumber<T>();
  const T t = -e * c + sqrt(disc);
  const T x = T(2) * e + t * c, y = t * s;
  // Angle from the true direction (x, y) to the mean direction (c, s).
  return Atan2Deg(s * x - c * y, c * x + s * y);
}

const char kAnomalyConvention[] =
    "argument: the anomaly on the epicycle in degrees from its apogee; the table gives the "
    "amount: p(360 - g) = p(g), added or subtracted by the table's rubric; not displaced.";

ParamSpec EpicycleRadius(double def, double low, double high) {
  return {"r", "parts of 60", "radius of the epicycle", def, low, high};
}
/// The greatest-distance and least-distance forms are epicycle-anomaly with
/// radius 60 r/(60 +- e): the entries fix that ratio, not r and e apart.
double RadiusAtGreatest(const double* p) { return 60 * p[0] / (60 + p[1]); }
double RadiusAtLeast(const double* p) { return 60 * p[0] / (60 - p[1]); }

ModelTraits AnomalyTraits(const char* combination = nullptr,
                          double (*value)(const double*) = nullptr) {
  ModelTraits t = FunctionTraits(true, SignForm::kMagnitude, {"anomaly", "planet", "epicycle"});
  if (combination) t.combinations.push_back({combination, {"r", "e"}, value, "epicycle-anomaly:r"});
  return t;
}
ParamSpec Eccentricity(double def) {
  return {"e", "parts of 60", "eccentricity of the deferent", def, 0.5, 12.0};
}

const BuiltinModel kEpicycleMean(
    "epicycle-anomaly",
    "p(g) = atan2(r sin g, 60 + r cos g): the equation of anomaly on an epicycle of radius r "
    "whose centre is at its mean distance 60; greatest asin(r/60).",
    kAnomalyConvention, {EpicycleRadius(6.5, 1.0, 45.0)}, AnomalyTraits(),
    APOGRAPH_FORMULA(EpicycleMean));
const BuiltinModel kEpicycleGreatest(
    "epicycle-anomaly-greatest",
    "p(g) = atan2(r sin g, 60 + e + r cos g): the equation of anomaly with the epicycle's "
    "centre at its greatest distance 60 + e.",
    kAnomalyConvention, {EpicycleRadius(6.5, 1.0, 45.0), Eccentricity(3.0)},
    AnomalyTraits("60 r/(60 + e), the radius of the equivalent epicycle at mean distance",
                  RadiusAtGreatest),
    APOGRAPH_FORMULA(EpicycleGreatest));
const BuiltinModel kEpicycleLeast(
    "epicycle-anomaly-least",
    "p(g) = atan2(r sin g, 60 - e + r cos g): the equation of anomaly with the epicycle's "
    "centre at its least distance 60 - e.",
    kAnomalyConvention, {EpicycleRadius(6.5, 1.0, 45.0), Eccentricity(3.0)},
    AnomalyTraits("60 r/(60 - e), the radius of the equivalent epicycle at mean distance",
                  RadiusAtLeast),
    APOGRAPH_FORMULA(EpicycleLeast));
const BuiltinModel kEquantCentre(
    "equant-centre",
    "The planetary equation of centre: deferent of radius 60 with its centre at e from the "
    "observer and the equant at 2e; q(k) = k - (true direction of the epicycle's centre), k "
    "the mean centre counted at the equant.",
    "argument: the mean centre in degrees from the apogee, counted at the equant; the table "
    "gives the amount: q(360 - k) = q(k), subtracted (0..180) or added (180..360) by the "
    "table's rubric; not displaced.",
    {Eccentricity(6.0)},
    FunctionTraits(true, SignForm::kMagnitude, {"centre", "center", "equant", "planet"}),
    APOGRAPH_FORMULA(EquantCentre));
const BuiltinModel kLunarAnomaly(
    "lunar-anomaly",
    "p(g) = atan2(r sin g, 60 + r cos g): the moon's first anomaly on an epicycle of radius r "
    "(5;15 is the usual figure); greatest asin(r/60).",
    kAnomalyConvention, {EpicycleRadius(5.25, 4.0, 7.0)},
    FunctionTraits(true, SignForm::kMagnitude, {"moon", "lunar"}), APOGRAPH_FORMULA(EpicycleMean));

}  // namespace

const std::vector<const BuiltinModel*>& PlanetModels() {
  static const std::vector<const BuiltinModel*> kAll = {
      &kEpicycleMean, &kEpicycleGreatest, &kEpicycleLeast, &kEquantCentre, &kLunarAnomaly};
  return kAll;
}

}  // namespace apograph::model::internal
