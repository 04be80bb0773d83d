#pragma once
/// What `demo` and `report` share: analysing a table or a whole work,
/// printing the editor's report, and writing the publication files.

#include <string>

#include "cli/command.hpp"
#include "cli/output_files.hpp"
#include "pipeline/analysis.hpp"
#include "publish/report.hpp"
#include "store/database.hpp"

namespace apograph::cli {

struct ReportRequest {
  /// Folder for the files (full report, apparatus, stemmata); empty: none.
  std::string output_dir;
  OutputRules output_rules;       ///< how the files may be written (the database, --force)
  publish::ReportOptions report;  ///< for what is printed
  std::string editor;             ///< named in the apparatus files beside those who decided
  /// Print one self-contained HTML page instead of Markdown (the work's
  /// page after every table has been analysed).
  bool html = false;
  pipeline::AnalysisOptions analysis;
};

/// Analyses one table, prints its report, writes its files; returns the
/// analysis (for the work's lineage).
pipeline::TableAnalysis ReportTable(store::Database& db, const std::string& table_id,
                                    const ReportRequest& request, Io& io);

/// Every table of the work, then the stemma argued from all of them. A table
/// that cannot be analysed (InputError) is skipped with its reason printed;
/// returns how many were skipped (InputError when all were). With an output
/// folder, also writes report.html there (every table and the work's stemma
/// in one self-contained page).
std::size_t WriteWorkReports(store::Database& db, const std::string& work_id,
                             const ReportRequest& request, Io& io);

}  // namespace apograph::cli
