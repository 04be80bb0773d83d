#pragma once
/// Internal to the store: the hot loop of an import. A revision's rows
/// become ONE row of `revision_cells` holding all its cells and the
/// arguments its rows stand for as compact JSON (cell_json.hpp), bound
/// without copying, so that an import writes one B-tree entry per table of
/// a witness rather than one per table row.

#include <cstdint>
#include <string>

#include "edition/transcription.hpp"
#include "store/database.hpp"

namespace apograph::store {

class CellWriter {
 public:
  explicit CellWriter(Database& db);

  /// Writes every row of `t` as the cells of revision `revision`, with the
  /// arguments they stand for; returns the number of cells written,
  /// argument cells included.
  std::int64_t Write(std::int64_t revision, const Transcription& t);

 private:
  Statement insert_;
  std::string rows_;       ///< the encoded rows, reused (no allocation once grown)
  std::string arguments_;  ///< the encoded row arguments, reused likewise
};

}  // namespace apograph::store
