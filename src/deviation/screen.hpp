#pragma once
/// The model-free screen: suspect entries found from the table alone, so a
/// newly transcribed table can be checked before any model is known.
///
/// Each entry is compared with a robust local polynomial (a quadratic fitted
/// by iteratively reweighted least squares, Tukey's biweight, to the entries
/// within a few rows on either side, the entry itself left out). An entry is
/// suspect when it stands further off that curve than the column's own
/// scatter allows (a robust z-score above the threshold, and at least
/// `min_units` units). Second differences around the entry are quoted as
/// evidence: an isolated slip shows the pattern +r, -2r, +r. Blank and
/// illegible cells are always listed. When a numeral script is given, the
/// deviation explainer is run against the local curve so the editor sees the
/// likely slip and reading at once.

#include <optional>
#include <string>
#include <vector>

#include "deviation/explain.hpp"
#include "deviation/numeral_script.hpp"
#include "edition/transcription.hpp"

namespace apograph::deviation {

struct ScreenOptions {
  int half_window = 4;     ///< rows on each side used for the local curve
  double threshold = 4.0;  ///< robust z-score above which an entry is suspect
  double min_units = 1.5;  ///< never suspect below this many units
};

struct Suspect {
  int column = 0;
  std::string column_name;
  std::size_t row = 0;
  std::string arg;
  std::string tabulated;
  std::optional<Sexagesimal> expected;  ///< the local curve at the column's places
  double diff_units = 0;                ///< tabulated - curve, units of the last place
  double score = 0;                     ///< |r| / (|r| + threshold * scatter), in [0, 1)
  std::string evidence;
  std::vector<Explanation> explanations;  ///< from the explainer against the curve (may be empty)
};

/// Screens one column. `script` may be null (no explanations).
std::vector<Suspect> ScreenColumn(const Transcription& table, int column,
                                  const NumeralScript* script, const ScreenOptions& options = {});

}  // namespace apograph::deviation
