#pragma once
/// A witness's date as catalogues write it ("1461", "c. 1420", "15th century",
/// "late 15th century", "s. XV ex.", "1450-1475", "before 1500"), read as the
/// range of years it allows. Lineage uses it: a copy cannot be older than its
/// exemplar.

#include <optional>
#include <string_view>

namespace apograph {

/// The years a date allows, both ends included. Open ends are wide
/// ("before 1500" is 0..1499).
struct YearRange {
  int earliest = 0;
  int latest = 0;
  bool operator==(const YearRange&) const = default;
  /// Whether every year of this range lies before every year of `later`:
  /// then a witness of this date cannot be a copy of one of `later`'s.
  bool WhollyBefore(const YearRange& later) const { return latest < later.earliest; }
};

/// The range a catalogue date allows, or nullopt when the text is not
/// understood (then nothing is inferred from it). Accepted forms, case
/// insensitive: a year (`1461`); a year with `c.`, `ca.`, `circa` or `about`
/// (plus or minus 10 years, a judgement: catalogues use it for a decade or
/// two); `1450-1475` (also with an en dash or `to`); `before 1500`, `after
/// 1450`; `15th century` (1400-1499, the catalogues' usage), with `early`,
/// `first half`, `mid`, `middle of the`, `second half` or `late` (first or
/// last third, a half, 1430-1470 for mid); `s. XV` with `in.`, `med.`, `ex.`,
/// `1` or `2` (first, middle, last part; first or second half). Words in
/// parentheses are ignored (`1461 (dated)`).
std::optional<YearRange> ParseWitnessDate(std::string_view text);

}  // namespace apograph
