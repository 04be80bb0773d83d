#pragma once
/// Decisions from a review page (`apograph serve`): the same tables as
/// `apograph emendation` and `apograph apparatus --override` write, but
/// each decision checks, in the transaction that writes it, that what the
/// editor saw is still so (another tab may have decided in between), and a
/// displaced run is decided as one finding.
///
///     auto s = store::FindingState(db, 12);            // "proposed"
///     store::DecideFinding(db, 12, "accepted", "ok", s); // throws StaleState if changed

#include <cstdint>
#include <optional>
#include <string>

#include "store/apparatus_store.hpp"
#include "store/database.hpp"
#include "support/input_error.hpp"

namespace apograph::store {

/// Refused: the target changed since the page showed it. The message says
/// what it is now.
class StaleState : public InputError {
 public:
  using InputError::InputError;
};

/// The state of the finding proposal `id` belongs to (its first proposal):
/// "proposed", or "accepted@2026-12-02T09:00:00Z" / "rejected@...".
/// Throws InputError (option `id`) when there is no such proposal.
std::string FindingState(Database& db, std::int64_t id);

/// Sets every proposal of the finding `id` belongs to (one cell, or every
/// cell of a displaced run) to `status` ("accepted", "rejected", or
/// "proposed" to undo), with `note`, in one transaction; refuses with
/// StaleState when `expected_state` is given and differs from
/// FindingState. Returns the cells decided.
int DecideFinding(Database& db, std::int64_t id, const std::string& status, const std::string& note,
                  const std::optional<std::string>& expected_state);

/// The state of a cell of the edited table: "cell:none" or "cell:<id of
/// its latest decision>".
std::string CellState(Database& db, const std::string& table_id, const std::string& row_argument,
                      const std::string& column);

/// Records `decision` (an empty reading withdraws the override) in one
/// transaction, refusing with StaleState when `expected_state` is given
/// and differs from CellState.
void DecideCell(Database& db, const ApparatusDecision& decision,
                const std::optional<std::string>& expected_state);

}  // namespace apograph::store
