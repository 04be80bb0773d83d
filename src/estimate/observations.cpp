#include "estimate/observations.hpp"

#include <cmath>

#include "model/model.hpp"
#include "support/input_error.hpp"

namespace apograph::estimate {

std::vector<int> ResolveColumns(const Transcription& table, const std::vector<std::string>& names,
                                const std::string& option) {
  std::vector<int> out;
  if (names.empty()) {
    for (std::size_t c = 0; c < table.columns.size(); ++c) out.push_back(static_cast<int>(c));
    return out;
  }
  for (const auto& name : names) {
    const int c = table.ColumnIndex(name);
    if (c < 0) {
      std::string known;
      for (const auto& col : table.columns) known += (known.empty() ? "" : ", ") + col.name;
      throw InputError::ForOption(
          option, ExpectedFound("a column of table " + table.table_id + " (" + known + ")", name));
    }
    out.push_back(c);
  }
  return out;
}

std::vector<Observation> CollectObservations(const Transcription& table,
                                             const std::vector<int>& columns) {
  const std::vector<int> cols = columns.empty() ? ResolveColumns(table, {}) : columns;
  std::vector<Observation> out;
  out.reserve(cols.size() * table.rows.size());
  for (int c : cols) {
    const auto& spec = table.columns.at(static_cast<std::size_t>(c));
    for (std::size_t r = 0; r < table.rows.size(); ++r) {
      const auto& row = table.rows[r];
      if (static_cast<std::size_t>(c) >= row.cells.size()) continue;
      const Cell& cell = row.cells[static_cast<std::size_t>(c)];
      if (cell.state != CellState::kRead || !cell.value) continue;
      const auto arg = model::RowArgument(table, r);
      if (!arg) continue;
      Observation o;
      o.row = r;
      o.column = c;
      o.arg = *arg;
      o.places = std::max(spec.places, cell.value->places());
      o.value = cell.value->Extended(o.places);
      o.units = static_cast<double>(o.value.units());
      out.push_back(o);
    }
  }
  return out;
}

}  // namespace apograph::estimate
