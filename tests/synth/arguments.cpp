// Argument grids by family (common practice: degree tables by 1, 0;30, 6
// or 10; sines also by 3;45; mean motions by days, hours, months, years).
#include "arguments.hpp"

#include <algorithm>
#include <string>
#include <vector>

namespace apograph::synth {
namespace {

struct Range {
  const char* start;
  const char* step;
  const char* end;
  double weight;
};

Sexagesimal Num(const char* text) { return Sexagesimal::ParseOrThrow(text); }

ArgumentKey FromRange(const std::string& name, const std::string& unit, const Range& r) {
  const Sexagesimal start = Num(r.start), step = Num(r.step), end = Num(r.end);
  const int places = std::max({start.places(), step.places(), end.places()});
  const auto count = static_cast<int>(
      ((end.Extended(places) - start.Extended(places)).units() / step.Extended(places).units()) +
      1);
  return RegularArgument(name, unit, start.Extended(places), step.Extended(places), count);
}

ArgumentKey PickRange(const std::string& name, const std::string& unit,
                      const std::vector<Range>& ranges, Rng& rng, int max_rows) {
  // Ranges longer than max_rows are left out; if every one is, the shortest.
  std::vector<double> weights;
  std::size_t shortest = 0;
  for (std::size_t i = 0; i < ranges.size(); ++i) {
    const auto rows = FromRange(name, unit, ranges[i]).values.size();
    weights.push_back(static_cast<int>(rows) <= max_rows ? ranges[i].weight : 0);
    if (rows < FromRange(name, unit, ranges[shortest]).values.size()) shortest = i;
  }
  const bool any = std::any_of(weights.begin(), weights.end(), [](double w) { return w > 0; });
  return FromRange(name, unit, ranges[any ? rng.Weighted(weights) : shortest]);
}

std::vector<Range> TrigRanges(Family f, bool full) {
  switch (f) {
    case Family::kChord:
      return {{"0;30", "0;30", "180", 3}, {"1", "1", "180", 2}, {"0;30", "0;30", "90", 1}};
    case Family::kVersedSine:
      return {{"1", "1", "180", 3}, {"6", "6", "180", 1}, {"0;30", "0;30", "90", 1}};
    case Family::kShadow:
      return {{"1", "1", "90", 4}, {"0;30", "0;30", "90", 1}, {"6", "6", "90", 1}};
    case Family::kReversedShadow:
      return {{"1", "1", "89", 4}, {"1", "1", "80", 1}, {"6", "6", "84", 1}};
    case Family::kCosine:
      if (full) return {{"1", "1", "180", 2}, {"1", "1", "360", 2}, {"6", "6", "360", 1}};
      return {{"0", "1", "90", 2}, {"1", "1", "90", 2}, {"0;30", "0;30", "90", 1}};
    default:  // sine
      if (full) return {{"1", "1", "360", 3}, {"6", "6", "360", 1}, {"10", "10", "360", 1}};
      return {{"1", "1", "90", 4},
              {"0;30", "0;30", "90", 1},
              {"3;45", "3;45", "90", 1},
              {"6", "6", "90", 1}};
  }
}

std::vector<Range> SphericalRanges(Family f, bool full) {
  const std::vector<Range> whole = {
      {"1", "1", "360", 4}, {"6", "6", "360", 1}, {"10", "10", "360", 1}, {"12", "12", "360", 1}};
  if (f == Family::kRightAscension || f == Family::kObliqueAscension || f == Family::kDaylight) {
    return whole;
  }
  if (full) return whole;
  return {{"1", "1", "90", 4}, {"6", "6", "90", 1}};
}

std::vector<Range> EquationRanges(bool full) {
  if (full)
    return {
        {"1", "1", "360", 4}, {"6", "6", "360", 1}, {"10", "10", "360", 1}, {"3", "3", "360", 1}};
  return {{"1", "1", "180", 3}, {"6", "6", "180", 1}, {"0;30", "0;30", "180", 1}};
}

// Single days, then tens, hundreds, thousands (and sometimes 10000 and a
// few odd entries such as 29 and 354 at the end, as real lists have).
std::vector<Sexagesimal> DayList(Rng& rng) {
  std::vector<int> days;
  const int singles = rng.Pick(std::vector<int>{9, 10, 30});
  for (int d = 1; d <= singles; ++d) days.push_back(d);
  for (int d = singles == 9 ? 10 : singles + 10; d <= 90; d += 10) days.push_back(d);
  for (int d = 100; d <= 900; d += 100) days.push_back(d);
  const int thousands = rng.Pick(std::vector<int>{3000, 9000});
  for (int d = 1000; d <= thousands; d += 1000) days.push_back(d);
  if (rng.Chance(0.5)) days.push_back(10000);
  if (rng.Chance(0.2)) {
    days.push_back(29);
    days.push_back(354);
  }
  std::vector<Sexagesimal> out;
  for (int d : days) out.push_back(Sexagesimal::FromUnits(d, 0));
  return out;
}

std::vector<Sexagesimal> ExpandedYearList(Rng& rng) {
  std::vector<Sexagesimal> out;
  const int singles = rng.Pick(std::vector<int>{10, 20});
  for (int y = 1; y <= singles; ++y) out.push_back(Sexagesimal::FromUnits(y, 0));
  for (int y = singles + 10; y <= 100; y += 10) out.push_back(Sexagesimal::FromUnits(y, 0));
  for (int y = 200; y <= 1000; y += 100) out.push_back(Sexagesimal::FromUnits(y, 0));
  return out;
}

ArgumentKey Irregular(const std::string& name, const std::string& unit,
                      std::vector<Sexagesimal> values) {
  ArgumentKey key;
  key.name = name;
  key.unit = unit;
  key.places = 0;
  key.regular = false;
  key.values = std::move(values);
  return key;
}

ArgumentKey MeanMotionArgument(const Function& f, Rng& rng, const TableOptions& o) {
  const bool irregular = rng.Chance(o.share_irregular_mean_motion);
  const std::string& v = f.variant;
  if (v == "days") {
    if (irregular) return Irregular("days", "day", DayList(rng));
    return PickRange("days", "day", {{"1", "1", "30", 2}, {"1", "1", "60", 1}}, rng, o.max_rows);
  }
  if (v == "hours") return PickRange("hours", "hour", {{"1", "1", "24", 1}}, rng, o.max_rows);
  if (v == "months") return PickRange("months", "month", {{"1", "1", "12", 1}}, rng, o.max_rows);
  if (v == "expanded-years") {
    if (irregular) return Irregular("years", "year", ExpandedYearList(rng));
    return PickRange("years", "year", {{"1", "1", "20", 2}, {"1", "1", "30", 1}}, rng, o.max_rows);
  }
  const int period = rng.Pick(std::vector<int>{20, 24, 28, 30});
  const int count = rng.Int(10, 30);
  const int start = rng.Chance(0.3) ? 0 : period;
  return RegularArgument("years", "year", Sexagesimal::FromUnits(start, 0),
                         Sexagesimal::FromUnits(period, 0), count);
}

ArgumentKey PositionArgument(Rng& rng, bool planet) {
  if (rng.Chance(0.5)) {  // by day
    const int n = planet ? rng.Int(60, 180) : rng.Int(30, 120);
    return RegularArgument("day", "day", Sexagesimal::FromUnits(1, 0), Sexagesimal::FromUnits(1, 0),
                           n);
  }
  const int n = planet ? rng.Int(40, 80) : rng.Int(37, 40);
  const int start = rng.Chance(0.5) ? 0 : 10;
  return RegularArgument("day", "day", Sexagesimal::FromUnits(start, 0),
                         Sexagesimal::FromUnits(10, 0), n);
}

}  // namespace

ArgumentKey RegularArgument(const std::string& name, const std::string& unit,
                            const Sexagesimal& start, const Sexagesimal& step, int count) {
  ArgumentKey key;
  key.name = name;
  key.unit = unit;
  key.places = std::max(start.places(), step.places());
  key.regular = true;
  key.start = start.Extended(key.places);
  key.step = step.Extended(key.places);
  for (int i = 0; i < count; ++i) key.values.push_back(*key.start + *key.step * i);
  return key;
}

ArgumentKey DrawArgument(const Function& f, bool full, Rng& rng, const TableOptions& o) {
  switch (f.family) {
    case Family::kChord:
    case Family::kSine:
    case Family::kCosine:
    case Family::kVersedSine:
    case Family::kShadow:
    case Family::kReversedShadow:
      return PickRange(
          f.family == Family::kShadow || f.family == Family::kReversedShadow ? "altitude" : "arc",
          "deg", TrigRanges(f.family, full), rng, o.max_rows);
    case Family::kDeclination:
    case Family::kRightAscension:
    case Family::kObliqueAscension:
    case Family::kAscensionalDifference:
    case Family::kDaylight:
      return PickRange("longitude", "deg", SphericalRanges(f.family, full), rng, o.max_rows);
    case Family::kSolarEquation:
    case Family::kEquationOfCentre:
    case Family::kEquationOfAnomaly:
    case Family::kLunarAnomaly:
      return PickRange(f.family == Family::kEquationOfCentre ? "centre" : "anomaly", "deg",
                       EquationRanges(full), rng, o.max_rows);
    case Family::kMeanMotion:
      return MeanMotionArgument(f, rng, o);
    case Family::kTrueSun:
      return PositionArgument(rng, false);
    case Family::kPlanetPosition:
      return PositionArgument(rng, true);
    case Family::kUnexplained:
      return PickRange("argument", "deg",
                       {{"1", "1", "90", 2}, {"1", "1", "180", 2}, {"6", "6", "360", 1}}, rng,
                       o.max_rows);
  }
  throw std::logic_error("DrawArgument: unknown family");
}

}  // namespace apograph::synth
