#include "model/check.hpp"

#include <cmath>
#include <stdexcept>

#include "support/input_error.hpp"

namespace apograph::model {
namespace {

/// Why a cell cannot be compared, or empty.
std::string SkipReason(const Cell& cell) {
  switch (cell.state) {
    case CellState::kRead:
      return cell.value ? "" : "illegible";
    case CellState::kBlank:
      return "blank";
    case CellState::kIllegible:
      return "illegible";
    case CellState::kPartial:
      return "partial";
  }
  return "";
}

void Count(CheckSummary& s, const CheckEntry& e) {
  ++s.entries;
  if (e.skipped == "blank")
    ++s.blank;
  else if (e.skipped == "illegible" || e.skipped == "partial")
    ++s.illegible;
  else if (!e.skipped.empty())
    ++s.undefined;
  if (!e.diff_units) return;
  ++s.compared;
  const double d = std::fabs(*e.diff_units);
  if (d == 0)
    ++s.exact;
  else if (d <= 1)
    ++s.within_one;
  if (e.flag) ++s.flagged;
  if (d > s.worst || (!s.worst_row && d == s.worst)) {
    s.worst = d;
    s.worst_row = e.row;
  }
}

}  // namespace

CheckReport Check(const Transcription& table, const Model& model, const std::vector<double>& params,
                  const Practice& practice, double tolerance, int column) {
  if (column < 0 || static_cast<std::size_t>(column) >= table.columns.size()) {
    throw std::invalid_argument("check: no column " + std::to_string(column));
  }
  if (params.size() != model.params().size()) {
    throw std::invalid_argument("check: model " + model.name() + " takes " +
                                std::to_string(model.params().size()) + " parameters");
  }
  const auto& spec = table.columns[static_cast<std::size_t>(column)];
  CheckReport r{table.table_id,
                table.witness.siglum,
                model.name(),
                {},
                practice,
                practice.places.value_or(spec.places),
                tolerance,
                {},
                {}};
  for (std::size_t k = 0; k < params.size(); ++k)
    r.params.emplace_back(model.params()[k].name, params[k]);
  const ColumnRecomputation rc = Recompute(model, params, table, column, practice);
  for (std::size_t i = 0; i < table.rows.size(); ++i) {
    const Row& row = table.rows[i];
    const Cell* cell = static_cast<std::size_t>(column) < row.cells.size()
                           ? &row.cells[static_cast<std::size_t>(column)]
                           : nullptr;
    CheckEntry e;
    e.row = i;
    e.arg = row.argument.raw;
    e.arg_value = RowArgument(table, i);
    e.column = spec.name;
    e.exact = rc.exact[i];
    e.computed = rc.computed[i];
    if (cell) {
      e.tabulated_raw = cell->raw;
      e.tabulated = cell->value;
      e.state = cell->state;
      e.skipped = SkipReason(*cell);
    } else {
      e.skipped = "blank";
      e.state = CellState::kBlank;
    }
    if (e.skipped.empty() && !e.arg_value) e.skipped = "no argument";
    if (e.skipped.empty() && !e.computed) e.skipped = "model undefined";
    if (e.skipped.empty()) {
      e.diff_units = DiffUnits(*e.tabulated, *e.computed, r.places);
      e.exact_diff_units = (e.tabulated->ToDouble() - e.exact) * std::pow(60.0, r.places);
      e.flag = std::fabs(*e.diff_units) > tolerance;
    }
    Count(r.summary, e);
    r.entries.push_back(std::move(e));
  }
  return r;
}

std::vector<double> ParamsWithOverrides(
    const Model& model, const std::vector<std::pair<std::string, double>>& overrides) {
  std::vector<double> p = model.Defaults();
  for (const auto& [name, value] : overrides) {
    const int k = model.ParamIndex(name);
    if (k < 0) {
      std::string known;
      for (const auto& spec : model.params()) known += (known.empty() ? "" : ", ") + spec.name;
      throw InputError::ForOption("--param",
                                  ExpectedFound("a parameter of " + model.name() + " (" +
                                                    (known.empty() ? "none" : known) + ")",
                                                "'" + name + "'"));
    }
    p[static_cast<std::size_t>(k)] = value;
  }
  return p;
}

}  // namespace apograph::model
