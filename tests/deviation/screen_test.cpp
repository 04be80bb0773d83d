#include "deviation/screen.hpp"

#include <doctest/doctest.h>

#include "synthetic.hpp"
#include "test_paths.hpp"

using namespace apograph;
using namespace apograph::deviation;
using apograph::testing::MakeTable;

namespace {
const std::string kDir = std::string(APOGRAPH_SOURCE_DIR) + "/corpora/scripts";
}

TEST_CASE("a faithful table screens clean") {
  auto s = MakeTable(testing::SolarEquation, 1, 1, 180, 2);
  CHECK(ScreenColumn(s.table, 0, nullptr).empty());
  auto c = MakeTable(testing::Chord, 1, 1, 180, 2);
  CHECK(ScreenColumn(c.table, 0, nullptr).empty());
  auto m = MakeTable(testing::SolarEquation, 1, 1, 180, 1);
  CHECK(ScreenColumn(m.table, 0, nullptr).empty());
}

TEST_CASE("the screen finds isolated slips and blanks without a model") {
  auto s = MakeTable(testing::SolarEquation, 1, 1, 180, 2);
  // Tens of minutes 4 read as 5 (a Hindu-Arabic confusion, from memory).
  std::size_t row = 30;
  while (s.table.rows[row].cells[0].value->FractionDigits()[0] / 10 != 4) ++row;
  const std::string original = s.Get(row);
  auto v = *s.table.rows[row].cells[0].value + Sexagesimal::FromUnits(600, 2);
  s.Set(row, v.ToString());
  s.Set(90, "_");  // blank
  auto w = *s.table.rows[120].cells[0].value + Sexagesimal::FromUnits(7, 2);
  s.Set(120, w.ToString());
  const NumeralScript script = FindNumeralScript("hindu-arabic", kDir);
  const auto suspects = ScreenColumn(s.table, 0, &script);
  REQUIRE(suspects.size() == 3);
  CHECK(suspects[0].row == row);
  CHECK(suspects[0].diff_units == doctest::Approx(600).epsilon(0.01));
  REQUIRE(suspects[0].expected.has_value());
  CHECK(std::fabs(DiffUnits(*suspects[0].expected, Sexagesimal::ParseOrThrow(original), 2)) <= 1);
  CHECK(suspects[0].evidence.find("second differences around it") != std::string::npos);
  REQUIRE_FALSE(suspects[0].explanations.empty());
  CHECK(suspects[0].explanations.front().cls == SlipClass::kConfusion);
  CHECK(suspects[0].explanations.front().emendation->ToString() == original);
  CHECK(suspects[1].row == 90);
  CHECK(suspects[2].row == 120);
}

TEST_CASE("a mean motion's passage through 360 is not a suspect") {
  auto s = MakeTable([](double d) { return std::fmod(d * 0.98564733, 360.0); }, 300, 1, 120, 2);
  CHECK(ScreenColumn(s.table, 0, nullptr).empty());
}
