// apograph import: transcription files and CSV sheets into the edition
// database, all in one transaction.
#include "cli/command.hpp"

#include <ostream>

#include <nlohmann/json.hpp>

#include "store/edition_store.hpp"
#include "support/tabular.hpp"
#include "transcription/csv.hpp"
#include "transcription/parser.hpp"

namespace apograph::cli {

extern const char kImportUsage[] =
    "usage: apograph import FILE... [--db FILE] [--format text|csv|json]\n"
    "       apograph import --csv FILE --table ID --witness SIGLUM [--work ID]\n"
    "                       [--script NAME] [--places N] [--places COLUMN=N]...\n"
    "\n"
    "Reads every file first; only when all of them are free of errors are\n"
    "their tables written, in one transaction. A table whose content differs\n"
    "from its current revision gets a new revision (the earlier ones stay);\n"
    "an unchanged table adds nothing. On any error nothing is written and the\n"
    "exit code is 2. Warnings (duplicate or out-of-step arguments) are shown\n"
    "with their positions and give exit code 1.\n"
    "\n"
    "A CSV sheet holds one witness's table: a header row naming the argument\n"
    "and the value columns, then one row per entry in trade notation (empty =\n"
    "blank, ? = illegible). Places are read off the cells unless --places\n"
    "gives them (N for every value column, COLUMN=N for one).\n"
    "\n"
    "examples:\n"
    "  apograph import corpora/demo/*.apo --db harbour.sqlite\n"
    "  apograph import --csv sun.csv --table sun-eq --witness K --script hindu-arabic";

namespace {

struct ImportOptions {
  std::string db;
  std::string format;
  std::vector<std::string> files;
  std::string csv;
  std::string table;
  std::string witness;
  std::string work;
  std::string script;
  std::vector<std::string> places;
};

int ParsePlaces(const std::string& text, const std::string& whole) {
  std::size_t used = 0;
  int n = -1;
  try {
    n = std::stoi(text, &used);
  } catch (const std::exception&) {
    used = 0;
  }
  if (used != text.size() || n < 0 || n > Sexagesimal::kMaxPlaces) {
    throw InputError::ForOption(
        "--places", ExpectedFound("N or COLUMN=N with N from 0 to 12", "'" + whole + "'"));
  }
  return n;
}

CsvOptions MakeCsvOptions(const ImportOptions& o) {
  if (o.table.empty())
    throw InputError::ForOption("--table", "expected the table id of the CSV sheet, found none");
  if (o.witness.empty())
    throw InputError::ForOption("--witness", "expected the siglum of the CSV sheet, found none");
  CsvOptions c;
  c.table_id = o.table;
  c.siglum = o.witness;
  c.work_id = o.work;
  c.script = o.script;
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
  return c;
}

/// Reads every input; throws on the first error, before anything is written.
TranscriptionFile ReadAll(const ImportOptions& o) {
  TranscriptionFile all;
  auto take = [&all](TranscriptionFile f) {
    for (auto& t : f.tables) all.tables.push_back(std::move(t));
    for (auto& w : f.warnings) all.warnings.push_back(std::move(w));
  };
  for (const auto& f : o.files) take(ReadTranscriptionFile(f));
  if (!o.csv.empty()) {
    take(ReadCsvFile(o.csv, MakeCsvOptions(o)));
  } else if (!o.table.empty() || !o.witness.empty() || !o.places.empty() || !o.work.empty() ||
             !o.script.empty()) {
    throw InputError::ForOption(
        "--csv", "expected a CSV file for --table/--witness/--work/--script/--places, found none");
  }
  if (all.tables.empty()) {
    throw InputError::ForOption(
        "apograph import",
        "expected at least one FILE or --csv FILE, found none (see apograph import --help)");
  }
  return all;
}

void PrintJson(const ImportOptions& o, const TranscriptionFile& input,
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
  for (const auto& w : input.warnings) {
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

}  // namespace

int RunImport(const std::vector<std::string>& args, Io& io) {
  ImportOptions o;
  po::options_description options("options");
  AddDbOption(options, o.db);
  AddFormatOption(options, o.format, {"text", "csv", "json"});
  options.add_options()("file", po::value(&o.files)->composing(),
                        "transcription file(s) (also positional)")(
      "csv", po::value(&o.csv), "a CSV sheet holding one witness's table")(
      "table", po::value(&o.table), "CSV: the table id")("witness", po::value(&o.witness),
                                                         "CSV: the witness's siglum")(
      "work", po::value(&o.work), "CSV: the work id (default: the table id)")(
      "script", po::value(&o.script), "CSV: the witness's numeral script")(
      "places", po::value(&o.places)->composing(), "CSV: N (every value column) or COLUMN=N");
  po::positional_options_description positional;
  positional.add("file", -1);
  po::variables_map vm;
  if (ParseOptions(FindCommand("import"), args, options, vm, io, &positional)) return kOk;
  CheckChoice("--format", o.format, {"text", "csv", "json"});

  const TranscriptionFile input = ReadAll(o);
  for (const auto& w : input.warnings) io.err << w.Render() << "\n";
  store::Database db(o.db);
  const store::ImportResult result = store::Import(db, input.tables);
  const Format format = ParseFormat(o.format);
  if (format == Format::kJson) {
    PrintJson(o, input, result, io);
  } else {
    PrintTable(o, result, format, io);
  }
  return input.warnings.empty() ? kOk : kFindings;
}

}  // namespace apograph::cli
