#pragma once
/// The editor's decisions (schema/013_decisions.sql) as plain rows, and the
/// argument every row of a revision stands for. Only rows in and out: what
/// a decision means, whether it still holds and who may make it is decided
/// by pipeline/decisions.hpp, which calls these inside its transactions.

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "store/database.hpp"

namespace apograph::store {

/// One witness's cell an accept or reject covers.
struct DecisionCellRow {
  std::string siglum;
  std::string column_name;
  std::string argument;  ///< the argument the row stands for (canonical trade notation)
  std::string reading;   ///< the witness's reading as typed when decided
  std::string proposed;  ///< the proposed reading
};

/// One row of `decision` with its cells.
struct DecisionRow {
  std::int64_t id = 0;
  std::string table_id;
  std::string action;  ///< accept, reject, override, conjecture, undo
  std::optional<std::int64_t> finding;
  std::string siglum;
  std::optional<int> revision;
  std::string argument;
  std::string column_name;
  std::string reading;  ///< override, conjecture: the adopted reading
  std::optional<std::int64_t> undoes;
  std::string editor;
  std::string decided_at;  ///< set by the database (UTC, ISO 8601)
  std::string note;
  std::vector<DecisionCellRow> cells;
};

/// Inserts a decision and its cells; returns it with id and time. Runs
/// inside the caller's transaction (none is opened here).
DecisionRow InsertDecision(Database& db, const DecisionRow& row);

/// Every decision of a table (undo rows included), oldest first.
std::vector<DecisionRow> LoadDecisions(Database& db, const std::string& table_id);

/// The table a decision belongs to, or nullopt when there is no such decision.
std::optional<std::string> LoadDecisionTable(Database& db, std::int64_t id);

/// The tables that have decisions or proposals, sorted.
std::vector<std::string> TablesWithDecisions(Database& db);

/// Sets emendation.status, decided_at and editor_note of one proposal (the
/// copy schema 004's views read). `status` is proposed, accepted or rejected.
void MirrorEmendationStatus(Database& db, std::int64_t emendation_id, const std::string& status,
                            const std::optional<std::string>& decided_at, const std::string& note);

/// Stores the argument each row of a revision stands for
/// (Transcription::ArgumentInUse), for the view row_argument, in place of
/// what it holds (the import writes them with the cells: see CellWriter).
void RecordRowArguments(Database& db, std::int64_t revision_id, const Transcription& t);

/// Stores the row arguments of every revision of a table imported before
/// they were kept (schema 013), so its views see repaired arguments too.
void FillRowArguments(Database& db, const std::string& table_id);

}  // namespace apograph::store
