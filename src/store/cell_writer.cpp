#include "store/cell_writer.hpp"

#include "store/cell_json.hpp"

namespace apograph::store {

CellWriter::CellWriter(Database& db)
    : insert_(db.Prepare(
          "INSERT INTO revision_cells(revision_id, rows, arguments) VALUES(?1, ?2, ?3)")) {}

std::int64_t CellWriter::Write(std::int64_t revision, const Transcription& t) {
  EncodeRevisionRows(rows_, t);
  EncodeRowArguments(arguments_, t);
  insert_.Bind(1, revision).BindStaticTerminated(2, rows_);  // JSON: a NUL is escaped
  insert_.BindStaticTerminated(3, arguments_);
  insert_.RunKeepBindings();
  std::int64_t cells = 0;
  for (const Row& r : t.rows) cells += static_cast<std::int64_t>(r.cells.size()) + 1;
  return cells;
}

}  // namespace apograph::store
