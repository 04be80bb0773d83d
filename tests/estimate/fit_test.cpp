#include "estimate/fit.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "estimate/fit_problem.hpp"
#include "model/formula.hpp"
#include "model/model.hpp"
#include "synthetic.hpp"

namespace apograph::estimate {
namespace {

// The reference solver is linked into the test suite only (the program has
// no Ceres); this file's tests compare against it.
const bool kCeresRegistered = (RegisterCeresSolver(), true);

double SolarEquation(double e, double a) {
  const double r = a * std::numbers::pi / 180.0;
  // The model library's convention: the table gives the amount, q(360-a) = q(a).
  return std::fabs(std::atan2(e * std::sin(r), 60.0 + e * std::cos(r)) * 180.0 / std::numbers::pi);
}

Transcription SolarTable(double e, std::map<int, int> errors = {},
                         Rounding rounding = Rounding::kNearest) {
  testing::SyntheticColumn c;
  c.name = "equation";
  c.places = 2;
  c.f = [e](double a) { return SolarEquation(e, a); };
  c.rounding = rounding;
  c.errors = std::move(errors);
  return testing::MakeTable("solar", 1, 1, 360, {c});
}

const model::Model& Eccentric() { return *model::FindBuiltinModel("solar-eccentric"); }

}  // namespace

TEST_CASE("a clean 360-entry solar table gives back its eccentricity within the standard error") {
  const double e = 2.0 + 4.0 / 60 + 48.0 / 3600;  // 2;4,48
  const Transcription t = SolarTable(e);
  const FitResult r = Fit(Eccentric(), t, std::vector<int>{}, FitOptions{});
  REQUIRE(r.params.size() == 1);
  const auto& p = r.params[0];
  CHECK(p.stderr_ > 0);
  CHECK(p.stderr_ < 1e-3);
  // Rounding errors are deterministic, not random: the estimate may fall a
  // little more than one standard error off (calibration checked below).
  CHECK(std::fabs(p.value - e) < 3 * p.stderr_);
  CHECK(r.exact >= 340);  // rounding of the model reproduces (almost) every entry
  CHECK(r.flagged == 0);
  CHECK(r.robust_scale < 0.45);
}

TEST_CASE(
    "a handful of gross copying errors does not move the estimate beyond its standard error") {
  const double e = 2.0 + 4.0 / 60 + 48.0 / 3600;
  const FitResult clean = Fit(Eccentric(), SolarTable(e), std::vector<int>{}, FitOptions{});
  const Transcription bad =
      SolarTable(e, {{10, 600}, {44, -37}, {90, 3600}, {200, 20}, {301, -1200}});
  const FitResult r = Fit(Eccentric(), bad, std::vector<int>{}, FitOptions{});
  CHECK(std::fabs(r.params[0].value - clean.params[0].value) < clean.params[0].stderr_);
  CHECK(std::fabs(r.params[0].value - e) < 3 * r.params[0].stderr_);
  CHECK(r.flagged == 5);
  int flagged_rows = 0;
  for (const auto& en : r.entries)
    flagged_rows +=
        en.flag && (en.row == 10 || en.row == 44 || en.row == 90 || en.row == 200 || en.row == 301);
  CHECK(flagged_rows == 5);
}

TEST_CASE("--cauchy-only: the Cauchy estimate alone, without the refit on the inliers") {
  const double e = 2.0 + 4.0 / 60 + 48.0 / 3600;
  const Transcription bad =
      SolarTable(e, {{10, 600}, {44, -37}, {90, 3600}, {200, 20}, {301, -1200}});
  FitOptions cauchy;
  cauchy.refit_inliers = false;
  const FitResult robust = Fit(Eccentric(), bad, std::vector<int>{}, FitOptions{});
  const FitResult alone = Fit(Eccentric(), bad, std::vector<int>{}, cauchy);
  CHECK(robust.inliers == 355);  // the five slips left out of the refit
  CHECK(alone.inliers == 360);
  CHECK(alone.params[0].value != robust.params[0].value);
  // Both near the author's value, and the slips flagged by both.
  CHECK(std::fabs(alone.params[0].value - e) < 3 * alone.params[0].stderr_);
  CHECK(alone.flagged == 5);
}

TEST_CASE(
    "standard errors are calibrated: over 40 tables the error in standard errors has rms near 1") {
  double sum2 = 0;
  int beyond3 = 0;
  for (int k = 0; k < 40; ++k) {
    const double e = 1.9 + 0.0123457 * k;
    testing::SyntheticColumn c;
    c.places = 2;
    c.f = [e](double a) { return SolarEquation(e, a); };
    const FitResult r =
        Fit(Eccentric(), testing::MakeTable("s", 1, 1, 180, {c}), std::vector<int>{}, FitOptions{});
    const double z = (r.params[0].value - e) / r.params[0].stderr_;
    sum2 += z * z;
    beyond3 += std::fabs(z) > 3;
  }
  const double rms = std::sqrt(sum2 / 40);
  CHECK(rms > 0.5);
  CHECK(rms < 1.5);
  CHECK(beyond3 == 0);
}

TEST_CASE("the Ceres reference solver agrees with the fast solver, standard errors included") {
  const double e = 2.5;
  const Transcription t = SolarTable(e, {{33, 100}});
  FitOptions fast, ref;
  ref.solver = Solver::kCeres;
  const FitResult a = Fit(Eccentric(), t, std::vector<int>{}, fast);
  const FitResult b = Fit(Eccentric(), t, std::vector<int>{}, ref);
  CHECK(a.params[0].value == doctest::Approx(b.params[0].value).epsilon(1e-7));
  CHECK(a.params[0].stderr_ == doctest::Approx(b.params[0].stderr_).epsilon(0.25));
}

TEST_CASE("a truncated table is fitted under truncation and every entry reproduced") {
  const double e = 2.0 + 30.0 / 60;
  const Transcription t = SolarTable(e, {}, Rounding::kTruncate);
  FitOptions trunc;
  trunc.practice.rounding = Rounding::kTruncate;
  const FitResult r = Fit(Eccentric(), t, std::vector<int>{}, trunc);
  CHECK(std::fabs(r.params[0].value - e) < 3 * r.params[0].stderr_);
  CHECK(r.exact >= 340);
  const FitResult wrong = Fit(Eccentric(), t, std::vector<int>{}, FitOptions{});
  CHECK(wrong.exact < r.exact);
}

TEST_CASE("--fix holds a parameter and leaves no free parameter") {
  FitOptions o;
  o.fixed["e"] = 2.0;
  const FitResult r = Fit(Eccentric(), SolarTable(2.0), std::vector<int>{}, o);
  CHECK(r.params[0].fixed);
  CHECK(r.params[0].value == 2.0);
  CHECK(r.free_parameters == 0);
  CHECK(r.exact == 360);
  o.fixed["x"] = 1;
  CHECK_THROWS(Fit(Eccentric(), SolarTable(2.0), std::vector<int>{}, o));
}

TEST_CASE("a displaced table: the displacement constant is estimated with the eccentricity") {
  testing::SyntheticColumn c;
  c.places = 2;
  c.f = [](double a) { return SolarEquation(2.2, a); };
  c.displacement = 3.0;
  const Transcription t = testing::MakeTable("displaced", 1, 1, 360, {c});
  FitOptions o;
  o.fit_displacement = true;
  const FitResult r = Fit(Eccentric(), t, std::vector<int>{}, o);
  CHECK(std::fabs(r.params[0].value - 2.2) < 3 * r.params[0].stderr_);
  CHECK(std::fabs(r.practice.displacement - 3.0) < 3 * r.displacement_stderr + 1e-6);
  CHECK(r.free_parameters == 2);
  CHECK(r.exact >= 350);
}

// Published check. Source: Maimonides, *Mishneh Torah*, Laws of the
// Sanctification of the New Moon 13:4 (12th century; values as printed in
// the standard text and in two public English translations, which agree).
TEST_CASE(
    "published solar equation table: e between 2;4 and 2;6, only the entry at 20 outside half a "
    "unit") {
  const char* values[] = {"0;20", "0;40", "0;58", "1;15", "1;29", "1;41", "1;51", "1;57", "1;59",
                          "1;58", "1;53", "1;45", "1;33", "1;19", "1;1",  "0;42", "0;21", "0;0"};
  Transcription t;
  t.table_id = "equation-of-the-sun";
  t.argument = {"mean anomaly", "deg", 0, Sexagesimal::ParseOrThrow("10"),
                Sexagesimal::ParseOrThrow("10")};
  t.columns.push_back({"equation", "deg", 1, "", std::nullopt});
  for (const char* v : values) {
    Row row;
    Cell cell;
    cell.value = Sexagesimal::ParseOrThrow(v);
    cell.raw = v;
    cell.places = 1;
    row.cells.push_back(cell);
    t.rows.push_back(row);
  }
  const FitResult r = Fit(Eccentric(), t, std::vector<int>{}, FitOptions{});
  const double e = r.params[0].value;
  CHECK(e >= 2.0 + 4.0 / 60);
  CHECK(e <= 2.0 + 6.0 / 60);
  int outside = 0;
  double outside_arg = 0;
  for (const auto& en : r.entries) {
    if (std::fabs(en.residual) > 0.5) {
      ++outside;
      outside_arg = en.arg;
    }
  }
  CHECK(outside == 1);
  CHECK(outside_arg == 20);
}

}  // namespace apograph::estimate

namespace apograph::estimate {

TEST_CASE("the summary's quick rounding gives exactly Sexagesimal::FromDouble's units") {
  int compared = 0;
  for (Rounding r : {Rounding::kNearest, Rounding::kTruncate}) {
    for (int places = 0; places <= 5; ++places) {
      // Ties (x.5 units exactly: dyadic values), negatives, and a spread of others.
      std::vector<double> values = {0.03125, -0.03125, 2.5,          -2.5, 0.5,
                                    1.0 / 3, -7.0 / 3, 59.999999999, 0};
      for (int k = 1; k < 400; ++k) values.push_back(std::sin(k * 0.7) * 90 + k * 1e-7);
      for (double v : values) {
        CAPTURE(v);
        CAPTURE(places);
        const auto q = internal::BroughtUnits(v, places, r);
        REQUIRE(q.has_value());
        CHECK(*q == static_cast<std::int64_t>(Sexagesimal::FromDouble(v, places, r).units()));
        ++compared;
      }
    }
  }
  CHECK(compared > 4000);
  CHECK_FALSE(
      internal::BroughtUnits(1e11, 5, Rounding::kNearest).has_value());  // beyond 2^52 units
}

}  // namespace apograph::estimate

namespace apograph::estimate {

TEST_CASE("a user formula compared modulo 360 is fitted by differences of the wrapped residuals") {
  // A mean motion written as a formula: its value jumps by 360 at each wrap,
  // which forward differences of the value would take for a slope.
  const auto f = model::CompileFormula(
      "param radix = 10 range 0 .. 360 \"radix\"\n"
      "param rate = 1 range 0.5 .. 1.5 \"rate\"\n"
      "param modulus = 360 range 0 .. 360 \"modulus\"\n"
      "mod(radix + rate * arg, modulus)");
  REQUIRE(!f->ExactGradient());
  // The entry at 200 days stands 0;0,0,2 below a whole turn: a forward
  // difference of the value there crosses the wrap.
  const double rate = 0.98564736, radix = 720 - 1e-5 - rate * 200 - 360;
  testing::SyntheticColumn c;
  c.places = 3;
  c.modulo_360 = true;
  c.f = [&](double t) { return radix + rate * t; };
  const Transcription t = testing::MakeTable("mm", 1, 1, 300, {c});
  FitOptions o;
  o.start = {{"radix", radix}, {"rate", rate}};
  const FitResult r = Fit(*f, t, std::vector<int>{}, o);
  CHECK(std::fabs(r.Value("rate") - rate) < 1e-7);
  CHECK(std::fabs(r.Value("radix") - radix) < 1e-4);
  CHECK(r.exact >= 290);
  // The Jacobian's row at 200 days is the slope of the wrapped residual
  // (-60^3 (1, 200)), not a jump of a whole turn over the step.
  FitOptions mo = o;
  mo.modulo_360 = true;
  const auto obs = CollectObservations(t, {});
  internal::FitProblem problem(*f, t, obs, mo);
  const std::vector<double> x = problem.Start(mo);
  std::vector<double> res(obs.size()), J(obs.size() * 2), v(obs.size());
  problem.Linearise(x.data(), res.data(), J.data(), v.data());
  const std::size_t row = 199;
  REQUIRE(obs[row].arg == 200);
  CHECK(J[row * 2] / -216000.0 == doctest::Approx(1).epsilon(1e-3));
  CHECK(J[row * 2 + 1] / -216000.0 == doctest::Approx(200).epsilon(1e-3));
}

TEST_CASE("an eccentricity fitted negative is shown positive with the apogee turned") {
  // Every built-in model with an apogee and an e: (-e, A + 180) computes
  // every value of (e, A) (what fit.cpp's PositiveEccentricity relies on).
  int models = 0;
  for (const model::Model* m : model::BuiltinModels()) {
    const int a = m->ParamIndex(model::ParamRole::kApogee), e = m->ParamIndex("e");
    if (a < 0 || e < 0) continue;
    ++models;
    std::vector<double> p = m->Defaults(), q = p;
    q[static_cast<std::size_t>(e)] = -p[static_cast<std::size_t>(e)];
    q[static_cast<std::size_t>(a)] = p[static_cast<std::size_t>(a)] + 180;
    for (double t : {0.0, 17.0, 123.5, 400.0}) {
      model::RowContext ctx;
      ctx.arg = t;
      CAPTURE(m->name());
      CHECK(m->Evaluate(q, ctx) == doctest::Approx(m->Evaluate(p, ctx)).epsilon(1e-12));
    }
  }
  CHECK(models == 2);  // true-sun, planet-position
  // True suns fitted from the mirrored start converge there, and are
  // reported with the author's e and apogee (each apogee's quadrant).
  const model::Model& sun = *model::FindBuiltinModel("true-sun");
  for (const auto& [e, apogee] : std::vector<std::pair<double, double>>{
           {2.5, 65.5}, {2.0 + 4.0 / 60, 10}, {1.25, 170}, {3.5, 300}}) {
    testing::SyntheticColumn c;
    c.f = [&sun, e = e, apogee = apogee](double t) {
      model::RowContext ctx;
      ctx.arg = t;
      return sun.Evaluate({10.5, 0.9856, apogee, e, 360}, ctx);
    };
    const Transcription table = testing::MakeTable("sun", 0, 10, 60, {c});
    FitOptions o;
    o.start = {{"radix", 10.5}, {"rate", 0.9856}, {"apogee", apogee}, {"e", e}};
    const FitResult own = Fit(sun, table, std::vector<int>{}, o);
    o.start = {{"radix", 10.5}, {"rate", 0.9856}, {"apogee", apogee + 180}, {"e", -e}};
    const FitResult r = Fit(sun, table, std::vector<int>{}, o);
    CAPTURE(apogee);
    CHECK(r.exact == own.exact);  // the same entries reproduced
    CHECK(r.exact >= 57);
    CHECK(r.Value("e") == doctest::Approx(e).epsilon(1e-4));
    CHECK(r.Value("apogee") == doctest::Approx(apogee).epsilon(1e-4));
    CHECK(r.params[2].stderr_ > 0);
  }
}

}  // namespace apograph::estimate
