#include "serve/review.hpp"

#include <cstdlib>

#include "number/sexagesimal.hpp"
#include "store/review_store.hpp"
#include "support/input_error.hpp"

namespace apograph::serve {
namespace {

/// "who: why", the editor's name kept with the note (the tables on this
/// branch have no column for it).
std::string Signed(const ReviewRequest& r) {
  return r.editor + (r.note.empty() ? "" : ": " + r.note);
}

std::string Canonical(const std::string& option, const std::string& text) {
  const auto value = Sexagesimal::Parse(text);
  if (!value)
    throw InputError::ForOption(option, ExpectedFound("a reading such as 2;16", "'" + text + "'"));
  return value->ToString();
}

std::string DecideFinding(store::Database& db, const ReviewRequest& r) {
  if (!r.emendation) throw InputError::ForOption("id", "expected the id of a finding, found none");
  const char* status = r.action == Action::kAccept   ? "accepted"
                       : r.action == Action::kReject ? "rejected"
                                                     : "proposed";
  const int cells = store::DecideFinding(db, *r.emendation, status, Signed(r), r.expected_state);
  return "finding " + std::to_string(*r.emendation) + " " +
         (r.action == Action::kUndo ? "undone" : status) + " (" + std::to_string(cells) +
         (cells == 1 ? " cell" : " cells") + ") by " + r.editor;
}

std::string DecideCell(store::Database& db, const ReviewRequest& r) {
  if (r.table_id.empty() || r.column.empty())
    throw InputError::ForOption("cell", "expected a table, an argument and a column, found none");
  store::ApparatusDecision d{r.table_id, Canonical("arg", r.arg), r.column, "", Signed(r), ""};
  if (r.action != Action::kUndo) d.reading = Canonical("reading", r.reading);
  if (r.action == Action::kConjecture) d.note = "conjecture; " + d.note;
  store::DecideCell(db, d, r.expected_state);
  return "cell " + d.row_argument + " " + d.column + ": " +
         (d.reading.empty() ? "override withdrawn" : d.reading + " adopted") + " by " + r.editor;
}

}  // namespace

std::optional<Action> ActionFromString(const std::string& text) {
  if (text == "accept") return Action::kAccept;
  if (text == "reject") return Action::kReject;
  if (text == "override") return Action::kOverride;
  if (text == "conjecture") return Action::kConjecture;
  if (text == "undo") return Action::kUndo;
  return std::nullopt;
}

std::string Decide(store::Database& db, const ReviewRequest& r) {
  if (r.editor.empty())
    throw InputError::ForOption("--editor", "expected the editor's name, found none");
  const bool finding = r.action == Action::kAccept || r.action == Action::kReject ||
                       (r.action == Action::kUndo && r.emendation);
  return finding ? DecideFinding(db, r) : DecideCell(db, r);
}

std::string DefaultEditor(const std::string& option) {
  if (!option.empty()) return option;
  for (const char* name : {"APOGRAPH_EDITOR", "USER"})
    if (const char* v = std::getenv(name); v && *v) return v;
  return "";
}

}  // namespace apograph::serve
