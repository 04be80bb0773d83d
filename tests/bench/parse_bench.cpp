// Parse + validation speed of the transcription parser on a generated file.
// Build with -DAPOGRAPH_BENCH=ON; run ./build/parse_bench [cells] (default
// 1,000,000). Prints cells per second for the best of three runs.
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <ctime>
#include <string>

#include "transcription/parser.hpp"

namespace {

/// A table of `rows` rows and `columns` value columns with mixed readings
/// and some marks, as an editor would type them.
std::string Generate(long cells, int columns) {
  std::string text = "@work bench title=\"Generated\"\n@witness B library=\"Nowhere\"\n";
  text += "@table t kind=bench\n@argument n places=0 start=1 step=1\n";
  for (int c = 0; c < columns; ++c) text += "@column c" + std::to_string(c) + " places=2\n";
  text += "@rows\n";
  const long rows = cells / columns;
  for (long r = 0; r < rows; ++r) {
    text += std::to_string(r + 1);
    for (int c = 0; c < columns; ++c) {
      const long v = (r * 7 + c * 13) % 216000;
      text += " | " + std::to_string(v / 3600) + ";" + std::to_string(v / 60 % 60) + "," +
              std::to_string(v % 60);
      if ((r + c) % 97 == 0) text += " {doubt}";
    }
    if (r % 50 == 0) text += "   # a comment";
    text += '\n';
  }
  return text;
}

}  // namespace

int main(int argc, char** argv) {
  const long cells = argc > 1 ? std::atol(argv[1]) : 1'000'000;
  const int columns = 8;
  const std::string text = Generate(cells, columns);
  double best = 1e9;
  double best_cpu = 1e9;
  std::size_t parsed = 0;
  for (int run = 0; run < 3; ++run) {
    const std::clock_t cpu_start = std::clock();
    const auto start = std::chrono::steady_clock::now();
    {
      const auto file = apograph::ParseTranscription(text, "bench.apo");
      parsed = file.tables.at(0).CellCount();
    }
    const auto stop = std::chrono::steady_clock::now();
    const std::clock_t cpu_stop = std::clock();
    best = std::min(best, std::chrono::duration<double>(stop - start).count());
    best_cpu = std::min(best_cpu, static_cast<double>(cpu_stop - cpu_start) / CLOCKS_PER_SEC);
  }
  std::printf(
      "parsed %zu cells (%.1f MB): wall %.3f s = %.0f cells/s; cpu %.3f s = %.0f cells/s "
      "(best of 3, freeing included)\n",
      parsed, static_cast<double>(text.size()) / 1e6, best, static_cast<double>(parsed) / best,
      best_cpu, static_cast<double>(parsed) / best_cpu);
  return 0;
}
