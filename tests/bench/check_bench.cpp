// Benchmark: recomputation and check of a 360-row column with every built-in
// model and with an equivalent user formula. Run:
//   cmake -S . -B build -DAPOGRAPH_BENCH=ON && cmake --build build --target check_bench
//   ./build/check_bench
#include <chrono>
#include <cstdio>

#include "model/check.hpp"
#include "model/formula.hpp"

using namespace apograph;

namespace {

Transcription Table(int rows) {
  Transcription t;
  t.table_id = "bench";
  t.argument.start = Sexagesimal::FromParts(false, 1, {});
  t.argument.step = Sexagesimal::FromParts(false, 1, {});
  t.columns.push_back({"v", "deg", 2, "", std::nullopt});
  for (int i = 0; i < rows; ++i) {
    Row r;
    r.argument.raw = std::to_string(i + 1);
    r.argument.value = Sexagesimal::FromParts(false, i + 1, {});
    Cell c;
    c.raw = "1;0,0";
    c.value = Sexagesimal::FromParts(false, 1, {0, 0});
    c.places = 2;
    r.cells.push_back(c);
    t.rows.push_back(r);
  }
  return t;
}

template <typename F>
double Seconds(F&& f) {
  const auto start = std::chrono::steady_clock::now();
  f();
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}

}  // namespace

int main() {
  const Transcription t = Table(360);
  const int reps = 200;
  int flagged = 0;
  const double all = Seconds([&] {
    for (int k = 0; k < reps; ++k) {
      for (const model::Model* m : model::BuiltinModels()) {
        flagged += model::Check(t, *m, m->Defaults(), model::Practice{}, 1, 0).summary.flagged;
      }
    }
  });
  const auto n_models = model::BuiltinModels().size();
  std::printf("check, %zu built-in models x 360 entries x %d: %.3f s (%.2f us per entry)\n",
              n_models, reps, all, 1e6 * all / (reps * 360.0 * n_models));
  auto f = model::CompileFormula("param e = 2;30\nabs(atan2(e * sin(arg), 60 + e * cos(arg)))");
  const model::Model& b = *model::FindBuiltinModel("solar-eccentric");
  model::Practice grid;
  grid.grid = 6;
  const double builtin = Seconds([&] {
    for (int k = 0; k < 10 * reps; ++k)
      flagged += model::Check(t, b, {2.5}, grid, 1, 0).summary.flagged;
  });
  const double formula = Seconds([&] {
    for (int k = 0; k < 10 * reps; ++k)
      flagged += model::Check(t, *f, {2.5}, grid, 1, 0).summary.flagged;
  });
  std::printf(
      "solar equation, grid 6, 360 entries x %d: built-in %.3f s, formula %.3f s (%.2f us/entry)\n",
      10 * reps, builtin, formula, 1e6 * formula / (10 * reps * 360.0));
  const double compile = Seconds([&] {
    for (int k = 0; k < 10000; ++k)
      model::CompileFormula("param e = 2;30\nabs(atan2(e * sin(arg), 60 + e * cos(arg)))");
  });
  std::printf("compile a formula: %.1f us\n(%d flagged, to keep the work)\n", 1e6 * compile / 10000,
              flagged);
}
