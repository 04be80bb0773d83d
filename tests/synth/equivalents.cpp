// Which apograph built-in models compute a column's values (by name only:
// the names and parameter names of `apograph formula list --builtin`; no
// model code is called). Benchmarks use this to score an identification.
#include "tables.hpp"

namespace apograph::synth {
namespace {

using Params = std::vector<std::pair<std::string, double>>;

// The four models that compute atan2(x sin a, 60 + x cos a).
std::vector<EquivalentModel> RatioModels(double x, const std::string& note) {
  return {{"solar-eccentric", {{"e", x}}, note},
          {"solar-epicycle", {{"r", x}}, note},
          {"epicycle-anomaly", {{"r", x}}, note},
          {"lunar-anomaly", {{"r", x}}, note}};
}

std::vector<EquivalentModel> Anomaly(const Function& f) {
  const double r = f.Param("epicycle-radius");
  if (f.variant == "mean-distance") return RatioModels(r, "");
  const double e = f.Param("eccentricity");
  const bool greatest = f.variant == "greatest-distance";
  const double distance = greatest ? 60 + e : 60 - e;
  auto out =
      RatioModels(60 * r / distance, "same values: only r / (60 " +
                                         std::string(greatest ? "+" : "-") + " e) is determined");
  out.insert(out.begin(), {greatest ? "epicycle-anomaly-greatest" : "epicycle-anomaly-least",
                           {{"r", r}, {"e", e}},
                           "r and e not separable from the values"});
  return out;
}

std::vector<EquivalentModel> MeanMotion(const Function& f) {
  const std::string& v = f.variant;
  const char* model = v == "months"            ? "mean-motion-months"
                      : v == "expanded-years"  ? "mean-motion-years"
                      : v == "collected-years" ? "mean-motion-collected"
                                               : "mean-motion";
  return {{model, {{"radix", f.Param("radix")}, {"rate", f.Param("rate")}, {"modulus", 360}}, ""}};
}

std::vector<EquivalentModel> Spherical(const Function& f) {
  const Params eps = {{"obliquity", f.Param("obliquity")}};
  Params both = eps;
  if (f.Find("latitude")) both.push_back({"latitude", f.Param("latitude")});
  switch (f.family) {
    case Family::kDeclination:
      return {{"declination", eps, ""}};
    case Family::kRightAscension:
      return {{"right-ascension", eps, ""}};
    case Family::kObliqueAscension:
      return {{"oblique-ascension", both, ""}};
    case Family::kAscensionalDifference:
      return {{"ascensional-difference", both, ""}};
    default:
      return {{"daylight", both, ""}};
  }
}

}  // namespace

std::vector<EquivalentModel> EquivalentModels(const ColumnKey& c) {
  if (c.role != ColumnKey::Role::kModel) return {};
  const Function& f = c.function;
  switch (f.family) {
    case Family::kChord:
      return {{"chord", {{"R", f.Param("radius")}}, ""}};
    case Family::kSine:
      return {{"sine", {{"R", f.Param("radius")}}, ""}};
    case Family::kCosine:
      return {{"cosine", {{"R", f.Param("radius")}}, ""}};
    case Family::kVersedSine:
      return {{"versed-sine", {{"R", f.Param("radius")}}, ""}};
    case Family::kShadow:
      return {{"shadow", {{"g", f.Param("gnomon")}}, ""}};
    case Family::kReversedShadow:
      return {{"reversed-shadow", {{"g", f.Param("gnomon")}}, ""}};
    case Family::kDeclination:
    case Family::kRightAscension:
    case Family::kObliqueAscension:
    case Family::kAscensionalDifference:
    case Family::kDaylight:
      return Spherical(f);
    case Family::kSolarEquation:
    case Family::kLunarAnomaly:
      return RatioModels(f.Param(f.Find("eccentricity") ? "eccentricity" : "epicycle-radius"), "");
    case Family::kEquationOfCentre:
      if (f.variant == "equant") return {{"equant-centre", {{"e", f.Param("eccentricity")}}, ""}};
      return RatioModels(f.Param("eccentricity"), "");
    case Family::kEquationOfAnomaly:
      return Anomaly(f);
    case Family::kMeanMotion:
      return MeanMotion(f);
    default:
      return {};  // composite positions and columns of no model
  }
}

}  // namespace apograph::synth
