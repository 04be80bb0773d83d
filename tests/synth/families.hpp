#pragma once
/// The kinds of table the generator draws and the closed-form functions
/// behind them, written here from the geometry (never by calling
/// src/model/), so that a draw is an independent check of the model code.
///
/// Arguments are in degrees (or days, months, years for mean motions and
/// positions); values in degrees, parts of the radius, gnomon units or
/// hours.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace apograph::synth {

enum class Family {
  kChord,                  ///< crd a on a diameter (120 usual)
  kSine,                   ///< R sin a
  kCosine,                 ///< R cos a
  kVersedSine,             ///< R (1 - cos a)
  kShadow,                 ///< g cot h (gnomon g, altitude h)
  kReversedShadow,         ///< g tan h
  kDeclination,            ///< asin(sin eps sin l)
  kRightAscension,         ///< arc of the equator rising with l at the sphaera recta
  kObliqueAscension,       ///< right ascension minus ascensional difference
  kAscensionalDifference,  ///< asin(tan phi tan delta)
  kDaylight,               ///< length of daylight in equinoctial hours
  kSolarEquation,          ///< eccentric or epicycle, radius 60
  kEquationOfCentre,       ///< planetary: simple eccentric or equant
  kEquationOfAnomaly,      ///< epicycle at mean, greatest or least distance
  kLunarAnomaly,           ///< the moon's first anomaly on its epicycle
  kMeanMotion,             ///< radix + rate t, reduced modulo 360
  kTrueSun,                ///< composite: mean sun, equation, true sun
  kPlanetPosition,         ///< composite: a planet on an epicycle, by day or ten days
  kUnexplained,            ///< a column no model explains (for "nothing fits")
};

/// The family's name as used by `synth_draw --family` and in the key
/// ("chord", "sine", ..., "solar-equation", "true-sun", "unexplained").
const char* FamilyName(Family family);
std::optional<Family> FamilyFromName(std::string_view name);
/// Every family, in declaration order.
const std::vector<Family>& AllFamilies();
/// The families whose values change sign over a full range of the argument
/// (so that signed, magnitude and displaced forms apply).
bool CanChangeSign(Family family);

/// A parameter by its role. `text` is the value in the trade's notation as
/// the author would have had it; `value` its decimal.
struct Parameter {
  std::string role;   ///< "radius", "eccentricity", "obliquity", "latitude", ...
  std::string text;   ///< "2;30", "23;51,20"
  double value = 0;   ///< decimal of text
  std::string basis;  ///< "round", "attested (from memory)", "non-round", "derived"
  bool operator==(const Parameter&) const = default;
};

/// What one column tabulates before any computing practice.
struct Function {
  Family family = Family::kSine;
  /// Which construction within the family: "eccentric", "epicycle",
  /// "equant", "mean-distance", "greatest-distance", "least-distance",
  /// "days", "hours", "months", "expanded-years", "collected-years",
  /// "mean", "equation", "true", "longitude", "smooth-curve",
  /// "ratio-of-equations", or "" when the family has only one.
  std::string variant;
  std::vector<Parameter> params;
  /// The parameter of that role; throws std::logic_error when absent.
  double Param(std::string_view role) const;
  const Parameter* Find(std::string_view role) const;
  bool operator==(const Function&) const = default;
};

/// The exact value at `arg` (degrees, or time units for mean motions and
/// positions). Mean motions and positions are not reduced modulo 360 here.
double Evaluate(const Function& function, double arg);

/// The formula in words for the key ("R sin a", ...).
std::string FormulaText(const Function& function);

}  // namespace apograph::synth
