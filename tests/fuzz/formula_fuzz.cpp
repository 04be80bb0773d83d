// libFuzzer target for the formula language (grammar/formula.ebnf): the X3
// parser, the compiler and evaluation. Build (clang only):
//   CXX=clang++ cmake -S . -B build-fuzz -DAPOGRAPH_FUZZ=ON -DAPOGRAPH_TESTS=OFF
//   cmake --build build-fuzz --target formula_fuzz
//   ./build-fuzz/formula_fuzz -max_total_time=600 corpus-copy/
// (seed corpus: tests/fuzz/corpus/formula/). Any input must either compile
// or throw InputError; a compiled formula must evaluate (a number or NaN,
// never a crash) on every row of a small table, with and without the
// gradient, at its default parameters.
#include <cstdint>
#include <cstdlib>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "model/formula.hpp"
#include "support/input_error.hpp"

namespace {

/// A table of 5 rows and the columns the seed formulas read.
const apograph::Transcription& SmallTable() {
  static const apograph::Transcription table = [] {
    apograph::Transcription t;
    t.table_id = "t";
    for (const char* name : {"chord", "value", "sixtieths"}) {
      apograph::ColumnSpec c;
      c.name = name;
      c.places = 2;
      t.columns.push_back(c);
    }
    for (int k = 0; k < 5; ++k) {
      apograph::Row row;
      row.argument.value = apograph::Sexagesimal::FromDouble(6.0 * k, 0);
      row.argument.state = apograph::CellState::kRead;
      for (int c = 0; c < 3; ++c) {
        apograph::Cell cell;
        cell.state = apograph::CellState::kRead;
        cell.value = apograph::Sexagesimal::FromDouble(1.5 * k + c, 2);
        row.cells.push_back(cell);
      }
      t.rows.push_back(row);
    }
    return t;
  }();
  return table;
}

void EvaluateEverywhere(const apograph::model::FormulaModel& f) {
  std::vector<double> params;
  std::vector<int> wrt;
  for (const auto& p : f.params()) {
    wrt.push_back(static_cast<int>(params.size()));
    params.push_back(p.default_value);
  }
  std::vector<double> gradient(params.size());
  const auto& t = SmallTable();
  for (std::size_t r = 0; r < t.rows.size(); ++r) {
    apograph::model::RowContext row{6.0 * static_cast<double>(r), std::nullopt, &t, r, 1};
    (void)f.Evaluate(params, row);
    (void)f.EvaluateWithGradient(params, row, wrt, gradient.data());
  }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    const auto f = apograph::model::CompileFormula(text, "fuzz", "fuzz.formula");
    EvaluateEverywhere(*f);
  } catch (const apograph::InputError& e) {
    (void)e.Render();
  }
  return 0;
}
