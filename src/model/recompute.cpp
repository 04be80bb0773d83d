#include <cmath>
#include <limits>

#include "model/model.hpp"

namespace apograph::model {

std::vector<double> Model::Defaults() const {
  std::vector<double> out;
  for (const auto& p : params()) out.push_back(p.default_value);
  return out;
}

std::optional<double> RowArgument(const Transcription& table, std::size_t row) {
  if (auto expected = table.ExpectedArgument(row)) return expected->ToDouble();
  const Cell& a = table.rows[row].argument;
  if (a.value) return a.value->ToDouble();
  return std::nullopt;
}

ColumnRecomputation Recompute(const Model& model, const std::vector<double>& params,
                              const Transcription& table, int column, const Practice& practice) {
  const std::size_t n = table.rows.size();
  const int places = practice.places.value_or(table.columns.at(static_cast<std::size_t>(column)).places);
  ColumnRecomputation out;
  out.exact.assign(n, std::numeric_limits<double>::quiet_NaN());
  out.computed.assign(n, std::nullopt);
  for (std::size_t i = 0; i < n; ++i) {
    auto arg = RowArgument(table, i);
    if (!arg) continue;
    RowContext ctx{*arg, table.columns[static_cast<std::size_t>(column)].arg2
                             ? std::optional<double>(table.columns[static_cast<std::size_t>(column)].arg2->ToDouble())
                             : std::nullopt,
                   &table, i, column};
    double v = model.Evaluate(params, ctx);
    if (practice.grid > 0) {
      const double lo = std::floor(*arg / practice.grid) * practice.grid;
      const double hi = lo + practice.grid;
      if (std::fabs(*arg - lo) > 1e-9) {
        RowContext a = ctx, b = ctx;
        a.arg = lo;
        b.arg = hi;
        const double va = model.Evaluate(params, a), vb = model.Evaluate(params, b);
        v = va + (vb - va) * (*arg - lo) / practice.grid;
      }
    }
    v += practice.displacement;
    out.exact[i] = v;
    if (std::isfinite(v)) out.computed[i] = Sexagesimal::FromDouble(v, places, practice.rounding);
  }
  return out;
}

}  // namespace apograph::model
