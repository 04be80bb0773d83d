// Identification where the demo never pushes it (issue: real tables): one
// slip anywhere, a fifth of the entries corrupted, round values and the
// author's departures, columns no model explains, signs, ties between
// equivalent models, and tables of positions. Each failure with a small
// table of its own; rates over several seeds where the corruption is drawn.
#include <doctest/doctest.h>

#include <cmath>
#include <random>

#include "estimate/catalog.hpp"
#include "estimate/identify.hpp"
#include "estimate/report.hpp"
#include "model_columns.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

using testing::D;

using testing::FromModel;

using testing::Catalog;

Identification Run(const Transcription& t, IdentifyOptions o = {}) {
  o.catalog = &Catalog();
  return Identify(t, 0, o);
}

/// Row `row`'s entry replaced by its neighbour's (the row above; the row
/// below for the first).
Transcription Repeated(Transcription t, std::size_t row) {
  const std::size_t from = row == 0 ? 1 : row - 1;
  t.rows[row].cells[0] = t.rows[from].cells[0];
  return t;
}

}  // namespace

TEST_CASE("one repetition at every row of a 30-row sine table: sine and R = 60 every time") {
  // Sines on a radius of 60 (common practice), arguments 1..30 and 3..90.
  for (double step : {1.0, 3.0}) {
    const Transcription t =
        testing::MakeTable("sines", step, step, 30, {FromModel("sine", {60}, 2)});
    for (std::size_t row = 0; row < 30; ++row) {
      CAPTURE(step);
      CAPTURE(row);
      const Identification id = Run(Repeated(t, row));
      REQUIRE(!id.ranked.empty());
      CHECK(id.ranked[0].model->name() == "sine");
      CHECK(id.ranked[0].Final().Value("R") == 60);
      CHECK(id.ranked[0].Final().exact >= 29);
      CHECK(id.explained);
    }
  }
}

TEST_CASE("a mean motion with one slip at every row is tried and ranked as a mean motion") {
  // The sun's daily motion 0;59,8,19,48 (from memory, the catalog's) from a
  // radix of 10;30, to thirds; one entry off by 10 units of its last place.
  testing::SyntheticColumn c;
  c.places = 3;
  c.modulo_360 = true;
  const double rate = D("0;59,8,19,48"), radix = D("10;30");
  c.f = [&](double t) { return radix + rate * t; };
  for (int row = 0; row < 30; ++row) {
    CAPTURE(row);
    c.errors = {{row, 10}};
    const Identification id = Run(testing::MakeTable("mm", 1, 1, 30, {c}));
    REQUIRE(!id.ranked.empty());
    CHECK(id.ranked[0].model->traits().kind == model::ModelKind::kMeanMotion);
    CHECK(id.ranked[0].Final().exact >= 29);
    REQUIRE(id.mean_motion.has_value());
    CHECK(id.mean_motion->unexplained <= 1);
  }
}

TEST_CASE("R = 60 with one author's departure is reported as 60, the departure kept") {
  // Computed with R = 60; the author wrote one entry a unit off his own
  // computation. A fitted radius can reproduce it (60;0,0,x), but the
  // table was computed with 60 and the departure is the author's.
  auto c = FromModel("sine", {60}, 2);
  c.errors = {{43, 1}};
  const Identification id = Run(testing::MakeTable("sines", 1, 1, 90, {c}));
  REQUIRE(!id.ranked.empty());
  const Candidate& best = id.ranked[0];
  CHECK(best.model->name() == "sine");
  REQUIRE(best.adoption.has_value());
  CHECK(best.Final().Value("R") == 60);
  CHECK(best.adoption->values.at(0).param == "R");
  CHECK(best.adoption->text.find("R = 60 adopted") == 0);
  CHECK(best.adoption->text.find("fitted 60") != std::string::npos);
  // The departure stays a departure of one unit.
  for (const auto& e : best.Final().entries) {
    CAPTURE(e.row);
    CHECK(e.diff_units == (e.row == 43 ? 1.0 : 0.0));
  }
}

TEST_CASE("a non-round value is not forced to a round one") {
  // e = 2;4,48 on a radius of 60 (published-checks.md, section 2, used here
  // only as a value): 2;5 or 2;4,45 would move many entries.
  const double e = D("2;4,48");
  const Identification id =
      Run(testing::MakeTable("sun", 1, 1, 180, {FromModel("solar-eccentric", {e}, 2)}));
  REQUIRE(!id.ranked.empty());
  CHECK(std::fabs(id.ranked[0].Final().params[0].value - e) < 1e-9);
}

TEST_CASE("a fifth of the entries corrupted: right model and value over ten seeds") {
  // Repetitions, displaced runs, digit slips and blanks at a fifth of the
  // rows, drawn with seeds 1..10, for three families.
  struct Case {
    const char* model;
    double value;
    double first, step;
    int rows;
  };
  const Case cases[] = {{"sine", 60, 1, 1, 90},
                        {"solar-eccentric", 2.5, 1, 1, 180},
                        {"declination", D("23;51,20"), 1, 1, 90}};
  for (const auto& k : cases) {
    int right = 0;
    for (unsigned seed = 1; seed <= 10; ++seed) {
      const Transcription t = testing::CorruptAFifth(
          testing::MakeTable("t", k.first, k.step, k.rows, {FromModel(k.model, {k.value}, 2)}),
          seed);
      const Identification id = Run(t);
      const bool ok = !id.ranked.empty() && id.ranked[0].model->name() == k.model &&
                      id.ranked[0].Final().params[0].value == k.value && id.explained;
      right += ok;
    }
    CAPTURE(k.model);
    CHECK(right >= 9);
  }
}

TEST_CASE("no model explains a column: the verdict says so, with its share") {
  // A curve of no model in the library: a sine of period 257 degrees on a
  // slow cubic (judgement: nothing here has that shape).
  testing::SyntheticColumn c;
  c.places = 2;
  c.f = [](double a) { return 7 * std::sin(a * 1.4 * 3.14159265 / 180) + 1e-6 * a * a * a; };
  const Identification id = Run(testing::MakeTable("odd", 1, 1, 120, {c}));
  REQUIRE(!id.ranked.empty());
  CHECK_FALSE(id.explained);
  CHECK(id.within_one_share < kExplainedShare);
  CHECK(id.verdict.find("no model explains column value") == 0);
  CHECK_FALSE(id.ranked[0].adoption.has_value());
  // A column a model explains, even with slips, is explained.
  auto s = FromModel("sine", {60}, 2);
  s.errors = {{3, 500}, {40, -77}};
  const Identification yes = Run(testing::MakeTable("sines", 1, 1, 90, {s}));
  CHECK(yes.explained);
  CHECK(yes.verdict.empty());
}

TEST_CASE("signs: signed, negated, magnitude and displaced tables") {
  const double e = 2.5;
  using model::SignForm;
  struct Case {
    SignForm made;
    double displacement;
    SignForm expected;
  };
  for (const Case k : {Case{SignForm::kSigned, 0, SignForm::kSigned},
                       Case{SignForm::kNegated, 0, SignForm::kNegated},
                       Case{SignForm::kMagnitude, 0, SignForm::kMagnitude},
                       Case{SignForm::kSigned, 3, SignForm::kSigned}}) {
    CAPTURE(model::ToString(k.made));
    CAPTURE(k.displacement);
    auto c = FromModel("solar-eccentric", {e}, 2, k.made);
    c.displacement = k.displacement;
    const Identification id = Run(testing::MakeTable("sun", 1, 1, 360, {c}));
    REQUIRE(!id.ranked.empty());
    const Candidate& best = id.ranked[0];
    CHECK(best.model->name() == "solar-eccentric");
    CHECK(best.model->ResolvedSign(best.fit.practice.sign) == k.expected);
    CHECK(best.Final().practice.displacement == k.displacement);
    CHECK(best.Final().exact >= 355);
  }
}

TEST_CASE("equivalent models are one explanation, named by the table's kind and ranges") {
  // A lunar table with r = 5;24: the eccentric, the solar epicycle, the
  // epicycle at mean distance and the moon's anomaly compute the same values.
  Transcription t =
      testing::MakeTable("moon", 1, 1, 180, {FromModel("lunar-anomaly", {D("5;24")}, 2)});
  t.kind = "equation of the moon's anomaly";
  Identification id = Run(t);
  REQUIRE(!id.ranked.empty());
  CAPTURE(id.ranked[0].naming);
  CHECK(id.ranked[0].model->name() == "lunar-anomaly");
  CHECK(id.ranked[0].equivalents.size() >= 2);
  CHECK(id.ranked[0].naming.find("says \"moon\"") != std::string::npos);
  // Without a kind, the historical ranges decide: 5;24 is outside the
  // sun's 1 .. 4, inside the moon's 4 .. 7 and the epicycle's 1 .. 45.
  t.kind.clear();
  t.table_title.clear();
  id = Run(t);
  REQUIRE(!id.ranked.empty());
  CHECK(id.ranked[0].model->name() != "solar-eccentric");
  CHECK(id.ranked[0].model->name() != "solar-epicycle");
}

TEST_CASE("right ascension on a 12-degree grid is named right ascension") {
  auto c = FromModel("right-ascension", {D("23;51,20")}, 2);
  c.grid = 12;
  c.errors = {{40, 300}};
  const Identification id = Run(testing::MakeTable("ra", 1, 1, 360, {c}));
  REQUIRE(!id.ranked.empty());
  CHECK(id.ranked[0].model->name() == "right-ascension");
  CHECK(id.ranked[0].fit.practice.grid == 12);
  CHECK(id.ranked[0].Final().Value("obliquity") == D("23;51,20"));
}

TEST_CASE("parameters the entries cannot separate: the combination, never an error of 0") {
  // The epicycle at greatest distance computes what the epicycle at mean
  // distance does with r' = 60 r / (60 + e): only that ratio is fixed.
  const double r = 6.5, e = 3;
  const Transcription t =
      testing::MakeTable("anomaly", 1, 1, 180, {FromModel("epicycle-anomaly-greatest", {r, e}, 2)});
  FitOptions o;
  const FitResult fit =
      Fit(*model::FindBuiltinModel("epicycle-anomaly-greatest"), t, std::vector<int>{}, o);
  for (const auto& p : fit.params) {
    CAPTURE(p.name);
    CHECK_FALSE(p.separable);
    CHECK_FALSE(std::isfinite(p.stderr_));
  }
  REQUIRE(fit.combinations.size() == 1);
  CHECK(fit.combinations[0].text.find("60 r/(60 + e)") == 0);
  CHECK(std::fabs(fit.combinations[0].value - 60 * r / (60 + e)) < 1e-3);
  CHECK(fit.combinations[0].stderr_ > 0);
  CHECK(fit.combinations[0].stderr_ < 1e-3);
  // Among every model, the simpler equivalent is preferred.
  const Identification id = Run(t);
  REQUIRE(!id.ranked.empty());
  CAPTURE(id.ranked[0].model->name());
  CHECK(id.ranked[0].model->params().size() == 1);
}

TEST_CASE("tables of positions: the true sun by day and a planet by ten days") {
  // The true sun: mean sun from 10;0 at 0;59,8,19,48 a day, apogee 65;30,
  // e = 2;30 (round values; common practice), one year by day, minutes.
  const model::Model* sun = model::FindBuiltinModel("true-sun");
  testing::SyntheticColumn s;
  s.places = 1;
  s.modulo_360 = true;
  const std::vector<double> ps = {10, D("0;59,8,19,48"), D("65;30"), 2.5, 360};
  s.f = [&](double t) {
    model::RowContext ctx;
    ctx.arg = t;
    return sun->Evaluate(ps, ctx);
  };
  s.errors = {{100, 7}, {200, -130}};
  Identification id = Run(testing::MakeTable("sun", 1, 1, 365, {s}));
  REQUIRE(!id.ranked.empty());
  CHECK(id.ranked[0].model->name() == "true-sun");
  CHECK(id.ranked[0].Final().exact >= 355);
  CHECK(std::fabs(id.ranked[0].Final().Value("e") - 2.5) < 0.05);
  // A planet on an epicycle (a large one, so that it regresses), by ten
  // days over four years.
  const model::Model* planet = model::FindBuiltinModel("planet-position");
  const std::vector<double> pp = {30, D("0;31,26,36"), 100, D("0;27,41,40"), D("115;30"),
                                  6,  D("39;30"),      360};
  testing::SyntheticColumn p;
  p.places = 1;
  p.modulo_360 = true;
  p.f = [&](double t) {
    model::RowContext ctx;
    ctx.arg = t;
    return planet->Evaluate(pp, ctx);
  };
  bool regresses = false;
  for (double t = 10; t < 1460; t += 10) {
    const double d = p.f(t) - p.f(t - 10);
    regresses = regresses || (d < 0 && d > -180);
  }
  REQUIRE(regresses);
  id = Run(testing::MakeTable("mars", 0, 10, 146, {p}));
  REQUIRE(!id.ranked.empty());
  CHECK(id.ranked[0].model->name() == "planet-position");
  CHECK(id.ranked[0].Final().within1 >= 140);
  CHECK(std::fabs(id.ranked[0].Final().Value("r") - D("39;30")) < 0.5);
}

TEST_CASE("equations by date at any body's daily motion are identified and explained") {
  // The column of equations beside a mean motion at the moon's, Venus's
  // and Mercury's daily motions in anomaly (from memory: 13;3,54,
  // 0;36,59,25 and 3;6,24 deg/day) and e = 2;30, by day, two places, with
  // a slip at 5% of the rows drawn by seeds 1..4: the equation by date,
  // explained, every time (its range once held the sun's motion only).
  const model::Model* eq = model::FindBuiltinModel("solar-equation-by-date");
  int right = 0, tried = 0;
  for (const char* rate : {"13;3,54", "0;36,59,25", "3;6,24"}) {
    for (unsigned seed = 1; seed <= 4; ++seed) {
      std::mt19937 rng(seed);
      std::uniform_real_distribution<double> radix(0, 360);
      const std::vector<double> pe = {radix(rng), D(rate), 2.5};
      testing::SyntheticColumn c;
      c.f = [&](double t) {
        model::RowContext ctx;
        ctx.arg = t;
        return eq->Evaluate(pe, ctx);
      };
      std::uniform_int_distribution<int> row(0, 59), units(-40, 40);
      for (int k = 0; k < 3; ++k) c.errors[row(rng)] = units(rng) | 1;
      const Identification id = Run(testing::MakeTable("eq", 1, 1, 60, {c}));
      ++tried;
      CAPTURE(rate);
      CAPTURE(seed);
      right += !id.ranked.empty() && id.ranked[0].model->name() == "solar-equation-by-date" &&
               id.explained;
    }
  }
  CHECK(right == tried);
}

TEST_CASE("notes and texts write arguments as the table does") {
  // Half-degree arguments: 88;30, never 88.5.
  auto c = FromModel("sine", {60}, 2);
  c.errors = {{5, 1000}};
  const Transcription t = testing::MakeTable("sines", 0.5, 0.5, 180, {c}, 1);
  FitOptions o;
  const FitResult fit = Fit(*model::FindBuiltinModel("sine"), t, std::vector<int>{}, o);
  const std::string text = FitText(fit, t, {}, true);
  CAPTURE(text);
  CHECK(text.find("88;30") != std::string::npos);
  CHECK(text.find("88.5") == std::string::npos);
  // The fit (no adoption here) in the table's notation, the decimal beside.
  CHECK(text.find("R = 59;59,59,59") != std::string::npos);
  CHECK(text.find("(59.9999") != std::string::npos);
}

TEST_CASE("a shadow interpolated from its first row is identified with its grid") {
  // Shadows of a gnomon of 12 (common practice) at altitudes 1..89, exact
  // every 6 degrees from the first row and linear between (near the horizon
  // far from the shadow itself), three slips: the grid counted from 1.
  auto c = FromModel("shadow", {12}, 2);
  c.grid = 6;
  c.grid_origin = 1;
  c.errors = {{10, 37}, {40, -600}, {70, 3600}};
  const Identification id = Run(testing::MakeTable("shadow", 1, 1, 89, {c}));
  REQUIRE(!id.ranked.empty());
  const Candidate& best = id.ranked[0];
  CHECK(best.model->name() == "shadow");
  CHECK(id.explained);
  CHECK(best.Final().practice.grid == 6);
  CHECK(best.Final().practice.grid_origin == 1);
  CHECK(best.Final().Value("g") == 12);
  CHECK(best.Final().exact >= 86);
}

TEST_CASE("right ascensions are named right ascension, not oblique ascension at latitude 0") {
  // Right ascensions for an obliquity of 23;51,20 (from memory: an attested
  // value) by degree, one place, three slips drawn by seeds 1..6: the
  // simpler model named every time, never oblique ascension with a
  // latitude of 0 adopted. Arguments 1..89: the ascensional difference at
  // the arctic circle (latitude 90 - obliquity) computes the same values
  // and, singular at 90, fits a slip there (open work, DEVELOPERS.md).
  int right = 0;
  for (unsigned seed = 1; seed <= 6; ++seed) {
    auto c = FromModel("right-ascension", {D("23;51,20")}, 1);
    std::mt19937 rng(seed);
    std::uniform_int_distribution<int> row(0, 88), units(-40, 40);
    for (int k = 0; k < 3; ++k) c.errors[row(rng)] = units(rng) | 1;
    const Identification id = Run(testing::MakeTable("ra", 1, 1, 89, {c}));
    CAPTURE(seed);
    right += !id.ranked.empty() && id.ranked[0].model->name() == "right-ascension" && id.explained;
  }
  CHECK(right == 6);
}

}  // namespace apograph::estimate
