// Import benchmark: generates a corpus of transcriptions (default 1,080,000
// value cells) as text in the transcription format, then times parsing,
// storing, and both together, on one core. Not a test: run it and read the
// figures.
//
//   cmake -S . -B build -DAPOGRAPH_BENCH=ON && cmake --build build --target import_bench
//   ./build/import_bench [WITNESSES] [DB-FILE] [keep] [scan]
//
// WITNESSES (default 10) scales the corpus: each witness has 50 tables of
// 360 rows and 6 columns. DB-FILE defaults to a file in the temp folder; it
// is removed first, and at the end unless `keep` is given (to query it with
// the sqlite3 shell). After the import it also times Load() of one table
// and, with `scan`, a pass over every cell through the view current_cell.
#include <chrono>
#include <cstdio>
#include <ctime>
#include <filesystem>
#include <iostream>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "store/database.hpp"
#include "store/edition_store.hpp"
#include "transcription/parser.hpp"

namespace {

using Clock = std::chrono::steady_clock;
constexpr int kTablesPerWitness = 50;
constexpr int kRows = 360;
constexpr int kColumns = 6;

void AppendPlace(std::string& out, int v) {
  if (v >= 10) out += static_cast<char>('0' + v / 10);
  out += static_cast<char>('0' + v % 10);
}

/// One value in trade notation with `places` places, deterministic in (r, c).
void AppendValue(std::string& out, unsigned seed, int places) {
  AppendPlace(out, static_cast<int>(seed % 30));
  for (int p = 0; p < places; ++p) {
    seed = seed * 1103515245u + 12345u;
    out += p == 0 ? ';' : ',';
    AppendPlace(out, static_cast<int>((seed >> 16) % 60));
  }
}

/// A cell, now and then illegible, blank, partly legible or with marks.
void AppendCell(std::string& out, unsigned seed, int places) {
  switch (seed % 97) {
    case 3:
      out += "?";
      return;
    case 7:
      out += "_";
      return;
    case 11:  // partly legible: the last place unread
      AppendValue(out, seed, places - 1);
      out += places == 1 ? ";?" : ",?";
      return;
    default:
      break;
  }
  AppendValue(out, seed, places);
  if (seed % 89 == 5) out += " {doubt}";
  if (seed % 83 == 2) out += " {was 0;1,2}";
}

/// The corpus of one witness as one file text.
std::string WitnessText(int w) {
  std::string out;
  out.reserve(kTablesPerWitness * kRows * 80);
  const std::string siglum = "W" + std::to_string(w);
  out += "# generated benchmark witness\n@work bench title=\"Benchmark Tables\"\n";
  out += "@witness " + siglum + " library=\"Generated\" script=hindu-arabic\n";
  for (int t = 0; t < kTablesPerWitness; ++t) {
    out += "@table t" + std::to_string(t) + " title=\"table " + std::to_string(t) + "\"\n";
    out += "@argument arg unit=deg places=0 start=1 step=1\n";
    for (int c = 0; c < kColumns; ++c) {
      out +=
          "@column c" + std::to_string(c) + " unit=deg places=" + std::to_string(1 + c % 3) + "\n";
    }
    out += "@rows\n";
    for (int r = 0; r < kRows; ++r) {
      out += std::to_string(r + 1);
      for (int c = 0; c < kColumns; ++c) {
        out += " | ";
        AppendCell(out, static_cast<unsigned>((w * 7919 + t * 104729 + r * 31 + c) * 2654435761u),
                   1 + c % 3);
      }
      out += '\n';
    }
  }
  return out;
}

/// Wall-clock and CPU time of this process (the machine may be shared: CPU
/// time is the fairer figure for "one core").
struct Stamp {
  Clock::time_point wall;
  double cpu;
  static Stamp Now() {
    timespec t{};
    clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &t);
    return {Clock::now(), static_cast<double>(t.tv_sec) + static_cast<double>(t.tv_nsec) * 1e-9};
  }
};

struct Span {
  double wall = 0;
  double cpu = 0;
  Span operator+(const Span& o) const { return {wall + o.wall, cpu + o.cpu}; }
};

Span Between(const Stamp& a, const Stamp& b) {
  return {std::chrono::duration<double>(b.wall - a.wall).count(), b.cpu - a.cpu};
}

void Report(const char* what, std::size_t cells, Span s) {
  const auto n = static_cast<double>(cells);
  std::printf("%-26s wall %7.3f s = %9.0f cells/s   cpu %7.3f s = %9.0f cells/s\n", what, s.wall,
              n / s.wall, s.cpu, n / s.cpu);
}

void RemoveDb(const std::string& path) {
  for (const char* suffix : {"", "-wal", "-shm", "-journal"}) std::remove((path + suffix).c_str());
}

/// Times what editors and later stages do with the database: Load() one
/// table, and read every current cell through the view (value_real included).
void ReadBack(const std::string& db_path, bool scan) {
  apograph::store::Database db(db_path);
  apograph::store::Load(db, "t6", "W0");  // the first query prepares the schema
  const Stamp a = Stamp::Now();
  const auto t = apograph::store::Load(db, "t7", "W0");
  const Stamp b = Stamp::Now();
  std::printf("read back: Load() of one table (%zu cells) %.1f ms\n", t.CellCount(),
              Between(a, b).wall * 1e3);
  if (!scan) return;
  auto s = db.Prepare("SELECT count(*), total(value_real) FROM current_cell");
  s.Step();
  const Stamp c = Stamp::Now();
  std::printf("read back: all %lld cells through current_cell (value_real too) %.2f s\n",
              static_cast<long long>(s.Int(0)), Between(b, c).wall);
}

}  // namespace

int main(int argc, char** argv) {
  const int witnesses = argc > 1 ? std::stoi(argv[1]) : 10;
  bool keep = false;
  bool scan = false;
  for (int i = 3; i < argc; ++i) {
    keep = keep || std::string(argv[i]) == "keep";
    scan = scan || std::string(argv[i]) == "scan";
  }
  const std::string db_path =
      argc > 2 ? argv[2]
               : (std::filesystem::temp_directory_path() / "apograph-import-bench.sqlite").string();

  std::vector<std::string> texts;
  std::size_t bytes = 0;
  for (int w = 0; w < witnesses; ++w) {
    texts.push_back(WitnessText(w));
    bytes += texts.back().size();
  }

  const Stamp t0 = Stamp::Now();
  std::vector<apograph::Transcription> tables;
  for (int w = 0; w < witnesses; ++w) {
    auto file = apograph::ParseTranscription(texts[static_cast<std::size_t>(w)],
                                             "W" + std::to_string(w) + ".apo");
    for (auto& t : file.tables) tables.push_back(std::move(t));
  }
  const Stamp t1 = Stamp::Now();
  std::size_t cells = 0;
  for (const auto& t : tables) cells += t.CellCount();

  RemoveDb(db_path);
  apograph::store::ImportResult result;
  const Stamp t2 = Stamp::Now();
  {
    apograph::store::Database db(db_path);
    result = apograph::store::Import(db, tables);
  }  // closing counts: it may write the last pages
  const Stamp t3 = Stamp::Now();
  std::printf(
      "corpus: %d witnesses, %zu tables, %zu value cells (%zu cells written with "
      "arguments), %.1f MB of text\n",
      witnesses, tables.size(), cells, result.cells_written, static_cast<double>(bytes) / 1e6);
  Report("parse", cells, Between(t0, t1));
  Report("store (one transaction)", cells, Between(t2, t3));
  Report("parse + store", cells, Between(t0, t1) + Between(t2, t3));
  const std::size_t all_cells = result.cells_written;
  std::printf("counting argument cells too (%zu cells):\n", all_cells);
  Report("parse + store", all_cells, Between(t0, t1) + Between(t2, t3));
  std::printf("database file: %.1f MB\n",
              static_cast<double>(std::filesystem::file_size(db_path)) / 1e6);
  ReadBack(db_path, scan);
  if (!keep) RemoveDb(db_path);
  return 0;
}
