#pragma once
/// The HTML report's edited table with its apparatus, and the cell views
/// the plots and findings link to (see html_report.hpp).

#include <string>

#include "pipeline/analysis.hpp"
#include "publish/apparatus.hpp"

namespace apograph::publish {

/// The edited table: every cell's adopted reading; a cell with variants
/// links to its view and is marked; an editor's reading is marked too.
std::string EditedTable(const pipeline::TableAnalysis& analysis, const Apparatus& apparatus);

/// One view per cell with variants, a finding or an editor's reading: every
/// witness's reading and its judgement, the model's value, the editor's
/// decisions there (override, conjecture, emendations accepted or
/// rejected, with who and when) and the apparatus entry.
std::string CellViews(const pipeline::TableAnalysis& analysis, const Apparatus& apparatus);

}  // namespace apograph::publish
