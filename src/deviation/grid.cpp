// The grid an author writes a column's last place in (thirds in tens, in
// fives, in twos), and departures counted in its steps.
#include <algorithm>
#include <optional>
#include <vector>

#include "deviation/explain_internal.hpp"

namespace apograph::deviation::internal {
namespace {

// A grid shows when this share of a column's readings (and this many at
// least) lie on it. Judgement: a copy's slips touch a few percent of the
// entries and the author may write a few rows off his grid; by chance half
// the readings are even and a tenth are multiples of 10, so 12 readings of
// which 90% lie on a grid of 2 occur by chance about once in 300 columns.
constexpr double kGridShare = 0.9;
constexpr int kGridMinRows = 12;
// The grids tried, coarsest first: the divisors of 60, as an author writes a
// sexagesimal place in steps that divide it (thirds in tens, in fives, in
// twos; 60 when he writes the last place as 0 throughout, a place he did
// not compute). Judgement.
constexpr int kGrids[] = {60, 30, 20, 15, 12, 10, 6, 5, 4, 3, 2};

/// The reading the author most likely wrote at each row: the others'
/// consensus where there is one, else this copy's (at the column's places).
std::optional<Sexagesimal> AuthorsReading(const Transcription& table, const ColumnValues& values,
                                          std::size_t r, int places) {
  if (r < values.tradition.size() && values.tradition[r].witnesses > 0 &&
      values.tradition[r].consensus)
    return AtPlaces(*values.tradition[r].consensus, places);
  const Cell& cell = table.rows[r].cells[static_cast<std::size_t>(values.column)];
  if (cell.state != CellState::kRead || !cell.value) return std::nullopt;
  return AtPlaces(*cell.value, places);
}

}  // namespace

/// The step the author writes the last place in: the coarsest grid that
/// kGridShare of the column's readings lie on; 1 when none does.
int MeasureGrid(const Transcription& table, const ColumnValues& values, int places) {
  std::vector<Sexagesimal::Units> units;
  for (std::size_t r = 0; r < table.rows.size(); ++r) {
    if (auto v = AuthorsReading(table, values, r, places)) units.push_back(v->units());
  }
  if (static_cast<int>(units.size()) < kGridMinRows) return 1;
  for (int g : kGrids) {
    const auto on = std::count_if(units.begin(), units.end(), [&](auto u) { return u % g == 0; });
    if (static_cast<double>(on) >= kGridShare * static_cast<double>(units.size())) return g;
  }
  return 1;
}

std::optional<double> GridSteps(const Sexagesimal& reading, const Sexagesimal& computed, int places,
                                int grid) {
  if (grid <= 1) return std::nullopt;
  const Sexagesimal r = AtPlaces(reading, places);
  if (r.units() % grid != 0) return std::nullopt;
  return DiffUnits(r, computed, places) / grid;
}

double AuthorDiff(const Sexagesimal& reading, const Sexagesimal& computed, int places, int grid) {
  const auto steps = GridSteps(reading, computed, places, grid);
  return steps ? *steps : CoarseDiff(reading, computed, places);
}

double DepartureDiff(const Sexagesimal& reading, const Sexagesimal& computed, int places,
                     int grid) {
  const auto steps = GridSteps(reading, computed, places, grid);
  return steps ? *steps : DiffUnits(reading, computed, places);
}

}  // namespace apograph::deviation::internal
