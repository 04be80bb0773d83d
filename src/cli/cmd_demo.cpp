// apograph demo: the whole pipeline on the bundled (invented) demo tradition.
#include "cli/command.hpp"

#include <algorithm>
#include <filesystem>
#include <ostream>

#include "cli/demo_folder.hpp"
#include "cli/report_output.hpp"
#include "pipeline/analysis.hpp"
#include "publish/report.hpp"
#include "store/database.hpp"
#include "store/edition_store.hpp"
#include "support/data_dir.hpp"
#include "support/input_error.hpp"
#include "transcription/parser.hpp"

namespace apograph::cli {

extern const char kDemoUsage[] =
    "usage: apograph demo [--corpus DIR] [--output DIR] [--findings N]\n"
    "\n"
    "Runs the whole pipeline on the demo tradition that ships in corpora/demo (an\n"
    "INVENTED work in five invented witnesses; corpora/demo/TRUTH.md is its answer\n"
    "key): imports every transcription into a fresh edition database, identifies\n"
    "how each table was computed, checks every witness, explains the deviations,\n"
    "collates the witnesses, works out the stemma of each table and of the whole\n"
    "work, and writes the apparatus. The summary goes to the terminal; the full\n"
    "reports, the apparatus (TEI, LaTeX, CSV) and the stemmata (Newick, DOT, and\n"
    "SVG when Graphviz is installed) go to the output folder, with the database,\n"
    "so that every other command can be tried on it:\n"
    "  apograph errors --db apograph-demo/edition.sqlite --table sun-eq --witness D --auto\n"
    "The output folder must be new, empty, or one an earlier demo wrote: the demo lists\n"
    "the files it writes in the folder's .apograph-demo file and, when run again,\n"
    "replaces only those (the database included, with any decisions recorded in it);\n"
    "it never deletes a folder nor a file it did not write.\n"
    "\n"
    "example: apograph demo --output /tmp/lantern";

namespace {

namespace fs = std::filesystem;

std::vector<Transcription> ReadCorpus(const fs::path& corpus, std::vector<Diagnostic>& warnings) {
  if (!fs::is_directory(corpus)) {
    throw InputError::ForOption(
        "--corpus", ExpectedFound("the demo corpus folder", "'" + corpus.string() + "'"));
  }
  std::vector<fs::path> files;
  for (const auto& e : fs::directory_iterator(corpus)) {
    if (e.path().extension() == ".apo") files.push_back(e.path());
  }
  std::sort(files.begin(), files.end());
  std::vector<Transcription> tables;
  for (const auto& f : files) {
    auto file = ReadTranscriptionFile(f.string());
    for (auto& t : file.tables) tables.push_back(std::move(t));
    for (auto& w : file.warnings) warnings.push_back(std::move(w));
  }
  if (tables.empty())
    throw InputError::ForOption("--corpus",
                                "expected .apo files, found none in " + corpus.string());
  return tables;
}

void PrintImport(const std::vector<Transcription>& tables, const std::vector<Diagnostic>& warnings,
                 const fs::path& db, Io& io) {
  std::vector<std::string> sigla, ids;
  std::size_t cells = 0;
  for (const auto& t : tables) {
    sigla.push_back(t.witness.siglum);
    ids.push_back(t.table_id);
    cells += t.CellCount();
  }
  for (auto* v : {&sigla, &ids}) {
    std::sort(v->begin(), v->end());
    v->erase(std::unique(v->begin(), v->end()), v->end());
  }
  io.out << "# apograph demo: " << tables.front().work.title << " (an invented tradition)\n\n"
         << "Imported " << tables.size() << " transcriptions (" << ids.size() << " tables in "
         << sigla.size() << " witnesses, " << cells << " cells) into " << db.string() << ".\n";
  if (!warnings.empty()) {
    io.out << "The transcriptions raise " << warnings.size()
           << " warnings about arguments (evidence, kept as written):\n";
    for (const auto& w : warnings)
      io.out << "  " << w.where.file.substr(w.where.file.find_last_of('/') + 1) << ":"
             << w.where.line << ": " << w.message << "\n";
  }
  io.out << "\nEverything below is a suggestion with its evidence: the editor decides.\n\n";
}

}  // namespace

int RunDemo(const std::vector<std::string>& args, Io& io) {
  std::string corpus, output;
  std::size_t findings = 6;
  po::options_description options("options");
  options.add_options()("corpus", po::value(&corpus)->default_value(DataDir() + "/demo"),
                        "folder of the demo transcriptions")(
      "output", po::value(&output)->default_value("apograph-demo"),
      "folder for the database and files")("findings", po::value(&findings)->default_value(6),
                                           "deviations shown per witness (0: all)");
  po::variables_map vm;
  if (ParseOptions(FindCommand("demo"), args, options, vm, io)) return kOk;

  std::vector<Diagnostic> warnings;
  const auto tables = ReadCorpus(corpus, warnings);  // all input read before anything is written
  const fs::path dir(output);
  PrepareDemoFolder(dir);
  const fs::path db_path = dir / "edition.sqlite";
  CheckOutputFile(db_path, {"--output", "", false, {}});  // not a database the editor put there
  RecordDemoFile(dir, db_path);
  store::Database db(db_path.string());
  store::Import(db, tables);
  PrintImport(tables, warnings, db_path, io);

  ReportRequest request;
  request.output_dir = dir.string();
  request.output_rules = {"--output", db_path.string(), false,
                          [&dir](const fs::path& file) { RecordDemoFile(dir, file); }};
  request.report.max_findings = findings;
  request.editor = pipeline::DefaultEditor();
  const auto outcome = WriteWorkReports(db, tables.front().work.id, request, io);
  io.out << "Files in " << dir.string()
         << "/: the edition database, one report per table (*.md, every\n"
         << "deviation listed), the apparatus (*.tei.xml, *.tex, *.csv) and the stemmata (*.nwk, "
            "*.dot,\n"
         << "*.svg).\nOpen " << (dir / "report.html").string()
         << " in a browser: every table plotted, the findings linked to their cells.\n"
         << "Try: apograph errors --db " << db_path.string()
         << " --table sun-eq --witness D --auto\n";
  return outcome.skipped > 0 || outcome.findings ? kFindings : kOk;
}

}  // namespace apograph::cli
