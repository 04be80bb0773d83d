#pragma once
/// The decisions the review page can make, in the shape of the decisions
/// module being written on another branch (pipeline/decisions.hpp there:
/// Action, DecisionRequest with expected_state, a stale decision refused),
/// so that the page's handlers move to it by replacing this file's
/// implementation. Here it writes through the store functions the command
/// line uses (emendation accept/reject, apparatus --override), each
/// decision in one transaction, with the editor's name and the database's
/// time.

#include <cstdint>
#include <optional>
#include <string>

#include "store/database.hpp"

namespace apograph::serve {

enum class Action { kAccept, kReject, kOverride, kConjecture, kUndo };
/// "accept", "reject", "override", "conjecture", "undo"; nullopt otherwise.
std::optional<Action> ActionFromString(const std::string& text);

struct ReviewRequest {
  Action action = Action::kAccept;
  /// accept, reject, undo of a finding: any proposal of it.
  std::optional<std::int64_t> emendation;
  /// override, conjecture, undo of a cell: the table, the row's argument in
  /// trade notation and the column's name.
  std::string table_id, arg, column;
  std::string reading;  ///< override, conjecture
  std::string editor;   ///< who (required)
  std::string note;     ///< why
  /// The state the page showed (store::FindingState / CellState); nullopt:
  /// no check.
  std::optional<std::string> expected_state;
};

/// Writes the decision; returns a sentence saying what was decided. Throws
/// InputError for a bad request and store::StaleState when the page was
/// stale.
std::string Decide(store::Database& db, const ReviewRequest& request);

/// The editor's name: `option`, else $APOGRAPH_EDITOR, else $USER; empty
/// when none is set.
std::string DefaultEditor(const std::string& option);

}  // namespace apograph::serve
