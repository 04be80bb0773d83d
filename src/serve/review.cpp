#include "serve/review.hpp"

#include "support/input_error.hpp"

namespace apograph::serve {
namespace {

std::string Get(const std::map<std::string, std::string>& f, const std::string& key) {
  const auto it = f.find(key);
  return it == f.end() ? "" : it->second;
}

std::int64_t Id(const std::string& field, const std::string& text) {
  // At most 18 digits: always fits an int64.
  if (text.empty() || text.size() > 18 || text.find_first_not_of("0123456789") != std::string::npos)
    throw InputError::ForOption(field, ExpectedFound("a number", "'" + text + "'"));
  return std::stoll(text);
}

/// The edited table's cell a form names (override, conjecture, undo of a cell).
void CellOf(const std::map<std::string, std::string>& form, pipeline::DecisionTarget& t) {
  t.table_id = Get(form, "table");
  t.arg = Get(form, "arg");
  t.column = Get(form, "column");
  t.option = "cell";
  if (t.table_id.empty() || t.arg.empty() || t.column.empty())
    throw InputError::ForOption("cell", "expected a table, an argument and a column, found none");
}

}  // namespace

pipeline::DecisionRequest RequestOf(const std::map<std::string, std::string>& form,
                                    const std::string& editor) {
  const auto action = pipeline::ActionFromString(Get(form, "action"));
  if (!action)
    throw InputError::ForOption("action", "expected accept, reject, override, conjecture or undo");
  pipeline::DecisionRequest r;
  r.action = *action;
  r.editor = editor;
  r.note = Get(form, "note");
  r.reading = Get(form, "reading");
  if (form.count("state")) r.expected_state = Get(form, "state");
  if (!Get(form, "id").empty()) {
    r.target.emendation = Id("id", Get(form, "id"));
  } else if (r.action == pipeline::Action::kAccept || r.action == pipeline::Action::kReject) {
    throw InputError::ForOption("id", "expected the id of a finding, found none");
  } else {
    CellOf(form, r.target);
  }
  const bool on_cell =
      r.action == pipeline::Action::kOverride || r.action == pipeline::Action::kConjecture;
  if (on_cell && r.target.emendation)
    throw InputError::ForOption("id", "expected a cell (table, arg, column), found a finding");
  if (on_cell && r.reading.empty())
    throw InputError::ForOption("reading", "expected the reading to adopt, found none");
  return r;
}

std::string Describe(const pipeline::Decision& d) {
  std::string out = "decision " + std::to_string(d.id) + ": " + pipeline::ToString(d.action);
  if (d.finding)
    out += " finding " + std::to_string(*d.finding) + " of " + d.witness + " (" +
           std::to_string(d.cells.size()) + (d.cells.size() == 1 ? " cell)" : " cells)");
  if (!d.reading.empty()) out += " " + d.arg + " " + d.column + " = " + d.reading;
  if (d.undoes) out += " withdrawing decision " + std::to_string(*d.undoes);
  out += " by " + d.editor + " at " + d.decided_at;
  return d.note.empty() ? out : out + ": " + d.note;
}

}  // namespace apograph::serve
