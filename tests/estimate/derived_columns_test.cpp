#include "estimate/derived_columns.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>

#include "estimate/derived_model.hpp"
#include "model/model.hpp"

namespace apograph::estimate {
namespace {

double Chord(double a) { return 120.0 * std::sin(a / 2 * std::numbers::pi / 180.0); }

/// Chords at step 0;30 (2 places) with a sixtieths column at 3 places,
/// made from the tabulated chords or from exact ones.
Transcription ChordTable(bool from_tabulated) {
  Transcription t;
  t.table_id = "chords";
  t.argument = {"arc", "deg", 1, Sexagesimal::ParseOrThrow("0;30"),
                Sexagesimal::ParseOrThrow("0;30")};
  t.columns = {{"chord", "", 2, "", std::nullopt}, {"sixtieths", "", 3, "", std::nullopt}};
  const int n = 300;
  for (int i = 0; i < n; ++i) {
    const double a = 0.5 * (i + 1);
    const Sexagesimal c0 = Sexagesimal::FromDouble(Chord(a), 2),
                      c1 = Sexagesimal::FromDouble(Chord(a + 0.5), 2);
    const Sexagesimal six = from_tabulated
                                ? (c1 - c0).Divided(30, 3)
                                : Sexagesimal::FromDouble((Chord(a + 0.5) - Chord(a)) / 30, 3);
    Row row;
    for (const auto& v : {c0, six}) {
      Cell cell;
      cell.value = v;
      cell.raw = v.ToString();
      row.cells.push_back(cell);
    }
    t.rows.push_back(row);
  }
  return t;
}

DerivedInputs ExactChords(const Transcription& t) {
  DerivedInputs in;
  in.exact.resize(2);
  for (std::size_t i = 0; i < t.rows.size(); ++i)
    in.exact[0].push_back(Chord(0.5 * static_cast<double>(i + 1)));
  return in;
}

}  // namespace

TEST_CASE("an interpolation column made from the tabulated chords is found, with its basis") {
  const Transcription t = ChordTable(true);
  const auto precise = ExactChords(t);
  const auto found = DetectDerivedColumns(t, &precise);
  REQUIRE(found.size() == 1);
  CHECK(found[0].column == 1);
  CHECK(found[0].source == 0);
  CHECK(found[0].spec.divisor == 30);
  CHECK(found[0].spec.multiplier == 1);
  CHECK(found[0].relation == "1/30 of the difference to the next row of chord");
  CHECK(found[0].matched_tabulated == found[0].rows);
  CHECK(found[0].basis == "tabulated entries");
}

TEST_CASE("an interpolation column made from exact chords is told apart") {
  const Transcription t = ChordTable(false);
  const auto precise = ExactChords(t);
  const auto found = DetectDerivedColumns(t, &precise);
  REQUIRE(found.size() == 1);
  CHECK(found[0].spec.divisor == 30);
  CHECK(found[0].basis == "precise values");
  CHECK(found[0].matched_precise > found[0].matched_tabulated);
}

TEST_CASE("without precise values the smoothed source still recognises the relation") {
  const auto found = DetectDerivedColumns(ChordTable(true));
  REQUIRE(found.size() == 1);
  CHECK(found[0].basis == "tabulated entries");
}

// Published check. Source: T. L. Heath, *A History of Greek Mathematics*,
// vol. 2 (Oxford, 1921), chapter on trigonometry, worked values of the
// ancient chord table: the tabulated difference 0;31,24 gives 0;1,2,48.
TEST_CASE("published sixtieths: one thirtieth of 0;31,24 is 0;1,2,48") {
  CHECK(Sexagesimal::ParseOrThrow("0;31,24").Divided(30, 3).Identical(
      Sexagesimal::ParseOrThrow("0;1,2,48")));
}

TEST_CASE("a column that is the sum of two others is found") {
  Transcription t;
  t.table_id = "sums";
  t.argument = {"arg", "", 0, Sexagesimal::ParseOrThrow("1"), Sexagesimal::ParseOrThrow("1")};
  t.columns = {{"a", "", 1, "", std::nullopt},
               {"b", "", 1, "", std::nullopt},
               {"total", "", 1, "", std::nullopt}};
  for (int i = 1; i <= 30; ++i) {
    const Sexagesimal a = Sexagesimal::FromDouble(std::sqrt(i * 7.3), 1),
                      b = Sexagesimal::FromDouble(std::log(i + 2.0) * 11, 1);
    Row row;
    for (const auto& v : {a, b, a + b}) {
      Cell cell;
      cell.value = v;
      row.cells.push_back(cell);
    }
    t.rows.push_back(row);
  }
  const auto found = DetectDerivedColumns(t);
  bool sum = false;
  for (const auto& d : found) sum = sum || (d.column == 2 && d.relation == "the sum of a and b");
  CHECK(sum);
}

TEST_CASE("true = mean minus the equation, within the turn, and with magnitudes") {
  // A lunar mean motion (13;10,35 a day, from memory) crossing 360 and a
  // signed equation whose correction is subtracted: true = mean - q, written
  // within [0, 360).
  Transcription t;
  t.table_id = "moon";
  t.argument = {"day", "", 0, Sexagesimal::ParseOrThrow("1"), Sexagesimal::ParseOrThrow("1")};
  t.columns = {{"mean", "", 2, "", std::nullopt},
               {"equation", "", 2, "", std::nullopt},
               {"true", "", 2, "", std::nullopt}};
  const double rate = Sexagesimal::ParseOrThrow("13;10,35").ToDouble();
  DerivedInputs signed_inputs;
  signed_inputs.exact.resize(3);
  signed_inputs.rounded.resize(3);
  signed_inputs.exact_signed.resize(3);
  signed_inputs.rounded_signed.resize(3);
  for (int i = 1; i <= 40; ++i) {
    const Sexagesimal mean = Sexagesimal::FromDouble(200 + rate * i, 2).Modulo(360);
    const double q = 5 * std::sin((30 + 13.06 * i) * std::numbers::pi / 180);
    const Sexagesimal eq = Sexagesimal::FromDouble(q, 2);
    Row row;
    // The equation printed as a magnitude (the rubric gives the sign).
    const Sexagesimal magnitude = eq.negative() ? Sexagesimal() - eq : eq;
    for (const auto& v : {mean, magnitude, (mean - eq).Modulo(360)}) {
      Cell cell;
      cell.value = v;
      row.cells.push_back(cell);
    }
    t.rows.push_back(row);
    signed_inputs.exact[0].push_back(std::fmod(200 + rate * i, 360));  // the mean motion's
    signed_inputs.rounded[0].push_back(mean);
    signed_inputs.exact_signed[1].push_back(q);
    signed_inputs.rounded_signed[1].push_back(eq);
  }
  // From the magnitudes alone the relation cannot be seen; with the signed
  // values of the identified equation (and the mean motion's) it is.
  for (const auto& d : DetectDerivedColumns(t)) CHECK(d.column != 2);
  const auto found = DetectDerivedColumns(t, &signed_inputs);
  bool minus = false;
  for (const auto& d : found) {
    if (d.column != 2) continue;
    CHECK(d.relation.rfind("mean minus equation", 0) == 0);  // within the turn or not: the
                                                             // rows where it matters are few
    CHECK(d.spec.other_sign == -1);
    CHECK(d.matched_rounded == 40);
    minus = true;
  }
  CHECK(minus);
}

TEST_CASE("differences from exact values take the function's own values, not the grid's") {
  // Chords (R = 60, common practice) tabulated exact every 3 degrees and
  // linear between, with a column of differences of the exact chords at 3
  // places: differences of the interpolated values would be constant over
  // each interval of the grid, the author's are not.
  const model::Model* chord = model::FindBuiltinModel("chord");
  REQUIRE(chord != nullptr);
  Transcription t;
  t.table_id = "chords";
  t.argument = {"arc", "deg", 0, Sexagesimal::FromUnits(1, 0), Sexagesimal::FromUnits(1, 0)};
  t.columns = {{"chord", "", 2, "", std::nullopt}, {"difference", "", 3, "", std::nullopt}};
  for (int a = 1; a <= 60; ++a) {
    Row row;
    row.argument.value = Sexagesimal::FromUnits(a, 0);
    for (const auto& v : {Sexagesimal::FromDouble(Chord(a), 2),
                          Sexagesimal::FromDouble(Chord(a + 1) - Chord(a), 3)}) {
      Cell cell;
      cell.value = v;
      row.cells.push_back(cell);
    }
    t.rows.push_back(row);
  }
  DerivedSource source;
  source.column = "chord";
  source.model = std::shared_ptr<const model::Model>(std::shared_ptr<const model::Model>(), chord);
  source.params = {60};
  source.practice.places = 2;
  source.practice.grid = 3;
  DerivedRelation next;  // the difference to the next row
  const DerivedModel m("difference", next, DerivedBasis::kExact, {source}, 3, Rounding::kNearest,
                       1);
  int same = 0;
  for (std::size_t r = 0; r + 1 < t.rows.size(); ++r) {
    model::RowContext ctx{static_cast<double>(r + 1), std::nullopt, &t, r, 1};
    same += Sexagesimal::FromDouble(m.Evaluate({}, ctx), 3) == *t.rows[r].cells[1].value;
  }
  CHECK(same == 59);
}

}  // namespace apograph::estimate
