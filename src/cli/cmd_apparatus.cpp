// apograph apparatus: the edited table with its apparatus of variants, and
// the editor's overrides of adopted readings.
#include "cli/command.hpp"

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <optional>
#include <ostream>

#include "cli/collate_input.hpp"
#include "cli/output_files.hpp"
#include "lineage/lineage.hpp"
#include "lineage/parsimony.hpp"
#include "pipeline/analysis.hpp"
#include "pipeline/decisions.hpp"
#include "publish/apparatus.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {

extern const char kApparatusUsage[] =
    "usage: apograph apparatus --table ID [--format tei|latex|csv|text] [--fragment] [--output "
    "FILE [--force]]\n"
    "                          [--override ROW:COLUMN=READING]... [--withdraw ROW:COLUMN]... "
    "[--note TEXT]\n"
    "                          [--editor NAME] [--witnesses A,B,...] [--db FILE]\n"
    "                          [(--model NAME | --formula TEXT) [--param N=V]... [practice "
    "options] | --auto]\n\n"
    "Writes the edited table: for every cell the adopted reading (the editor's override or\n"
    "conjecture, else a reading the editor accepted as an emendation, else the reading of\n"
    "most independent branches of the parsimony stemma that is not an error; where every\n"
    "witness errs, the restoration by recomputation marked as a conjecture) and the other\n"
    "readings with their sigla and the cause of each error, the editorial marks of the\n"
    "transcriptions, miswritten arguments and each witness's folios. --fragment writes\n"
    "LaTeX to \\input into a book (no preamble); the document mode uses vector fonts.\n"
    "--override records the editor's reading for a cell (ROW is the row's argument,\n"
    "COLUMN the column's name) and --withdraw withdraws it, as apograph emendation\n"
    "override and undo do; --note gives the reason (for every decision of this call),\n"
    "--editor who decides (else APOGRAPH_EDITOR, else the login name). A READING is\n"
    "read like a transcription's cell and must have the column's places.\n"
    "Which readings are errors: see apograph collate --help (--auto or a model judges\n"
    "them by the explained deviations); the editor's decisions take precedence.\n\n"
    "example: apograph apparatus --table decl --override '46:declination=16;41,57' --note \"all "
    "witnesses err\"\n"
    "         apograph apparatus --table sun-eq --auto --format tei --output sun-eq.xml";

namespace {

// ROW:COLUMN[=READING]: the row is everything before the last ':' of the left side.
pipeline::DecisionRequest ParseDecision(const std::string& option, const std::string& text,
                                        bool with_reading, const std::string& table) {
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
  pipeline::DecisionRequest r;
  r.action = with_reading ? pipeline::Action::kOverride : pipeline::Action::kUndo;
  r.target.table_id = table;
  r.target.arg = cell.substr(0, colon);
  r.target.column = cell.substr(colon + 1);
  r.target.option = option;
  if (with_reading) r.reading = text.substr(eq + 1);
  return r;
}

std::vector<std::vector<std::string>> Branches(const collate::Collation& c) {
  return pipeline::Branches(lineage::Parsimony(lineage::BuildErrorCharacters(c)).stemma);
}

std::string Render(const publish::Apparatus& a, const std::string& format, bool fragment) {
  if (format == "tei") return publish::ToTei(a);
  if (format == "latex") return publish::ToLatex(a, {fragment});
  if (format == "csv") return publish::ToCsv(a);
  return publish::ToText(a);
}

}  // namespace

int RunApparatus(const std::vector<std::string>& args, Io& io) {
  po::options_description options("options");
  CollateRequest request;
  std::string format, db_path, output, note, editor;
  bool fragment = false;
  std::vector<std::string> overrides, withdrawals;
  options.add_options()("table", po::value(&request.table)->required(), "table id")(
      "output", po::value(&output), "write to this file instead of standard output")(
      "fragment", po::bool_switch(&fragment), "LaTeX to \\input into a book (no preamble)")(
      "force", "replace an existing --output file")(
      "override", po::value(&overrides)->composing(),
      "ROW:COLUMN=READING: the editor's reading (repeatable)")(
      "withdraw", po::value(&withdrawals)->composing(),
      "ROW:COLUMN: withdraw an override (repeatable)")(
      "note", po::value(&note), "the editor's reason for the decisions of this call")(
      "editor", po::value(&editor), "who decides (default: APOGRAPH_EDITOR, else the login name)");
  AddCollateOptions(options, request);
  AddFormatOption(options, format, {"text", "tei", "latex", "csv"});
  AddDbOption(options, db_path);
  po::variables_map vm;
  if (ParseOptions(FindCommand("apparatus"), args, options, vm, io)) return kOk;
  FinishCollateRequest(request, vm);
  const OutputRules rules{"--output", db_path, vm.count("force") > 0, {}};
  if (!output.empty()) CheckOutputFile(output, rules);  // before anything is stored
  const std::string who = pipeline::DefaultEditor(editor);
  std::vector<pipeline::DecisionRequest> pending;
  for (const auto& o : overrides)
    pending.push_back(ParseDecision("--override", o, true, request.table));
  for (const auto& w : withdrawals)
    pending.push_back(ParseDecision("--withdraw", w, false, request.table));
  for (auto& p : pending) p.editor = who, p.note = note;
  store::Database db = OpenEdition(db_path);
  // The decisions are held in one transaction until the output is written:
  // a failed write (disk full, a folder that vanished) leaves nothing stored.
  std::optional<store::Transaction> hold;
  if (!pending.empty()) {
    hold.emplace(db);
    pipeline::DecideAll(db, pending);  // checked, then written at once
  }
  const auto table = CollateTableFromDb(db, request);
  publish::ApparatusOptions ao;
  ao.branches = Branches(table.collation);
  ao.overrides = publish::OverridesFrom(table.decisions);
  ao.transcriptions = &table.transcriptions;
  ao.editors = table.decisions.Editors();
  if (std::find(ao.editors.begin(), ao.editors.end(), who) == ao.editors.end())
    ao.editors.insert(ao.editors.begin(), who);
  const std::string text = Render(publish::BuildApparatus(table.collation, ao), format, fragment);
  if (output.empty()) {
    io.out << text;
  } else {
    WriteOutputFile(output, text, rules);
    io.err << "wrote " << output << "\n";
  }
  if (hold) hold->Commit();
  return kOk;
}

}  // namespace apograph::cli
