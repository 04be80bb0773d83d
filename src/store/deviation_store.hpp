#pragma once
/// The deviation stage's tables (schema/004_deviation.sql) as plain values:
/// record the emendations `apograph errors` proposes and list them. The
/// editor's decisions on them are pipeline/decisions.hpp's (schema 010).

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "store/database.hpp"

namespace apograph::store {

/// One proposed reading of one cell, with the editor's decision.
struct EmendationRecord {
  std::int64_t id = 0;
  std::string table_id;
  std::string siglum;
  int revision = 1;
  int row = 0;     ///< 0-based row index
  int column = 0;  ///< 0-based value column
  std::string column_name;
  std::string arg;
  std::string tabulated;  ///< the reading as transcribed
  std::string proposed;   ///< the proposed original reading, trade notation
  std::string cls;        ///< explanation class ("confusion", "displaced-run", ...)
  std::string evidence;
  double score = 0;
  std::string model;  ///< what the entries were compared with
  /// Cells of one finding (a displaced run) share the id of its first
  /// proposal; set by RecordEmendations from `group` below.
  std::optional<std::int64_t> finding;
  int group = 0;  ///< input only: proposals with the same non-zero group form one finding
  /// proposed / accepted / rejected: a copy of the decision in force, kept
  /// in step by pipeline/decisions.hpp for schema 004's views.
  std::string status = "proposed";
  std::string proposed_at;
  std::optional<std::string> decided_at;
  std::string editor_note;
};

struct RecordResult {
  int added = 0;  ///< new proposals
  int kept = 0;   ///< already recorded (same cell, revision and reading): left as they were
};

/// Records proposals in one transaction. A proposal already recorded for the
/// same cell, revision and reading is kept as it is, with any decision.
RecordResult RecordEmendations(Database& db, const std::vector<EmendationRecord>& proposals);
/// The same inside the caller's transaction.
RecordResult InsertEmendations(Database& db, const std::vector<EmendationRecord>& proposals);

struct EmendationFilter {
  std::optional<std::string> table_id;
  std::optional<std::string> siglum;
  std::optional<std::string> status;
};

/// Proposals in table, witness, revision, row, column order.
std::vector<EmendationRecord> ListEmendations(Database& db, const EmendationFilter& filter = {});

/// One proposal by id, or nullopt.
std::optional<EmendationRecord> FindEmendation(Database& db, std::int64_t id);

}  // namespace apograph::store
