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
/// says how many were skipped (InputError when all were). With an output
/// folder, also writes report.html there (every table and the work's stemma
/// in one self-contained page).
struct WorkReportOutcome {
  std::size_t skipped = 0;  ///< tables that could not be analysed
  bool findings = false;    ///< some table holds findings (HasFindings)
};
WorkReportOutcome WriteWorkReports(store::Database& db, const std::string& work_id,
                                   const ReportRequest& request, Io& io);

/// Whether an analysis holds something the editor should look at (exit 1):
/// a deviation of any witness explained or unexplained, or a column whose
/// reference the guard refused for a witness.
bool HasFindings(const pipeline::TableAnalysis& a);

}  // namespace apograph::cli
