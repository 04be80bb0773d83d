// Parameter values. "round" values are simple sexagesimal numbers; the
// "attested" ones are values recalled from the literature (from memory, not
// read in a source: they only need to look like a tradition's); "non-round"
// values are a round or attested value moved by 0.4-2 per cent (judgement:
// enough to change entries, not enough to change the family's look).
#include "parameters.hpp"

#include <cmath>
#include <vector>

#include "number/sexagesimal.hpp"

namespace apograph::synth {
namespace {

using Texts = std::vector<const char*>;
constexpr const char* kAttested = "attested (from memory)";

Parameter NonRound(const Parameter& p, Rng& rng) {
  const int places = std::max(2, Sexagesimal::ParseOrThrow(p.text).places() + 1);
  for (;;) {
    const double v = p.value * (1 + rng.Sign() * rng.Uniform(0.004, 0.02));
    const Sexagesimal s = Sexagesimal::FromDouble(v, places);
    if (s.ToDouble() != p.value && !s.is_zero()) {
      return MakeParameter(p.role, s.ToString(), "non-round (near " + p.text + ")");
    }
  }
}

Parameter Draw(Rng& rng, const TableOptions& o, const std::string& role, const Texts& round,
               const Texts& attested) {
  const bool use_attested = !attested.empty() && (round.empty() || rng.Chance(o.share_attested));
  Parameter p = MakeParameter(role, use_attested ? rng.Pick(attested) : rng.Pick(round),
                              use_attested ? kAttested : "round");
  return rng.Chance(o.share_nonround) ? NonRound(p, rng) : p;
}

// A value fixed by the model's convention (the radius of 60 of the equations).
Parameter Fixed(const std::string& role, const char* text) {
  return MakeParameter(role, text, "convention");
}

// A position drawn at random (a radix at an epoch), to whole minutes.
Parameter DrawnPosition(Rng& rng, const std::string& role) {
  const Sexagesimal s = Sexagesimal::FromUnits(rng.Int(0, 360 * 60 - 1), 1);
  return MakeParameter(role, s.ToString(), "drawn");
}

Parameter Radius(Rng& rng, const TableOptions& o) {
  const std::size_t k = rng.Weighted({0.62, 0.2, 0.18});
  if (k == 0) return Draw(rng, o, "radius", {"60"}, {});
  if (k == 1) return Draw(rng, o, "radius", {"150"}, {"150"});
  return Draw(rng, o, "radius", {"120", "10", "1"}, {"3438"});
}

Parameter Obliquity(Rng& rng, const TableOptions& o) {
  return Draw(rng, o, "obliquity", {"24", "23;30", "23;50"},
              {"23;51,20", "23;51", "23;35", "23;33,30", "23;32,30", "23;33"});
}

Parameter Latitude(Rng& rng, const TableOptions& o) {
  return Draw(rng, o, "latitude", {"30", "36", "40", "45", "48"},
              {"31", "33;25", "36", "38;30", "39;54", "41;50", "43;30", "48;50", "51;30"});
}

Parameter SolarEccentricity(Rng& rng, const TableOptions& o) {
  return Draw(rng, o, "eccentricity", {"2;30", "2;0", "2;15", "2;20"},
              {"2;4,45", "2;4,48", "2;14", "2;16", "2;29,30"});
}

// A planet's recalled figures (from memory): epicycle radius, eccentricity,
// daily motion in longitude and in anomaly, longitude of the apogee.
struct Planet {
  const char *r, *e, *rate_longitude, *rate_anomaly, *apogee;
};
const std::vector<Planet>& Planets() {
  static const std::vector<Planet> kPlanets = {
      {"6;30", "3;25", "0;2,0,33,31", "0;57,7,43,41", "233"},      // outer, slow
      {"11;30", "2;45", "0;4,59,14,27", "0;54,9,2,46", "161"},     // outer
      {"39;30", "6", "0;31,26,36,54", "0;27,41,40,19", "115;30"},  // outer, large epicycle
      {"43;10", "1;15", "0;59,8,17,13", "0;36,59,25,53", "55"},    // inner
      {"22;30", "3", "0;59,8,17,13", "3;6,24,6,59", "190"},        // inner, fast anomaly
  };
  return kPlanets;
}

Function Trigonometric(Family family, Rng& rng, const TableOptions& o) {
  Function f{family, "", {}};
  if (family == Family::kChord) {
    f.params.push_back(Draw(rng, o, "radius", {"60"}, {}));
  } else if (family == Family::kShadow || family == Family::kReversedShadow) {
    f.params.push_back(Draw(rng, o, "gnomon", {"12", "7", "60"}, {"12", "7", "6;40", "6;30"}));
  } else {
    f.params.push_back(Radius(rng, o));
  }
  return f;
}

Function Spherical(Family family, Rng& rng, const TableOptions& o) {
  Function f{family, "", {Obliquity(rng, o)}};
  if (family != Family::kDeclination && family != Family::kRightAscension) {
    f.params.push_back(Latitude(rng, o));
  }
  return f;
}

Function Equation(Family family, Rng& rng, const TableOptions& o) {
  Function f{family, "", {Fixed("radius", "60")}};
  const Planet& planet = rng.Pick(Planets());
  switch (family) {
    case Family::kSolarEquation:
      f.variant = rng.Chance(0.6) ? "eccentric" : "epicycle";
      f.params.push_back(SolarEccentricity(rng, o));
      break;
    case Family::kEquationOfCentre:
      f.variant = rng.Chance(0.5) ? "eccentric" : "equant";
      f.params.push_back(Draw(rng, o, "eccentricity", {"1", "2", "3", "4", "5", "6"}, {planet.e}));
      break;
    case Family::kEquationOfAnomaly:
      f.variant = rng.Pick(
          std::vector<std::string>{"mean-distance", "greatest-distance", "least-distance"});
      f.params.push_back(
          Draw(rng, o, "epicycle-radius", {"6", "10", "12", "20", "40", "45"}, {planet.r}));
      if (f.variant != "mean-distance") {
        f.params.push_back(Draw(rng, o, "eccentricity", {"2", "3", "5", "6"}, {planet.e}));
      }
      break;
    default:  // lunar anomaly
      f.params.push_back(
          Draw(rng, o, "epicycle-radius", {"5", "5;15", "5;30", "6"}, {"5;15", "4;46", "5;10"}));
      break;
  }
  return f;
}

// Days in one unit of the argument of a mean-motion table.
const char* DaysPerPeriod(const std::string& variant, Rng& rng) {
  if (variant == "hours") return "0;2,30";
  if (variant == "months") return rng.Chance(0.7) ? "29;31,50,8,20" : "30";
  if (variant == "days") return "1";
  return rng.Chance(0.5) ? "365" : "365;15";  // years: Egyptian or Julian
}

Function MeanMotion(Rng& rng, const TableOptions& o) {
  Function f{Family::kMeanMotion, "", {}};
  f.variant =
      std::vector<std::string>{"days", "hours", "months", "expanded-years",
                               "collected-years"}[rng.Weighted({0.45, 0.05, 0.15, 0.2, 0.15})];
  const Parameter daily = DrawDailyRate(rng, o);
  const Parameter per =
      MakeParameter("days-per-period", DaysPerPeriod(f.variant, rng), "convention");
  const Sexagesimal rate6 = Sexagesimal::FromDouble(std::fmod(daily.value * per.value, 360.0), 6);
  f.params.push_back(daily);
  f.params.push_back(per);
  f.params.push_back(MakeParameter("rate", rate6.ToString(), "derived (daily rate x days)"));
  f.params.push_back(f.variant == "collected-years" ? DrawnPosition(rng, "radix")
                                                    : MakeParameter("radix", "0", "round"));
  return f;
}

Function TrueSun(Rng& rng, const TableOptions& o) {
  Function f{Family::kTrueSun, "true", {Fixed("radius", "60"), SolarEccentricity(rng, o)}};
  f.params.push_back(
      Draw(rng, o, "apogee", {"65", "70", "80", "90"}, {"65;30", "77;55", "82;39", "85;49"}));
  f.params.push_back(DrawnPosition(rng, "radix"));
  Parameter rate = DrawDailyRate(rng, o);
  rate.role = "rate";
  f.params.push_back(rate);
  return f;
}

Function PlanetPosition(Rng& rng, const TableOptions& o) {
  const Planet& p = rng.Pick(Planets());
  Function f{Family::kPlanetPosition, "longitude", {Fixed("radius", "60")}};
  f.params.push_back(Draw(rng, o, "epicycle-radius", {}, {p.r}));
  f.params.push_back(rng.Chance(0.5) ? MakeParameter("eccentricity", "0", "round")
                                     : Draw(rng, o, "eccentricity", {}, {p.e}));
  f.params.push_back(Draw(rng, o, "apogee", {}, {p.apogee}));
  f.params.push_back(Draw(rng, o, "rate-longitude", {}, {p.rate_longitude}));
  f.params.push_back(Draw(rng, o, "rate-anomaly", {}, {p.rate_anomaly}));
  f.params.push_back(DrawnPosition(rng, "radix-longitude"));
  f.params.push_back(DrawnPosition(rng, "radix-anomaly"));
  return f;
}

// A curve of no model: amplitude, a period that is not a whole turn, a
// phase, a cubic trend (judgement: large enough that no straight line or
// trigonometric function fits it to a unit).
Function Unexplained(Rng& rng, const TableOptions& o) {
  if (rng.Chance(0.3)) {  // an auxiliary column of planetary tables
    const Planet& p = Planets()[static_cast<std::size_t>(rng.Int(1, 4))];
    return Function{
        Family::kUnexplained,
        "ratio-of-equations",
        {Draw(rng, o, "epicycle-radius", {}, {p.r}), Draw(rng, o, "eccentricity", {}, {p.e})}};
  }
  Function f{Family::kUnexplained, "smooth-curve", {}};
  auto drawn = [&](const char* role, double lo, double hi) {
    const Sexagesimal s = Sexagesimal::FromDouble(rng.Uniform(lo, hi), 1);
    f.params.push_back(MakeParameter(role, s.ToString(), "drawn"));
  };
  drawn("amplitude", 2, 30);
  drawn("period", 100, 290);
  drawn("phase", 5, 80);
  drawn("cubic", 2, 20);
  drawn("centre", 30, 60);
  drawn("scale", 60, 120);
  drawn("offset", 35, 70);
  return f;
}

}  // namespace

Parameter MakeParameter(const std::string& role, const std::string& text,
                        const std::string& basis) {
  return Parameter{role, text, Sexagesimal::ParseOrThrow(text).ToDouble(), basis};
}

Parameter DrawDailyRate(Rng& rng, const TableOptions& o) {
  // Daily mean motions (from memory): sun, moon, lunar anomaly, three
  // planets in longitude, two in anomaly.
  static const Texts kRates = {"0;59,8,17,13,12,31",  "13;10,34,58,33,30,30", "13;3,53,56,17,51,59",
                               "0;2,0,33,31,28,51",   "0;4,59,14,26,46,31",   "0;31,26,36,53,51,33",
                               "0;36,59,25,53,11,28", "3;6,24,6,59,35,50"};
  Parameter p = MakeParameter("daily-rate", rng.Pick(kRates), kAttested);
  if (rng.Chance(1 - o.share_attested)) {  // a rate rounded to three places: "round"
    p = MakeParameter("daily-rate", Sexagesimal::ParseOrThrow(p.text).Rounded(3).ToString(),
                      "round");
  }
  if (rng.Chance(o.share_nonround)) {  // moved in the fourth place
    const Sexagesimal s = Sexagesimal::ParseOrThrow(p.text).Extended(6) +
                          Sexagesimal::FromUnits(rng.Sign() * rng.Int(1, 59) * 60 * 60, 6);
    p = MakeParameter("daily-rate", s.ToString(), "non-round (near " + p.text + ")");
  }
  return p;
}

Function DrawFunction(Family family, Rng& rng, const TableOptions& options) {
  switch (family) {
    case Family::kChord:
    case Family::kSine:
    case Family::kCosine:
    case Family::kVersedSine:
    case Family::kShadow:
    case Family::kReversedShadow:
      return Trigonometric(family, rng, options);
    case Family::kDeclination:
    case Family::kRightAscension:
    case Family::kObliqueAscension:
    case Family::kAscensionalDifference:
    case Family::kDaylight:
      return Spherical(family, rng, options);
    case Family::kSolarEquation:
    case Family::kEquationOfCentre:
    case Family::kEquationOfAnomaly:
    case Family::kLunarAnomaly:
      return Equation(family, rng, options);
    case Family::kMeanMotion:
      return MeanMotion(rng, options);
    case Family::kTrueSun:
      return TrueSun(rng, options);
    case Family::kPlanetPosition:
      return PlanetPosition(rng, options);
    case Family::kUnexplained:
      return Unexplained(rng, options);
  }
  throw std::logic_error("DrawFunction: unknown family");
}

}  // namespace apograph::synth
