#pragma once
/// Exact sexagesimal numbers: the one value type for every tabulated value.
///
/// A value is an integer count of units of its last place together with the
/// number of fractional places, so `2;23,10` is 8590 units of the second
/// fractional place (2*3600 + 23*60 + 10). Arithmetic on values is exact;
/// doubles appear only when a model computes something.
///
/// Limits: at most kMaxPlaces fractional places and an integer part of
/// magnitude below kIntegerLimit. Every operation that would leave these
/// limits throws std::overflow_error; nothing wraps silently.

#include <compare>
#include <cstdint>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace apograph {

/// How a value is brought to fewer places.
enum class Rounding {
  kNearest,   ///< to nearest; ties go away from zero (0;0,30 -> 0;1 at 1 place)
  kTruncate,  ///< drop the extra places (toward zero)
};

/// Where a number in text could not be read; column is 0-based in the text.
struct NumberSyntaxError {
  std::size_t column = 0;
  std::string expected;
  std::string found;
};

/// Options for writing a value back as text.
struct SexagesimalFormat {
  bool sexagesimal_integer = false;  ///< write 90 as `1,30` instead of `90`
  bool pad = false;                  ///< write every fractional place with 2 digits
};

class Sexagesimal {
 public:
  using Units = __int128;

  static constexpr int kMaxPlaces = 12;
  static constexpr std::int64_t kIntegerLimit = 1'000'000'000'000;  // 10^12

  /// Zero with no fractional places.
  constexpr Sexagesimal() = default;

  /// `units` units of fractional place `places` (0 = whole units).
  static Sexagesimal FromUnits(Units units, int places);
  /// From an integer part and fractional digits, each 0..59.
  /// Example: FromParts(false, 2, {23, 10}) is 2;23,10.
  static Sexagesimal FromParts(bool negative, std::int64_t integer,
                               const std::vector<int>& fractions);
  /// The nearest (or truncated) value at `places` places.
  static Sexagesimal FromDouble(double value, int places, Rounding rounding = Rounding::kNearest);

  /// Parses the trade's notation: `2;23,10`, `-0;5`, `1,30;0` (= 90),
  /// `12` and degree forms `2°23'10"` (also with the primes ′ ″).
  /// Surrounding blanks are not allowed; the caller trims.
  static std::optional<Sexagesimal> Parse(std::string_view text,
                                          NumberSyntaxError* error = nullptr);
  /// Parses places separated by blanks as they stand in a manuscript's
  /// sub-columns: with places = 2, `2 23 10` is 2;23,10. More leading parts
  /// than places + 1 are sexagesimal integer places (`1 30 0` at 1 place = 90).
  static std::optional<Sexagesimal> ParseColumns(std::string_view text, int places,
                                                 NumberSyntaxError* error = nullptr);
  /// Like Parse, but throws std::invalid_argument with the reason.
  static Sexagesimal ParseOrThrow(std::string_view text);

  int places() const { return places_; }
  Units units() const { return units_; }
  bool negative() const { return units_ < 0; }
  bool is_zero() const { return units_ == 0; }

  /// Magnitude of the integer part (90 for -1,30;15).
  std::int64_t IntegerPart() const;
  /// Magnitude of the fractional places, most significant first.
  std::vector<int> FractionDigits() const;
  /// The integer part written as sexagesimal digits, most significant first.
  std::vector<int> IntegerDigits() const;

  double ToDouble() const;
  /// Canonical trade notation: `2;23,10`, `-0;5`, `90` (no places).
  std::string ToString(const SexagesimalFormat& format = {}) const;
  /// Degree notation: `2°23'10"` (places beyond seconds as `;`-free thirds are
  /// written in trade notation instead).
  std::string ToDegrees() const;

  /// The same value written with more places (exact). Fewer places than now
  /// is a programming error unless the dropped places are zero.
  Sexagesimal Extended(int places) const;
  /// Rounded or truncated to `places` places.
  Sexagesimal Rounded(int places, Rounding rounding = Rounding::kNearest) const;
  /// Reduced into [0, modulus) (mean motions modulo 360).
  Sexagesimal Modulo(std::int64_t modulus) const;
  /// This value divided by `divisor`, brought to `places` places.
  Sexagesimal Divided(std::int64_t divisor, int places,
                      Rounding rounding = Rounding::kNearest) const;

  Sexagesimal operator-() const;
  friend Sexagesimal operator+(const Sexagesimal& a, const Sexagesimal& b);
  friend Sexagesimal operator-(const Sexagesimal& a, const Sexagesimal& b);
  friend Sexagesimal operator*(const Sexagesimal& a, std::int64_t k);
  friend Sexagesimal operator*(std::int64_t k, const Sexagesimal& a) { return a * k; }

  /// Numeric comparison: 2;30 == 2;30,0.
  friend std::strong_ordering operator<=>(const Sexagesimal& a, const Sexagesimal& b);
  friend bool operator==(const Sexagesimal& a, const Sexagesimal& b) {
    return (a <=> b) == std::strong_ordering::equal;
  }
  /// Same value and same number of places (same reading).
  bool Identical(const Sexagesimal& other) const {
    return places_ == other.places_ && units_ == other.units_;
  }

 private:
  constexpr Sexagesimal(Units units, int places) : units_(units), places_(places) {}
  Units units_ = 0;
  int places_ = 0;
};

/// 60^places as an exact integer; places in 0..2*kMaxPlaces.
Sexagesimal::Units PowerOf60(int places);

/// (a - b) in units of fractional place `places`; exact when both values have
/// at most `places` places. Example: DiffUnits(0;40, 0;39,28, 1) = 0.5333...
double DiffUnits(const Sexagesimal& a, const Sexagesimal& b, int places);

/// A double brought to `places` places with the given rounding, as a double
/// count of units (used inside recomputation loops).
double RoundUnits(double value, int places, Rounding rounding);

}  // namespace apograph
