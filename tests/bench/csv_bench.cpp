// Reading CSV sheets against parsing the same cells as a transcription, in
// the same run. Build with -DAPOGRAPH_BENCH=ON; run ./build-bench/csv_bench
// [cells] (default 1,000,000). Prints cells per second (wall and CPU) of the
// best of three runs of each; the machine is shared, so CPU time is the
// figure to compare.
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <ctime>
#include <functional>
#include <string>

#include "transcription/csv.hpp"
#include "transcription/parser.hpp"

namespace {

std::string Reading(long r, int c) {
  const long v = (r * 7 + c * 13) % 216000;
  return std::to_string(v / 3600) + ";" + std::to_string(v / 60 % 60) + "," +
         std::to_string(v % 60);
}

/// The same table as parse_bench: `cells` cells in 8 columns of 2 places.
std::string Sheet(long cells, int columns) {
  std::string text = "n";
  for (int c = 0; c < columns; ++c) text += ",c" + std::to_string(c);
  text += '\n';
  for (long r = 0; r < cells / columns; ++r) {
    text += std::to_string(r + 1);
    for (int c = 0; c < columns; ++c) text += ",\"" + Reading(r, c) + "\"";
    text += '\n';
  }
  return text;
}

std::string Transcription(long cells, int columns) {
  std::string text = "@work bench\n@witness B\n@table t\n@argument n places=0 start=1 step=1\n";
  for (int c = 0; c < columns; ++c) text += "@column c" + std::to_string(c) + " places=2\n";
  text += "@rows\n";
  for (long r = 0; r < cells / columns; ++r) {
    text += std::to_string(r + 1);
    for (int c = 0; c < columns; ++c) text += " | " + Reading(r, c);
    text += '\n';
  }
  return text;
}

void Measure(const char* what, const std::function<std::size_t()>& run) {
  double best = 1e9, best_cpu = 1e9;
  std::size_t cells = 0;
  for (int i = 0; i < 3; ++i) {
    const std::clock_t cpu_start = std::clock();
    const auto start = std::chrono::steady_clock::now();
    cells = run();
    const auto stop = std::chrono::steady_clock::now();
    best = std::min(best, std::chrono::duration<double>(stop - start).count());
    best_cpu = std::min(best_cpu, static_cast<double>(std::clock() - cpu_start) / CLOCKS_PER_SEC);
  }
  std::printf("%-24s %zu cells: wall %.3f s = %.2f M cells/s; cpu %.3f s = %.2f M cells/s\n", what,
              cells, best, static_cast<double>(cells) / best / 1e6, best_cpu,
              static_cast<double>(cells) / best_cpu / 1e6);
}

}  // namespace

int main(int argc, char** argv) {
  const long cells = argc > 1 ? std::atol(argv[1]) : 1'000'000;
  const int columns = 8;
  const std::string sheet = Sheet(cells, columns);
  const std::string apo = Transcription(cells, columns);
  apograph::CsvOptions options;
  options.head.table_id = "t";
  options.head.witness.siglum = "B";
  options.head.argument.start = apograph::Sexagesimal::ParseOrThrow("1");
  options.head.argument.step = apograph::Sexagesimal::ParseOrThrow("1");
  // Alternating, so that neither always runs on a heap the other warmed;
  // `csv` or `apo` as second argument measures one of them alone.
  const std::string only = argc > 2 ? argv[2] : "";
  for (int round = 0; round < 2; ++round) {
    if (only != "csv")
      Measure("transcription (parse)", [&] {
        return apograph::ParseTranscription(apo, "bench.apo").tables.at(0).CellCount();
      });
    if (only != "apo")
      Measure("CSV sheet (ReadCsv)", [&] {
        return apograph::ReadCsv(sheet, "bench.csv", options).tables.at(0).CellCount();
      });
  }
  return 0;
}
