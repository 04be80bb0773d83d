#pragma once
// Synthetic tables for the estimate tests: entries made from a known function
// and practice, optionally with injected gross errors.

#include <algorithm>
#include <cmath>
#include <functional>
#include <map>
#include <random>
#include <string>

#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::estimate::testing {

/// A sexagesimal written as text, as a number ("0;59,8" -> 0.9856).
inline double D(const char* text) { return Sexagesimal::ParseOrThrow(text).ToDouble(); }

struct SyntheticColumn {
  std::string name = "value";
  int places = 2;
  std::function<double(double)> f;
  Rounding rounding = Rounding::kNearest;
  double grid = 0;           ///< interpolation grid (0: none)
  double grid_origin = 0;    ///< nodes at grid_origin + k * grid
  bool round_nodes = false;  ///< nodes brought to `places` before interpolating
  int written_places = -1;   ///< places as written (zeros appended); -1: `places`
  double displacement = 0;   ///< constant added
  bool modulo_360 = false;
  std::map<int, int> errors;  ///< row -> units added (gross copying errors)
};

inline Transcription MakeTable(const std::string& id, double start, double step, int count,
                               const std::vector<SyntheticColumn>& columns, int arg_places = 0) {
  Transcription t;
  t.table_id = id;
  t.witness.siglum = "S";
  t.argument.name = "arg";
  t.argument.places = arg_places;
  t.argument.start = Sexagesimal::FromDouble(start, arg_places);
  t.argument.step = Sexagesimal::FromDouble(step, arg_places);
  for (const auto& c : columns) {
    t.columns.push_back({c.name, "", std::max(c.places, c.written_places), "", std::nullopt});
  }
  for (int i = 0; i < count; ++i) {
    Row row;
    const Sexagesimal arg = *t.ExpectedArgument(static_cast<std::size_t>(i));
    row.argument.value = arg;
    row.argument.raw = arg.ToString();
    row.argument.places = arg_places;
    for (const auto& c : columns) {
      const double a = arg.ToDouble();
      double v = c.f(a);
      if (c.grid > 0) {
        const double lo = c.grid_origin + std::floor((a - c.grid_origin) / c.grid + 1e-9) * c.grid;
        auto node = [&](double x) {
          const double y = c.f(x);
          return c.round_nodes ? Sexagesimal::FromDouble(y, c.places, c.rounding).ToDouble() : y;
        };
        if (std::fabs(a - lo) > 1e-9)
          v = node(lo) + (node(lo + c.grid) - node(lo)) * (a - lo) / c.grid;
      }
      v += c.displacement;
      Sexagesimal s = Sexagesimal::FromDouble(v, c.places, c.rounding);
      if (c.modulo_360) s = s.Modulo(360);
      const int written = std::max(c.places, c.written_places);
      s = s.Extended(written);
      auto e = c.errors.find(i);
      if (e != c.errors.end()) s = s + Sexagesimal::FromUnits(e->second, written);
      Cell cell;
      cell.value = s;
      cell.raw = s.ToString();
      cell.places = written;
      row.cells.push_back(cell);
    }
    t.rows.push_back(row);
  }
  return t;
}

/// A fifth of the rows of column 0 corrupted as a copyist does, drawn with
/// `seed`: repetitions of the row above, runs of three displaced by a row,
/// digit slips in the minutes and blanks (rows 1 .. rows - 4).
inline Transcription CorruptAFifth(Transcription t, unsigned seed) {
  const int rows = static_cast<int>(t.rows.size());
  std::mt19937 rng(seed);
  std::uniform_int_distribution<int> row(1, rows - 4), kind(0, 3);
  for (int n = 0; n < rows / 5; ++n) {
    const auto r = static_cast<std::size_t>(row(rng));
    Cell& cell = t.rows[r].cells[0];
    switch (kind(rng)) {
      case 0:  // repetition of the row above
        cell = t.rows[r - 1].cells[0];
        break;
      case 1:  // a run of three displaced by a row
        for (std::size_t i = r + 2; i >= r + 1; --i) t.rows[i].cells[0] = t.rows[i - 1].cells[0];
        break;
      case 2:  // a digit slip in the minutes
        cell.value = *cell.value + Sexagesimal::FromUnits(600, 2);
        break;
      default:  // a blank
        cell.state = CellState::kBlank;
        cell.value.reset();
    }
  }
  return t;
}

}  // namespace apograph::estimate::testing
