// apograph import: transcription files and CSV sheets into the edition
// database, all in one transaction.
#include "cli/command.hpp"

#include <filesystem>
#include <ostream>
#include <stdexcept>

#include <nlohmann/json.hpp>

#include "store/edition_store.hpp"
#include "store/import_session.hpp"
#include "support/data_dir.hpp"
#include "support/tabular.hpp"
#include "transcription/csv.hpp"
#include "transcription/parser.hpp"
#include "transcription/sheet_manifest.hpp"

namespace apograph::cli {

extern const char kImportUsage[] =
    "usage: apograph import FILE... [--db FILE] [--format text|csv|json] [--wait SECONDS]\n"
    "       apograph import --csv SHEET... --witness SIGLUM [--table ID] [attributes] [sheet "
    "options]\n"
    "       apograph import --manifest FILE [sheet options]\n"
    "\n"
    "Reads and writes file by file inside ONE transaction for the whole job\n"
    "(a thousand sheets are never all in memory): an error in any file\n"
    "rolls back every table, so nothing is ever half written (exit code 2;\n"
    "a database the failed import created is removed). A table whose content\n"
    "differs from its current revision gets a new revision (the earlier ones\n"
    "stay); an unchanged table adds nothing. Warnings (duplicate\n"
    "or out-of-step arguments, a witness's or table's attribute changed by\n"
    "this import) are shown with their positions and give exit code 1.\n"
    "\n"
    "A CSV sheet holds one witness's table: a header row naming the argument\n"
    "and the value columns, then one row per entry in trade notation (empty =\n"
    "blank, ? = illegible). The delimiter (',', ';' or TAB) is read off the\n"
    "header unless --delimiter gives it. Arguments may be decimals (88.5) or\n"
    "have fewer places than others (1 beside 1;30): they are normalised, the\n"
    "written form kept. Places are read off the cells unless --places gives\n"
    "them (N for every value column, COLUMN=N for one). Columns holding the\n"
    "degrees, minutes and seconds of one value are joined with --join\n"
    "'NAME=D+M+S'; a sheet that looks like that is refused until you --join or\n"
    "--keep-columns. Several sheets take their table ids from their file\n"
    "names; a manifest names each sheet with its attributes (see README).\n"
    "\n"
    "examples:\n"
    "  apograph import corpora/demo/*.apo --db harbour.sqlite\n"
    "  apograph import --csv sun.csv --table sun-eq --witness K --script hindu-arabic\n"
    "  apograph import --csv sheets/*.csv --witness K --date 'c. 1420' --kind manuscript\n"
    "  apograph import --manifest sheets/K.sheets --join 'decl=d+m+s'";

namespace {

struct ImportOptions {
  std::string db;
  std::string format;
  std::vector<std::string> files;
  std::vector<std::string> csv;
  std::string manifest;
  std::string wait;
  std::string scripts;
  CsvOptions sheet;  ///< head: ids and attributes from the options
  std::string step, start, delimiter;
  std::vector<std::string> places, joins;
  std::size_t max_file_mb = 0, max_line_kb = 0;
};

int ParsePlaces(const std::string& text, const std::string& whole) {
  std::size_t used = 0;
  int n = -1;
  try {
    n = std::stoi(text, &used);
  } catch (const std::invalid_argument&) {
    used = 0;
  } catch (const std::out_of_range&) {
    used = 0;
  }
  if (used != text.size() || n < 0 || n > Sexagesimal::kMaxPlaces) {
    throw InputError::ForOption(
        "--places", ExpectedFound("N or COLUMN=N with N from 0 to 12", "'" + whole + "'"));
  }
  return n;
}

Sexagesimal ParseNumberOption(const std::string& option, const std::string& text) {
  auto v = Sexagesimal::Parse(text);
  if (!v)
    throw InputError::ForOption(option, ExpectedFound("a number such as 0;30", "'" + text + "'"));
  return *v;
}

/// The options that shape how every sheet is read (places, joins, delimiter).
void SheetOptions(ImportOptions& o) {
  CsvOptions& c = o.sheet;
  for (const auto& p : o.places) {
    const auto eq = p.find('=');
    if (eq == std::string::npos) {
      c.places = ParsePlaces(p, p);
    } else if (eq == 0) {
      ParsePlaces("x", p);  // throws: no column name
    } else {
      c.column_places[p.substr(0, eq)] = ParsePlaces(p.substr(eq + 1), p);
    }
  }
  for (const auto& j : o.joins) c.joins.push_back(ParseColumnJoin(j, "--join"));
  if (!o.delimiter.empty()) {
    CheckChoice("--delimiter", o.delimiter, {",", ";", "tab"});
    c.delimiter = o.delimiter == "tab" ? '\t' : o.delimiter[0];
  }
  if (o.step == kListedStep) {
    c.head.argument.listed = true;
  } else if (!o.step.empty()) {
    c.head.argument.step = ParseNumberOption("--step", o.step);
  }
  if (!o.start.empty()) {
    if (c.head.argument.listed)
      throw InputError::ForOption("--start", "expected no --start with --step list, found one");
    c.head.argument.start = ParseNumberOption("--start", o.start);
  }
  if (o.max_file_mb > 0) c.read.max_file_bytes = o.max_file_mb << 20;
  if (o.max_line_kb > 0) c.read.max_line_bytes = o.max_line_kb << 10;
  if (!o.scripts.empty()) c.read.scripts = ScriptNames(o.scripts);
}

/// True when an option that describes a sheet's table or witness was given.
bool GivesAttributes(const ImportOptions& o) {
  const Transcription& h = o.sheet.head;
  const WitnessInfo& w = h.witness;
  return !h.table_id.empty() || !w.siglum.empty() || !h.work.id.empty() || !h.work.title.empty() ||
         !w.script.empty() || !w.library.empty() || !w.shelfmark.empty() || !w.date.empty() ||
         !w.kind.empty() || !w.note.empty() || !h.table_title.empty() || !h.kind.empty() ||
         !h.folios.empty() || !h.hand.empty() || !o.step.empty() || !o.start.empty();
}

InputError NothingToImport() {
  return InputError::ForOption("apograph import",
                               "expected at least one FILE, --csv SHEET or --manifest FILE, "
                               "found none (see apograph import --help)");
}

/// What to read, in order: transcription files, then the manifest's or the
/// command line's sheets. Settles every option before anything is read.
struct Sources {
  std::vector<std::string> files;
  std::vector<SheetEntry> sheets;
};

/// Checks the options and lists the inputs; throws before anything is
/// read or opened.
Sources ListSources(ImportOptions& o) {
  SheetOptions(o);
  Sources sources{o.files, {}};
  if (!o.manifest.empty() && GivesAttributes(o)) {
    throw InputError::ForOption("--manifest",
                                "expected the attributes in the manifest, found them given as "
                                "options too (give them in one place)");
  }
  if (!o.manifest.empty()) sources.sheets = ReadSheetManifest(o.manifest, o.sheet);
  if (!o.csv.empty()) {
    if (o.sheet.head.witness.siglum.empty())
      throw InputError::ForOption("--witness", "expected the siglum of the CSV sheets, found none");
    auto sheets = SheetsFromFiles(o.csv, o.sheet);
    if (sources.sheets.empty()) {
      sources.sheets = std::move(sheets);  // each entry holds a table head: not moved one by one
    } else {
      sources.sheets.reserve(sources.sheets.size() + sheets.size());
      for (auto& s : sheets) sources.sheets.push_back(std::move(s));
    }
  } else if (o.manifest.empty() && GivesAttributes(o)) {
    throw InputError::ForOption(
        "--csv", "expected CSV sheets for the table and witness options, found none");
  }
  if (sources.files.empty() && sources.sheets.empty()) throw NothingToImport();
  return sources;
}

/// Reads each input in turn and writes its tables in the one transaction
/// of the session, keeping only what is reported (a thousand sheets are
/// never all in memory). An error in any input rolls everything back.
store::ImportResult ReadAndWrite(const Sources& sources, const CsvOptions& options,
                                 store::Database& db, std::vector<Diagnostic>& warnings) {
  store::ImportSession session(db);
  std::size_t tables = 0;
  auto take = [&](const TranscriptionFile& f) {
    for (const auto& t : f.tables) session.Add(t);
    tables += f.tables.size();
    for (const auto& w : f.warnings) warnings.push_back(w);
  };
  for (const auto& f : sources.files) take(ReadTranscriptionFile(f, options.read));
  Transcription spare;  // the table before, whose rows the next sheet reuses
  for (const auto& s : sources.sheets) {
    TranscriptionFile f = ReadCsvFile(s.path, s.options, spare);
    take(f);
    if (!f.tables.empty()) spare.rows = std::move(f.tables.front().rows);
  }
  if (tables == 0) throw NothingToImport();
  return session.Commit();
}

/// Runs `write` on the database at `path`; when the file did not exist
/// before and `write` throws, the database it created is removed again, so
/// that a failed import leaves no trace on a fresh path.
template <typename Write>
store::ImportResult ImportInto(const std::string& path, Write write) {
  namespace fs = std::filesystem;
  const bool fresh = !fs::exists(path);
  try {
    store::Database db(path);
    return write(db);
  } catch (...) {
    if (fresh) {
      std::error_code ignored;  // best effort: the error being reported matters more
      for (const char* suffix : {"", "-wal", "-shm", "-journal"})
        fs::remove(path + suffix, ignored);
    }
    throw;
  }
}

void PrintJson(const ImportOptions& o, const std::vector<Diagnostic>& warnings,
               const store::ImportResult& result, Io& io) {
  nlohmann::ordered_json j;
  j["database"] = o.db;
  j["tables"] = nlohmann::ordered_json::array();
  for (const auto& t : result.tables) {
    j["tables"].push_back({{"file", t.source_file},
                           {"table", t.table_id},
                           {"witness", t.siglum},
                           {"siglum", t.siglum},  // deprecated alias of witness (README 0.1)
                           {"status", t.changed ? "new revision" : "unchanged"},
                           {"revision", t.revision},
                           {"rows", t.rows},
                           {"cells", t.cells}});
  }
  j["warnings"] = nlohmann::ordered_json::array();
  for (const auto& w : warnings) {
    j["warnings"].push_back({{"file", w.where.file},
                             {"line", w.where.line},
                             {"source_column", w.where.column},
                             {"message", w.message}});
  }
  j["cells_written"] = result.cells_written;
  io.out << j.dump(2) << "\n";
}

void PrintTable(const ImportOptions& o, const store::ImportResult& result, Format format, Io& io) {
  Tabular tab;
  tab.headers = {"file", "table", "witness", "result", "revision", "rows", "cells"};
  tab.right_aligned = {false, false, false, false, true, true, true};
  std::size_t fresh = 0;
  for (const auto& t : result.tables) {
    fresh += t.changed;
    tab.Add({t.source_file, t.table_id, t.siglum, t.changed ? "new revision" : "unchanged",
             std::to_string(t.revision), std::to_string(t.rows), std::to_string(t.cells)});
  }
  if (format == Format::kCsv) {
    io.out << tab.RenderCsv();
    return;
  }
  io.out << tab.RenderText() << "\n"
         << result.tables.size() << " table(s) into " << o.db << ": " << fresh
         << " new revision(s), " << result.tables.size() - fresh << " unchanged, "
         << result.cells_written << " cells written (argument cells included)\n";
}

void AddSheetOptions(po::options_description& options, ImportOptions& o) {
  Transcription& h = o.sheet.head;
  WitnessInfo& w = h.witness;
  options.add_options()("csv", po::value(&o.csv)->multitoken()->composing(),
                        "CSV sheet(s), each one witness's table")(
      "manifest", po::value(&o.manifest), "a sheet manifest naming sheets and their attributes")(
      "table", po::value(&h.table_id), "CSV: the table id (one sheet; default: the file name)")(
      "witness", po::value(&w.siglum), "CSV: the witness's siglum")(
      "work", po::value(&h.work.id), "CSV: the work id (default: the table id)")(
      "work-title", po::value(&h.work.title), "CSV: the work's title")(
      "library", po::value(&w.library), "CSV: the witness's library")(
      "shelfmark", po::value(&w.shelfmark), "CSV: the witness's shelfmark")(
      "date", po::value(&w.date), "CSV: the witness's date (1461, c. 1420, 1450-1475 ...)")(
      "script", po::value(&w.script), "CSV: the witness's numeral script")(
      "kind", po::value(&w.kind), "CSV: manuscript, print or modern-edition")(
      "title", po::value(&h.table_title), "CSV: the table's title")(
      "table-kind", po::value(&h.kind), "CSV: what the table tabulates (free text)")(
      "folios", po::value(&h.folios), "CSV: the folios of the table in the witness")(
      "hand", po::value(&h.hand), "CSV: the hand")(
      "step", po::value(&o.step), "CSV: the argument's step, or 'list' (taken as written)")(
      "start", po::value(&o.start), "CSV: the argument's first value")(
      "places", po::value(&o.places)->composing(), "CSV: N (every value column) or COLUMN=N")(
      "delimiter", po::value(&o.delimiter), "CSV: ',', ';' or tab (default: read off the header)")(
      "join", po::value(&o.joins)->composing(), "CSV: NAME=D+M[+S] joins columns into one value")(
      "keep-columns", po::bool_switch(&o.sheet.keep_columns),
      "CSV: keep degree/minute/second columns apart");
}

void AddLimitOptions(po::options_description& options, ImportOptions& o) {
  options.add_options()("max-file-mb", po::value(&o.max_file_mb),
                        "largest file read, in MB (default 512)")(
      "max-line-kb", po::value(&o.max_line_kb), "longest line read, in KB (default 1024)")(
      "scripts", po::value(&o.scripts), "folder of the numeral scripts witnesses may name")(
      "wait", po::value(&o.wait), "seconds to wait for another process writing (default 5)");
}

}  // namespace

int RunImport(const std::vector<std::string>& args, Io& io) {
  ImportOptions o;
  po::options_description options("options");
  AddDbOption(options, o.db);
  AddFormatOption(options, o.format, {"text", "csv", "json"});
  options.add_options()("file", po::value(&o.files)->composing(),
                        "transcription file(s) (also positional)");
  AddSheetOptions(options, o);
  AddLimitOptions(options, o);
  po::positional_options_description positional;
  positional.add("file", -1);
  po::variables_map vm;
  if (ParseOptions(FindCommand("import"), args, options, vm, io, &positional)) return kOk;
  if (!o.wait.empty()) SetWait(o.wait);

  const Sources sources = ListSources(o);
  std::vector<Diagnostic> warnings;
  const store::ImportResult result = ImportInto(
      o.db, [&](store::Database& db) { return ReadAndWrite(sources, o.sheet, db, warnings); });
  for (const auto& w : result.warnings) warnings.push_back(w);
  for (const auto& w : warnings) io.err << w.Render() << "\n";
  const Format format = ParseFormat(o.format);
  if (format == Format::kJson) {
    PrintJson(o, warnings, result, io);
  } else {
    PrintTable(o, result, format, io);
  }
  return warnings.empty() ? kOk : kFindings;
}

}  // namespace apograph::cli
