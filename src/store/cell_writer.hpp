#pragma once
/// Internal to the store: the hot loop of an import. Each table row becomes
/// one row of `cell_row` holding its cells as compact JSON (cell_json.hpp),
/// inserted in key order several rows per statement with the text bound
/// without copying, so that a large import writes a few hundred thousand
/// B-tree entries rather than a million.

#include <array>
#include <cstdint>
#include <string>

#include "edition/transcription.hpp"
#include "store/database.hpp"

namespace apograph::store {

class CellWriter {
 public:
  /// Table rows per multi-row INSERT: fewer statement executions (each
  /// opens and closes cursors); 32 * 4 parameters stay far below SQLite's limit.
  static constexpr int kBatch = 32;

  explicit CellWriter(Database& db);

  /// Queues row `row` of `t` for revision `revision`.
  void Add(std::int64_t revision, const Transcription& t, std::size_t row);
  /// Writes what is queued.
  void Flush();
  /// Cells written so far, argument cells included.
  std::int64_t written() const { return written_; }

 private:
  void Bind(Statement& s, int slot, int pending_index);

  struct Pending {
    std::int64_t revision;
    std::int64_t row;
    int line;
  };
  Statement batch_;
  Statement single_;
  std::array<Pending, kBatch> pending_{};
  std::array<std::string, kBatch> cells_;  ///< encoded cells, reused (no allocation once grown)
  int count_ = 0;
  std::int64_t queued_cells_ = 0;
  std::int64_t written_ = 0;
};

}  // namespace apograph::store
