#pragma once
// Helpers for the store tests: a temporary database file and transcriptions
// built in code.

#include <unistd.h>
#include <algorithm>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "store/deviation_store.hpp"
#include "test_paths.hpp"

namespace apograph::testing {

/// Every transcription file the project ships (corpora/, grammar/examples/),
/// sorted: the round-trip tests run over all of them.
inline std::vector<std::string> ProjectFiles() {
  namespace fs = std::filesystem;
  std::vector<std::string> files;
  const fs::path root = APOGRAPH_SOURCE_DIR;
  for (const char* dir : {"corpora", "grammar/examples"}) {
    if (!fs::exists(root / dir)) continue;
    for (const auto& e : fs::recursive_directory_iterator(root / dir)) {
      if (e.is_regular_file() && e.path().extension() == ".apo") files.push_back(e.path().string());
    }
  }
  std::sort(files.begin(), files.end());
  return files;
}

/// A fresh database path in the temp folder, removed (with its journal files)
/// at the end of the test.
class TempDb {
 public:
  explicit TempDb(const std::string& tag) {
    static int counter = 0;
    path_ = (std::filesystem::temp_directory_path() /
             ("apograph-test-" + tag + "-" + std::to_string(::getpid()) + "-" +
              std::to_string(++counter) + ".sqlite"))
                .string();
    Remove();
  }
  ~TempDb() { Remove(); }
  const std::string& path() const { return path_; }

  /// The whole file, to compare byte for byte.
  std::string Bytes() const {
    std::ifstream in(path_, std::ios::binary);
    return std::string(std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>());
  }

 private:
  void Remove() {
    for (const char* suffix : {"", "-wal", "-shm", "-journal"})
      std::remove((path_ + suffix).c_str());
  }
  std::string path_;
};

inline Cell ReadCell(const std::string& text, int places, int line, int column) {
  Cell c;
  c.raw = text;
  c.value = Sexagesimal::ParseOrThrow(text);
  c.places = places;
  c.line = line;
  c.column = column;
  return c;
}

/// A solar-equation-like table of `rows` rows and two columns with every
/// kind of editorial state somewhere in it.
inline Transcription MakeTranscription(const std::string& table_id, const std::string& siglum,
                                       int rows = 12) {
  Transcription t;
  t.work = {"harbour", "The Harbour Tables", "anonymous"};
  t.table_id = table_id;
  t.table_title = "Equation of the sun";
  t.kind = "solar equation";
  t.witness = {siglum, "Nordhafen, Town Library", "Cod. 112", "c. 1420", "hindu-arabic", "a note"};
  t.folios = "12r-13v";
  t.hand = "main hand";
  t.argument = {"anomaly", "deg", 0, Sexagesimal::ParseOrThrow("1"),
                Sexagesimal::ParseOrThrow("1")};
  t.columns = {{"equation", "deg", 2, "equation", std::nullopt},
               {"diff", "deg", 2, "", std::nullopt}};
  t.source_file = table_id + "-" + siglum + ".apo";
  t.source_text = "@table " + table_id + "\n";
  for (int i = 0; i < rows; ++i) {
    const int line = 10 + i;
    Row r;
    r.line = line;
    r.argument = ReadCell(std::to_string(i + 1), 0, line, 1);
    r.cells.push_back(
        ReadCell("0;" + std::to_string(2 * i % 60) + "," + std::to_string(5 * i % 60), 2, line, 6));
    r.cells.push_back(ReadCell("0;2," + std::to_string(i % 60), 2, line, 18));
    t.rows.push_back(r);
  }
  if (rows > 5) {
    auto& a = t.rows[2].cells[0];
    a.raw = "0;6,?";
    a.value.reset();
    a.state = CellState::kPartial;
    auto& b = t.rows[2].cells[1];
    b.raw = "?";
    b.value.reset();
    b.state = CellState::kIllegible;
    auto& c = t.rows[3].cells[0];
    c.raw = "_";
    c.value.reset();
    c.state = CellState::kBlank;
    auto& d = t.rows[4].cells[0];
    d.corrected_from = "0;10,52";
    d.doubtful = true;
    t.rows[4].cells[1].addition = Addition::kMargin;
    t.rows[5].cells[0].damaged = true;
    t.rows[5].cells[0].note = "ink faded";
    t.rows[5].cells[1].addition = Addition::kInterlinear;
  }
  return t;
}

/// A proposal for column "equation" of witness A of
/// MakeTranscription("solar", "A") at row `row` (0-based), as apograph errors
/// records it; a `group` above 0 makes it part of a displaced run.
inline store::EmendationRecord SolarProposal(const Transcription& t, int row,
                                             const std::string& proposed, int group = 0) {
  store::EmendationRecord r;
  r.table_id = "solar";
  r.siglum = "A";
  r.revision = 1;
  r.row = row;
  r.column = 0;
  r.column_name = "equation";
  r.arg = std::to_string(row + 1);
  r.tabulated = t.rows[static_cast<std::size_t>(row)].cells[0].raw;
  r.proposed = proposed;
  r.cls = group ? "displaced-run" : "confusion";
  r.evidence = "invented for the test";
  r.score = 0.5;
  r.model = "a model";
  r.group = group;
  return r;
}

}  // namespace apograph::testing
