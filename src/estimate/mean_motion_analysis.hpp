#pragma once
/// How a mean-motion table was built, told from its entries.
///
/// Entries are given modulo 360; they are unwrapped by argument (whole turns
/// restored) and each entry bounds the rate: a rounded entry v at argument a
/// allows rates in [(v + 360k - radix - u/2)/a, (v + 360k - radix + u/2)/a],
/// u the unit of the last place (truncation: [v, v + u)). The largest set of
/// entries whose bounds share a rate are the entries computed directly from
/// one rate; the shared interval is the rate to full precision. Every other
/// entry is tested, in exact sexagesimal arithmetic, as a multiple (a = m b)
/// or a sum (a = b + c) of other tabulated (rounded) entries; what is left is
/// reported as unexplained. The coarsest rounded rate that reproduces the
/// direct entries, and successive addition of a rounded unit value, are
/// tested too.
///
/// Example (published table of the sun's mean motion): the 1000-day entry
/// 265;38,50 is 10 x 98;33,53 = 985;38,50 less 2 x 360, i.e. ten times the
/// rounded 100-day entry, not a direct product of the rate.

#include <optional>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::estimate {

/// How one entry came about.
enum class EntryOrigin {
  kDirect,       ///< rate x argument (+ radix), brought to the places
  kMultiple,     ///< m x another tabulated entry, reduced mod 360
  kSum,          ///< sum of two tabulated entries, reduced mod 360
  kUnexplained,  ///< none of these
};
const char* ToString(EntryOrigin origin);

struct MeanMotionEntry {
  std::size_t row = 0;
  double arg = 0;
  Sexagesimal value;
  int turns = 0;  ///< whole turns removed from the unwrapped motion
  EntryOrigin origin = EntryOrigin::kUnexplained;
  std::optional<Sexagesimal> direct;  ///< what the rate gives here (mid rate)
  double direct_diff_units = 0;       ///< tabulated - direct, units
  std::vector<std::size_t> from;      ///< rows it was made from (multiple/sum)
  std::string evidence;               ///< in words, with the exact arithmetic
};

struct MeanMotionAnalysis {
  int column = 0;
  int places = 0;
  Rounding rounding = Rounding::kNearest;  ///< of the direct entries
  Sexagesimal radix;                       ///< 0 when the table has none
  bool radix_present = false;
  double rate_low = 0, rate_high = 0;  ///< rates that reproduce every direct entry
  double rate = 0;                     ///< least squares over the direct entries
  double rate_stderr = 0;
  Sexagesimal rate_sexagesimal;  ///< mid-interval, to the places the entries allow
  /// Coarsest rounded rate reproducing every direct entry (exact check).
  std::optional<Sexagesimal> rounded_rate;
  /// Arguments in a regular step and (at least three quarters of) the
  /// entries the first plus k times the same unit value.
  bool successive_addition = false;
  std::optional<Sexagesimal> unit_value;
  /// Arguments of the entries off the successive-addition pattern (slips,
  /// or the author's), when the pattern holds for most entries.
  std::vector<std::string> successive_exceptions;
  double error_first = 0, error_last = 0;  ///< successive addition: error vs rate, units
  std::vector<MeanMotionEntry> entries;    ///< in table order
  std::string verdict;                     ///< one paragraph an editor can read
  int unexplained = 0;
};

/// Analyses column `column` of `table` (arguments must be whole numbers for
/// the multiple/sum tests). Throws InputError when fewer than two entries are
/// readable.
MeanMotionAnalysis AnalyseMeanMotion(const Transcription& table, int column);

/// True when a column looks like a mean motion: entries within [0, 360) and,
/// after unwrapping by argument, close to a straight line.
bool LooksLikeMeanMotion(const Transcription& table, int column);

}  // namespace apograph::estimate
