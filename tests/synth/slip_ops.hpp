#pragma once
// Internal to tests/synth: what one slip does to one value (slip_ops.cpp).
// Each returns nothing when the slip cannot be made on that value (or
// would not change it).

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "number/sexagesimal.hpp"
#include "numerals.hpp"
#include "random.hpp"

namespace apograph::synth::internal {

/// A value as its places: the integer part and the fractions (0..59).
struct Places {
  bool negative = false;
  std::int64_t integer = 0;
  std::vector<int> fractions;
  int Count() const { return 1 + static_cast<int>(fractions.size()); }
  std::int64_t Get(int k) const {
    return k == 0 ? integer : fractions[static_cast<std::size_t>(k - 1)];
  }
  void Set(int k, std::int64_t v);
};
Places ToPlaces(const Sexagesimal& value);
/// Nothing if a fraction is outside 0..59 or the integer part is negative.
std::optional<Sexagesimal> FromPlaces(const Places& places);

struct Changed {
  Sexagesimal value;
  int place = -1;
  std::string pair;  ///< symbol slips: "from/to"
  bool listed = false;
  std::string detail;
};

/// A symbol of one place written as its look-alike (or, `outside`, as any
/// symbol outside the hand's list).
std::optional<Changed> SymbolSlip(const Sexagesimal& v, const Hand& hand, bool outside, Rng& rng);
/// Two adjacent digits of a place, or two adjacent places, swapped.
std::optional<Changed> Transposed(const Sexagesimal& v, const Hand& hand, Rng& rng);
/// A place left out (0) or dropped with the following places moved up.
std::optional<Changed> PlaceDropped(const Sexagesimal& v, Rng& rng);
/// A place written twice, the following places pushed down (last lost).
std::optional<Changed> PlaceAdded(const Sexagesimal& v, Rng& rng);
/// The whole number moved one place down (minutes as seconds) or up.
std::optional<Changed> PlaceShifted(const Sexagesimal& v, Rng& rng);
/// The leading (first non-zero) place left out: systematic runs.
std::optional<Changed> LeadingPlaceLeftOut(const Sexagesimal& v);
/// The whole number moved one place down: systematic runs.
std::optional<Changed> ShiftedDown(const Sexagesimal& v);
/// v + amount, unless that changes its sign.
std::optional<Changed> Added(const Sexagesimal& v, const Sexagesimal& amount,
                             const std::string& detail);
/// The reading with place k unreadable: "0;?,10".
std::string PartlyIllegible(const Sexagesimal& v, int k);

}  // namespace apograph::synth::internal
