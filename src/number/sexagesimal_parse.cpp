// Reading one number in the trade's notation (2;23,10, 0;4,10 with a
// sign, degree/minute/second marks): a small hand-written reader, so that
// the number stage needs no parser library (Sexagesimal::Parse).
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "number/sexagesimal.hpp"

namespace apograph {
namespace {

using Units = Sexagesimal::Units;

/// The fractional places read so far, accumulated as they come: no
/// allocation per number (the store decodes a million cells with Parse).
struct Fractions {
  Units units = 0;  ///< the first kMaxPlaces places as units of the last of them
  int count = 0;    ///< every place read, also beyond kMaxPlaces (an error later)
  void Add(int place) {
    if (count++ < Sexagesimal::kMaxPlaces) units = units * 60 + place;
  }
};

/// A small hand-written reader for one number in the trade's notation.
class NumberReader {
 public:
  explicit NumberReader(std::string_view text) : text_(text) {}

  std::optional<Sexagesimal> Read(NumberSyntaxError* error);

 private:
  bool AtEnd() const { return pos_ >= text_.size(); }
  bool Peek(std::string_view s) const { return text_.substr(pos_, s.size()) == s; }
  bool Accept(std::string_view s) {
    if (!Peek(s)) return false;
    pos_ += s.size();
    return true;
  }
  std::optional<std::int64_t> Digits(int max_digits);
  bool Fail(NumberSyntaxError* error, std::string expected);
  bool ReadTradeFractions(Fractions& fractions, NumberSyntaxError* error);
  bool ReadDegreeForm(Fractions& fractions, NumberSyntaxError* error);
  bool AcceptMinuteMark() { return Accept("'") || Accept("\u2032"); }
  bool AcceptSecondMark() { return Accept("\"") || Accept("\u2033") || Accept("''"); }

  std::string_view text_;
  std::size_t pos_ = 0;
};

std::optional<std::int64_t> NumberReader::Digits(int max_digits) {
  std::int64_t v = 0;
  int n = 0;
  while (!AtEnd() && text_[pos_] >= '0' && text_[pos_] <= '9' && n < max_digits) {
    v = v * 10 + (text_[pos_] - '0');
    ++pos_;
    ++n;
  }
  if (n == 0) return std::nullopt;
  return v;
}

bool NumberReader::Fail(NumberSyntaxError* error, std::string expected) {
  if (error) {
    error->column = pos_;
    error->expected = std::move(expected);
    if (AtEnd()) {
      error->found = "end of number";
    } else {
      // Quote one UTF-8 character.
      std::size_t len = 1;
      auto c = static_cast<unsigned char>(text_[pos_]);
      if (c >= 0xF0)
        len = 4;
      else if (c >= 0xE0)
        len = 3;
      else if (c >= 0xC0)
        len = 2;
      error->found = "'" + std::string(text_.substr(pos_, len)) + "'";
    }
  }
  return false;
}

bool NumberReader::ReadTradeFractions(Fractions& fractions, NumberSyntaxError* error) {
  do {
    std::size_t start = pos_;
    auto d = Digits(3);
    if (!d) return Fail(error, "a digit");
    if (*d > 59) {
      pos_ = start;
      return Fail(error, "a place from 0 to 59");
    }
    fractions.Add(static_cast<int>(*d));
  } while (Accept(","));
  return true;
}

bool NumberReader::ReadDegreeForm(Fractions& fractions, NumberSyntaxError* error) {
  // After the degree sign: minutes with their mark, then optional seconds.
  for (int k = 0; k < 2 && !AtEnd(); ++k) {
    std::size_t start = pos_;
    auto d = Digits(3);
    if (!d) return Fail(error, k == 0 ? "minutes" : "seconds");
    if (*d > 59) {
      pos_ = start;
      return Fail(error, "a place from 0 to 59");
    }
    fractions.Add(static_cast<int>(*d));
    if (k == 0 && !AcceptMinuteMark()) return Fail(error, "a minute mark (')");
    if (k == 1 && !AcceptSecondMark()) return Fail(error, "a second mark (\")");
  }
  return true;
}

std::optional<Sexagesimal> NumberReader::Read(NumberSyntaxError* error) {
  bool negative = Accept("-") || (Accept("\u2212"));
  if (!negative) Accept("+");
  Fractions fractions;
  std::size_t first = pos_;
  auto d = Digits(13);
  if (!d) return Fail(error, "a digit"), std::nullopt;
  // The integer part: one run of digits, or sexagesimal places after commas
  // (1,30 = 90), accumulated as read; its limit is reported after the syntax.
  Units integer = *d;
  bool too_large = integer >= Sexagesimal::kIntegerLimit;
  if (Accept("\u00b0")) {
    if (!ReadDegreeForm(fractions, error)) return std::nullopt;
  } else {
    while (Accept(",")) {
      std::size_t start = pos_;
      auto p = Digits(3);
      if (!p) return Fail(error, "a digit"), std::nullopt;
      if (*p > 59) {
        pos_ = start;
        return Fail(error, "a place from 0 to 59"), std::nullopt;
      }
      if (!too_large) {
        integer = integer * 60 + *p;
        too_large = integer >= Sexagesimal::kIntegerLimit;
      }
    }
    if (Accept(";") && !ReadTradeFractions(fractions, error)) return std::nullopt;
  }
  if (!AtEnd())
    return Fail(error, fractions.count == 0 ? "';' or ','" : "',' or end of number"), std::nullopt;
  if (fractions.count > Sexagesimal::kMaxPlaces) {
    pos_ = first;
    return Fail(error, "at most 12 fractional places"), std::nullopt;
  }
  if (too_large) {
    pos_ = first;
    return Fail(error, "an integer part below 10^12"), std::nullopt;
  }
  const Units units = integer * PowerOf60(fractions.count) + fractions.units;
  return Sexagesimal::FromUnits(negative ? -units : units, fractions.count);
}

}  // namespace

std::optional<Sexagesimal> Sexagesimal::Parse(std::string_view text, NumberSyntaxError* error) {
  return NumberReader(text).Read(error);
}

std::optional<Sexagesimal> Sexagesimal::ParseColumns(std::string_view text, int places,
                                                     NumberSyntaxError* error) {
  std::vector<std::pair<std::size_t, std::string_view>> parts;
  std::size_t i = 0;
  bool negative = false;
  if (!text.empty() && text[0] == '-') {
    negative = true;
    i = 1;
  }
  while (i < text.size()) {
    if (text[i] == ' ' || text[i] == '\t') {
      ++i;
      continue;
    }
    std::size_t start = i;
    while (i < text.size() && text[i] != ' ' && text[i] != '\t') ++i;
    parts.emplace_back(start, text.substr(start, i - start));
  }
  auto fail = [&](std::size_t col, std::string expected, std::string found) {
    if (error) *error = {col, std::move(expected), std::move(found)};
    return std::nullopt;
  };
  if (parts.size() < static_cast<std::size_t>(places) + 1) {
    return fail(text.size(), std::to_string(places + 1) + " places separated by blanks",
                std::to_string(parts.size()));
  }
  std::int64_t integer = 0;
  std::vector<int> fractions;
  const std::size_t n_integer = parts.size() - static_cast<std::size_t>(places);
  for (std::size_t k = 0; k < parts.size(); ++k) {
    auto [col, part] = parts[k];
    std::int64_t v = 0;
    for (char c : part) {
      if (c < '0' || c > '9') return fail(col, "a digit", std::string("'") + c + "'");
      v = v * 10 + (c - '0');
      if (v >= kIntegerLimit) return fail(col, "an integer part below 10^12", std::string(part));
    }
    if ((k > 0 || n_integer > 1) && v > 59)
      return fail(col, "a place from 0 to 59", std::string(part));
    if (k < n_integer) {
      integer = n_integer > 1 ? integer * 60 + v : v;
      if (integer >= kIntegerLimit)
        return fail(col, "an integer part below 10^12", std::string(part));
    } else {
      fractions.push_back(static_cast<int>(v));
    }
  }
  return FromParts(negative, integer, fractions);
}

Sexagesimal Sexagesimal::ParseOrThrow(std::string_view text) {
  NumberSyntaxError error;
  auto v = Parse(text, &error);
  if (!v) {
    throw std::invalid_argument(
        "'" + std::string(text) + "' is not a sexagesimal number: expected " + error.expected +
        " at column " + std::to_string(error.column + 1) + ", found " + error.found);
  }
  return *v;
}

}  // namespace apograph
