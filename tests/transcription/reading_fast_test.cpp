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
                           "+"}) {
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
