// The editor's decisions: listing, deciding, undoing (decisions.hpp).
#include "pipeline/decisions.hpp"

#include <pwd.h>
#include <unistd.h>

#include <algorithm>
#include <cstdlib>
#include <set>

#include "pipeline/decision_state.hpp"
#include "store/decision_store.hpp"
#include "store/edition_store.hpp"
#include "transcription/editor_value.hpp"

namespace apograph::pipeline {

using internal::DecisionContext;

const char* ToString(Action action) {
  switch (action) {
    case Action::kAccept:
      return "accept";
    case Action::kReject:
      return "reject";
    case Action::kOverride:
      return "override";
    case Action::kConjecture:
      return "conjecture";
    case Action::kUndo:
      return "undo";
  }
  return "undo";
}

std::optional<Action> ActionFromString(const std::string& text) {
  for (auto a :
       {Action::kAccept, Action::kReject, Action::kOverride, Action::kConjecture, Action::kUndo}) {
    if (text == ToString(a)) return a;
  }
  return std::nullopt;
}

const char* ToString(FindingStatus status) {
  switch (status) {
    case FindingStatus::kProposed:
      return "proposed";
    case FindingStatus::kAccepted:
      return "accepted";
    case FindingStatus::kRejected:
      return "rejected";
    case FindingStatus::kReview:
      return "review";
    case FindingStatus::kSuperseded:
      return "superseded";
  }
  return "proposed";
}

namespace {

constexpr const char* kCommand = "apograph emendation";

std::string Quoted(const std::string& s) { return "'" + s + "'"; }

/// Refuses a decision whose target changed since the caller looked.
void CheckExpected(const std::string& actual, const std::optional<std::string>& expected,
                   const std::string& what, const std::optional<Decision>& in_force) {
  if (!expected || *expected == actual) return;
  std::string found = Quoted(actual);
  if (in_force) {
    found += " (" + std::string(ToString(in_force->action)) + " by " + in_force->editor + " at " +
             in_force->decided_at + ")";
  }
  throw StaleDecision(
      InputError::ForOption(
          "--expect", ExpectedFound(what + " in the state you saw (" + Quoted(*expected) + ")",
                                    found + ": it changed meanwhile; list again "
                                            "and decide on what is there now"))
          .diagnostics());
}

FindingState FindingOf(DecisionContext& cx, const store::EmendationRecord& e) {
  const std::int64_t head = e.finding.value_or(e.id);
  for (auto& f : cx.EvaluateAll(e.siglum)) {
    if (f.id == head) return f;
  }
  throw std::logic_error("emendation " + std::to_string(e.id) + " has no finding");
}

store::EmendationRecord FindProposal(store::Database& db, const std::optional<std::int64_t>& id) {
  if (!id) throw InputError::ForOption(kCommand, "expected the id of an emendation, found none");
  auto e = store::FindEmendation(db, *id);
  if (!e) {
    throw InputError::ForOption(
        kCommand, ExpectedFound("the id of a proposed emendation (see apograph emendation list)",
                                Quoted(std::to_string(*id))));
  }
  return *e;
}

Decision DecideFinding(store::Database& db, const DecisionRequest& r) {
  const auto e = FindProposal(db, r.target.emendation);
  store::FillRowArguments(db, e.table_id);
  DecisionContext cx(db, e.table_id);
  const FindingState f = FindingOf(cx, e);
  CheckExpected(f.state, r.expected_state, "emendation " + std::to_string(e.id), f.decision);
  const bool changed = std::any_of(f.cells.begin(), f.cells.end(),
                                   [](const FindingCell& c) { return c.now.has_value(); });
  if (f.status == FindingStatus::kSuperseded || changed) {
    throw InputError::ForOption(
        kCommand, ExpectedFound("a proposal for the readings transcribed now",
                                "emendation " + std::to_string(e.id) + ", " + f.review +
                                    " (run apograph errors on the current revision and decide "
                                    "its proposal, or undo the earlier decision)"));
  }
  store::DecisionRow row;
  row.table_id = e.table_id;
  row.action = ToString(r.action);
  row.finding = f.id;
  row.siglum = f.witness;
  row.revision = f.revision;
  row.argument = f.cells.front().arg;
  row.column_name = f.column;
  row.editor = r.editor;
  row.note = r.note;
  for (const auto& c : f.cells)
    row.cells.push_back({f.witness, f.column, c.arg, c.tabulated, c.proposed});
  const Decision d = internal::ToDecision(store::InsertDecision(db, row));
  DecisionContext(db, e.table_id).RefreshMirrors(e.siglum);
  return d;
}

/// The edited cell named by a request, checked against the transcriptions.
struct EditedTarget {
  std::string arg;
  std::string column;
};

EditedTarget CheckCell(const DecisionContext& cx, const DecisionTarget& t) {
  if (cx.current().empty()) {
    throw InputError::ForOption("--table",
                                ExpectedFound("a table with transcriptions", Quoted(t.table_id)));
  }
  const auto arg = internal::Canonical(t.arg);
  if (!arg) throw InputError::ForOption(t.option, ExpectedFound("a row argument", Quoted(t.arg)));
  bool column = false, row = false;
  for (const auto& [siglum, tr] : cx.current()) {
    column = column || tr.ColumnIndex(t.column) >= 0;
    row = row || cx.RowAt(siglum, *arg).has_value();
  }
  if (!column) {
    throw InputError::ForOption(t.option,
                                ExpectedFound("a column of table " + t.table_id, Quoted(t.column)));
  }
  if (!row) {
    throw InputError::ForOption(
        t.option, ExpectedFound("the argument of a row of table " + t.table_id, Quoted(t.arg)));
  }
  return {*arg, t.column};
}

/// The places of a column, as the current transcriptions declare them.
int ColumnPlaces(const DecisionContext& cx, const std::string& column) {
  for (const auto& [siglum, tr] : cx.current()) {
    if (const int c = tr.ColumnIndex(column); c >= 0)
      return tr.columns[static_cast<std::size_t>(c)].places;
  }
  return 0;  // unreachable after CheckCell, which requires the column
}

/// A conjecture is a reading no witness has.
void CheckConjecture(const DecisionContext& cx, const EditedTarget& cell,
                     const Sexagesimal& reading) {
  std::string carriers;
  for (const auto& [siglum, tr] : cx.current()) {
    const auto row = cx.RowAt(siglum, cell.arg);
    const int c = tr.ColumnIndex(cell.column);
    if (!row || c < 0) continue;
    const auto& v =
        tr.rows[static_cast<std::size_t>(*row)].cells[static_cast<std::size_t>(c)].value;
    if (v && v->Identical(reading)) carriers += (carriers.empty() ? "" : " ") + siglum;
  }
  if (!carriers.empty()) {
    throw InputError::ForOption(
        "--reading",
        ExpectedFound("a reading no witness has (to adopt a witness's reading, override)",
                      Quoted(reading.ToString()) + ", the reading of " + carriers));
  }
}

std::pair<std::string, std::optional<Decision>> CellState(const DecisionContext& cx,
                                                          const EditedTarget& cell) {
  for (const auto& e : cx.EditedCells()) {
    if (e.arg == cell.arg && e.column == cell.column) return {e.state, e.decision};
  }
  return {"none", std::nullopt};
}

Decision DecideCell(store::Database& db, const DecisionRequest& r) {
  DecisionContext cx(db, r.target.table_id);
  const EditedTarget cell = CheckCell(cx, r.target);
  // Read like a transcription's cell in this column: nothing is stored that
  // a transcription could not hold (places 0..59, the column's places).
  const std::string option = r.target.option.empty() ? "--reading" : r.target.option;
  const auto reading =
      Sexagesimal::Parse(ParseEditorReading(option, r.reading, ColumnPlaces(cx, cell.column)));
  const auto [state, in_force] = CellState(cx, cell);
  CheckExpected(state, r.expected_state, "cell " + cell.arg + ":" + cell.column, in_force);
  if (r.action == Action::kConjecture) CheckConjecture(cx, cell, *reading);
  store::DecisionRow row;
  row.table_id = r.target.table_id;
  row.action = ToString(r.action);
  row.argument = cell.arg;
  row.column_name = cell.column;
  row.reading = reading->ToString();
  row.editor = r.editor;
  row.note = r.note;
  return internal::ToDecision(store::InsertDecision(db, row));
}

/// The decision an undo withdraws, with the target's state.
struct UndoTarget {
  const store::DecisionRow* row = nullptr;
  std::string state;
  std::string what;
};

UndoTarget FindUndoTarget(DecisionContext& cx, const DecisionRequest& r,
                          const store::EmendationRecord* e) {
  if (r.target.decision) {
    const auto* row = cx.Find(*r.target.decision);
    const std::string what = "decision " + std::to_string(*r.target.decision);
    if (!row || row->action == "undo") {
      throw InputError::ForOption(kCommand,
                                  ExpectedFound("the id of a decision (see apograph "
                                                "emendation log)",
                                                Quoted(std::to_string(*r.target.decision))));
    }
    const auto by = cx.WithdrawnBy(row->id);
    return {by ? nullptr : row, (by ? "withdrawn:" : row->action + ":") + std::to_string(row->id),
            what};
  }
  if (e) {
    const FindingState f = FindingOf(cx, *e);
    return {f.decision ? cx.Find(f.decision->id) : nullptr, f.state,
            "emendation " + std::to_string(e->id)};
  }
  const EditedTarget cell = CheckCell(cx, r.target);
  const auto [state, in_force] = CellState(cx, cell);
  return {in_force ? cx.Find(in_force->id) : nullptr, state,
          "cell " + cell.arg + ":" + cell.column};
}

Decision Undo(store::Database& db, const DecisionRequest& r) {
  std::optional<store::EmendationRecord> e;
  std::string table = r.target.table_id;
  if (r.target.emendation && !r.target.decision) {
    e = FindProposal(db, r.target.emendation);
    table = e->table_id;
  }
  if (r.target.decision) {
    auto s = store::LoadDecisionTable(db, *r.target.decision);
    table = s.value_or(table);
  }
  DecisionContext cx(db, table);
  const UndoTarget target = FindUndoTarget(cx, r, e ? &*e : nullptr);
  const auto in_force =
      target.row ? std::optional<Decision>(internal::ToDecision(*target.row)) : std::nullopt;
  CheckExpected(target.state, r.expected_state, target.what, in_force);
  if (!target.row)
    throw InputError::ForOption(
        kCommand, ExpectedFound("a decision to undo", target.what + " has none in force"));
  store::DecisionRow row;
  row.table_id = table;
  row.action = "undo";
  row.undoes = target.row->id;
  row.editor = r.editor;
  row.note = r.note;
  const std::string siglum = target.row->siglum;
  const Decision d = internal::ToDecision(store::InsertDecision(db, row));
  if (!siglum.empty()) DecisionContext(db, table).RefreshMirrors(siglum);
  return d;
}

Decision DecideOne(store::Database& db, const DecisionRequest& r) {
  if (r.editor.empty())
    throw InputError::ForOption("--editor", "expected the editor's name, found none");
  switch (r.action) {
    case Action::kAccept:
    case Action::kReject:
      return DecideFinding(db, r);
    case Action::kOverride:
    case Action::kConjecture:
      return DecideCell(db, r);
    case Action::kUndo:
      return Undo(db, r);
  }
  throw std::logic_error("unknown decision action");
}

}  // namespace

std::vector<FindingState> ListFindings(store::Database& db, const FindingFilter& filter) {
  std::vector<std::string> tables;
  if (filter.table_id)
    tables.push_back(*filter.table_id);
  else
    tables = store::TablesWithDecisions(db);
  std::vector<FindingState> out;
  for (const auto& t : tables) {
    DecisionContext cx(db, t);
    for (auto& f : cx.EvaluateAll(filter.witness)) {
      const bool wanted =
          filter.status ? f.status == *filter.status : f.status != FindingStatus::kSuperseded;
      if (wanted) out.push_back(std::move(f));
    }
  }
  return out;
}

std::vector<EditedCellDecision> ListEditedCells(store::Database& db, const std::string& table_id) {
  return DecisionContext(db, table_id).EditedCells();
}

std::vector<Decision> DecisionLog(store::Database& db, const std::string& table_id) {
  DecisionContext cx(db, table_id);
  std::vector<Decision> out;
  for (const auto& row : store::LoadDecisions(db, table_id)) {
    Decision d = internal::ToDecision(row);
    d.withdrawn_by = cx.WithdrawnBy(row.id);
    out.insert(out.begin(), std::move(d));
  }
  return out;
}

Decision Decide(store::Database& db, const DecisionRequest& request) {
  return DecideAll(db, {request}).front();
}

std::vector<Decision> DecideAll(store::Database& db, const std::vector<DecisionRequest>& requests) {
  store::Transaction t(db);
  std::vector<Decision> out;
  for (const auto& r : requests) out.push_back(DecideOne(db, r));
  t.Commit();
  return out;
}

store::RecordResult RecordProposals(store::Database& db,
                                    const std::vector<store::EmendationRecord>& proposals) {
  store::Transaction t(db);
  const auto result = store::InsertEmendations(db, proposals);
  std::set<std::pair<std::string, std::string>> touched;
  for (const auto& p : proposals) touched.insert({p.table_id, p.siglum});
  for (const auto& [table, siglum] : touched) {
    store::FillRowArguments(db, table);
    DecisionContext(db, table).RefreshMirrors(siglum);
  }
  t.Commit();
  return result;
}

std::string DefaultEditor(const std::string& option) {
  if (!option.empty()) return option;
  if (const char* env = std::getenv("APOGRAPH_EDITOR"); env && *env) return env;
  if (const passwd* pw = getpwuid(getuid()); pw && pw->pw_name && *pw->pw_name) return pw->pw_name;
  if (const char* user = std::getenv("USER"); user && *user) return user;
  throw InputError::ForOption(
      "--editor", "expected the editor's name (--editor NAME or APOGRAPH_EDITOR), found none");
}

}  // namespace apograph::pipeline
