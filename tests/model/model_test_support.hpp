#pragma once
// Helpers for the model tests: values in the trade's notation, tables built
// in code.
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "model/model.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::model::testing {

inline Sexagesimal S(const char* text) { return Sexagesimal::ParseOrThrow(text); }
inline double D(const char* text) { return S(text).ToDouble(); }

/// The exact value of a built-in model at its defaults, overridden by `params`.
inline double Eval(const char* name, std::vector<double> params, double arg) {
  const Model* m = FindBuiltinModel(name);
  REQUIRE(m != nullptr);
  RowContext row;
  row.arg = arg;
  return m->Evaluate(params, row);
}

/// The model value rounded to `places` places.
inline Sexagesimal Rounded(const char* name, std::vector<double> params, double arg, int places,
                           Rounding rounding = Rounding::kNearest) {
  return Sexagesimal::FromDouble(Eval(name, std::move(params), arg), places, rounding);
}

inline Cell ReadCell(const std::string& text, int places) {
  Cell c;
  c.raw = text;
  c.places = places;
  if (text == "_") {
    c.state = CellState::kBlank;
  } else if (text == "?") {
    c.state = CellState::kIllegible;
  } else {
    c.value = Sexagesimal::ParseOrThrow(text);
  }
  return c;
}

/// A one-witness table: rows of {argument, cell, cell...} in trade notation.
inline Transcription MakeTable(const std::vector<std::string>& columns, int places,
                               const std::vector<std::vector<std::string>>& rows,
                               int arg_places = 0) {
  Transcription t;
  t.table_id = "t";
  t.witness.siglum = "A";
  t.argument.name = "arg";
  t.argument.places = arg_places;
  for (const auto& name : columns) t.columns.push_back({name, "deg", places, "", std::nullopt});
  for (const auto& r : rows) {
    Row row;
    row.argument = ReadCell(r[0], arg_places);
    for (std::size_t k = 1; k < r.size(); ++k) row.cells.push_back(ReadCell(r[k], places));
    t.rows.push_back(row);
  }
  return t;
}

}  // namespace apograph::model::testing
