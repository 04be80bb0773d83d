// apograph emendation: the findings apograph errors proposed and the
// editor's decisions on them and on the edited table's cells. All the
// deciding is pipeline/decisions.hpp's; this file reads options and prints.
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <ostream>

#include <nlohmann/json.hpp>

#include "cli/command.hpp"
#include "pipeline/decisions.hpp"
#include "store/decision_store.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kEmendationUsage[] =
    "usage: apograph emendation list [--table ID] [--witness SIGLUM]\n"
    "                                [--status proposed|accepted|rejected|review|superseded]\n"
    "       apograph emendation accept ID [--note TEXT]\n"
    "       apograph emendation reject ID [--note TEXT]\n"
    "       apograph emendation override --table ID --cell ARG:COLUMN --reading R [--note TEXT]\n"
    "       apograph emendation conjecture --table ID --cell ARG:COLUMN --reading R [--note "
    "TEXT]\n"
    "       apograph emendation undo (ID | --table ID --cell ARG:COLUMN | --decision N) [--note "
    "TEXT]\n"
    "       apograph emendation log [--table ID]\n"
    "  every form: [--editor NAME] [--expect STATE] [--format text|csv|json] [--db FILE]\n"
    "\n"
    "The findings apograph errors proposed (a proposed emendation of a witness's cell,\n"
    "or a whole displaced run), with their status, and the editor's decisions. Deciding\n"
    "is the editor's act: accept adopts the proposed readings (the witness's are\n"
    "errors), reject keeps the witness's readings; a run is decided as one. override\n"
    "adopts a reading for a cell of the edited table, conjecture restores one no witness\n"
    "has; undo withdraws the decision in force. Every decision is recorded with the\n"
    "editor (--editor, else APOGRAPH_EDITOR, else the login name), the time and the\n"
    "note, and report, apparatus, collate and stemma follow it. A decision carries over\n"
    "to a new revision of the transcription where the cell reads the same, and is listed\n"
    "for review where it changed. --expect STATE (the state column of list) refuses the\n"
    "decision if someone decided in between. log lists every decision.\n"
    "\n"
    "example: apograph emendation accept 12 --note \"B and C agree with the emendation\"\n"
    "         apograph emendation conjecture --table decl --cell '46:declination' --reading "
    "'16;41,57'";

namespace {

using nlohmann::json;

struct EmendationOptions {
  std::string db, action, table, witness, status, note, format, cell, reading, editor, expect;
  std::int64_t id = 0;
  std::int64_t decision = 0;
};

json Nullable(const std::string& s) { return s.empty() ? json(nullptr) : json(s); }

json DecisionJson(const pipeline::Decision& d) {
  json cells = json::array();
  for (const auto& c : d.cells) {
    cells.push_back({{"witness", c.witness},
                     {"column", c.column},
                     {"arg", c.arg},
                     {"reading", c.reading},
                     {"proposed", c.proposed}});
  }
  return {{"id", d.id},
          {"table", d.table_id},
          {"action", pipeline::ToString(d.action)},
          {"editor", d.editor},
          {"decided_at", d.decided_at},
          {"note", d.note},
          {"witness", Nullable(d.witness)},
          {"revision", d.revision ? json(*d.revision) : json(nullptr)},
          {"finding", d.finding ? json(*d.finding) : json(nullptr)},
          {"arg", Nullable(d.arg)},
          {"column", Nullable(d.column)},
          {"reading", Nullable(d.reading)},
          {"undoes", d.undoes ? json(*d.undoes) : json(nullptr)},
          {"withdrawn_by", d.withdrawn_by ? json(*d.withdrawn_by) : json(nullptr)},
          {"cells", cells}};
}

json CellJson(const pipeline::FindingState& f, const pipeline::FindingCell& c) {
  const auto& d = f.decision;
  return {{"id", c.emendation},
          {"finding", f.id},
          {"table", f.table_id},
          {"witness", f.witness},
          {"revision", f.revision},
          {"row", c.row + 1},
          {"arg", c.arg},
          {"written_arg", c.written_arg},
          {"column", f.column},
          {"tabulated", c.tabulated},
          {"proposed", c.proposed},
          {"class", f.cls},
          {"evidence", f.evidence},
          {"score", std::round(f.score * 100) / 100},
          {"model", f.model},
          {"status", pipeline::ToString(f.status)},
          {"state", f.state},
          {"proposed_at", f.proposed_at},
          {"decision", d ? json(d->id) : json(nullptr)},
          {"editor", d ? json(d->editor) : json(nullptr)},
          {"decided_at", d ? json(d->decided_at) : json(nullptr)},
          {"note", d ? d->note : ""},
          {"decided_on_revision", d && d->revision ? json(*d->revision) : json(nullptr)},
          {"carried", f.carried},
          {"review", f.review},
          {"current_reading", c.now ? json(*c.now) : json(nullptr)}};
}

json EditedJson(const pipeline::EditedCellDecision& e) {
  return {{"table", e.table_id},
          {"arg", e.arg},
          {"column", e.column},
          {"reading", e.reading},
          {"action", pipeline::ToString(e.decision.action)},
          {"decision", e.decision.id},
          {"editor", e.decision.editor},
          {"decided_at", e.decision.decided_at},
          {"note", e.decision.note},
          {"state", e.state}};
}

std::string Args(const pipeline::FindingState& f) {
  if (f.cells.size() == 1) return f.cells.front().arg;
  return f.cells.front().arg + "-" + f.cells.back().arg;
}

std::string Readings(const pipeline::FindingState& f, bool proposed) {
  std::string out;
  for (const auto& c : f.cells)
    out += (out.empty() ? "" : " ") + (proposed ? c.proposed : c.tabulated);
  return out;
}

std::string DecisionText(const pipeline::FindingState& f) {
  std::string out;
  if (f.decision) {
    out = f.decision->editor + " " + f.decision->decided_at.substr(0, 10);
    if (f.carried && f.decision->revision)
      out += " (revision " + std::to_string(*f.decision->revision) + ")";
    if (!f.decision->note.empty()) out += ": " + f.decision->note;
  }
  if (!f.review.empty()) out += (out.empty() ? "" : "; ") + f.review;
  return out;
}

std::vector<std::string> Tables(store::Database& db, const EmendationOptions& o) {
  if (!o.table.empty()) return {o.table};
  return store::TablesWithDecisions(db);
}

int List(store::Database& db, const EmendationOptions& o, Io& io) {
  pipeline::FindingFilter filter;
  if (!o.table.empty()) filter.table_id = o.table;
  if (!o.witness.empty()) filter.witness = o.witness;
  for (auto s : {pipeline::FindingStatus::kProposed, pipeline::FindingStatus::kAccepted,
                 pipeline::FindingStatus::kRejected, pipeline::FindingStatus::kReview,
                 pipeline::FindingStatus::kSuperseded}) {
    if (o.status == pipeline::ToString(s)) filter.status = s;
  }
  const auto findings = pipeline::ListFindings(db, filter);
  std::vector<pipeline::EditedCellDecision> edited;
  if (o.witness.empty() && o.status.empty()) {
    for (const auto& t : Tables(db, o)) {
      for (auto& e : pipeline::ListEditedCells(db, t)) edited.push_back(std::move(e));
    }
  }
  const Format f = ParseFormat(o.format);
  if (f == Format::kJson) {
    json j = {{"emendations", json::array()}, {"edited", json::array()}};
    for (const auto& x : findings) {
      for (const auto& c : x.cells) j["emendations"].push_back(CellJson(x, c));
    }
    for (const auto& e : edited) j["edited"].push_back(EditedJson(e));
    io.out << j.dump(2) << "\n";
    return kOk;
  }
  Tabular tab;
  tab.headers = {"id",       "table", "witness", "rev",   "arg",     "column",  "tabulated",
                 "proposed", "class", "score",   "state", "decided", "evidence"};
  for (const auto& x : findings) {
    char score[16];
    std::snprintf(score, sizeof score, "%.2f", x.score);
    tab.Add({std::to_string(x.id), x.table_id, x.witness, std::to_string(x.revision), Args(x),
             x.column, Readings(x, false), Readings(x, true), x.cls, score, x.state,
             DecisionText(x), x.evidence});
  }
  for (const auto& e : edited) {
    tab.Add({"-", e.table_id, "", "", e.arg, e.column, "", e.reading,
             pipeline::ToString(e.decision.action), "", e.state,
             e.decision.editor + " " + e.decision.decided_at.substr(0, 10) +
                 (e.decision.note.empty() ? "" : ": " + e.decision.note),
             "the edited table's reading"});
  }
  io.out << (f == Format::kCsv ? tab.RenderCsv() : tab.RenderText());
  return kOk;
}

int Log(store::Database& db, const EmendationOptions& o, Io& io) {
  std::vector<pipeline::Decision> all;
  for (const auto& t : Tables(db, o)) {
    for (auto& d : pipeline::DecisionLog(db, t)) all.push_back(std::move(d));
  }
  if (ParseFormat(o.format) == Format::kJson) {
    json j = {{"decisions", json::array()}};
    for (const auto& d : all) j["decisions"].push_back(DecisionJson(d));
    io.out << j.dump(2) << "\n";
    return kOk;
  }
  Tabular tab;
  tab.headers = {"decision", "table", "action", "editor", "decided_at", "on", "note"};
  for (const auto& d : all) {
    std::string on = d.undoes ? "decision " + std::to_string(*d.undoes)
                     : d.finding
                         ? "emendation " + std::to_string(*d.finding) + " (" + d.witness + ")"
                         : d.arg + ":" + d.column + " = " + d.reading;
    if (d.withdrawn_by) on += " [withdrawn by " + std::to_string(*d.withdrawn_by) + "]";
    tab.Add({std::to_string(d.id), d.table_id, pipeline::ToString(d.action), d.editor, d.decided_at,
             on, d.note});
  }
  io.out << (ParseFormat(o.format) == Format::kCsv ? tab.RenderCsv() : tab.RenderText());
  return kOk;
}

/// ARG:COLUMN, the argument being everything before the last ':'.
void ParseCell(const std::string& text, pipeline::DecisionTarget& t) {
  const auto colon = text.rfind(':');
  if (colon == std::string::npos || colon == 0 || colon + 1 == text.size())
    throw InputError::ForOption("--cell", ExpectedFound("ARG:COLUMN", "'" + text + "'"));
  t.arg = text.substr(0, colon);
  t.column = text.substr(colon + 1);
}

pipeline::DecisionRequest Request(const EmendationOptions& o, const po::variables_map& vm) {
  pipeline::DecisionRequest r;
  r.action = *pipeline::ActionFromString(o.action);
  r.editor = pipeline::DefaultEditor(o.editor);
  r.note = o.note;
  r.reading = o.reading;
  if (!o.expect.empty()) r.expected_state = o.expect;
  if (vm.count("id")) r.target.emendation = o.id;
  if (vm.count("decision")) r.target.decision = o.decision;
  r.target.table_id = o.table;
  const bool on_cell =
      r.action == pipeline::Action::kOverride || r.action == pipeline::Action::kConjecture ||
      (r.action == pipeline::Action::kUndo && !vm.count("id") && !vm.count("decision"));
  if (on_cell) {
    if (o.table.empty() || o.cell.empty())
      throw InputError::ForOption("apograph emendation " + o.action,
                                  "expected --table and --cell ARG:COLUMN, found " +
                                      std::string(o.table.empty() ? "no --table" : "no --cell"));
    ParseCell(o.cell, r.target);
  }
  const bool needs_reading =
      r.action == pipeline::Action::kOverride || r.action == pipeline::Action::kConjecture;
  if (needs_reading && o.reading.empty())
    throw InputError::ForOption("--reading", "expected the reading to adopt, found none");
  if ((r.action == pipeline::Action::kAccept || r.action == pipeline::Action::kReject) &&
      !vm.count("id"))
    throw InputError::ForOption("apograph emendation " + o.action,
                                "expected the id of an emendation, found none");
  return r;
}

void PrintDecision(const pipeline::Decision& d, const EmendationOptions& o, Io& io) {
  if (ParseFormat(o.format) == Format::kJson) {
    io.out << json({{"decision", DecisionJson(d)}}).dump(2) << "\n";
    return;
  }
  io.out << "decision " << d.id << ": " << pipeline::ToString(d.action) << " by " << d.editor
         << " at " << d.decided_at;
  if (d.finding) io.out << ", emendation " << *d.finding << " of " << d.witness;
  if (!d.reading.empty()) io.out << ", " << d.arg << " " << d.column << " = " << d.reading;
  if (d.undoes) io.out << ", withdrawing decision " << *d.undoes;
  for (const auto& c : d.cells)
    io.out << "\n  " << c.arg << " " << c.column << ": " << c.reading << " " << c.witness << "] "
           << c.proposed;
  io.out << (d.note.empty() ? "" : "\n  note: " + d.note) << "\n";
}

}  // namespace

int RunEmendation(const std::vector<std::string>& args, Io& io) {
  EmendationOptions o;
  po::options_description options("options");
  options.add_options()("action", po::value(&o.action)->required(),
                        "list, accept, reject, override, conjecture, undo or log")(
      "id", po::value(&o.id), "the emendation decided on")(
      "table", po::value(&o.table), "the table")("witness", po::value(&o.witness),
                                                 "list: only this witness")(
      "status", po::value(&o.status), "list: only findings with this status")(
      "cell", po::value(&o.cell), "ARG:COLUMN: a cell of the edited table")(
      "reading", po::value(&o.reading), "override, conjecture: the reading adopted")(
      "decision", po::value(&o.decision), "undo: the decision to withdraw")(
      "note", po::value(&o.note)->default_value(""), "why: the editor's note")(
      "editor", po::value(&o.editor), "who decides (default: APOGRAPH_EDITOR, else the login)")(
      "expect", po::value(&o.expect), "refuse unless the target is in this state (see list)");
  AddFormatOption(options, o.format, {"text", "csv", "json"});
  AddDbOption(options, o.db);
  po::positional_options_description positional;
  positional.add("action", 1).add("id", 1);
  po::variables_map vm;
  if (ParseOptions(FindCommand("emendation"), args, options, vm, io, &positional)) return kOk;
  CheckChoice("action", o.action,
              {"list", "accept", "reject", "override", "conjecture", "undo", "log"});
  if (!o.status.empty())
    CheckChoice("--status", o.status, {"proposed", "accepted", "rejected", "review", "superseded"});
  store::Database db = OpenEdition(o.db);
  if (o.action == "list") return List(db, o, io);
  if (o.action == "log") return Log(db, o, io);
  PrintDecision(pipeline::Decide(db, Request(o, vm)), o, io);
  return kOk;
}

}  // namespace apograph::cli
