#include "cli/report_output.hpp"

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <ostream>

#include "lineage/stemma.hpp"
#include "publish/apparatus.hpp"
#include "publish/html_report.hpp"
#include "store/edition_store.hpp"

namespace apograph::cli {
namespace {

namespace fs = std::filesystem;

/// Writes through a temporary file and a rename, so a failure never leaves
/// half a file behind.
void WriteFile(const fs::path& path, const std::string& text) {
  const fs::path tmp = path.string() + ".tmp";
  {
    std::ofstream out(tmp, std::ios::binary);
    out << text;
    if (!out) throw std::runtime_error("cannot write " + tmp.string());
  }
  fs::rename(tmp, path);
}

std::string ShellQuote(const std::string& s) {
  std::string out = "'";
  for (char c : s) out += c == '\'' ? std::string("'\\''") : std::string(1, c);
  return out + "'";
}

void WriteStemma(const fs::path& dir, const std::string& stem, const std::string& title,
                 const lineage::LineageReport& lineage) {
  if (lineage.results.empty()) return;
  const auto& stemma = lineage.results.front().stemma;
  WriteFile(dir / (stem + ".nwk"), lineage::ToNewick(stemma) + "\n");
  const std::string dot = lineage::ToDot(stemma, title);
  WriteFile(dir / (stem + ".dot"), dot);
  RenderSvg(dot, (dir / (stem + ".svg")).string());
}

void WriteTableFiles(const fs::path& dir, const pipeline::TableAnalysis& a,
                     const ReportRequest& request) {
  publish::ReportOptions full = request.report;
  full.max_findings = 0;
  WriteFile(dir / (a.table_id + ".md"), publish::TableReport(a, full));
  WriteFile(dir / (a.table_id + ".tei.xml"), publish::ToTei(a.apparatus));
  WriteFile(dir / (a.table_id + ".tex"), publish::ToLatex(a.apparatus));
  WriteFile(dir / (a.table_id + ".csv"), publish::ToCsv(a.apparatus));
  WriteStemma(dir, a.table_id + ".stemma", a.table_title, a.lineage);
}

}  // namespace

bool RenderSvg(const std::string& dot, const std::string& svg_path) {
  if (std::system("command -v dot > /dev/null 2>&1") != 0) return false;
  const fs::path tmp = svg_path + ".dot.tmp";
  WriteFile(tmp, dot);
  const int rc = std::system(
      ("dot -Tsvg " + ShellQuote(tmp.string()) + " -o " + ShellQuote(svg_path)).c_str());
  fs::remove(tmp);
  if (rc != 0) throw std::runtime_error("Graphviz dot failed to render " + svg_path);
  return true;
}

pipeline::TableAnalysis ReportTable(store::Database& db, const std::string& table_id,
                                    const ReportRequest& request, Io& io) {
  pipeline::TableAnalysis a = pipeline::AnalyseTable(db, table_id, request.analysis);
  if (!request.html) io.out << publish::TableReport(a, request.report);
  if (!request.output_dir.empty()) WriteTableFiles(request.output_dir, a, request);
  return a;
}

void WriteWorkReports(store::Database& db, const std::string& work_id, const ReportRequest& request,
                      Io& io) {
  std::vector<pipeline::TableAnalysis> analyses;
  for (const auto& table : store::TablesOfWork(db, work_id)) {
    analyses.push_back(ReportTable(db, table, request, io));
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
    WriteFile(dir / "report.html", html);
    WriteFile(dir / (work_id + ".stemma.md"), text);
    WriteStemma(dir, work_id + ".stemma", "stemma of " + work_id, lineage);
  }
}

}  // namespace apograph::cli
