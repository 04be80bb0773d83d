#include "store/cell_writer.hpp"

#include <string>

namespace apograph::store {
namespace {

constexpr int kParams = 10;

std::string InsertSql(int rows) {
  std::string sql =
      "INSERT INTO cell(revision_id, row_index, col, raw, value, value_real, places, state, "
      "source_line, source_col) VALUES ";
  for (int r = 0; r < rows; ++r) {
    sql += r ? ",(" : "(";
    for (int k = 0; k < kParams; ++k) sql += k ? ",?" : "?";
    sql += ")";
  }
  return sql;
}

bool HasMarks(const Cell& c) {
  return c.damaged || c.doubtful || c.addition != Addition::kNone || c.corrected_from ||
         !c.note.empty();
}

}  // namespace

CellWriter::CellWriter(Database& db)
    : batch_(db.Prepare(InsertSql(kBatch))),
      single_(db.Prepare(InsertSql(1))),
      mark_(db.Prepare(
          "INSERT INTO cell_mark(revision_id, row_index, col, damaged, doubtful, addition, "
          "corrected_from, note) VALUES(?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8)")) {}

void CellWriter::Add(std::int64_t revision, std::int64_t row, int col, const Cell& cell) {
  pending_[static_cast<std::size_t>(count_++)] = {revision, row, col, &cell};
  if (count_ == kBatch) {
    for (int i = 0; i < kBatch; ++i) Bind(batch_, i, i);
    batch_.RunKeepBindings();
    WriteMarks();
  }
}

void CellWriter::Flush() {
  for (int i = 0; i < count_; ++i) {
    Bind(single_, 0, i);
    single_.RunKeepBindings();
  }
  WriteMarks();
}

/// Binds pending cell `index` to the parameters of row `slot` of `s`.
void CellWriter::Bind(Statement& s, int slot, int index) {
  const Pending& p = pending_[static_cast<std::size_t>(index)];
  const Cell& c = *p.cell;
  const int b = slot * kParams;
  s.Bind(b + 1, p.revision).Bind(b + 2, p.row).Bind(b + 3, p.col).BindStatic(b + 4, c.raw);
  if (c.value) {
    s.BindStatic(b + 5, FormatValue(*c.value, value_text_[static_cast<std::size_t>(index)]));
    s.Bind(b + 6, c.value->ToDouble());
  } else {
    s.BindNull(b + 5).BindNull(b + 6);
  }
  s.Bind(b + 7, c.places).BindStatic(b + 8, ToString(c.state));
  s.Bind(b + 9, c.line).Bind(b + 10, c.column);
}

/// The marks of the cells just written (after them: cell_mark refers to cell).
void CellWriter::WriteMarks() {
  for (int i = 0; i < count_; ++i) {
    const Pending& p = pending_[static_cast<std::size_t>(i)];
    const Cell& c = *p.cell;
    if (!HasMarks(c)) continue;
    mark_.Bind(1, p.revision).Bind(2, p.row).Bind(3, p.col);
    mark_.Bind(4, c.damaged ? 1 : 0).Bind(5, c.doubtful ? 1 : 0).BindStatic(6, ToString(c.addition));
    if (c.corrected_from) mark_.BindStatic(7, *c.corrected_from); else mark_.BindNull(7);
    mark_.BindStatic(8, c.note).RunKeepBindings();
  }
  written_ += count_;
  count_ = 0;
}

}  // namespace apograph::store
