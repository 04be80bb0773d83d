// Trigonometric tables: chord, sine, cosine, versed sine and the two shadows.
// All arguments are arcs in degrees; any radius (or gnomon) is a parameter.
#include <cmath>
#include <limits>

#include "model/builtin.hpp"

namespace apograph::model::internal {
namespace {

/// crd(a) = 2R sin(a/2). The ancient Greek chord table: R = 60 (diameter 120), arcs 0;30..180.
template <typename T>
T Chord(const T* p, T a, T) {
  return T(2) * p[0] * fabs(SinDeg(a / T(2)));
}
/// Sin(a) = R sin a.
template <typename T>
T Sine(const T* p, T a, T) {
  return p[0] * SinDeg(a);
}
/// Cos(a) = R cos a.
template <typename T>
T Cosine(const T* p, T a, T) {
  return p[0] * CosDeg(a);
}
/// vers(a) = R (1 - cos a), computed as 2R sin^2(a/2) to avoid cancellation
/// near 0.
template <typename T>
T VersedSine(const T* p, T a, T) {
  const T s = SinDeg(a / T(2));
  return T(2) * p[0] * s * s;
}
/// Shadow (cotangent) of a gnomon g at altitude h: g cos h / sin h.
template <typename T>
T Shadow(const T* p, T h, T) {
  const T s = SinDeg(h);
  if (s == T(0)) return NotANumber<T>();
  return p[0] * CosDeg(h) / s;
}
/// Reversed shadow (tangent) on a vertical wall: g sin h / cos h.
template <typename T>
T ReversedShadow(const T* p, T h, T) {
  const T c = CosDeg(h);
  if (c == T(0)) return NotANumber<T>();
  return p[0] * SinDeg(h) / c;
}

ParamSpec Radius(double def) {
  return {"R", "parts", "radius of the circle (60 is usual; 150, 3438 and others occur)",
          def, 1.0,     3600.0};
}
ParamSpec Gnomon() {
  return {"g", "parts", "length of the gnomon (12 digits and 7 feet are usual)", 12.0, 1.0, 60.0};
}

const BuiltinModel kChord(
    "chord", "crd(a) = 2R sin(a/2); on the usual diameter 120 (R = 60) crd(60) = 60.",
    "argument: the arc in degrees; crd(360 - a) = crd(a) and the value is never negative; "
    "not displaced.",
    {Radius(60)}, FunctionTraits(false, SignForm::kSigned, {"chord"}), APOGRAPH_FORMULA(Chord));
const BuiltinModel kSine(
    "sine", "Sin(a) = R sin a, the sine on a radius R (60, 150, 3438 ...).",
    "argument: the arc in degrees; signed: negative for arcs between 180 and 360; not displaced.",
    {Radius(60)}, FunctionTraits(true, SignForm::kSigned, {"sine"}), APOGRAPH_FORMULA(Sine));
const BuiltinModel kCosine(
    "cosine", "Cos(a) = R cos a, the cosine on a radius R.",
    "argument: the arc in degrees; signed: negative between 90 and 270; not displaced.",
    {Radius(60)}, FunctionTraits(true, SignForm::kSigned, {"cosine"}), APOGRAPH_FORMULA(Cosine));
const BuiltinModel kVersedSine(
    "versed-sine", "vers(a) = R (1 - cos a), the versed sine on a radius R.",
    "argument: the arc in degrees; vers(360 - a) = vers(a), from 0 to 2R; not displaced.",
    {Radius(60)}, FunctionTraits(false, SignForm::kSigned, {"versed"}),
    APOGRAPH_FORMULA(VersedSine));
const BuiltinModel kShadow(
    "shadow",
    "u(h) = g cot h, the shadow a gnomon of length g casts on the horizontal plane "
    "when the sun stands at altitude h.",
    "argument: the altitude in degrees; undefined at 0 and 180; signed (negative between 90 "
    "and 180); not displaced.",
    {Gnomon()}, FunctionTraits(true, SignForm::kSigned, {"shadow", "umbra"}),
    APOGRAPH_FORMULA(Shadow));
const BuiltinModel kReversedShadow(
    "reversed-shadow",
    "v(h) = g tan h, the shadow of a gnomon set at right angles to a "
    "vertical wall, at altitude h.",
    "argument: the altitude in degrees; undefined at 90 and 270; signed; not displaced.",
    {Gnomon()},
    FunctionTraits(true, SignForm::kSigned, {"reversed shadow", "vertical", "umbra versa"}),
    APOGRAPH_FORMULA(ReversedShadow));

}  // namespace

const std::vector<const BuiltinModel*>& TrigModels() {
  static const std::vector<const BuiltinModel*> kAll = {&kChord,      &kSine,   &kCosine,
                                                        &kVersedSine, &kShadow, &kReversedShadow};
  return kAll;
}

}  // namespace apograph::model::internal
