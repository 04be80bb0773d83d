#pragma once
/// The editor's report as one self-contained HTML file: inline CSS and
/// SVG, no script, no font or image fetched from anywhere, readable offline
/// and printable. It reads the same analysis as the Markdown report
/// (publish/report.hpp) and shows, per table: the deviation plots of every
/// column (svg_plot.hpp), the model with its evidence, the findings each
/// linked to its cell, the stemma as SVG, the edited table with its
/// apparatus, and a view of every cell that has variants or a finding.
///
///     std::string body = publish::HtmlTableSection(analysis);
///     std::ofstream("report.html") << publish::HtmlDocument("sun-eq", body);

#include <string>

#include "lineage/lineage.hpp"
#include "pipeline/analysis.hpp"

namespace apograph::publish {

/// One table's section (an <article> with id "table-<id>").
std::string HtmlTableSection(const pipeline::TableAnalysis& analysis);

/// The stemma argued from all tables of a work.
std::string HtmlWorkSection(const std::string& work_id, const lineage::LineageReport& lineage);

/// A whole page around `body`, with the report's style sheet inline and a
/// Content-Security-Policy that forbids fetching anything.
std::string HtmlDocument(const std::string& title, const std::string& body);

/// The style sheet (also used by the review pages of `apograph serve`).
const char* HtmlStyle();

/// Escapes text for HTML (the same as EscapeXml).
std::string Html(const std::string& text);

}  // namespace apograph::publish
