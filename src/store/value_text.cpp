#include "store/value_text.hpp"

#include <cstdint>

namespace apograph::store {
namespace {

/// Writes the decimal digits of `v` backwards ending at `end`; returns the start.
char* WriteDecimalBackwards(std::uint64_t v, char* end) {
  do {
    *--end = static_cast<char>('0' + v % 10);
    v /= 10;
  } while (v != 0);
  return end;
}

template <typename U>
std::string_view FormatMagnitude(bool negative, U magnitude, int places,
                                 char (&buffer)[kValueTextSize]) {
  // Fractional places, least significant first, written from the end.
  char* end = buffer + kValueTextSize;
  char* p = end;
  for (int k = 0; k < places; ++k) {
    const auto digit = static_cast<std::uint64_t>(magnitude % 60);
    magnitude /= 60;
    p = WriteDecimalBackwards(digit, p);
    *--p = k == places - 1 ? ';' : ',';
  }
  p = WriteDecimalBackwards(static_cast<std::uint64_t>(magnitude), p);
  if (negative) *--p = '-';
  return std::string_view(p, static_cast<std::size_t>(end - p));
}

}  // namespace

std::string_view FormatValue(const Sexagesimal& value, char (&buffer)[kValueTextSize]) {
  const Sexagesimal::Units units = value.units();
  const bool negative = units < 0;
  const auto magnitude = static_cast<unsigned __int128>(negative ? -units : units);
  if (magnitude <= UINT64_MAX) {
    return FormatMagnitude(negative, static_cast<std::uint64_t>(magnitude), value.places(), buffer);
  }
  return FormatMagnitude(negative, magnitude, value.places(), buffer);
}

}  // namespace apograph::store
