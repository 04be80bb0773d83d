// apograph export: one witness's table (any revision) back as a
// transcription, a CSV sheet or JSON.
#include "cli/command.hpp"

#include <ostream>

#include <nlohmann/json.hpp>

#include "cli/output_files.hpp"
#include "store/edition_store.hpp"
#include "transcription/csv.hpp"
#include "transcription/writer.hpp"

namespace apograph::cli {

extern const char kExportUsage[] =
    "usage: apograph export --table ID --witness SIGLUM [--revision N]\n"
    "                       [--format transcription|csv|json] [--output FILE [--force]]\n"
    "                       [--db FILE]\n"
    "\n"
    "Writes one witness's copy of a table as stored: the current revision, or\n"
    "revision N. The transcription format re-imports to identical content\n"
    "(cells, readings, marks, metadata); CSV holds the readings only; JSON\n"
    "holds everything, with each cell's exact value and provenance. --output never\n"
    "writes over the edition database, nor over an existing file without --force.\n"
    "\n"
    "examples:\n"
    "  apograph export --table sun-eq --witness D > sun-eq-D.apo\n"
    "  apograph export --table sun-eq --witness D --revision 1 --format json --output d1.json";

namespace {

nlohmann::ordered_json ValueJson(const std::optional<Sexagesimal>& v) {
  return v ? nlohmann::ordered_json(v->ToString()) : nlohmann::ordered_json(nullptr);
}

nlohmann::ordered_json CellJson(const Cell& c) {
  return {{"raw", c.raw},
          {"value", ValueJson(c.value)},
          {"decimal",
           c.value ? nlohmann::ordered_json(c.value->ToDouble()) : nlohmann::ordered_json(nullptr)},
          {"places", c.places},
          {"state", ToString(c.state)},
          {"damaged", c.damaged},
          {"doubtful", c.doubtful},
          {"addition", ToString(c.addition)},
          {"corrected_from", c.corrected_from ? nlohmann::ordered_json(*c.corrected_from)
                                              : nlohmann::ordered_json(nullptr)},
          {"note", c.note},
          {"line", c.line},
          {"source_column", c.column}};  // `column` names a value column elsewhere
}

nlohmann::ordered_json ArgumentJson(const ArgumentSpec& a) {
  return {{"name", a.name},
          {"unit", a.unit},
          {"places", a.places},
          {"start", ValueJson(a.start)},
          {"step", ValueJson(a.step)},
          {"listed", a.listed}};
}

nlohmann::ordered_json TranscriptionJson(const Transcription& t, int revision) {
  nlohmann::ordered_json j = {
      {"table", t.table_id},
      {"title", t.table_title},
      {"kind", t.kind},
      {"work", t.work.id},
      {"work_title", t.work.title},
      {"work_author", t.work.author},
      {"witness", t.witness.siglum},
      {"library", t.witness.library},
      {"shelfmark", t.witness.shelfmark},
      {"date", t.witness.date},
      {"script", t.witness.script},
      {"witness_kind", ToString(t.witness.Kind())},
      {"witness_note", t.witness.note},
      {"folios", t.folios},
      {"hand", t.hand},
      {"revision", revision},
      {"source_file", t.source_file},
      {"argument", ArgumentJson(t.argument)},
      {"argument2", t.argument2 ? ArgumentJson(*t.argument2) : nlohmann::ordered_json(nullptr)}};
  j["columns"] = nlohmann::ordered_json::array();
  for (const auto& c : t.columns) {
    j["columns"].push_back({{"name", c.name},
                            {"unit", c.unit},
                            {"places", c.places},
                            {"title", c.title},
                            {"arg2", ValueJson(c.arg2)}});
  }
  j["rows"] = nlohmann::ordered_json::array();
  for (const auto& r : t.rows) {
    nlohmann::ordered_json cells = nlohmann::ordered_json::array();
    for (const auto& c : r.cells) cells.push_back(CellJson(c));
    j["rows"].push_back({{"line", r.line}, {"argument", CellJson(r.argument)}, {"cells", cells}});
  }
  return j;
}

}  // namespace

int RunExport(const std::vector<std::string>& args, Io& io) {
  std::string db_path, format, table, witness, output;
  int revision = 0;
  po::options_description options("options");
  AddDbOption(options, db_path);
  options.add_options()("table", po::value(&table)->required(), "the table id")(
      "witness", po::value(&witness)->required(), "the witness's siglum")(
      "revision", po::value(&revision), "revision number (default: the current one)")(
      "output", po::value(&output), "write to FILE instead of standard output")(
      "force", "replace an existing --output file");
  AddFormatOption(options, format, {"transcription", "csv", "json"});
  po::variables_map vm;
  if (ParseOptions(FindCommand("export"), args, options, vm, io)) return kOk;
  if (vm.count("revision") && revision < 1) {
    throw InputError::ForOption(
        "--revision", ExpectedFound("a revision number from 1", std::to_string(revision)));
  }
  const OutputRules rules{"--output", db_path, vm.count("force") > 0, {}};
  if (!output.empty()) CheckOutputFile(output, rules);
  store::Database db = OpenEdition(db_path);
  const std::optional<int> wanted =
      vm.count("revision") ? std::optional<int>(revision) : std::nullopt;
  const Transcription t = store::Load(db, table, witness, wanted);
  std::string text;
  if (format == "csv") {
    text = WriteCsv(t);
  } else if (format == "json") {
    const int number = wanted ? *wanted : store::CurrentRevision(db, table, witness);
    text = TranscriptionJson(t, number).dump(2) + "\n";
  } else {
    text = WriteTranscription(t);
  }
  if (output.empty()) {
    io.out << text;
  } else {
    WriteOutputFile(output, text, rules);
  }
  return kOk;
}

}  // namespace apograph::cli
