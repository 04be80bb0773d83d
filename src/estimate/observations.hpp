#pragma once
/// The entries an estimate is made from: every readable cell of the chosen
/// columns, with its argument and its value in units of its last place.

#include <cstddef>
#include <vector>

#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::estimate {

/// One tabulated entry.
struct Observation {
  std::size_t row = 0;
  int column = 0;
  double arg = 0;     ///< the argument the model uses (model::RowArgument)
  Sexagesimal value;  ///< as tabulated
  int places = 0;     ///< places of the column
  double units = 0;   ///< value in units of its last place (an integer)
};

/// The readable entries of `columns` (every value column when empty), in row
/// order, column after column. Cells not read in full, and rows without a
/// usable argument, are left out.
std::vector<Observation> CollectObservations(const Transcription& table,
                                             const std::vector<int>& columns);

/// Indices of the columns named, in order; InputError (option `option`) for
/// an unknown name. Every value column when `names` is empty.
std::vector<int> ResolveColumns(const Transcription& table, const std::vector<std::string>& names,
                                const std::string& option = "--column");

}  // namespace apograph::estimate
