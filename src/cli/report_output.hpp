#pragma once
/// What `demo` and `report` share: analysing a table or a whole work,
/// printing the editor's report, and writing the publication files.

#include <string>

#include "cli/command.hpp"
#include "pipeline/analysis.hpp"
#include "publish/report.hpp"
#include "store/database.hpp"

namespace apograph::cli {

struct ReportRequest {
  /// Folder for the files (full report, apparatus, stemmata); empty: none.
  std::string output_dir;
  publish::ReportOptions report;  ///< for what is printed
  std::string editor;             ///< named in the apparatus files beside those who decided
  pipeline::AnalysisOptions analysis;
};

/// Analyses one table, prints its report, writes its files; returns the
/// analysis (for the work's lineage).
pipeline::TableAnalysis ReportTable(store::Database& db, const std::string& table_id,
                                    const ReportRequest& request, Io& io);

/// Every table of the work, then the stemma argued from all of them.
void WriteWorkReports(store::Database& db, const std::string& work_id, const ReportRequest& request,
                      Io& io);

/// Renders DOT into an SVG file with Graphviz; false when `dot` is not
/// installed. Throws std::runtime_error when dot fails.
bool RenderSvg(const std::string& dot, const std::string& svg_path);

}  // namespace apograph::cli
