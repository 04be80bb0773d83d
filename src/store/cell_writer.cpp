#include "store/cell_writer.hpp"

#include "store/cell_json.hpp"

namespace apograph::store {
namespace {

constexpr int kParams = 4;

std::string InsertSql(int rows) {
  std::string sql = "INSERT INTO cell_row(revision_id, row_index, line, cells) VALUES ";
  for (int r = 0; r < rows; ++r) sql += r ? ",(?,?,?,?)" : "(?,?,?,?)";
  return sql;
}

}  // namespace

CellWriter::CellWriter(Database& db)
    : batch_(db.Prepare(InsertSql(kBatch))), single_(db.Prepare(InsertSql(1))) {}

void CellWriter::Add(std::int64_t revision, const Transcription& t, std::size_t row) {
  const Row& r = t.rows[row];
  const auto slot = static_cast<std::size_t>(count_++);
  pending_[slot] = {revision, static_cast<std::int64_t>(row), r.argument.line};
  EncodeRowCells(cells_[slot], t, r);
  queued_cells_ += static_cast<std::int64_t>(r.cells.size()) + 1;
  if (count_ == kBatch) {
    for (int i = 0; i < kBatch; ++i) Bind(batch_, i, i);
    batch_.RunKeepBindings();
    written_ += queued_cells_;
    queued_cells_ = 0;
    count_ = 0;
  }
}

void CellWriter::Flush() {
  for (int i = 0; i < count_; ++i) {
    Bind(single_, 0, i);
    single_.RunKeepBindings();
  }
  written_ += queued_cells_;
  queued_cells_ = 0;
  count_ = 0;
}

/// Binds pending row `index` to the parameters of row `slot` of `s`.
void CellWriter::Bind(Statement& s, int slot, int index) {
  const auto i = static_cast<std::size_t>(index);
  const int b = slot * kParams;
  s.Bind(b + 1, pending_[i].revision).Bind(b + 2, pending_[i].row).Bind(b + 3, pending_[i].line);
  s.BindStaticTerminated(b + 4, cells_[i]);  // JSON: a NUL is escaped
}

}  // namespace apograph::store
