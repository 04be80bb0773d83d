#include "cli/report_output.hpp"

#include <filesystem>
#include <optional>
#include <ostream>

#include "lineage/lineage_text.hpp"
#include "publish/apparatus.hpp"
#include "publish/html_report.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {
namespace {

namespace fs = std::filesystem;

void WriteStemma(const fs::path& dir, const std::string& id, const lineage::LineageReport& lineage,
                 const OutputRules& rules) {
  if (lineage.results.empty()) return;
  const auto& stemma = lineage.results.front().stemma;
  WriteOutputFile(FileInFolder(dir, id, ".stemma.nwk", rules), lineage::ToNewick(stemma) + "\n",
                  rules);
  const std::string dot = lineage::ToDot(lineage);
  WriteOutputFile(FileInFolder(dir, id, ".stemma.dot", rules), dot, rules);
  RenderSvgFile(dot, FileInFolder(dir, id, ".stemma.svg", rules), rules);
}

void WriteTableFiles(const fs::path& dir, const pipeline::TableAnalysis& a,
                     const ReportRequest& request) {
  publish::ReportOptions full = request.report;
  full.max_findings = 0;
  const OutputRules& rules = request.output_rules;
  const auto file = [&](const char* suffix) {
    return FileInFolder(dir, a.table_id, suffix, rules);
  };
  WriteOutputFile(file(".md"), publish::TableReport(a, full), rules);
  const publish::Apparatus apparatus = publish::BuildApparatus(a, request.editor);
  WriteOutputFile(file(".tei.xml"), publish::ToTei(apparatus), rules);
  WriteOutputFile(file(".tex"), publish::ToLatex(apparatus), rules);
  WriteOutputFile(file(".csv"), publish::ToCsv(apparatus), rules);
  WriteStemma(dir, a.table_id, a.lineage, rules);
}

void PrintAndWrite(const pipeline::TableAnalysis& a, const ReportRequest& request, Io& io) {
  if (!request.html) io.out << publish::TableReport(a, request.report);
  if (!request.output_dir.empty()) WriteTableFiles(request.output_dir, a, request);
}

}  // namespace

pipeline::TableAnalysis ReportTable(store::Database& db, const std::string& table_id,
                                    const ReportRequest& request, Io& io) {
  pipeline::TableAnalysis a = pipeline::AnalyseTable(db, table_id, request.analysis);
  PrintAndWrite(a, request, io);
  return a;
}

bool HasFindings(const pipeline::TableAnalysis& a) {
  for (const auto& w : a.witnesses) {
    if (!w.findings.empty()) return true;
    for (const auto& v : w.verdicts) {
      if (!v.verdict.explains) return true;
    }
  }
  return false;
}

WorkReportOutcome WriteWorkReports(store::Database& db, const std::string& work_id,
                                   const ReportRequest& request, Io& io) {
  WorkReportOutcome outcome;
  std::vector<pipeline::TableAnalysis> analyses;
  const auto tables = store::TablesOfWork(db, work_id);
  for (const auto& table : tables) {
    std::optional<pipeline::TableAnalysis> a;
    try {  // only the analysis: a file that cannot be written stops the command
      a = pipeline::AnalyseTable(db, table, request.analysis);
    } catch (const InputError& e) {  // one table too damaged or too short: report the others
      if (analyses.empty() && table == tables.back()) throw;  // none could be analysed
      io.out << "\n**Table " << table << " skipped**: " << e.diagnostics().front().message
             << "\n\n";
      io.err << "apograph: table " << table << " skipped: " << e.Render() << "\n";
      continue;
    }
    PrintAndWrite(*a, request, io);
    outcome.findings = outcome.findings || HasFindings(*a);
    analyses.push_back(std::move(*a));
  }
  const auto lineage = pipeline::WorkLineage(analyses, request.analysis.lineage);
  const std::string text = publish::WorkLineageReport(work_id, lineage);
  std::string html;
  for (const auto& a : analyses) html += publish::HtmlTableSection(a);
  html = publish::HtmlDocument("apograph report: " + work_id,
                               html + publish::HtmlWorkSection(work_id, lineage));
  io.out << (request.html ? html : text);
  if (!request.output_dir.empty()) {
    const fs::path dir(request.output_dir);
    const OutputRules& rules = request.output_rules;
    WriteOutputFile(FileInFolder(dir, "report", ".html", rules), html, rules);
    WriteOutputFile(FileInFolder(dir, work_id, ".stemma.md", rules), text, rules);
    WriteStemma(dir, work_id, lineage, rules);
  }
  outcome.skipped = tables.size() - analyses.size();
  return outcome;
}

}  // namespace apograph::cli
