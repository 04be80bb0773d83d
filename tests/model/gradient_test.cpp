// Exact derivatives of the built-in models (dual numbers) against central
// differences in long double, and the practice's derivatives (grids, rounded
// nodes) against the model's own.
#include <cmath>
#include <vector>

#include <doctest/doctest.h>

#include "model/builtin.hpp"
#include "model/formula.hpp"

namespace apograph::model {
namespace {

using internal::AllBuiltinModels;
using internal::BuiltinModel;

/// d f / d p_i by central differences in long double (step 1e-6 relative).
double Central(const BuiltinModel& m, std::vector<double> p, std::size_t i, double arg,
               double arg2) {
  std::vector<long double> pl(p.begin(), p.end());
  const long double h = 1e-6L * std::max(std::fabs(pl[i]), 1.0L);
  pl[i] += h;
  const long double up = m.EvaluateLong(pl, arg, arg2);
  pl[i] -= 2 * h;
  const long double down = m.EvaluateLong(pl, arg, arg2);
  return static_cast<double>((up - down) / (2 * h));
}

std::vector<int> AllIndices(const Model& m) {
  std::vector<int> wrt;
  for (std::size_t i = 0; i < m.params().size(); ++i) wrt.push_back(static_cast<int>(i));
  return wrt;
}

}  // namespace

TEST_CASE("every built-in model's exact derivatives agree with central differences") {
  int compared = 0, exact = 0;
  for (const BuiltinModel* m : AllBuiltinModels()) {
    CAPTURE(m->name());
    exact += m->HasExactGradient();
    const double tol = 1e-6;
    const std::vector<double> p = m->Defaults();
    const std::vector<int> wrt = AllIndices(*m);
    for (double arg : {0.5, 13.0, 44.75, 90.25, 133.0, 200.5, 271.0, 345.0}) {
      CAPTURE(arg);
      RowContext row;
      row.arg = arg;
      row.arg2 = 12.0;
      std::vector<double> g(wrt.size());
      const double v = m->EvaluateWithGradient(p, row, wrt, g.data());
      const double plain = m->Evaluate(p, row);
      if (!std::isfinite(plain)) continue;
      CHECK(v == plain);  // the value is the double formula's, bit for bit
      for (std::size_t i = 0; i < wrt.size(); ++i) {
        const double c = Central(*m, p, i, arg, 12.0);
        CHECK(std::fabs(g[i] - c) <= tol * std::max(1.0, std::fabs(c)));
        ++compared;
      }
    }
  }
  CHECK(compared > 150);
  CHECK(exact == static_cast<int>(AllBuiltinModels().size()));
}

TEST_CASE("a mean motion's derivatives hold across the wrap at 360") {
  const Model& m = *FindBuiltinModel("mean-motion");
  RowContext row;
  row.arg = 365;  // 365 days: radix + about 359.76 degrees, just below a wrap
  const std::vector<int> wrt = {0, 1, 2};
  double g[3];
  for (double radix : {0.0, 0.2, 0.24, 0.25, 100.0}) {
    CAPTURE(radix);
    const std::vector<double> p = {radix, 0.98564736, 360};
    const double v = m.EvaluateWithGradient(p, row, wrt, g);
    CHECK(v == m.Evaluate(p, row));
    CHECK(g[0] == 1);
    CHECK(g[1] == doctest::Approx(365).epsilon(1e-12));
    CHECK(g[2] == (radix + 0.98564736 * 365 >= 360 ? -1 : 0));  // one whole turn removed, or none
  }
}

TEST_CASE("a model without exact derivatives gets forward differences (user formulas)") {
  const auto f = CompileFormula("param R = 60 range 1 .. 150 \"radius\"\nR * sin(arg) + 2 * R");
  RowContext row;
  row.arg = 30;
  double g = 0;
  const double v = f->EvaluateWithGradient({60}, row, {0}, &g);
  CHECK(v == doctest::Approx(150).epsilon(1e-12));
  CHECK(g == doctest::Approx(2.5).epsilon(1e-6));  // sin 30 + 2
}

TEST_CASE("under a grid the derivative is the straight line between the nodes' derivatives") {
  const Model& m = *FindBuiltinModel("sine");
  Practice pr;
  pr.grid = 6;
  RowContext row;
  row.arg = 32;  // between the nodes 30 and 36, a third of the way
  double g = 0;
  const double v = PracticeValueWithGradient(m, {60}, row, pr, 2, {0}, &g);
  CHECK(v == doctest::Approx(PracticeValue(m, {60}, row, pr, 2)).epsilon(1e-15));
  const double s30 = std::sin(30 * M_PI / 180), s36 = std::sin(36 * M_PI / 180);
  CHECK(g == doctest::Approx(s30 + (s36 - s30) / 3).epsilon(1e-12));
  pr.round_nodes = true;  // the value follows the rounded nodes, the derivative the exact ones
  const double vr = PracticeValueWithGradient(m, {60}, row, pr, 2, {0}, &g);
  CHECK(vr == doctest::Approx(PracticeValue(m, {60}, row, pr, 2)).epsilon(1e-15));
  CHECK(g == doctest::Approx(s30 + (s36 - s30) / 3).epsilon(1e-12));
  pr.displacement = 3;
  CHECK(PracticeValueWithGradient(m, {60}, row, pr, 2, {}, nullptr) == doctest::Approx(vr + 3));
}

}  // namespace apograph::model
