#pragma once
// Synthetic tables for the estimate tests: entries made from a known function
// and practice, optionally with injected gross errors.

#include <cmath>
#include <functional>
#include <map>
#include <string>

#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::estimate::testing {

struct SyntheticColumn {
  std::string name = "value";
  int places = 2;
  std::function<double(double)> f;
  Rounding rounding = Rounding::kNearest;
  double grid = 0;          ///< interpolation grid (0: none)
  double displacement = 0;  ///< constant added
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
  for (const auto& c : columns) t.columns.push_back({c.name, "", c.places, "", std::nullopt});
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
        const double lo = std::floor(a / c.grid + 1e-9) * c.grid;
        if (std::fabs(a - lo) > 1e-9) v = c.f(lo) + (c.f(lo + c.grid) - c.f(lo)) * (a - lo) / c.grid;
      }
      v += c.displacement;
      Sexagesimal s = Sexagesimal::FromDouble(v, c.places, c.rounding);
      if (c.modulo_360) s = s.Modulo(360);
      auto e = c.errors.find(i);
      if (e != c.errors.end()) s = s + Sexagesimal::FromUnits(e->second, c.places);
      Cell cell;
      cell.value = s;
      cell.raw = s.ToString();
      cell.places = c.places;
      row.cells.push_back(cell);
    }
    t.rows.push_back(row);
  }
  return t;
}

}  // namespace apograph::estimate::testing
