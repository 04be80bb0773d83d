#pragma once
/// Internal to the store: the hot loop of an import. Cells are inserted in
/// key order (revision, row, column) several rows per statement, with text
/// bound without copying, and the rare editor's marks go to their own table, so that a large import is limited by SQLite's
/// B-tree rather than by statement overhead.

#include <array>
#include <cstdint>

#include "edition/transcription.hpp"
#include "store/database.hpp"
#include "store/value_text.hpp"

namespace apograph::store {

class CellWriter {
 public:
  /// Cells per multi-row INSERT: fewer statement executions (each opens and
  /// closes cursors); 64 * 10 parameters stay far below SQLite's limit.
  static constexpr int kBatch = 64;

  explicit CellWriter(Database& db);

  /// Queues one cell; the referenced strings must live until Flush().
  void Add(std::int64_t revision, std::int64_t row, int col, const Cell& cell);
  /// Writes what is queued.
  void Flush();
  std::int64_t written() const { return written_; }

 private:
  void Bind(Statement& s, int slot, int pending_index);
  void WriteMarks();

  struct Pending {
    std::int64_t revision;
    std::int64_t row;
    int col;
    const Cell* cell;
  };
  Statement batch_;
  Statement single_;
  Statement mark_;
  std::array<Pending, kBatch> pending_{};
  int count_ = 0;
  std::array<char[kValueTextSize], kBatch> value_text_{};
  std::int64_t written_ = 0;
};

}  // namespace apograph::store
