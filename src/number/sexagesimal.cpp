#include "number/sexagesimal.hpp"

#include <algorithm>
#include <cmath>

namespace apograph {
namespace {

using Units = Sexagesimal::Units;

Units Abs(Units v) { return v < 0 ? -v : v; }

/// Largest magnitude allowed at `places` places.
Units Bound(int places) { return Units(Sexagesimal::kIntegerLimit) * PowerOf60(places); }

void CheckPlaces(int places) {
  if (places < 0 || places > Sexagesimal::kMaxPlaces) {
    throw std::overflow_error("sexagesimal value: " + std::to_string(places) + " places (at most " +
                              std::to_string(Sexagesimal::kMaxPlaces) + " are supported)");
  }
}

void CheckRange(Units units, int places) {
  if (Abs(units) >= Bound(places)) {
    throw std::overflow_error("sexagesimal value: integer part beyond 10^12");
  }
}

/// Divides with the given rounding (ties away from zero).
Units DivideRounded(Units n, Units d, Rounding rounding) {
  Units q = n / d;
  Units r = n % d;
  if (rounding == Rounding::kNearest && 2 * Abs(r) >= d) q += (n < 0 ? -1 : 1);
  return q;
}

}  // namespace

Units PowerOf60(int places) {
  Units p = 1;
  for (int i = 0; i < places; ++i) p *= 60;
  return p;
}

Sexagesimal Sexagesimal::FromUnits(Units units, int places) {
  CheckPlaces(places);
  CheckRange(units, places);
  return Sexagesimal(units, places);
}

Sexagesimal Sexagesimal::FromParts(bool negative, std::int64_t integer,
                                   const std::vector<int>& fractions) {
  const int places = static_cast<int>(fractions.size());
  CheckPlaces(places);
  if (integer < 0 || integer >= kIntegerLimit) {
    throw std::overflow_error("sexagesimal value: integer part beyond 10^12");
  }
  Units units = integer;
  for (int f : fractions) {
    if (f < 0 || f > 59) throw std::invalid_argument("sexagesimal place outside 0..59");
    units = units * 60 + f;
  }
  return Sexagesimal(negative ? -units : units, places);
}

Sexagesimal Sexagesimal::FromDouble(double value, int places, Rounding rounding) {
  CheckPlaces(places);
  if (!std::isfinite(value) || std::fabs(value) >= static_cast<double>(kIntegerLimit)) {
    throw std::overflow_error("sexagesimal value: not finite or beyond 10^12");
  }
  // Scale in long double so that 5 or 6 places keep every digit of a double.
  long double scaled =
      static_cast<long double>(value) * static_cast<long double>(PowerOf60(places));
  long double r = rounding == Rounding::kTruncate ? truncl(scaled) : roundl(scaled);
  return FromUnits(static_cast<Units>(r), places);
}

std::int64_t Sexagesimal::IntegerPart() const {
  return static_cast<std::int64_t>(Abs(units_) / PowerOf60(places_));
}

std::vector<int> Sexagesimal::FractionDigits() const {
  std::vector<int> digits(static_cast<std::size_t>(places_));
  Units u = Abs(units_);
  for (int k = places_ - 1; k >= 0; --k) {
    digits[static_cast<std::size_t>(k)] = static_cast<int>(u % 60);
    u /= 60;
  }
  return digits;
}

std::vector<int> Sexagesimal::IntegerDigits() const {
  std::vector<int> digits;
  std::int64_t v = IntegerPart();
  do {
    digits.insert(digits.begin(), static_cast<int>(v % 60));
    v /= 60;
  } while (v > 0);
  return digits;
}

double Sexagesimal::ToDouble() const {
  const Units scale = PowerOf60(places_);
  const Units whole = units_ / scale;
  const Units rest = units_ % scale;
  return static_cast<double>(whole) +
         static_cast<double>(static_cast<long double>(rest) / static_cast<long double>(scale));
}

std::string Sexagesimal::ToString(const SexagesimalFormat& format) const {
  std::string out = negative() ? "-" : "";
  if (format.sexagesimal_integer) {
    auto digits = IntegerDigits();
    for (std::size_t i = 0; i < digits.size(); ++i) {
      if (i) out += ',';
      out += std::to_string(digits[i]);
    }
  } else {
    out += std::to_string(IntegerPart());
  }
  auto fractions = FractionDigits();
  for (std::size_t i = 0; i < fractions.size(); ++i) {
    out += i == 0 ? ';' : ',';
    if (format.pad && fractions[i] < 10) out += '0';
    out += std::to_string(fractions[i]);
  }
  return out;
}

std::string Sexagesimal::ToDegrees() const {
  if (places_ > 2) return ToString();
  std::string out = (negative() ? "-" : "") + std::to_string(IntegerPart()) + "\u00b0";
  auto fractions = FractionDigits();
  const char* marks[] = {"'", "\""};
  for (std::size_t i = 0; i < fractions.size(); ++i) out += std::to_string(fractions[i]) + marks[i];
  return out;
}

Sexagesimal Sexagesimal::Extended(int places) const {
  CheckPlaces(places);
  if (places >= places_) return FromUnits(units_ * PowerOf60(places - places_), places);
  const Units scale = PowerOf60(places_ - places);
  if (units_ % scale != 0) throw std::logic_error("Extended: would drop non-zero places");
  return Sexagesimal(units_ / scale, places);
}

Sexagesimal Sexagesimal::Rounded(int places, Rounding rounding) const {
  CheckPlaces(places);
  if (places >= places_) return Extended(places);
  return FromUnits(DivideRounded(units_, PowerOf60(places_ - places), rounding), places);
}

Sexagesimal Sexagesimal::Modulo(std::int64_t modulus) const {
  if (modulus <= 0) throw std::invalid_argument("Modulo: modulus must be positive");
  const Units m = Units(modulus) * PowerOf60(places_);
  Units r = units_ % m;
  if (r < 0) r += m;
  return Sexagesimal(r, places_);
}

Sexagesimal Sexagesimal::Divided(std::int64_t divisor, int places, Rounding rounding) const {
  if (divisor == 0) throw std::invalid_argument("Divided: division by zero");
  CheckPlaces(places);
  Units n = units_;
  Units d = divisor;
  if (places >= places_) {
    n *= PowerOf60(places - places_);
  } else {
    d *= PowerOf60(places_ - places);
  }
  if (d < 0) {
    n = -n;
    d = -d;
  }
  return FromUnits(DivideRounded(n, d, rounding), places);
}

Sexagesimal Sexagesimal::operator-() const { return Sexagesimal(-units_, places_); }

Sexagesimal operator+(const Sexagesimal& a, const Sexagesimal& b) {
  const int p = std::max(a.places_, b.places_);
  return Sexagesimal::FromUnits(
      a.units_ * PowerOf60(p - a.places_) + b.units_ * PowerOf60(p - b.places_), p);
}

Sexagesimal operator-(const Sexagesimal& a, const Sexagesimal& b) { return a + (-b); }

Sexagesimal operator*(const Sexagesimal& a, std::int64_t k) {
  Units out = 0;
  if (__builtin_mul_overflow(a.units_, Units(k), &out)) {
    throw std::overflow_error("sexagesimal value: product beyond 10^12");
  }
  return Sexagesimal::FromUnits(out, a.places_);
}

std::strong_ordering operator<=>(const Sexagesimal& a, const Sexagesimal& b) {
  const int p = std::max(a.places_, b.places_);
  const Units x = a.units_ * PowerOf60(p - a.places_);
  const Units y = b.units_ * PowerOf60(p - b.places_);
  return x < y ? std::strong_ordering::less
               : (x > y ? std::strong_ordering::greater : std::strong_ordering::equal);
}

double DiffUnits(const Sexagesimal& a, const Sexagesimal& b, int places) {
  const Sexagesimal d = a - b;
  if (d.places() <= places) {
    return static_cast<double>(d.units() * PowerOf60(places - d.places()));
  }
  return static_cast<double>(static_cast<long double>(d.units()) /
                             static_cast<long double>(PowerOf60(d.places() - places)));
}

double RoundUnits(double value, int places, Rounding rounding) {
  const double scaled = value * std::pow(60.0, places);
  return rounding == Rounding::kTruncate ? std::trunc(scaled) : std::round(scaled);
}

}  // namespace apograph
