// Benchmarks of the estimate stage (built with -DAPOGRAPH_BENCH=ON):
//   ./build/estimate_bench [tables]   (default 1000 tables for identify --all)
// 1. a robust one-parameter fit of a 360-entry column (goal <= 0.2 ms);
// 2. identify of a 360-entry column against every family and practice (goal <= 200 ms);
// 3. identify --all over a generated database of N tables on 2 threads (goal < 1 min for 1000).
// Each line gives wall and CPU time; on a loaded machine compare CPU times
// (`uptime` before running tells the load).
#include <chrono>
#include <cmath>
#include <cstdio>
#include <ctime>
#include <filesystem>
#include <iostream>
#include <sstream>
#include <string>

#include "../estimate/synthetic.hpp"
#include "cli/command.hpp"
#include "estimate/fit.hpp"
#include "estimate/identify.hpp"
#include "model/model.hpp"
#include "store/edition_store.hpp"

using namespace apograph;
using Clock = std::chrono::steady_clock;

namespace {

estimate::testing::SyntheticColumn Column(const std::string& model, std::vector<double> params,
                                          int places) {
  const model::Model* m = model::FindBuiltinModel(model);
  estimate::testing::SyntheticColumn c;
  c.places = places;
  c.f = [m, params](double a) {
    model::RowContext ctx;
    ctx.arg = a;
    return m->Evaluate(params, ctx);
  };
  return c;
}

double Millis(Clock::time_point a, Clock::time_point b) {
  return std::chrono::duration<double, std::milli>(b - a).count();
}
/// CPU time of the process since c0 (every thread), ms: steadier than wall
/// time on a shared machine.
double CpuMillis(std::clock_t c0) {
  return 1000.0 * static_cast<double>(std::clock() - c0) / CLOCKS_PER_SEC;
}

void BenchFit() {
  auto c = Column("solar-eccentric", {2.08}, 2);
  c.errors = {{10, 600}, {200, -37}};
  const Transcription t = estimate::testing::MakeTable("sun", 1, 1, 360, {c});
  const auto obs = estimate::CollectObservations(t, {});
  const model::Model& m = *model::FindBuiltinModel("solar-eccentric");
  for (auto solver : {estimate::Solver::kFast, estimate::Solver::kCeres}) {
    estimate::FitOptions o;
    o.solver = solver;
    const int n = solver == estimate::Solver::kFast ? 2000 : 200;
    double sink = 0;
    const auto t0 = Clock::now();
    const std::clock_t c0 = std::clock();
    for (int i = 0; i < n; ++i) sink += estimate::Fit(m, t, obs, o).params[0].value;
    const double ms = Millis(t0, Clock::now()) / n;
    const double cpu = CpuMillis(c0) / n;
    std::printf(
        "fit, 1 parameter, 360 entries, %s solver: %.3f ms wall, %.3f ms CPU per fit (e = %.6f)\n",
        solver == estimate::Solver::kFast ? "fast" : "Ceres", ms, cpu, sink / n);
  }
}

void BenchIdentify() {
  auto c = Column("solar-eccentric", {2.08}, 2);
  const Transcription t = estimate::testing::MakeTable("sun", 1, 1, 360, {c});
  const int n = 10;
  int tried = 0;
  const auto t0 = Clock::now();
  const std::clock_t c0 = std::clock();
  for (int i = 0; i < n; ++i) tried = estimate::Identify(t, 0).candidates_tried;
  std::printf(
      "identify, 360 entries, every family and practice (%d candidates): %.1f ms wall, %.1f ms "
      "CPU\n",
      tried, Millis(t0, Clock::now()) / n, CpuMillis(c0) / n);
}

Transcription Generated(int i) {
  static const char* kModels[] = {"solar-eccentric", "declination", "sine", "equant-centre",
                                  "lunar-anomaly"};
  static const std::vector<double> kParams[] = {{2.08}, {23.85}, {60}, {6}, {5.25}};
  const int k = i % 5;
  auto c = Column(kModels[k], kParams[k], 2);
  c.name = "value";
  if (i % 3 == 1) c.rounding = Rounding::kTruncate;
  if (i % 7 == 0) c.grid = 6;
  c.errors = {{i % 60, 37}};
  const int count = k == 1 || k == 2 ? 90 : 180;
  Transcription t = estimate::testing::MakeTable("t" + std::to_string(i / 2), 1, 1, count, {c});
  t.work.id = "gen";
  t.witness.siglum = i % 2 ? "B" : "A";
  return t;
}

void BenchAll(int tables) {
  const std::string path =
      (std::filesystem::temp_directory_path() / "apograph_estimate_bench.sqlite").string();
  std::filesystem::remove(path);
  {
    store::Database db(path);
    std::vector<Transcription> all;
    for (int i = 0; i < tables; ++i) all.push_back(Generated(i));
    store::Import(db, all);
  }
  std::ostringstream out, err;
  cli::Io io{out, err, false, false};
  const auto t0 = Clock::now();
  const std::clock_t c0 = std::clock();
  const int code =
      cli::Dispatch({"identify", "--all", "--threads", "2", "--format", "csv", "--db", path}, io);
  const double s = Millis(t0, Clock::now()) / 1000;
  const double cpu = static_cast<double>(std::clock() - c0) / CLOCKS_PER_SEC;
  int lines = 0;
  for (char ch : out.str()) lines += ch == '\n';
  std::printf(
      "identify --all, %d tables (90-180 entries), 2 threads: %.1f s wall, %.1f s CPU (exit %d, %d "
      "result rows)\n",
      tables, s, cpu, code, lines - 1);
  std::filesystem::remove(path);
}

}  // namespace

int main(int argc, char** argv) {
  apograph::estimate::RegisterCeresSolver();  // the reference solver, compared below
  const int tables = argc > 1 ? std::atoi(argv[1]) : 1000;
  BenchFit();
  BenchIdentify();
  BenchAll(tables);
}
