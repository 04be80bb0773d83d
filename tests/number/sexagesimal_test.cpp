#include "number/sexagesimal.hpp"

#include <doctest/doctest.h>

using apograph::Rounding;
using apograph::Sexagesimal;

namespace {
Sexagesimal S(const char* text) { return Sexagesimal::ParseOrThrow(text); }
}  // namespace

TEST_CASE("trade notation parses and formats back canonically") {
  CHECK(S("2;23,10").units() == 2 * 3600 + 23 * 60 + 10);
  CHECK(S("2;23,10").places() == 2);
  CHECK(S("2;23,10").ToString() == "2;23,10");
  CHECK(S("-0;5").ToString() == "-0;5");
  CHECK(S("0;0,7").ToString() == "0;0,7");
  CHECK(S("1,30;0") == S("90"));
  CHECK(S("1,30;0").ToString() == "90;0");
  CHECK(S("2°23'10\"").ToString() == "2;23,10");
}
