#pragma once
/// A witness's table as a CSV sheet in the styles of real sheets made by
/// different hands: `;` as the delimiter, half-degree arguments as decimals
/// (`0.5`, `88.5`), whole arguments without places mixed with `1;30`,
/// inconsistent places in the argument column (`1`, `1;0`, `2;0,0`),
/// degrees, minutes and seconds in separate columns, leading zeros left out
/// or places padded. The key holds what every row means in the trade's
/// notation (the import features that read these sheets are separate work).

#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "edition/transcription.hpp"
#include "random.hpp"

namespace apograph::synth {

struct SheetStyle {
  char delimiter = ',';  ///< ',' or ';'
  /// "trade" (1;30), "decimal" (1.5; whole arguments as 1), "mixed" (1
  /// beside 1;30), "inconsistent-places" (1, 1;0, 1;0,0 in one column).
  std::string arguments = "trade";
  bool dms = false;  ///< each place of a value in its own column (name_deg, name_min, ...)
  /// "plain" (0;4,10), "padded" (0;04,10), "dropped" (;4,10; in separate
  /// columns an empty degree field for 0).
  std::string zeros = "plain";
};

/// A style drawn for a table (decimal arguments only where every argument
/// is a finite decimal; separate place columns only where every column has
/// places). Proportions are a judgement of how often each habit occurs.
SheetStyle DrawSheetStyle(const Transcription& table, Rng& rng);

struct Sheet {
  std::string text;    ///< the CSV
  nlohmann::json key;  ///< style, header, sheet columns per column, rows in trade notation
};

/// The sheet of one table. `rng` decides the per-row choices of the mixed
/// and inconsistent styles.
Sheet WriteSheet(const Transcription& table, const SheetStyle& style, Rng& rng);

}  // namespace apograph::synth
