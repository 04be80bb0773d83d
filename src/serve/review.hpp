#pragma once
/// The review page's decision forms read into the decisions module's
/// requests (pipeline/decisions.hpp), the one code that writes decisions
/// for the command line and the page alike: each in one transaction, with
/// the editor's name, the database's time and the note, and refused as
/// StaleDecision when the page showed another state than the one now.
///
///     auto request = serve::RequestOf(form, "A. Editor");  // throws InputError
///     auto decision = pipeline::Decide(db, request);
///     std::string done = serve::Describe(decision);         // "accept by A. Editor: ..."

#include <map>
#include <string>

#include "pipeline/decisions.hpp"

namespace apograph::serve {

/// A decision form's fields: action (accept, reject, override, conjecture,
/// undo), id (any proposal of a finding), table, arg, column (a cell of the
/// edited table), reading, note, state (the state the page showed: a
/// finding's FindingState::state or a cell's EditedCellDecision::state,
/// "none" for a cell without a decision). Throws InputError naming the field
/// when one is missing or malformed.
pipeline::DecisionRequest RequestOf(const std::map<std::string, std::string>& form,
                                    const std::string& editor);

/// What was decided, in a sentence for the page.
std::string Describe(const pipeline::Decision& decision);

}  // namespace apograph::serve
