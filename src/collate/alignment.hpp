#pragma once
/// Internal to the collation: the grid of expected arguments and the
/// alignment of one witness's rows to it (an edit-distance alignment whose
/// costs are documented in alignment.cpp).

#include <functional>
#include <vector>

#include "collate/collation.hpp"

namespace apograph::collate::internal {

/// The expected arguments of the table: from a declared start and step, else
/// from the step and start most witnesses show, else the sorted arguments
/// read by enough witnesses. The grid ends at the last argument read by a
/// quorum of witnesses (one of one or two, two otherwise).
std::vector<Sexagesimal> InferGrid(const std::vector<const Transcription*>& witnesses);

/// Cost (0..1) of pairing a witness row with a grid row judged by its values;
/// return 0 when nothing is known.
using ValueCost = std::function<double(int source_row, int grid_row)>;

struct RowAlignment {
  std::vector<int> grid_to_source;  ///< per grid row: the witness row, or -1
  std::vector<AlignmentNote> notes;
};

/// Aligns the rows of `witness` to `grid` in order.
RowAlignment AlignRows(const Transcription& witness, const std::vector<Sexagesimal>& grid,
                       const ValueCost& value_cost);

}  // namespace apograph::collate::internal
