#pragma once
/// The deviation plots of a table, read from the same analysis the reports
/// read: for every referenced column, every witness's entries recomputed
/// (model::Check) and marked by their findings.

#include <string>

#include "pipeline/analysis.hpp"
#include "publish/svg_plot.hpp"

namespace apograph::publish {

/// The id of a cell's view in the HTML report ("cell-sun-eq-12-0"): the
/// aligned row and the collation's column.
std::string CellAnchor(const std::string& table_id, int row, int column);

/// The aligned row of a witness's transcription row; -1 when not aligned.
int AlignedRow(const pipeline::TableAnalysis& a, const std::string& siglum, int source_row);

/// The collation's index of a column by name; -1 when absent.
int CollationColumn(const pipeline::TableAnalysis& a, const std::string& name);

/// The mark of an explained deviation.
PointKind KindOf(deviation::SlipClass cls);

/// The traces of one referenced column (one per witness that has it).
std::vector<PlotTrace> ColumnTraces(const pipeline::TableAnalysis& a,
                                    const pipeline::ColumnReference& ref);

/// The interpolation grid's nodes inside the table's argument range (empty
/// when the practice has no grid).
std::vector<double> GridNodes(const pipeline::ColumnReference& ref,
                              const std::vector<PlotTrace>& traces);

/// The plots of one column as HTML: one plot with every trace, or one
/// small plot per witness on a common vertical scale when there are many.
std::string ColumnPlots(const pipeline::TableAnalysis& a, const pipeline::ColumnReference& ref);

}  // namespace apograph::publish
