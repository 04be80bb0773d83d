#pragma once
/// The editor's report on a table: what the pipeline found, stage by stage,
/// with its evidence, written so that a scholar can decide at a glance what
/// to accept. Markdown, which also reads well as plain text in a terminal.
///
///     auto analysis = pipeline::AnalyseTable(db, "sun-eq");
///     std::cout << publish::TableReport(analysis, {.max_findings = 12});
///
/// Every finding in it is a suggestion: the report says so at the top, and
/// shows for every flag the reading, the model's value and the reason.

#include <cstddef>
#include <string>
#include <vector>

#include "lineage/lineage.hpp"
#include "pipeline/analysis.hpp"

namespace apograph::publish {

struct ReportOptions {
  /// Deviations listed per witness (the rest are counted, with the command
  /// that lists them all); 0 lists every one.
  std::size_t max_findings = 0;
  /// Show the author's own departures too (they are counted either way).
  bool show_departures = true;
};

/// The report on one table: the witnesses, how the table was computed, each
/// witness against the model, the explained deviations, the stemma with
/// copies and contamination, and the state of the apparatus.
std::string TableReport(const pipeline::TableAnalysis& analysis, const ReportOptions& options = {});

/// "A. Editor on 2026-12-02: why": who decided, when and why.
std::string DecidedBy(const pipeline::Decision& decision);

/// What the editor decided about a witness's finding, in words: "accepted
/// by ... (adopting ...)", "rejected by ...; the reading is kept",
/// "undecided" or "review: ..." (decided on a reading since changed), and the
/// edited text's override or conjecture at its cell. The Markdown and HTML
/// reports both say it so.
std::string DecisionWords(const pipeline::TableAnalysis& analysis, const std::string& siglum,
                          const deviation::Finding& finding);

/// The stemma argued from all tables of a work together.
std::string WorkLineageReport(const std::string& work_id, const lineage::LineageReport& lineage);

}  // namespace apograph::publish
