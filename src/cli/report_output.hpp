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
  /// Print one self-contained HTML page instead of Markdown (the work's
  /// page after every table has been analysed).
  bool html = false;
  pipeline::AnalysisOptions analysis;
};

/// Analyses one table, prints its report, writes its files; returns the
/// analysis (for the work's lineage).
pipeline::TableAnalysis ReportTable(store::Database& db, const std::string& table_id,
                                    const ReportRequest& request, Io& io);

/// Every table of the work, then the stemma argued from all of them. With
/// an output folder, also writes report.html there (every table and the
/// work's stemma in one self-contained page).
void WriteWorkReports(store::Database& db, const std::string& work_id, const ReportRequest& request,
                      Io& io);

/// Renders DOT into an SVG file with Graphviz; false when `dot` is not
/// installed. Throws std::runtime_error when dot fails.
bool RenderSvg(const std::string& dot, const std::string& svg_path);

}  // namespace apograph::cli
