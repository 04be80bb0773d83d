// Spherical astronomy: declination, right ascension, ascensional difference,
// oblique ascension and the length of daylight, from the obliquity of the
// ecliptic and the geographical latitude. The argument is the sun's (or a
// point of the ecliptic's) longitude in degrees from the vernal equinox.
#include <cmath>
#include <limits>

#include "model/builtin.hpp"

namespace apograph::model::internal {
namespace {

/// Signed declination: asin(sin eps sin lambda).
template <typename T>
T SignedDeclination(T eps, T lambda) {
  return AsinDeg(SinDeg(eps) * SinDeg(lambda));
}

/// Signed ascensional difference asin(tan phi tan delta); NaN where the sun
/// does not rise or set.
template <typename T>
T SignedAscensionalDifference(T eps, T phi, T lambda) {
  const T x = TanDeg(phi) * TanDeg(SignedDeclination(eps, lambda));
  if (fabs(x) > T(1)) return NotANumber<T>();
  return AsinDeg(x);
}

/// Right ascension counted on from 0 like the longitude: the same number of
/// whole turns as lambda, so that alpha(360) = 360 and the column rises.
template <typename T>
T RightAscensionOf(T eps, T lambda) {
  const T turns = floor(lambda / T(360));
  const T a = ReduceModulo(Atan2Deg(CosDeg(eps) * SinDeg(lambda), CosDeg(lambda)), T(360));
  return turns * T(360) + a;
}

template <typename T>
T Declination(const T* p, T lambda, T) {
  return SignedDeclination(p[0], lambda);
}
template <typename T>
T RightAscension(const T* p, T lambda, T) {
  return RightAscensionOf(p[0], lambda);
}
template <typename T>
T AscensionalDifference(const T* p, T lambda, T) {
  return SignedAscensionalDifference(p[0], p[1], lambda);
}
template <typename T>
T ObliqueAscension(const T* p, T lambda, T) {
  return RightAscensionOf(p[0], lambda) - SignedAscensionalDifference(p[0], p[1], lambda);
}
/// Daylight in equinoctial hours: 12 + 2 * delta_asc / 15.
template <typename T>
T Daylight(const T* p, T lambda, T) {
  return T(12) + T(2) * SignedAscensionalDifference(p[0], p[1], lambda) / T(15);
}

ParamSpec Obliquity() {
  return {
      "obliquity",        "deg", "obliquity of the ecliptic (23;51,20, 23;35, 23;33,30, 24 occur)",
      23.0 + 35.0 / 60.0, 23.0,  24.2};
}
ParamSpec Latitude() {
  return {"latitude", "deg", "geographical latitude of the place", 36.0, 0.0, 66.0};
}

const BuiltinModel kDeclination(
    "declination", "delta(l) = asin(sin eps sin l); at l = 90 it equals the obliquity eps.",
    "argument: the longitude in degrees; the table gives the amount: delta(180 - l) = "
    "delta(l), and between 180 and 360 the same amounts are southern; not displaced.",
    {Obliquity()}, FunctionTraits(true, SignForm::kMagnitude, {"declination"}),
    APOGRAPH_FORMULA(Declination));
const BuiltinModel kRightAscension(
    "right-ascension", "alpha(l) = atan2(cos eps sin l, cos l), counted from 0 to 360 with l.",
    "argument: the longitude in degrees; rises with l (alpha(90) = 90, alpha(180) = 180, "
    "alpha(360) = 360; beyond 360 keeps counting); not displaced.",
    {Obliquity()}, FunctionTraits(false, SignForm::kSigned, {"right ascension"}),
    APOGRAPH_FORMULA(RightAscension));
const BuiltinModel kAscensionalDifference(
    "ascensional-difference",
    "d(l) = asin(tan phi tan delta(l)), the difference between right and oblique ascension at "
    "latitude phi.",
    "argument: the longitude in degrees; the table gives the amount (the same for l and "
    "180 - l, and for the southern half); undefined where the sun does not set; not displaced.",
    {Obliquity(), Latitude()}, FunctionTraits(true, SignForm::kMagnitude, {"ascensional"}),
    APOGRAPH_FORMULA(AscensionalDifference));
const BuiltinModel kObliqueAscension(
    "oblique-ascension",
    "rho(l) = alpha(l) - d(l) with the signed ascensional difference (positive for northern "
    "declination): the arc of the equator rising with the arc of the ecliptic from 0 to l.",
    "argument: the longitude in degrees; rises from 0 to 360 with l; not displaced.",
    {Obliquity(), Latitude()},
    FunctionTraits(false, SignForm::kSigned, {"oblique ascension", "rising"}),
    APOGRAPH_FORMULA(ObliqueAscension));
const BuiltinModel kDaylight(
    "daylight",
    "D(l) = 12 + 2 d(l) / 15 equinoctial hours, d the signed ascensional difference (time "
    "degrees are 15 times the hours).",
    "argument: the sun's longitude in degrees; signed through d: longer than 12 hours for "
    "northern declinations at a northern latitude; not displaced.",
    {Obliquity(), Latitude()},
    FunctionTraits(false, SignForm::kSigned, {"daylight", "day length", "length of day"}),
    APOGRAPH_FORMULA(Daylight));

}  // namespace

const std::vector<const BuiltinModel*>& SphericalModels() {
  static const std::vector<const BuiltinModel*> kAll = {
      &kDeclination, &kRightAscension, &kAscensionalDifference, &kObliqueAscension, &kDaylight};
  return kAll;
}

}  // namespace apograph::model::internal
