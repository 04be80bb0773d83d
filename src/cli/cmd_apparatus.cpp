// apograph apparatus: the edited table with its apparatus of variants, and
// the editor's overrides of adopted readings.
#include "cli/command.hpp"

#include <ostream>

#include "cli/collate_input.hpp"
#include "cli/output_files.hpp"
#include "lineage/lineage.hpp"
#include "pipeline/analysis.hpp"
#include "publish/apparatus.hpp"
#include "store/apparatus_store.hpp"
#include "support/input_error.hpp"
#include "transcription/editor_value.hpp"

namespace apograph::cli {

extern const char kApparatusUsage[] =
    "usage: apograph apparatus --table ID [--format tei|latex|csv|text] [--output FILE [--force]]\n"
    "                          [--override ROW:COLUMN=READING]... [--withdraw ROW:COLUMN]... "
    "[--note TEXT]\n"
    "                          [--witnesses A,B,...] [--db FILE]\n"
    "                          [(--model NAME | --formula TEXT) [--param N=V]... [practice "
    "options] | --auto]\n\n"
    "Writes the edited table: for every cell the adopted reading (the reading of most\n"
    "independent branches of the parsimony stemma that is not an error; an editor's\n"
    "override wins) and the variant readings with their sigla.\n"
    "--override records the editor's reading for a cell (ROW is the row's argument,\n"
    "COLUMN the column's name); --withdraw removes an override; --note gives the reason\n"
    "(for every override of this call). A READING is read like a transcription's cell\n"
    "and must have the column's places. Decisions are kept in the database with their\n"
    "history (table apparatus_decision, view apparatus_override).\n"
    "Which readings are errors: see apograph collate --help (--auto or a model judges\n"
    "them by the explained deviations).\n\n"
    "example: apograph apparatus --table decl --override '46:declination=16;41,57' --note \"all "
    "witnesses err\"\n"
    "         apograph apparatus --table sun-eq --auto --format tei --output sun-eq.xml";

namespace {

/// The reading of an override, checked like a transcription's cell of its
/// column (an unknown column is left to BuildApparatus, which names it).
std::string CheckedReading(const std::string& text, const std::string& column,
                           const collate::Collation& c) {
  for (const auto& k : c.columns) {
    if (k.name == column) return ParseEditorReading("--override", text, k.places);
  }
  return text;
}

// ROW:COLUMN[=READING]: the row is everything before the last ':' of the left side.
store::ApparatusDecision ParseDecision(const std::string& option, const std::string& text,
                                       bool with_reading, const collate::Collation& c,
                                       const std::string& note) {
  const auto eq = text.find('=');
  const std::string cell = with_reading ? text.substr(0, eq) : text;
  const auto colon = cell.rfind(':');
  const bool ok = colon != std::string::npos && colon > 0 && colon + 1 < cell.size() &&
                  (!with_reading || (eq != std::string::npos && eq + 1 < text.size()));
  if (!ok) {
    throw InputError::ForOption(
        option,
        ExpectedFound(with_reading ? "ROW:COLUMN=READING" : "ROW:COLUMN", "'" + text + "'"));
  }
  const std::string row = cell.substr(0, colon);
  auto v = Sexagesimal::Parse(row);
  if (!v)
    throw InputError::ForOption(option,
                                ExpectedFound("a row argument in trade notation", "'" + row + "'"));
  const std::string column = cell.substr(colon + 1);
  const std::string reading = with_reading ? CheckedReading(text.substr(eq + 1), column, c) : "";
  return {c.table_id, v->ToString(), column, reading, note, ""};
}

std::vector<std::vector<std::string>> Branches(const collate::Collation& c) {
  return pipeline::Branches(lineage::Parsimony(lineage::BuildErrorCharacters(c)).stemma);
}

std::vector<publish::Override> Overrides(const std::vector<store::ApparatusDecision>& ds) {
  std::vector<publish::Override> out;
  for (const auto& d : ds) {
    if (!d.reading.empty()) out.push_back({d.row_argument, d.column, d.reading, d.note});
  }
  return out;
}

// Pending decisions applied over the stored ones (for validation before writing).
std::vector<store::ApparatusDecision> Merged(std::vector<store::ApparatusDecision> stored,
                                             const std::vector<store::ApparatusDecision>& pending) {
  for (const auto& p : pending) {
    std::erase_if(stored, [&](const auto& s) {
      return s.row_argument == p.row_argument && s.column == p.column;
    });
    stored.push_back(p);
  }
  return stored;
}

}  // namespace

int RunApparatus(const std::vector<std::string>& args, Io& io) {
  po::options_description options("options");
  CollateRequest request;
  std::string format, db_path, output, note;
  std::vector<std::string> overrides, withdrawals;
  options.add_options()("table", po::value(&request.table)->required(), "table id")(
      "output", po::value(&output), "write to this file instead of standard output")(
      "force", "replace an existing --output file")(
      "override", po::value(&overrides)->composing(),
      "ROW:COLUMN=READING: the editor's reading (repeatable)")(
      "withdraw", po::value(&withdrawals)->composing(),
      "ROW:COLUMN: withdraw an override (repeatable)")(
      "note", po::value(&note), "the editor's reason for the overrides of this call");
  AddCollateOptions(options, request);
  AddFormatOption(options, format, {"text", "tei", "latex", "csv"});
  AddDbOption(options, db_path);
  po::variables_map vm;
  if (ParseOptions(FindCommand("apparatus"), args, options, vm, io)) return kOk;
  FinishCollateRequest(request, vm);
  CheckChoice("--format", format, {"text", "tei", "latex", "csv"});
  const OutputRules rules{"--output", db_path, vm.count("force") > 0, {}};
  if (!output.empty()) CheckOutputFile(output, rules);  // before anything is computed or stored
  store::Database db = OpenEdition(db_path);
  const auto collation = CollateFromDb(db, request);
  std::vector<store::ApparatusDecision> pending;
  for (const auto& o : overrides)
    pending.push_back(ParseDecision("--override", o, true, collation, note));
  for (const auto& w : withdrawals)
    pending.push_back(ParseDecision("--withdraw", w, false, collation, note));
  const auto decisions = Merged(store::LoadApparatusOverrides(db, request.table), pending);
  // Built before anything is written: a bad row or column stops here.
  const auto apparatus =
      publish::BuildApparatus(collation, Branches(collation), Overrides(decisions));
  std::string text = format == "tei"     ? publish::ToTei(apparatus)
                     : format == "latex" ? publish::ToLatex(apparatus)
                     : format == "csv"   ? publish::ToCsv(apparatus)
                                         : publish::ToText(apparatus);
  if (!output.empty()) {  // the file first: a failed write stores no decision
    WriteOutputFile(output, text, rules);
    io.err << "wrote " << output << "\n";
  }
  if (!pending.empty()) store::SaveApparatusDecisions(db, pending);
  if (output.empty()) io.out << text;
  return kOk;
}

}  // namespace apograph::cli
