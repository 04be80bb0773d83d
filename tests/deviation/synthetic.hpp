#pragma once
// Synthetic tables for the deviation tests and the benchmark: a column
// computed from a known function, into which slips are injected by hand.
#include <cmath>
#include <functional>
#include <numbers>
#include <string>

#include "deviation/explain.hpp"
#include "edition/transcription.hpp"

namespace apograph::testing {

/// Solar equation of the eccentric, e = 2;30 on a radius of 60, in degrees.
inline double SolarEquation(double a) {
  const double r = a * std::numbers::pi / 180.0, e = 2.5;
  return std::atan2(e * std::sin(r), 60.0 + e * std::cos(r)) * 180.0 / std::numbers::pi;
}

/// Chord on a diameter of 120.
inline double Chord(double a) { return 120.0 * std::sin(a * std::numbers::pi / 360.0); }

struct Synthetic {
  Transcription table;
  deviation::ColumnValues values;

  /// Sets the reading of a row (the copy's text as typed).
  void Set(std::size_t row, const std::string& text) {
    Cell& c = table.rows[row].cells[0];
    c.raw = text;
    if (text == "_" || text == "?") {
      c.state = text == "_" ? CellState::kBlank : CellState::kIllegible;
      c.value.reset();
    } else {
      c.state = CellState::kRead;
      c.value = Sexagesimal::ParseOrThrow(text);
    }
  }
  std::string Get(std::size_t row) const { return table.rows[row].cells[0].raw; }
  /// Row index of an argument (arguments start at `first` with step `step`).
  std::size_t Row(int arg) const { return static_cast<std::size_t>((arg - first) / step); }
  int first = 1, step = 1;
};

/// A table of f(first), f(first+step), ... rounded to `places`, copied
/// faithfully, with the model's values (rounded) and exact values.
inline Synthetic MakeTable(const std::function<double(double)>& f, int first, int step, int count,
                           int places, const std::string& script = "hindu-arabic") {
  Synthetic s;
  s.first = first;
  s.step = step;
  s.table.table_id = "synthetic";
  s.table.witness.siglum = "A";
  s.table.witness.script = script;
  s.table.argument = {"a", "deg", 0, Sexagesimal::FromParts(false, first, {}),
                      Sexagesimal::FromParts(false, step, {})};
  s.table.columns.push_back({"equation", "deg", places, "", std::nullopt});
  s.values.column = 0;
  for (int i = 0; i < count; ++i) {
    const double a = first + i * step;
    Row row;
    row.argument.raw = std::to_string(static_cast<int>(a));
    row.argument.value = Sexagesimal::FromParts(false, static_cast<std::int64_t>(a), {});
    Cell c;
    c.places = places;
    const auto v = Sexagesimal::FromDouble(f(a), places);
    c.value = v;
    c.raw = v.ToString();
    row.cells.push_back(c);
    s.table.rows.push_back(row);
    s.values.computed.push_back(v);
    s.values.exact.push_back(f(a));
  }
  return s;
}

}  // namespace apograph::testing
