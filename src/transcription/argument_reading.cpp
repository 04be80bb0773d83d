// Argument cells as sheets and modern editions write them: the trade's
// notation with fewer places than the argument's (`1` beside `1;30`), or a
// decimal (`0.5`, `88.5`). Every decimal fraction is an exact sexagesimal
// one (10 divides 60, so k decimal digits need at most k places); the value
// is normalised, the written form stays in Cell::raw as evidence.
#include "transcription/syntax.hpp"

namespace apograph::transcription {
namespace {

bool IsDigit(char c) { return c >= '0' && c <= '9'; }

[[noreturn]] void Fail(std::size_t offset, std::string message) {
  throw LineError{offset, std::move(message)};
}

/// `[sign] digits "." digits`, exactly. Returns nullopt when `text` holds
/// no '.' (then it is not a decimal at all).
std::optional<ReadingInfo> ParseDecimal(std::string_view text, std::size_t base) {
  const std::size_t dot = text.find('.');
  if (dot == std::string_view::npos) return std::nullopt;
  std::size_t i = 0;
  const bool negative = !text.empty() && text[0] == '-';
  if (!text.empty() && (text[0] == '-' || text[0] == '+')) ++i;
  constexpr int kMaxDigits = 12;  // integer part below 10^12; 12 decimals need <= 12 places
  const std::size_t int_start = i;
  while (i < dot && IsDigit(text[i])) ++i;
  if (i == int_start || i != dot) {
    Fail(base + i, "expected a decimal argument such as 88.5, found " + FoundChar(text, i));
  }
  const std::size_t frac_start = dot + 1;
  i = frac_start;
  while (i < text.size() && IsDigit(text[i])) ++i;
  if (i == frac_start || i != text.size()) {
    Fail(base + i, "expected a digit of a decimal argument such as 88.5, found " +
                       (i < text.size() ? FoundChar(text, i) : std::string("end of cell")));
  }
  const std::size_t int_digits = dot - int_start, frac_digits = text.size() - frac_start;
  if (int_digits > kMaxDigits || frac_digits > kMaxDigits) {
    Fail(base + int_start, "expected at most 12 digits before and after the decimal point, found " +
                               QuotedText(text));
  }
  Sexagesimal::Units whole = 0, fraction = 0, ten_k = 1;
  for (std::size_t k = int_start; k < dot; ++k) whole = whole * 10 + (text[k] - '0');
  for (std::size_t k = frac_start; k < text.size(); ++k) {
    fraction = fraction * 10 + (text[k] - '0');
    ten_k *= 10;
  }
  if (whole >= Sexagesimal::kIntegerLimit) {
    Fail(base + int_start, "expected an integer part below 10^12, found " + QuotedText(text));
  }
  ReadingInfo info;
  // The fewest places at which fraction / 10^k is a whole number of units.
  int places = 0;
  Sexagesimal::Units scale = 1;
  while ((fraction * scale) % ten_k != 0) {
    ++places;
    scale *= 60;
  }
  const Sexagesimal::Units units = whole * scale + fraction * scale / ten_k;
  info.value = Sexagesimal::FromUnits(negative ? -units : units, places);
  info.fraction_places = places;
  return info;
}

}  // namespace

ReadingInfo ParseArgumentReading(std::string_view text, int places, std::size_t base) {
  std::optional<ReadingInfo> decimal = ParseDecimal(text, base);
  ReadingInfo info = decimal ? *decimal : ParseReading(text, places, base);
  const bool has_places = info.state == CellState::kRead || info.state == CellState::kPartial;
  if (has_places && places >= 0 && info.fraction_places < places) {
    if (info.value) info.value = info.value->Extended(places);
    info.fraction_places = places;
  }
  return info;
}

}  // namespace apograph::transcription
