// ParseReading's fast path for the plain trade form against the grammar
// (transcription/cell_x3.cpp): the same value, places and state, or the same
// error at the same offset, for every reading tried.
#include <doctest/doctest.h>

#include <optional>
#include <random>
#include <string>
#include <vector>

#include "transcription/syntax.hpp"

namespace tr = apograph::transcription;

namespace {

/// The outcome of one parse: the reading's fields, or the error's offset and text.
struct Outcome {
  std::optional<tr::ReadingInfo> info;
  std::size_t offset = 0;
  std::string message;
};

template <typename Parse>
Outcome Run(Parse parse) {
  Outcome out;
  try {
    out.info = parse();
  } catch (const tr::LineError& e) {
    out.offset = e.offset;
    out.message = e.message;
  }
  return out;
}

/// Compares both parsers on `text`; returns whether it was read.
bool Agree(const std::string& text, int places) {
  const Outcome fast = Run([&] { return tr::ParseReading(text, places, 3); });
  const Outcome grammar = Run([&] { return tr::ParseReadingByGrammar(text, places, 3); });
  INFO("reading '", text, "'");
  REQUIRE(fast.info.has_value() == grammar.info.has_value());
  if (!fast.info) {
    CHECK(fast.offset == grammar.offset);
    CHECK(fast.message == grammar.message);
    return false;
  }
  CHECK(fast.info->state == grammar.info->state);
  CHECK(fast.info->fraction_places == grammar.info->fraction_places);
  REQUIRE(fast.info->value.has_value() == grammar.info->value.has_value());
  if (fast.info->value) CHECK(fast.info->value->Identical(*grammar.info->value));
  return true;
}

}  // namespace

TEST_CASE("the plain trade form reads as the grammar reads it, every short reading") {
  // Every reading of up to 5 characters over digits, separators, signs, '?' and a blank.
  const std::string alphabet = "0159;,-+? ";
  int read = 0, tried = 0;
  std::vector<std::size_t> digits;
  for (std::size_t length = 1; length <= 5; ++length) {
    digits.assign(length, 0);
    for (;;) {
      std::string text;
      for (std::size_t d : digits) text += alphabet[d];
      if (text.front() != ' ' && text.back() != ' ') {  // readings come trimmed
        read += Agree(text, 1);
        ++tried;
      }
      std::size_t k = 0;
      while (k < length && ++digits[k] == alphabet.size()) digits[k++] = 0;
      if (k == length) break;
    }
  }
  CHECK(tried > 50000);
  CHECK(read > 2000);  // not a comparison of errors alone
}

TEST_CASE("the plain trade form reads as the grammar at the limits and on random readings") {
  for (const char* text : {"999999999999;59",
                           "1000000000000;0",
                           "9999999999999",
                           "99999999999999",
                           "0;0000000000005",
                           "0;00000000000005",
                           "21,26,0,29,37,46,39;0",
                           "21,26,0,29,37,46,40;0",
                           "0;1,2,3,4,5,6,7,8,9,10,11,12",
                           "0;1,2,3,4,5,6,7,8,9,10,11,12,13",
                           "1,60;0",
                           "1;60",
                           "-0;0",
                           "+0;5",
                           "\xE2\x88\x92"
                           "0;5",
                           "0;4,10\xC2\xB0",
                           "2\xC2\xB0"
                           "3'",
                           "0 4 10",
                           "0;;4",
                           "0;4;5",
                           ";4",
                           "0;4,",
                           "1,",
                           "-",
                           "+",
                           "0;001",
                           "0;0012",
                           "0;059",
                           "0;060",
                           "1,001;5",
                           "0000000000001;1",
                           "00000000000001;1",
                           "0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0;1",
                           "0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0;1",
                           "999999999999,59;1",
                           "1,0,0,0,0,0,0,0,0,0,0;1",
                           "-999999999999;59,59,59,59,59,59,59,59,59,59,59,59"}) {
    Agree(text, 2);
  }
  std::mt19937 draw(15);  // fixed seed: the same readings on every run
  const std::string alphabet = "0123456789;,;,-";
  int read = 0;
  for (int n = 0; n < 20000; ++n) {
    std::string text;
    const int length = 1 + static_cast<int>(draw() % 24);
    for (int k = 0; k < length; ++k) text += alphabet[draw() % alphabet.size()];
    read += Agree(text, 2);
  }
  CHECK(read > 500);
}

TEST_CASE("the plain trade form reads as the grammar on drawn readings of its own shape") {
  // Readings shaped like a sheet's (sign, a leading run, places of 1 to 4
  // digits after ',' or ';'), so that most are read and the limits are hit.
  std::mt19937 draw(1515);  // fixed seed: the same readings on every run
  auto digits = [&](int count) {
    std::string out;
    for (int k = 0; k < count; ++k) out += static_cast<char>('0' + draw() % 10);
    return out;
  };
  int read = 0;
  for (int n = 0; n < 20000; ++n) {
    std::string text;
    const unsigned sign = draw() % 8;
    if (sign == 0) text += '-';
    if (sign == 1) text += '+';
    text += digits(1 + static_cast<int>(draw() % 15 == 0 ? draw() % 15 : draw() % 3));
    const int places = static_cast<int>(draw() % 16);
    const int semicolon = static_cast<int>(draw() % (places + 2));
    for (int k = 0; k < places; ++k) {
      text += k == semicolon ? ';' : ',';
      const unsigned width = draw() % 20;
      text += width == 0 ? digits(3 + static_cast<int>(draw() % 2))
                         : std::to_string(draw() % (width == 1 ? 100 : 60));
    }
    read += Agree(text, 2);
  }
  CHECK(read > 5000);  // about half are read (9,317 with this seed)
}
