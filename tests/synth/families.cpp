// Closed forms written from the geometry of each model (see families.hpp).
// Where two constructions give the same values (eccentric and epicycle) the
// second is computed by its own geometry, so a slip in one shows.
#include "families.hpp"

#include <array>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <utility>

namespace apograph::synth {
namespace {

constexpr double kDeg = std::numbers::pi / 180.0;

double Sin(double deg) { return std::sin(deg * kDeg); }
double Cos(double deg) { return std::cos(deg * kDeg); }
double Tan(double deg) { return std::tan(deg * kDeg); }
double Atan2Deg(double y, double x) { return std::atan2(y, x) / kDeg; }
double AsinDeg(double x) { return std::asin(x) / kDeg; }

/// An angle brought into (-180, 180].
double Signed180(double deg) {
  double x = std::fmod(deg, 360.0);
  if (x <= -180) x += 360;
  if (x > 180) x -= 360;
  return x;
}

constexpr std::array<std::pair<Family, const char*>, 19> kNames = {{
    {Family::kChord, "chord"},
    {Family::kSine, "sine"},
    {Family::kCosine, "cosine"},
    {Family::kVersedSine, "versed-sine"},
    {Family::kShadow, "shadow"},
    {Family::kReversedShadow, "reversed-shadow"},
    {Family::kDeclination, "declination"},
    {Family::kRightAscension, "right-ascension"},
    {Family::kObliqueAscension, "oblique-ascension"},
    {Family::kAscensionalDifference, "ascensional-difference"},
    {Family::kDaylight, "daylight"},
    {Family::kSolarEquation, "solar-equation"},
    {Family::kEquationOfCentre, "equation-of-centre"},
    {Family::kEquationOfAnomaly, "equation-of-anomaly"},
    {Family::kLunarAnomaly, "lunar-anomaly"},
    {Family::kMeanMotion, "mean-motion"},
    {Family::kTrueSun, "true-sun"},
    {Family::kPlanetPosition, "planet-position"},
    {Family::kUnexplained, "unexplained"},
}};

// Declination on the obliquity eps (signed with sin l).
double Declination(double eps, double l) { return AsinDeg(Sin(eps) * Sin(l)); }

// Right ascension by the reduction to the equator: alpha = l - atan(y sin 2l
// / (1 + y cos 2l)), y = tan^2(eps/2); continuous in l, equal to l at the
// equinoxes and solstices.
double RightAscension(double eps, double l) {
  const double y = Tan(eps / 2) * Tan(eps / 2);
  return l - Atan2Deg(y * Sin(2 * l), 1 + y * Cos(2 * l));
}

double AscensionalDifference(double eps, double phi, double l) {
  return AsinDeg(Tan(phi) * Tan(Declination(eps, l)));
}

// The equation of an eccentric of eccentricity e on radius R: the angle at
// the observer between the mean direction (from the centre) and the body.
double EccentricEquation(double R, double e, double a) {
  return Atan2Deg(e * Sin(a), R + e * Cos(a));
}

// The same motion on a concentric deferent carrying an epicycle whose radius
// stays parallel to the apsidal line: the body at (R cos a + r, R sin a).
double EpicycleEquation(double R, double r, double a) {
  return Signed180(a - Atan2Deg(R * Sin(a), R * Cos(a) + r));
}

// The equant: deferent centre at e, equant at 2e from the observer; the
// epicycle's centre C is on the deferent where the line from the equant at
// the mean centre k meets it; equation = k - direction of C.
double EquantEquation(double R, double e, double k) {
  const double t = -e * Cos(k) + std::sqrt(R * R - e * e * Sin(k) * Sin(k));
  const double cx = 2 * e + t * Cos(k), cy = t * Sin(k);
  return Signed180(k - Atan2Deg(cy, cx));
}

// The equation of anomaly seen from a distance D to the epicycle's centre.
double AnomalyEquation(double D, double r, double g) {
  const double x = D + r * Cos(g), y = r * Sin(g);
  return Atan2Deg(y, x);
}

double SolarFamily(const Function& f, double a) {
  const double R = f.Param("radius"), e = f.Param("eccentricity");
  return f.variant == "epicycle" ? EpicycleEquation(R, e, a) : EccentricEquation(R, e, a);
}

double CentreFamily(const Function& f, double k) {
  const double R = f.Param("radius"), e = f.Param("eccentricity");
  return f.variant == "equant" ? EquantEquation(R, e, k) : EccentricEquation(R, e, k);
}

double AnomalyFamily(const Function& f, double g) {
  const double R = f.Param("radius"), r = f.Param("epicycle-radius");
  if (f.variant == "mean-distance") return AnomalyEquation(R, r, g);
  const double e = f.Param("eccentricity");
  return AnomalyEquation(f.variant == "greatest-distance" ? R + e : R - e, r, g);
}

// Mean sun, the equation as a signed correction (true = mean + correction,
// subtractive while the anomaly is in its first half), or the true sun.
double TrueSun(const Function& f, double t) {
  const double mean = f.Param("radix") + f.Param("rate") * t;
  const double correction =
      -EccentricEquation(f.Param("radius"), f.Param("eccentricity"), mean - f.Param("apogee"));
  if (f.variant == "mean") return mean;
  if (f.variant == "equation") return correction;
  return mean + correction;
}

// A planet on an epicycle carried by an eccentric deferent (centre at e
// towards the apogee A); the epicycle's centre moves uniformly about the
// deferent's centre, the planet uniformly on the epicycle from the line
// through the centre. Longitude = direction of the planet from the observer.
double PlanetLongitude(const Function& f, double t) {
  const double k = f.Param("radix-longitude") + f.Param("rate-longitude") * t;
  const double g = f.Param("radix-anomaly") + f.Param("rate-anomaly") * t;
  if (f.variant == "mean-longitude") return k;
  if (f.variant == "anomaly") return g;
  const double R = f.Param("radius"), r = f.Param("epicycle-radius");
  const double e = f.Param("eccentricity"), A = f.Param("apogee");
  const double cx = e * Cos(A) + R * Cos(k), cy = e * Sin(A) + R * Sin(k);
  const double px = cx + r * Cos(k + g), py = cy + r * Sin(k + g);
  // Unwrapped near the mean longitude so that a run of positions is smooth.
  return k + Signed180(Atan2Deg(py, px) - k);
}

// A smooth curve of no model: a sine of a period that is not a full turn,
// with a phase, plus a cubic trend and an offset.
double SmoothCurve(const Function& f, double a) {
  const double s = (a - f.Param("centre")) / f.Param("scale");
  return f.Param("amplitude") * Sin(360.0 * (a - f.Param("phase")) / f.Param("period")) +
         f.Param("cubic") * s * s * s + f.Param("offset");
}

// Sixtieths of the mean-distance equation that the greatest-distance one
// reaches (an auxiliary column of planetary tables; no model of its own).
double RatioOfEquations(const Function& f, double g) {
  const double R = 60, r = f.Param("epicycle-radius"), e = f.Param("eccentricity");
  double x = std::fabs(Sin(g)) < 1e-9 ? g + 1e-6 : g;
  return 60.0 * AnomalyEquation(R + e, r, x) / AnomalyEquation(R, r, x);
}

double Unexplained(const Function& f, double a) {
  return f.variant == "ratio-of-equations" ? RatioOfEquations(f, a) : SmoothCurve(f, a);
}

double Spherical(const Function& f, double l) {
  const double eps = f.Param("obliquity");
  switch (f.family) {
    case Family::kDeclination:
      return Declination(eps, l);
    case Family::kRightAscension:
      return RightAscension(eps, l);
    case Family::kAscensionalDifference:
      return AscensionalDifference(eps, f.Param("latitude"), l);
    case Family::kObliqueAscension:
      return RightAscension(eps, l) - AscensionalDifference(eps, f.Param("latitude"), l);
    default:  // daylight: twice the ascensional difference in time (15 degrees an hour)
      return 12.0 + 2.0 * AscensionalDifference(eps, f.Param("latitude"), l) / 15.0;
  }
}

double Trigonometric(const Function& f, double a) {
  switch (f.family) {
    case Family::kChord:
      return 2 * f.Param("radius") * Sin(a / 2);
    case Family::kSine:
      return f.Param("radius") * Sin(a);
    case Family::kCosine:
      return f.Param("radius") * Cos(a);
    case Family::kVersedSine:
      return f.Param("radius") * (1 - Cos(a));
    case Family::kShadow:
      return f.Param("gnomon") * Cos(a) / Sin(a);
    default:
      return f.Param("gnomon") * Sin(a) / Cos(a);
  }
}

}  // namespace

const char* FamilyName(Family family) {
  for (const auto& [f, name] : kNames) {
    if (f == family) return name;
  }
  throw std::logic_error("FamilyName: unknown family");
}

std::optional<Family> FamilyFromName(std::string_view name) {
  for (const auto& [f, n] : kNames) {
    if (name == n) return f;
  }
  return std::nullopt;
}

const std::vector<Family>& AllFamilies() {
  static const std::vector<Family> kAll = [] {
    std::vector<Family> out;
    for (const auto& entry : kNames) out.push_back(entry.first);
    return out;
  }();
  return kAll;
}

bool CanChangeSign(Family family) {
  switch (family) {
    case Family::kSine:
    case Family::kCosine:
    case Family::kDeclination:
    case Family::kAscensionalDifference:
    case Family::kSolarEquation:
    case Family::kEquationOfCentre:
    case Family::kEquationOfAnomaly:
    case Family::kLunarAnomaly:
      return true;
    default:
      return false;
  }
}

const Parameter* Function::Find(std::string_view role) const {
  for (const auto& p : params) {
    if (p.role == role) return &p;
  }
  return nullptr;
}

double Function::Param(std::string_view role) const {
  if (const Parameter* p = Find(role)) return p->value;
  throw std::logic_error("synth: function " + std::string(FamilyName(family)) +
                         " has no parameter " + std::string(role));
}

double Evaluate(const Function& f, double arg) {
  switch (f.family) {
    case Family::kChord:
    case Family::kSine:
    case Family::kCosine:
    case Family::kVersedSine:
    case Family::kShadow:
    case Family::kReversedShadow:
      return Trigonometric(f, arg);
    case Family::kDeclination:
    case Family::kRightAscension:
    case Family::kObliqueAscension:
    case Family::kAscensionalDifference:
    case Family::kDaylight:
      return Spherical(f, arg);
    case Family::kSolarEquation:
      return SolarFamily(f, arg);
    case Family::kEquationOfCentre:
      return CentreFamily(f, arg);
    case Family::kEquationOfAnomaly:
      return AnomalyFamily(f, arg);
    case Family::kLunarAnomaly:
      return AnomalyEquation(f.Param("radius"), f.Param("epicycle-radius"), arg);
    case Family::kMeanMotion:
      return f.Param("radix") + f.Param("rate") * arg;
    case Family::kTrueSun:
      return TrueSun(f, arg);
    case Family::kPlanetPosition:
      return PlanetLongitude(f, arg);
    case Family::kUnexplained:
      return Unexplained(f, arg);
  }
  throw std::logic_error("Evaluate: unknown family");
}

}  // namespace apograph::synth

namespace apograph::synth {

std::string FormulaText(const Function& f) {
  switch (f.family) {
    case Family::kChord:
      return "2 radius sin(a/2)";
    case Family::kSine:
      return "radius sin a";
    case Family::kCosine:
      return "radius cos a";
    case Family::kVersedSine:
      return "radius (1 - cos a)";
    case Family::kShadow:
      return "gnomon cot h";
    case Family::kReversedShadow:
      return "gnomon tan h";
    case Family::kDeclination:
      return "asin(sin obliquity sin l)";
    case Family::kRightAscension:
      return "atan(cos obliquity tan l), continuous from 0 to 360";
    case Family::kObliqueAscension:
      return "right ascension(l) - asin(tan latitude tan declination(l))";
    case Family::kAscensionalDifference:
      return "asin(tan latitude tan declination(l))";
    case Family::kDaylight:
      return "12 + 2 asin(tan latitude tan declination(l)) / 15 hours";
    case Family::kSolarEquation:
      return f.variant == "epicycle"
                 ? "a - atan2(R sin a, R cos a + eccentricity), epicycle of radius eccentricity"
                 : "atan2(eccentricity sin a, R + eccentricity cos a)";
    case Family::kEquationOfCentre:
      return f.variant == "equant"
                 ? "k - direction of the epicycle's centre (deferent centre at e, equant at 2e)"
                 : "atan2(eccentricity sin k, R + eccentricity cos k)";
    case Family::kEquationOfAnomaly:
      return f.variant == "mean-distance"       ? "atan2(r sin g, R + r cos g)"
             : f.variant == "greatest-distance" ? "atan2(r sin g, R + eccentricity + r cos g)"
                                                : "atan2(r sin g, R - eccentricity + r cos g)";
    case Family::kLunarAnomaly:
      return "atan2(r sin g, R + r cos g)";
    case Family::kMeanMotion:
      return "radix + rate t, reduced modulo 360";
    case Family::kTrueSun:
      return f.variant == "mean" ? "radix + rate t"
             : f.variant == "equation"
                 ? "-atan2(e sin(m - apogee), R + e cos(m - apogee)), m the mean sun"
                 : "mean sun + equation";
    case Family::kPlanetPosition:
      return f.variant == "mean-longitude" ? "radix-longitude + rate-longitude t"
             : f.variant == "anomaly"
                 ? "radix-anomaly + rate-anomaly t"
                 : "direction of a planet on an epicycle (radius r, anomaly g) "
                   "carried by an eccentric deferent (mean longitude k)";
    case Family::kUnexplained:
      return f.variant == "ratio-of-equations"
                 ? "60 p(R + e) / p(R), p the equation of anomaly at that distance (no model)"
                 : "amplitude sin(360 (a - phase) / period) + cubic ((a - centre) / scale)^3 + "
                   "offset (no model)";
  }
  return "";
}

}  // namespace apograph::synth
