// apograph emendation: list the proposed emendations; accept or reject one
// (the editor's act, recorded with its time and note).
#include <cstdio>
#include <filesystem>
#include <ostream>

#include <nlohmann/json.hpp>

#include "cli/command.hpp"
#include "store/deviation_store.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kEmendationUsage[] =
    "usage: apograph emendation list [--table ID] [--witness SIGLUM] [--status "
    "proposed|accepted|rejected]\n"
    "                                [--format text|csv|json] [--db FILE]\n"
    "       apograph emendation accept ID [--note TEXT] [--db FILE]\n"
    "       apograph emendation reject ID [--note TEXT] [--db FILE]\n"
    "\n"
    "The emendations `apograph errors` proposed, with their evidence, and the\n"
    "editor's decisions. Accepting or rejecting is the editor's act: it is\n"
    "recorded with the time and the note; a later decision replaces it.\n"
    "\n"
    "example: apograph emendation accept 12 --note \"B and C agree with the emendation\"";

namespace {

nlohmann::json RecordJson(const store::EmendationRecord& r) {
  return {{"id", r.id},
          {"table", r.table_id},
          {"witness", r.siglum},
          {"revision", r.revision},
          {"row", r.row + 1},
          {"arg", r.arg},
          {"column", r.column_name},
          {"tabulated", r.tabulated},
          {"proposed", r.proposed},
          {"class", r.cls},
          {"evidence", r.evidence},
          {"score", r.score},
          {"model", r.model},
          {"finding", r.finding ? nlohmann::json(*r.finding) : nlohmann::json(nullptr)},
          {"status", r.status},
          {"proposed_at", r.proposed_at},
          {"decided_at", r.decided_at ? nlohmann::json(*r.decided_at) : nlohmann::json(nullptr)},
          {"note", r.editor_note}};
}

int List(store::Database& db, const store::EmendationFilter& filter, const std::string& format,
         Io& io) {
  const auto records = store::ListEmendations(db, filter);
  const Format f = ParseFormat(format);
  if (f == Format::kJson) {
    nlohmann::json j = {{"emendations", nlohmann::json::array()}};
    for (const auto& r : records) j["emendations"].push_back(RecordJson(r));
    io.out << j.dump(2) << "\n";
    return kOk;
  }
  Tabular tab;
  tab.headers = {"id",       "table", "witness", "rev",    "arg",      "column", "tabulated",
                 "proposed", "class", "score",   "status", "evidence", "note"};
  tab.right_aligned = {true, false, false, true,  true,  false, true,
                       true, false, true,  false, false, false};
  for (const auto& r : records) {
    char score[16];
    std::snprintf(score, sizeof score, "%.2f", r.score);
    std::string id = std::to_string(r.id);
    if (r.finding) id += " (run " + std::to_string(*r.finding) + ")";
    tab.Add({id, r.table_id, r.siglum, std::to_string(r.revision), r.arg, r.column_name,
             r.tabulated, r.proposed, r.cls, score, r.status, r.evidence, r.editor_note});
  }
  io.out << (f == Format::kCsv ? tab.RenderCsv() : tab.RenderText());
  return kOk;
}

}  // namespace

int RunEmendation(const std::vector<std::string>& args, Io& io) {
  std::string db_path, action, table, witness, status, note, format;
  std::int64_t id = 0;
  po::options_description options("options");
  options.add_options()("action", po::value(&action)->required(), "list, accept or reject")(
      "id", po::value(&id), "the emendation to accept or reject")(
      "table", po::value(&table), "list: only this table")("witness", po::value(&witness),
                                                           "list: only this witness")(
      "status", po::value(&status), "list: only proposed, accepted or rejected")(
      "note", po::value(&note)->default_value(""), "accept/reject: the editor's note");
  AddFormatOption(options, format, {"text", "csv", "json"});
  AddDbOption(options, db_path);
  po::positional_options_description positional;
  positional.add("action", 1).add("id", 1);
  po::variables_map vm;
  if (ParseOptions(FindCommand("emendation"), args, options, vm, io, &positional)) return kOk;
  CheckChoice("action", action, {"list", "accept", "reject"});
  CheckChoice("--format", format, {"text", "csv", "json"});
  if (!status.empty()) CheckChoice("--status", status, {"proposed", "accepted", "rejected"});
  store::Database db = OpenEdition(db_path);
  if (action == "list") {
    store::EmendationFilter filter;
    if (!table.empty()) filter.table_id = table;
    if (!witness.empty()) filter.siglum = witness;
    if (!status.empty()) filter.status = status;
    return List(db, filter, format, io);
  }
  if (!vm.count("id"))
    throw InputError::ForOption("apograph emendation " + action,
                                "expected the id of an emendation, found none");
  const auto r =
      store::DecideEmendation(db, id, action == "accept" ? "accepted" : "rejected", note);
  io.out << "emendation " << r.id << " " << r.status << ": " << r.arg << " " << r.column_name << " "
         << r.tabulated << " " << r.siglum << "] " << r.proposed
         << (r.editor_note.empty() ? "" : " (" + r.editor_note + ")") << "\n";
  return kOk;
}

}  // namespace apograph::cli
