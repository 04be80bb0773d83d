#pragma once
/// The editor's overrides of adopted readings (schema/005_apparatus.sql).
/// Cells are addressed by the row's argument (trade notation, canonical)
/// and the column's name, so decisions survive new revisions of the
/// transcriptions and rows that move in the alignment.

#include <string>
#include <vector>

#include "store/database.hpp"

namespace apograph::store {

struct ApparatusDecision {
  std::string table_id;
  std::string row_argument;  ///< canonical trade notation ("20", "0;30")
  std::string column;
  std::string reading;  ///< empty: withdraw the override
  std::string note;
  std::string decided_at;  ///< set by the database (UTC, ISO 8601)
};

/// Records one decision in its own transaction. Throws InputError when the
/// table does not exist.
void SaveApparatusDecision(Database& db, const ApparatusDecision& decision);
/// Records several decisions in one transaction (all or nothing).
void SaveApparatusDecisions(Database& db, const std::vector<ApparatusDecision>& decisions);

/// The overrides in force for a table, ordered by row and column.
std::vector<ApparatusDecision> LoadApparatusOverrides(Database& db, const std::string& table_id);

}  // namespace apograph::store
