#pragma once
/// Checking a witness's column against a model: every entry recomputed under
/// a computing practice and compared in units of its last place. This is what
/// `apograph check` prints and stores; other stages may call it too.

#include <cstddef>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "edition/transcription.hpp"
#include "model/model.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::model {

/// One entry of the checked column.
struct CheckEntry {
  std::size_t row = 0;
  std::string arg;                  ///< the argument as written (raw)
  std::optional<double> arg_value;  ///< the argument the model used
  std::string column;
  std::string tabulated_raw;             ///< the reading as typed
  std::optional<Sexagesimal> tabulated;  ///< present when the cell was read in full
  CellState state = CellState::kRead;
  double exact = 0;  ///< model value under the practice, before rounding (NaN: none)
  std::optional<Sexagesimal> computed;     ///< after the practice
  std::optional<double> diff_units;        ///< tabulated - computed, in units of the last place
  std::optional<double> exact_diff_units;  ///< tabulated - exact, in units of the last place
  bool flag = false;                       ///< |diff_units| > tolerance
  /// Why the entry was not compared ("blank", "illegible", "partial",
  /// "no argument", "model undefined"); empty when it was.
  std::string skipped;
};

/// Counts over the checked entries.
struct CheckSummary {
  int entries = 0;     ///< rows in the column
  int compared = 0;    ///< entries with a reading and a model value
  int exact = 0;       ///< diff 0
  int within_one = 0;  ///< 0 < |diff| <= 1
  int flagged = 0;     ///< |diff| > tolerance
  int blank = 0;
  int illegible = 0;  ///< illegible or only partly read
  int undefined = 0;  ///< no argument or the model has no value there
  double worst = 0;   ///< largest |diff| in units
  std::optional<std::size_t> worst_row;
};

/// The whole result, as printed, stored and returned as JSON.
struct CheckReport {
  std::string table;
  std::string witness;
  std::string model;
  std::vector<std::pair<std::string, double>> params;  ///< name -> value, in model order
  Practice practice;
  int places = 0;  ///< places compared (the practice's or the column's)
  double tolerance = 1;
  std::vector<CheckEntry> entries;
  CheckSummary summary;
};

/// Recomputes column `column` of `table` with `model` at `params` under
/// `practice`, and compares every entry. An entry is flagged when
/// |tabulated - computed| > `tolerance` units of the last place (the default
/// 1 flags differences of 2 units and more; 0 flags every difference).
/// Throws std::invalid_argument when the column does not exist or the
/// parameter count is wrong.
CheckReport Check(const Transcription& table, const Model& model, const std::vector<double>& params,
                  const Practice& practice, double tolerance, int column);

/// The model's parameters with `overrides` (name, value) applied over the
/// defaults. Throws InputError (option --param) for an unknown name.
std::vector<double> ParamsWithOverrides(
    const Model& model, const std::vector<std::pair<std::string, double>>& overrides);

}  // namespace apograph::model
