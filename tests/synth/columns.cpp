// Choosing a drawn table's columns: names, places, computing practice, sign
// form, derived and auxiliary columns (proportions from TableOptions).
#include <algorithm>
#include <cmath>
#include <string>

#include "parameters.hpp"
#include "table_build.hpp"

namespace apograph::synth::internal {
namespace {

struct Naming {
  const char* name;
  const char* unit;
  const char* title;
};

Naming NameFor(Family f) {
  switch (f) {
    case Family::kChord:
      return {"chord", "parts", "chord"};
    case Family::kSine:
      return {"sine", "parts", "sine"};
    case Family::kCosine:
      return {"cosine", "parts", "cosine"};
    case Family::kVersedSine:
      return {"versed", "parts", "versed sine"};
    case Family::kShadow:
    case Family::kReversedShadow:
      return {"shadow", "parts", "shadow"};
    case Family::kDeclination:
      return {"declination", "deg", "declination"};
    case Family::kRightAscension:
    case Family::kObliqueAscension:
      return {"ascension", "deg", "ascension"};
    case Family::kAscensionalDifference:
      return {"ascensional", "deg", "ascensional difference"};
    case Family::kDaylight:
      return {"hours", "h", "length of daylight"};
    case Family::kMeanMotion:
      return {"motion", "deg", "mean motion"};
    case Family::kUnexplained:
      return {"value", "deg", "value"};
    default:
      return {"equation", "deg", "equation"};
  }
}

int DrawPlaces(const Function& f, Rng& rng) {
  auto pick = [&](std::vector<int> places, std::vector<double> weights) {
    return places[rng.Weighted(weights)];
  };
  switch (f.family) {
    case Family::kChord:
      return pick({1, 2, 3}, {0.1, 0.8, 0.1});
    case Family::kSine:
    case Family::kCosine:
    case Family::kVersedSine: {
      const double R = f.Param("radius");
      if (R > 1000) return 0;
      if (R < 2) return 4;
      if (R < 20) return 3;
      if (R > 100 && R < 200) return pick({1, 2}, {0.5, 0.5});
      return pick({1, 2, 3}, {0.2, 0.7, 0.1});
    }
    case Family::kShadow:
    case Family::kReversedShadow:
      return pick({1, 2}, {0.4, 0.6});
    case Family::kMeanMotion:
      return pick({2, 3, 4, 5}, {0.3, 0.35, 0.25, 0.1});
    case Family::kUnexplained:
      return pick({1, 2}, {0.5, 0.5});
    default:
      return pick({1, 2}, {0.3, 0.7});
  }
}

bool GridAllowed(Family f) {
  return f != Family::kMeanMotion && f != Family::kTrueSun && f != Family::kPlanetPosition &&
         f != Family::kUnexplained && f != Family::kReversedShadow;
}

Practice DrawPractice(const Function& f, const ArgumentKey& a, Rng& rng, const TableOptions& o) {
  Practice p;
  if (rng.Chance(o.share_truncation)) p.rounding = Rounding::kTruncate;
  const bool small_step = a.regular && a.step->ToDouble() <= 1.0;
  if (!GridAllowed(f.family) || !small_step || !rng.Chance(o.share_grid)) return p;
  const int k = rng.Pick(std::vector<int>{3, 5, 6, 10, 12});
  if (static_cast<int>(a.values.size()) < 2 * k) return p;
  p.grid = k * a.step->ToDouble();
  // Nodes at multiples of the grid; a shadow (infinite at 0) from its first row.
  p.grid_origin = f.family == Family::kShadow ? a.start->ToDouble() : 0.0;
  p.round_nodes = rng.Chance(o.share_round_nodes);
  return p;
}

ColumnKey ModelColumn(const Naming& n, const Function& f, int places, const Practice& p) {
  ColumnKey c;
  c.name = n.name;
  c.unit = n.unit;
  c.title = n.title;
  c.places = places;
  c.function = f;
  c.practice = p;
  return c;
}

// The largest amount by which the (possibly flipped) function goes below 0.
double Excursion(const ColumnKey& c, const ArgumentKey& a, bool negated) {
  double m = 0;
  for (const auto& x : a.values) {
    const double f = Evaluate(c.function, x.ToDouble());
    m = std::max(m, negated ? f : -f);
  }
  return m;
}

// Signed, magnitude or displaced, drawn once for the table (every column of
// a double-argument table shares the form and the constant).
void DrawSignForm(TableKey& t, Rng& rng, const TableOptions& o) {
  auto signable = [&](const ColumnKey& c) {
    return c.role == ColumnKey::Role::kModel && SignMatters(c.function) &&
           Excursion(c, t.argument, false) > 0 && Excursion(c, t.argument, true) > 0;
  };
  if (std::none_of(t.columns.begin(), t.columns.end(), signable)) return;
  const std::size_t k = rng.Weighted(
      {o.share_signed, o.share_displaced, std::max(0.0, 1 - o.share_signed - o.share_displaced)});
  const SignForm form = k == 0   ? SignForm::kSigned
                        : k == 1 ? SignForm::kDisplaced
                                 : SignForm::kMagnitude;
  const bool negated = form != SignForm::kMagnitude && rng.Chance(o.share_negated);
  double m = 0;
  for (const auto& c : t.columns) {
    if (signable(c)) m = std::max(m, Excursion(c, t.argument, negated));
  }
  const std::vector<double> steps = {1, 5, 10, 30, 60};
  const double step = rng.Pick(steps);
  const auto constant = static_cast<std::int64_t>(std::ceil((m + 1e-9) / step) * step);
  for (auto& c : t.columns) {
    if (!signable(c)) continue;
    c.sign_form = form;
    c.negated = negated;
    if (form == SignForm::kDisplaced) c.displacement = Sexagesimal::FromUnits(constant, 0);
    if (form == SignForm::kMagnitude) c.title += " (sign by rubric)";
  }
}

void LatitudeGrid(TableKey& t, const Function& f, int places, const Practice& p, Rng& rng) {
  static const std::vector<const char*> kClimates = {"16;27", "23;51", "30;22", "36",
                                                     "40;56", "45;1",  "48;32"};  // from memory
  static const std::vector<const char*> kRound = {"20", "25", "30", "35", "40", "45", "50"};
  const auto& list = rng.Chance(0.5) ? kClimates : kRound;
  const int n = rng.Int(3, 7), first = rng.Int(0, 7 - n);
  ArgumentKey a2{"latitude", "deg", 0, false, std::nullopt, std::nullopt, {}};
  for (int i = first; i < first + n; ++i) {
    const Sexagesimal lat = Sexagesimal::ParseOrThrow(list[static_cast<std::size_t>(i)]);
    a2.places = std::max(a2.places, lat.places());
    Function g = f;
    for (auto& param : g.params) {
      if (param.role == "latitude")
        param = MakeParameter("latitude", list[static_cast<std::size_t>(i)], "round");
    }
    ColumnKey c = ModelColumn(NameFor(f.family), g, places, p);
    std::string id = lat.ToString();
    std::replace(id.begin(), id.end(), ';', '-');
    c.name = "lat" + id;
    c.arg2 = lat;
    t.columns.push_back(c);
  }
  for (auto& c : t.columns) c.arg2 = c.arg2->Extended(a2.places);
  for (int i = first; i < first + n; ++i)
    a2.values.push_back(
        Sexagesimal::ParseOrThrow(list[static_cast<std::size_t>(i)]).Extended(a2.places));
  t.argument2 = a2;
}

void MeanMotionColumn(TableKey& t, const Function& f, Rng& rng, const TableOptions& o) {
  ColumnKey c = ModelColumn(NameFor(f.family), f, DrawPlaces(f, rng), Practice{});
  if (rng.Chance(o.share_truncation)) c.practice.rounding = Rounding::kTruncate;
  if (f.variant == "collected-years") c.name = c.title = "position";
  c.modulo_360 = true;
  MeanMotionBuild b;
  const bool decimal = std::any_of(t.argument.values.begin(), t.argument.values.end(),
                                   [](const Sexagesimal& v) { return v.IntegerPart() == 1000; });
  const std::size_t k = rng.Weighted({decimal ? o.share_from_entries : 0.0, o.share_addition,
                                      1 - o.share_addition - (decimal ? o.share_from_entries : 0)});
  b.construction = k == 0 ? "from-entries" : k == 1 ? "addition" : "multiplication";
  b.multiplied_up_to = rng.Chance(0.7) ? 100 : 10;
  b.period = f.variant == "days"     ? "day"
             : f.variant == "hours"  ? "hour"
             : f.variant == "months" ? "month"
                                     : "year";
  b.days_per_period = Sexagesimal::ParseOrThrow(f.Find("days-per-period")->text);
  c.mean_motion = b;
  t.columns.push_back(c);
}

DerivedSpec Difference(const std::string& from, bool exact, int span, std::int64_t divisor,
                       bool forward) {
  DerivedSpec d;
  d.kind = DerivedSpec::Kind::kDifference;
  d.from = {from};
  d.from_exact = exact;
  d.span_rows = span;
  d.divisor = divisor;
  d.forward = forward;
  return d;
}

ColumnKey DerivedColumn(const std::string& name, const std::string& unit, int places,
                        DerivedSpec d) {
  ColumnKey c;
  c.name = c.title = name;
  c.unit = unit;
  c.places = places;
  c.role = ColumnKey::Role::kDerived;
  c.derived = std::move(d);
  return c;
}

void TrueSunColumns(TableKey& t, const Function& f, Rng& rng, const TableOptions& o) {
  const int places = DrawPlaces(f, rng);
  Function mean = f, eq = f;
  mean.variant = "mean";
  eq.variant = "equation";
  ColumnKey m = ModelColumn({"mean", "deg", "mean sun"}, mean, places, Practice{});
  m.modulo_360 = true;
  t.columns.push_back(m);
  t.columns.push_back(ModelColumn({"equation", "deg", "equation"}, eq, places, Practice{}));
  TableOptions forms = o;
  forms.share_displaced = 0;  // the sum below adds the equation as written
  DrawSignForm(t, rng, forms);
  DerivedSpec d{DerivedSpec::Kind::kSum,
                {"mean", "equation"},
                rng.Chance(o.share_sum_exact),
                1,
                true,
                1,
                true};
  t.columns.push_back(DerivedColumn("true", "deg", places, d));
}

void PlanetColumns(TableKey& t, const Function& f, Rng& rng, const TableOptions& o) {
  const int places = DrawPlaces(f, rng);
  ColumnKey lon = ModelColumn({"longitude", "deg", "true longitude"}, f, places, Practice{});
  lon.modulo_360 = true;
  t.columns.push_back(lon);
  if (rng.Chance(0.25)) {
    for (const char* v : {"mean-longitude", "anomaly"}) {
      Function g = f;
      g.variant = v;
      ColumnKey c = ModelColumn({v, "deg", v}, g, places, Practice{});
      c.modulo_360 = true;
      t.columns.push_back(c);
    }
  }
  if (!rng.Chance(0.5)) return;
  const std::int64_t step = static_cast<std::int64_t>(t.argument.step->IntegerPart());
  const bool per_day = step > 1 && rng.Chance(o.share_derived_divided);
  DerivedSpec d =
      Difference("longitude", rng.Chance(o.share_derived_exact), 1, per_day ? step : 1, true);
  d.wrap_360 = true;
  t.columns.push_back(DerivedColumn("motion", "deg", places + (per_day ? 1 : 0), d));
}

void MaybeDifference(TableKey& t, Rng& rng, const TableOptions& o) {
  const ColumnKey& main = t.columns.front();
  if (!t.argument.regular || main.role != ColumnKey::Role::kModel || !rng.Chance(o.share_derived))
    return;
  const std::int64_t step_units = static_cast<std::int64_t>(t.argument.step->units());
  int span = 1;
  if (rng.Chance(o.share_derived_span)) {
    span = main.practice.grid > 0
               ? static_cast<int>(std::lround(main.practice.grid / t.argument.step->ToDouble()))
               : rng.Int(2, 6);
  }
  const bool divided = step_units > 1 && rng.Chance(o.share_derived_divided);
  // Shadows are infinite at 0 and reversed shadows at 90: difference away from them.
  bool forward = rng.Chance(0.8);
  if (t.family == Family::kShadow) forward = true;
  if (t.family == Family::kReversedShadow) forward = false;
  const DerivedSpec d = Difference(main.name, rng.Chance(o.share_derived_exact), span,
                                   divided ? span * step_units : 1, forward);
  const int places = main.places + (rng.Chance(o.share_derived_extra_place) ? 1 : 0) +
                     (divided && span * step_units >= 30 ? 1 : 0);
  t.columns.push_back(DerivedColumn(divided && step_units == 30 ? "sixtieths" : "difference",
                                    main.unit, std::min(places, 6), d));
}

void MaybeUnexplained(TableKey& t, Rng& rng, const TableOptions& o) {
  if (t.family == Family::kMeanMotion || t.argument2 || !rng.Chance(o.share_unexplained_column))
    return;
  const Function f = DrawFunction(Family::kUnexplained, rng, o);
  ColumnKey c = ModelColumn({"auxiliary", "", "auxiliary"}, f, DrawPlaces(f, rng), Practice{});
  c.role = ColumnKey::Role::kUnexplained;
  t.columns.push_back(c);
}

}  // namespace

void DrawColumns(TableKey& t, const Function& f, Rng& rng, const TableOptions& o) {
  switch (f.family) {
    case Family::kMeanMotion:
      MeanMotionColumn(t, f, rng, o);
      break;
    case Family::kTrueSun:
      TrueSunColumns(t, f, rng, o);
      break;
    case Family::kPlanetPosition:
      PlanetColumns(t, f, rng, o);
      break;
    default: {
      const int places = DrawPlaces(f, rng);
      const Practice p = DrawPractice(f, t.argument, rng, o);
      const bool grid_of_latitudes = f.Find("latitude") && rng.Chance(o.share_double_argument);
      if (grid_of_latitudes) {
        LatitudeGrid(t, f, places, p, rng);
      } else {
        t.columns.push_back(ModelColumn(NameFor(f.family), f, places, p));
      }
      if (f.family == Family::kUnexplained) t.columns.front().role = ColumnKey::Role::kUnexplained;
      DrawSignForm(t, rng, o);
      if (!grid_of_latitudes) MaybeDifference(t, rng, o);
      break;
    }
  }
  MaybeUnexplained(t, rng, o);
}

}  // namespace apograph::synth::internal
