// Rows where the model, not the copy, leaves the curve the column follows:
// the entry lies on the line through its neighbours that read the model,
// the model far off it (a derived model computed from a miscopied source
// entry or argument, a fitted reference off at one row).
#include <algorithm>
#include <cmath>
#include <cstdio>

#include "deviation/explain_internal.hpp"

namespace apograph::deviation::internal {
namespace {

// Judgement: the model must leave the neighbours' line four times as far as
// the entry does (and by more than a unit) before the model, not the copy, is
// the suspect; a copy's slip leaves the line itself, the model staying on it.
constexpr double kSpikeRatio = 4;
// Judgement: neighbours within two rows each side; farther, the line through
// them misses a curving column by more than a slip would.
constexpr std::size_t kAnchorReach = 2;
// Judgement: the author's largest usual departure (AuthorProfile::typical
// is at most 2), in units of the last place.
constexpr double kOnLine = 2;

/// The nearest row within kAnchorReach on one side (`step` -1 or +1) whose
/// reading departs from the model within the author's departure.
std::optional<std::size_t> Anchor(const Transcription& table, const ColumnValues& values,
                                  const ColumnContext& column, std::size_t row, int step) {
  for (std::size_t k = 1; k <= kAnchorReach; ++k) {
    const std::ptrdiff_t j =
        static_cast<std::ptrdiff_t>(row) + step * static_cast<std::ptrdiff_t>(k);
    if (j < 0 || j >= static_cast<std::ptrdiff_t>(column.departure.size()) ||
        j >= static_cast<std::ptrdiff_t>(values.computed.size()))
      return std::nullopt;
    const auto at = static_cast<std::size_t>(j);
    const Cell& cell = table.rows[at].cells[static_cast<std::size_t>(values.column)];
    if (cell.state != CellState::kRead || !cell.value || !std::isfinite(column.departure[at]))
      continue;
    if (!column.deviant[at]) return at;
  }
  return std::nullopt;
}

/// The model's second difference (units) at rows a-1, a, a+1 when all three
/// are computed; 0 otherwise.
double Curvature(const ColumnValues& values, std::size_t a, int places) {
  if (a == 0 || a + 1 >= values.computed.size()) return 0;
  const auto &m0 = values.computed[a - 1], &m1 = values.computed[a], &m2 = values.computed[a + 1];
  if (!m0 || !m1 || !m2) return 0;
  return std::fabs(DiffUnits(*m2, *m1, places) - DiffUnits(*m1, *m0, places));
}

}  // namespace

std::vector<std::optional<OffCurve>> ModelOffCurve(const Transcription& table,
                                                   const ColumnValues& values,
                                                   const ColumnContext& column, int places) {
  const std::size_t n = std::min(table.rows.size(), values.computed.size());
  std::vector<std::optional<OffCurve>> out(table.rows.size());
  for (std::size_t r = 0; r < n; ++r) {
    const Cell& cell = table.rows[r].cells[static_cast<std::size_t>(values.column)];
    if (!column.deviant[r] || cell.state != CellState::kRead || !cell.value ||
        !values.computed[r] || !std::isfinite(column.diffs.diff[r]))
      continue;
    const Sexagesimal x = AtPlaces(*cell.value, places);
    // Where the other witnesses agree on another reading, the copy's own
    // slip is the likelier story: left to the slips.
    if (r < column.consensus.size() && column.consensus[r] && !(*column.consensus[r] == x))
      continue;
    const auto lo = Anchor(table, values, column, r, -1);
    const auto hi = Anchor(table, values, column, r, +1);
    if (!lo || !hi) continue;
    const auto read = [&](std::size_t j) {
      return DiffUnits(
          AtPlaces(*table.rows[j].cells[static_cast<std::size_t>(values.column)].value, places), x,
          places);
    };
    const double span = static_cast<double>(*hi - *lo);
    const double line =  // the neighbours' line at r, relative to the entry
        (static_cast<double>(*hi - r) * read(*lo) + static_cast<double>(r - *lo) * read(*hi)) /
        span;
    const double model = -column.diffs.diff[r];  // model - entry
    const double reading_off = std::fabs(line), model_off = std::fabs(model - line);
    // A straight line misses a curving column between its anchors by about
    // the second difference times (r - lo)(hi - r) / 2; measured on the
    // model beyond the anchors, away from this row.
    const double bend = std::max(*lo >= 1 ? Curvature(values, *lo - 1, places) : 0.0,
                                 Curvature(values, *hi + 1, places)) *
                        static_cast<double>((r - *lo) * (*hi - r)) / 2;
    // The entry itself lies on the line, within the line's own error there
    // and the author's largest usual departure (two units; judgement): an
    // entry off the line is a slip whatever the model does (seeds 281-310 of
    // deviation_bench: a transposition 374 units off a line the model missed
    // by 2,340 was kept without this; DEVELOPERS.md, eighteenth round).
    if (reading_off > bend + kOnLine) continue;
    if (model_off < kSpikeRatio * std::max({reading_off, bend, 1.0})) continue;
    out[r] = OffCurve{*lo, *hi, reading_off, model_off};
  }
  return out;
}

Finding OffCurveFinding(const Transcription& table, const ColumnValues& values,
                        const ColumnContext& column, std::size_t row, int places) {
  const OffCurve& off = *column.off_curve[row];
  const double exact = row < values.exact.size() ? values.exact[row] : NAN;
  char buf[160];
  std::snprintf(buf, sizeof buf,
                "the line through rows %zu and %zu (which read the model) passes %g units from "
                "the entry and %g units from the model",
                off.lo + 1, off.hi + 1, std::round(off.reading_off * 100) / 100,
                std::round(off.model_off * 100) / 100);
  return KeptAgainstModel(
      table, values, row, places,
      SignedUnits(column.diffs.diff[row]) + " from the model (" +
          ModelText(*values.computed[row], exact, places) + "), but " + buf +
          ": the model leaves the column's curve here, not the copy (a model derived from a "
          "miscopied source entry or argument, or a reference off at this row); no emendation "
          "on the model's word alone; keep the reading (undecided)");
}

Finding ArgumentDoubtFinding(const Transcription& table, const ColumnValues& values,
                             const ColumnContext& column, std::size_t row, int places) {
  const double exact = row < values.exact.size() ? values.exact[row] : NAN;
  Finding f = KeptAgainstModel(
      table, values, row, places,
      SignedUnits(column.diffs.diff[row]) + " from the model (" +
          ModelText(*values.computed[row], exact, places) + "), but " + values.argument_doubt[row] +
          ": the model and the other witnesses are compared here at an argument the row may not "
          "stand for (a miscopied argument); no emendation on their word; keep the reading "
          "(undecided)");
  f.argument_doubted = true;
  return f;
}

}  // namespace apograph::deviation::internal
