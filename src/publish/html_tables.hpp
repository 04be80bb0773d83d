#pragma once
/// The HTML report's edited table with its apparatus, and the cell views
/// the plots and findings link to (see html_report.hpp).

#include <string>

#include "pipeline/analysis.hpp"

namespace apograph::publish {

/// The edited table: every cell's adopted reading; a cell with variants
/// links to its view and is marked; an editor's reading is marked too.
std::string EditedTable(const pipeline::TableAnalysis& analysis);

/// One view per cell with variants or a finding: every witness's reading
/// and its judgement, the model's value and the apparatus entry.
std::string CellViews(const pipeline::TableAnalysis& analysis);

}  // namespace apograph::publish
