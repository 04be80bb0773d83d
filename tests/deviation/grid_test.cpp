// A column whose author writes the last place on a coarser grid (thirds in
// tens, "0;5,24,20"): a departure is counted in steps of that grid, so a
// reading every witness shares one or two steps from the model is the
// author's, not a copyist's slip emended to the model.
#include <doctest/doctest.h>

#include <cmath>

#include "deviation/explain.hpp"
#include "deviation/numeral_script.hpp"
#include "synthetic.hpp"
#include "test_paths.hpp"

using namespace apograph;
using namespace apograph::deviation;
using apograph::testing::MakeTable;
using apograph::testing::Synthetic;

namespace {

const std::string kDir = std::string(APOGRAPH_SOURCE_DIR) + "/corpora/scripts";

/// `x` degrees to thirds, rounded to a multiple of `grid` thirds.
Sexagesimal OnGrid(double x, int grid) {
  const double thirds = x * 60 * 60 * 60;
  return Sexagesimal::FromUnits(static_cast<Sexagesimal::Units>(std::llround(thirds / grid)) * grid,
                                3);
}

/// The solar equation to thirds written in steps of `grid` thirds; the model
/// gives the same values. Every row is read alike by three other witnesses.
Synthetic GridTable(int grid) {
  Synthetic s = MakeTable(testing::SolarEquation, 1, 1, 180, 3);
  s.values.tradition.assign(s.table.rows.size(), {});
  for (std::size_t r = 0; r < s.table.rows.size(); ++r) {
    const Sexagesimal v = OnGrid(s.values.exact[r], grid);
    s.Set(r, v.ToString());
    s.values.computed[r] = v;
    TraditionCell& t = s.values.tradition[r];
    t.witnesses = t.same = t.agree = t.model = 3;
    t.consensus = v;
  }
  return s;
}

/// The model moved by `thirds` at `row`: every witness now departs from it.
void MoveModel(Synthetic& s, std::size_t row, int thirds) {
  s.values.computed[row] = *s.values.computed[row] + Sexagesimal::FromUnits(thirds, 3);
  s.values.tradition[row].model = 0;
}

const Finding* At(const std::vector<Finding>& findings, std::size_t row) {
  for (const auto& f : findings) {
    for (const auto& c : f.cells) {
      if (c.row == row) return &f;
    }
  }
  return nullptr;
}

std::string Notes(const std::vector<Finding>& findings) {
  std::string out;
  for (const auto& f : findings) out += f.Note("A") + "\n";
  return out;
}

}  // namespace

TEST_CASE("a reading every witness shares one or two grid steps from the model is the author's") {
  // Thirds written in tens; the reference's difference misses the author's by
  // one step (10 thirds) or two at scattered rows, where every witness reads
  // the author's value. Another witness writes Roman numerals, whose X added
  // or dropped reaches a ten-thirds change.
  for (int grid : {10, 5}) {
    Synthetic s = GridTable(grid);
    const std::vector<std::size_t> moved = {20, 47, 48, 90, 133};
    MoveModel(s, 20, grid);
    MoveModel(s, 47, -grid);
    MoveModel(s, 48, grid);
    MoveModel(s, 90, 2 * grid);
    MoveModel(s, 133, -2 * grid);
    const NumeralScript own = FindNumeralScript("hindu-arabic", kDir);
    const NumeralScript roman = FindNumeralScript("roman", kDir);
    const auto findings = ExplainColumn(s.table, s.values, own, {}, {&roman});
    INFO("grid " << grid << "\n" << Notes(findings));
    for (std::size_t r : moved) {
      const Finding* f = At(findings, r);
      if (!f) continue;
      CHECK_FALSE(IsCopyingSlip(f->best().cls));
      for (const auto& c : f->cells) CHECK_FALSE(c.emendation.has_value());
      // The evidence counts the departure on the author's grid.
      CHECK(f->best().evidence.find("multiples of " + std::to_string(grid)) != std::string::npos);
    }
  }
}

TEST_CASE("on a grid, a copy's own slips are still found and restored to the author's reading") {
  Synthetic s = GridTable(10);
  MoveModel(s, 60, 10);  // the reference misses the author by one step here
  // Row 60: this copy reads one step off the author's value that the others
  // read (the model's, now one step off too): the copy's slip, restored to
  // the others' reading. Row 100: a confusion of the degrees.
  const Sexagesimal author60 = *s.table.rows[60].cells[0].value;
  const Sexagesimal author100 = *s.table.rows[100].cells[0].value;
  s.Set(60, (author60 - Sexagesimal::FromUnits(10, 3)).ToString());
  s.values.tradition[60].same = 0;
  s.values.tradition[60].model = 0;
  s.Set(100, (author100 + Sexagesimal::FromUnits(216000 * 3, 3)).ToString());
  s.values.tradition[100].same = 0;
  const auto findings = ExplainColumn(s.table, s.values, FindNumeralScript("hindu-arabic", kDir));
  INFO(Notes(findings));
  for (auto [row, want] : {std::pair{std::size_t{60}, author60}, {std::size_t{100}, author100}}) {
    const Finding* f = At(findings, row);
    REQUIRE(f != nullptr);
    CHECK(IsCopyingSlip(f->best().cls));
    REQUIRE(f->cells.front().emendation.has_value());
    CHECK(f->cells.front().emendation->ToString() == want.ToString());
  }
}
