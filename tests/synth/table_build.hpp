#pragma once
// Internal to tests/synth: computing a drawn table's columns once their
// functions, forms and practices are chosen (practice.cpp, mean_motion.cpp,
// derived.cpp) and choosing them (columns.cpp).

#include <cstdint>

#include "random.hpp"
#include "tables.hpp"

namespace apograph::synth::internal {

/// Whether the function can change sign (so that a sign form applies):
/// the sign-changing families and the equation column of a true-sun table.
bool SignMatters(const Function& function);

/// x brought to units of fractional place `places`: to nearest (ties away
/// from zero) or truncated toward zero.
std::int64_t ToUnits(long double x, int places, Rounding rounding);
/// 60^places as an integer (places 0..8).
std::int64_t Scale(int places);
/// A value from units.
Sexagesimal FromUnits(std::int64_t units, int places);
/// units reduced into [0, 360) at `places`.
std::int64_t Reduce360(std::int64_t units, int places);

/// The function's value after the column's sign form (magnitude, sign flip,
/// displacement); no grid, no rounding.
double Formed(const ColumnKey& column, double arg);
/// The value the author's practice gives at `arg` (grid, rounding, modulo),
/// before departures.
Sexagesimal Practised(const ColumnKey& column, double arg);
/// The function's own sign value recovered from a written entry of the
/// column (undoes the magnitude, flip and displacement).
double SignedFromTabulated(const ColumnKey& column, std::size_t row, double arg);

/// Fills exact, computed and tabulated (= computed) of a model column, and
/// its rubric.
void ComputeModelColumn(ColumnKey& column, const ArgumentKey& argument);
/// Same for a mean-motion column by its construction (column.mean_motion).
void ComputeMeanMotion(ColumnKey& column, const ArgumentKey& argument);
/// Same for a derived column from the table's earlier columns.
void ComputeDerived(ColumnKey& column, const TableKey& table);
/// Adds the author's departures to `tabulated` (and records them).
void AddDepartures(ColumnKey& column, Rng& rng, const TableOptions& options);

/// Chooses the table's columns (functions, forms, practice, derived
/// definitions) for the drawn function and argument.
void DrawColumns(TableKey& table, const Function& function, Rng& rng, const TableOptions& options);

}  // namespace apograph::synth::internal
