#include "number/sexagesimal.hpp"

#include <doctest/doctest.h>

#include "test_support.hpp"

#include <limits>
#include <stdexcept>

using apograph::DiffUnits;
using apograph::NumberSyntaxError;
using apograph::Rounding;
using apograph::Sexagesimal;

namespace {
Sexagesimal S(const char* text) { return Sexagesimal::ParseOrThrow(text); }
std::string Str(const Sexagesimal& v) { return v.ToString(); }
}  // namespace

TEST_CASE("trade notation parses and formats back canonically") {
  CHECK(S("2;23,10").units() == 2 * 3600 + 23 * 60 + 10);
  CHECK(S("2;23,10").places() == 2);
  CHECK(Str(S("2;23,10")) == "2;23,10");
  CHECK(Str(S("-0;5")) == "-0;5");
  CHECK(S("-0;5").negative());
  CHECK(Str(S("0;0,7")) == "0;0,7");
  CHECK(Str(S("+3;1")) == "3;1");
  CHECK(Str(S("12")) == "12");
  CHECK(S("12").places() == 0);
  CHECK(Str(S("2;05,40")) == "2;5,40");
}

TEST_CASE("a sexagesimal integer part") {
  CHECK(S("1,30;0") == S("90"));
  CHECK(Str(S("1,30;0")) == "90;0");
  CHECK(S("1,30;0").ToString({.sexagesimal_integer = true}) == "1,30;0");
  CHECK(S("1,0,0") == S("3600"));
  CHECK(S("2,30").IntegerDigits() == std::vector<int>{2, 30});
}

TEST_CASE("degree forms with ASCII marks and Unicode primes") {
  CHECK(Str(S("2°23'10\"")) == "2;23,10");
  CHECK(Str(S("2°23\u203210\u2033")) == "2;23,10");
  CHECK(Str(S("2°23'")) == "2;23");
  CHECK(Str(S("2°")) == "2");
  CHECK(S("2;23,10").ToDegrees() == "2°23'10\"");
  CHECK(S("-0;5").ToDegrees() == "-0°5'");
}

TEST_CASE("places separated by blanks as in a manuscript's sub-columns") {
  CHECK(Str(*Sexagesimal::ParseColumns("2 23 10", 2)) == "2;23,10");
  CHECK(Str(*Sexagesimal::ParseColumns("0  4\t10", 2)) == "0;4,10");
  CHECK(*Sexagesimal::ParseColumns("1 30 0", 1) == S("90"));
  CHECK(Str(*Sexagesimal::ParseColumns("-0 5", 1)) == "-0;5");
  NumberSyntaxError e;
  CHECK_FALSE(Sexagesimal::ParseColumns("2 23", 2, &e));
  CHECK(e.expected == "3 places separated by blanks");
  CHECK_FALSE(Sexagesimal::ParseColumns("2 60 1", 2, &e));
  CHECK(e.column == 2);
  CHECK(e.expected == "a place from 0 to 59");
}

TEST_CASE("malformed numbers are refused with the position and what was expected") {
  NumberSyntaxError e;
  CHECK_FALSE(Sexagesimal::Parse("2;60", &e));
  CHECK(e.column == 2);
  CHECK(e.expected == "a place from 0 to 59");
  CHECK_FALSE(Sexagesimal::Parse("2;", &e));
  CHECK(e.expected == "a digit");
  CHECK(e.found == "end of number");
  CHECK_FALSE(Sexagesimal::Parse("2;3x", &e));
  CHECK(e.column == 3);
  CHECK(e.found == "'x'");
  CHECK_FALSE(Sexagesimal::Parse("", &e));
  CHECK_FALSE(Sexagesimal::Parse("1,60;0", &e));
  CHECK_FALSE(Sexagesimal::Parse("2°61'", &e));
  CHECK_THROWS_AS(S("abc"), std::invalid_argument);
}

TEST_CASE("limits: 12 places, integer part below 10^12, no silent wrap") {
  CHECK(S("999999999999;59,59,59,59,59,59,59,59,59,59,59,59").places() == 12);
  CHECK_FALSE(Sexagesimal::Parse("1000000000000;0"));
  CHECK_FALSE(Sexagesimal::Parse("1;1,1,1,1,1,1,1,1,1,1,1,1,1"));
  const auto big = S("999999999999;0");
  CHECK_THROWS_AS(big + S("1"), std::overflow_error);
  CHECK_THROWS_AS(big * 2, std::overflow_error);
  CHECK_THROWS_AS(S("1;0") * std::numeric_limits<std::int64_t>::max(), std::overflow_error);
  CHECK_THROWS_AS(Sexagesimal::FromDouble(1e13, 2), std::overflow_error);
  CHECK_THROWS_AS(Sexagesimal::FromDouble(std::numeric_limits<double>::quiet_NaN(), 2),
                  std::overflow_error);
  // At 8 places an integer part of 10^6 is far inside the limits.
  CHECK(Str(S("1000000;1,2,3,4,5,6,7,8") * 59) == "59000001;1,1,1,1,1,1,0,52");
}

TEST_CASE("the limits are reported after the syntax, at the number's first digit") {
  NumberSyntaxError e;
  // Sexagesimal integer places: 1,0,0,0,0,0,0,0 is 60^7 (about 2.8 * 10^12).
  CHECK(Str(S("21,26,0,29,37,46,39;0")) == "999999999999;0");
  CHECK_FALSE(Sexagesimal::Parse("21,26,0,29,37,46,40;0"));
  CHECK_FALSE(Sexagesimal::Parse("-1,0,0,0,0,0,0,0;5", &e));
  CHECK(e.column == 1);
  CHECK(e.expected == "an integer part below 10^12");
  // Too many places is said before too large a value, a bad character before both.
  CHECK_FALSE(Sexagesimal::Parse("1,0,0,0,0,0,0,0;1,1,1,1,1,1,1,1,1,1,1,1,1", &e));
  CHECK(e.column == 0);
  CHECK(e.expected == "at most 12 fractional places");
  CHECK_FALSE(Sexagesimal::Parse("1,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0,0;1x", &e));
  CHECK(e.column == 51);
  CHECK(e.expected == "',' or end of number");
  CHECK_FALSE(Sexagesimal::Parse("10000000000000", &e));
  CHECK(e.expected == "';' or ','");  // 13 digits at most, then the 14th is unexpected
  CHECK(Str(S("2\u00b023'10\"")) == "2;23,10");
  CHECK(Str(S("-12\u00b05'")) == "-12;5");
  // Every value of two places from -2;0,0 to 2;0,0 reads back as written.
  for (int units = -2 * 3600; units <= 2 * 3600; ++units) {
    const auto v = Sexagesimal::FromUnits(units, 2);
    REQUIRE(Sexagesimal::Parse(v.ToString()));
    CHECK(Sexagesimal::Parse(v.ToString())->Identical(v));
  }
}

TEST_CASE("exact addition, subtraction, multiplication and comparison") {
  CHECK(Str(S("0;59,8") + S("0;0,52")) == "1;0,0");
  CHECK(Str(S("1;0") - S("0;0,1")) == "0;59,59");
  CHECK(Str(S("0;5") - S("0;10")) == "-0;5");
  CHECK(Str(S("0;59,8,20") * 10) == "9;51,23,20");
  CHECK(S("2;30") == S("2;30,0"));
  CHECK_FALSE(S("2;30").Identical(S("2;30,0")));
  CHECK(S("-0;1") < S("0;0,1"));
  CHECK(S("2;30,1") > S("2;30"));
}

TEST_CASE("rounding to nearest (ties away from zero) and truncation are two operations") {
  CHECK(Str(S("0;39,28").Rounded(1)) == "0;39");
  CHECK(Str(S("0;39,30").Rounded(1)) == "0;40");
  CHECK(Str(S("-0;39,30").Rounded(1)) == "-0;40");
  CHECK(Str(S("0;39,59").Rounded(1, Rounding::kTruncate)) == "0;39");
  CHECK(Str(S("-0;39,59").Rounded(1, Rounding::kTruncate)) == "-0;39");
  CHECK(Str(S("0;59,30").Rounded(1)) == "1;0");
  CHECK(Str(S("2;3").Rounded(3)) == "2;3,0,0");
  CHECK(Str(Sexagesimal::FromDouble(2.0 + 4.0 / 60 + 48.0 / 3600, 2)) == "2;4,48");
  CHECK(Str(Sexagesimal::FromDouble(0.999999, 1, Rounding::kTruncate)) == "0;59");
  CHECK(Sexagesimal::FromDouble(-1.25, 1).ToString() == "-1;15");
}

TEST_CASE("differences in units of a chosen last place") {
  CHECK(DiffUnits(S("0;40"), S("0;39"), 1) == 1.0);
  CHECK(DiffUnits(S("0;40"), S("0;41"), 2) == -60.0);
  CHECK(DiffUnits(S("0;40"), S("0;39,30"), 1) == 0.5);
  CHECK(DiffUnits(S("9;51,23"), S("9;51,23,20"), 2) == doctest::Approx(-1.0 / 3));
}

TEST_CASE("division and reduction modulo 360") {
  // Source: T. L. Heath, A History of Greek Mathematics, vol. 2 (Oxford, 1921):
  // the sixtieths column is one thirtieth of the difference 0;31,24.
  CHECK(Str(S("0;31,24").Divided(30, 3)) == "0;1,2,48");
  CHECK(Str(S("985;38,50").Modulo(360)) == "265;38,50");
  CHECK(Str(S("-10;0").Modulo(360)) == "350;0");
}

TEST_CASE("a mean-motion table built from rounded entries (exact arithmetic)") {
  // Source: Maimonides, Mishneh Torah, Laws of the Sanctification of the New
  // Moon 12:1 (the sun's mean motion).
  CHECK(Str(S("98;33,53") * 10) == "985;38,50");
  CHECK((S("98;33,53") * 10).Modulo(360) == S("265;38,50"));
  CHECK(Str(S("265;38,50") * 10) == "2656;28,20");
  CHECK((S("265;38,50") * 10).Modulo(360) == S("136;28,20"));
}

TEST_CASE("base-60 reciprocals multiply to a power of 60") {
  // Reciprocals of regular numbers, from memory (the standard table of
  // reciprocals printed in handbooks of early mathematics); digits without
  // the point, so n x reciprocal must be 60^k.
  const std::vector<std::pair<int, const char*>> table = {
      {2, "30"},     {3, "20"},       {4, "15"},    {5, "12"},       {6, "10"},    {8, "7,30"},
      {9, "6,40"},   {10, "6"},       {12, "5"},    {15, "4"},       {16, "3,45"}, {18, "3,20"},
      {20, "3"},     {24, "2,30"},    {25, "2,24"}, {27, "2,13,20"}, {30, "2"},    {32, "1,52,30"},
      {36, "1,40"},  {40, "1,30"},    {45, "1,20"}, {48, "1,15"},    {50, "1,12"}, {54, "1,6,40"},
      {64, "56,15"}, {81, "44,26,40"}};
  for (const auto& [n, digits] : table) {
    // Read the digits as 0;d1,d2,...: the reciprocal itself.
    const auto reciprocal = S((std::string("0;") + digits).c_str());
    const auto product = reciprocal * n;
    CAPTURE(n);
    // The point is not written, so the product is 1 or 1,0 (= 60).
    CHECK((product == S("1") || product == S("60")));
  }
}

TEST_CASE("chords of a circle of diameter 120 parse exactly") {
  // Source: T. L. Heath, A History of Greek Mathematics, vol. 2 (Oxford, 1921).
  CHECK(S("0;31,25").units() == 31 * 60 + 25);
  CHECK(S("103;55,23").IntegerPart() == 103);
  CHECK(S("103;55,23").FractionDigits() == std::vector<int>{55, 23});
  CHECK(Str(S("2;37,4") - S("2;5,40")) == "0;31,24");
}

TEST_CASE("conversion to double") {
  CHECK(S("2;30").ToDouble() == 2.5);
  CHECK(S("-0;0,36").ToDouble() == doctest::Approx(-0.01));
  CHECK(S("1,30;0").ToDouble() == 90.0);
}
