#pragma once
/// Columns computed from another column of the same table: differences of
/// successive entries, sums of two columns, a fixed fraction (1/k) of the
/// difference of successive entries (the "sixtieths" of an interpolation
/// column) - and whether they were made from the tabulated (rounded)
/// entries or from more precise values.
///
/// Each relation is evaluated in exact sexagesimal arithmetic on the
/// tabulated source entries and compared with the target entry brought to
/// its places (nearest or truncated). The same relation is evaluated on
/// precise source values (given, e.g. from a fit of the
/// source's model, or else a local quadratic smoothing of the tabulated
/// source, which removes most of its rounding). A relation is reported when
/// either basis reproduces at least 80% of the rows it applies to; more
/// matches from the tabulated entries mean the author worked from the table
/// as written.

#include <string>
#include <vector>

#include "edition/transcription.hpp"

namespace apograph::estimate {

struct DerivedColumn {
  int column = 0;        ///< the derived column
  int source = 0;        ///< the column it is made from
  int other = -1;        ///< second column of a sum
  std::string relation;  ///< "difference to the next row", "1/30 of the difference to the next
                         ///< row", "sum", ...
  int divisor = 1;
  Rounding rounding = Rounding::kNearest;
  int rows = 0;               ///< rows the relation applies to
  int matched_tabulated = 0;  ///< reproduced from the tabulated source entries
  int matched_precise = 0;    ///< reproduced from precise source values
  std::string basis;          ///< "tabulated entries", "precise values", "cannot tell"
  std::vector<std::size_t> mismatched_rows;  ///< rows not reproduced from the tabulated entries
  std::string evidence;                      ///< one sentence with an example in exact arithmetic
};

/// Finds derived columns. `precise` (optional, per column, per row; NaN
/// where unknown) holds precise values of source columns.
std::vector<DerivedColumn> DetectDerivedColumns(
    const Transcription& table, const std::vector<std::vector<double>>* precise = nullptr);

}  // namespace apograph::estimate
