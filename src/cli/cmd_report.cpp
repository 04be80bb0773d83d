// apograph report: the editor's report on a table or a whole work.
#include "cli/command.hpp"

#include <filesystem>
#include <ostream>

#include "cli/report_output.hpp"
#include "pipeline/decisions.hpp"
#include "publish/html_report.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {

extern const char kReportUsage[] =
    "usage: apograph report (--table ID | --work ID) [--findings N] [--format markdown|html]\n"
    "                       [--output DIR [--force]] [--editor NAME] [--db FILE]\n"
    "\n"
    "Runs the pipeline on the table (or on every table of the work) and prints\n"
    "the editor's report, in Markdown: the witnesses; how the table was computed\n"
    "(model, parameters and practice identified from the least corrupted witness,\n"
    "with near-ties); each witness against the model; every deviation explained as\n"
    "a copyist's slip or the author's own computation, with the proposed reading;\n"
    "the stemma with candidate copies and contamination; the cells where every\n"
    "witness deviates, with the editor's decisions (accepted, rejected, overridden,\n"
    "conjectured, and those to review after a new revision). For a work, the stemma\n"
    "argued from all its tables follows.\n"
    "--output also writes, per table, the full report, the apparatus (TEI, LaTeX,\n"
    "CSV) and the stemma (Newick, DOT, SVG when Graphviz is installed); the apparatus\n"
    "names the editor (--editor, else APOGRAPH_EDITOR, else the login name) beside\n"
    "everyone whose decisions it shows. An existing file there is replaced only with\n"
    "--force, and never the edition database. A table of the work that cannot be\n"
    "analysed is skipped, with the reason.\n"
    "--format html prints one self-contained HTML page instead (inline CSS and\n"
    "SVG, nothing fetched, printable): per column a plot of every witness's\n"
    "deviations along the argument, the findings linked to their cells, the\n"
    "stemma, the edited table and the apparatus cell by cell; for a work,\n"
    "--output also writes it as report.html.\n"
    "All findings are suggestions with their evidence: the editor decides.\n"
    "\n"
    "examples:\n"
    "  apograph report --table sun-eq\n"
    "  apograph report --work lantern --format html > lantern.html\n"
    "  apograph report --work lantern --findings 10 --output lantern-edition";

int RunReport(const std::vector<std::string>& args, Io& io) {
  std::string table, work, output, db_path, editor, format;
  std::size_t findings = 0;
  po::options_description options("options");
  options.add_options()("table", po::value(&table), "the table to report on")(
      "work", po::value(&work), "report on every table of this work")(
      "findings", po::value(&findings)->default_value(0), "deviations shown per witness (0: all)")(
      "output", po::value(&output), "folder for the files (created if missing)")(
      "editor", po::value(&editor), "the editor named in the apparatus files")(
      "force", "replace files that already exist in the --output folder")(
      "format", po::value(&format)->default_value("markdown"), "markdown or html");
  AddDbOption(options, db_path);
  po::variables_map vm;
  if (ParseOptions(FindCommand("report"), args, options, vm, io)) return kOk;
  if (table.empty() == work.empty()) {
    throw InputError::ForOption("apograph report",
                                "expected one of --table or --work, found " +
                                    std::string(table.empty() ? "neither" : "both"));
  }
  store::Database db = OpenEdition(db_path);
  ReportRequest request;
  request.html = format == "html";
  request.output_dir = output;
  request.output_rules = {"--output", db_path, vm.count("force") > 0, {}};
  request.report.max_findings = findings;
  if (!output.empty()) request.editor = pipeline::DefaultEditor(editor);
  if (!output.empty()) MakeOutputFolder(output);
  if (!table.empty()) {
    const auto a = ReportTable(db, table, request, io);
    if (request.html)
      io.out << publish::HtmlDocument("apograph report: " + table, publish::HtmlTableSection(a));
    return HasFindings(a) ? kFindings : kOk;
  } else {
    if (store::TablesOfWork(db, work).empty()) {
      throw InputError::ForOption("--work",
                                  ExpectedFound("a work in the database", "'" + work + "'"));
    }
    const auto outcome = WriteWorkReports(db, work, request, io);
    if (outcome.skipped > 0 || outcome.findings) return kFindings;
  }
  return kOk;
}

}  // namespace apograph::cli
