#pragma once
// Internal to src/pipeline/decision*.cpp: the decisions of one table loaded
// with the transcriptions they are matched against, and the rules that say
// which decision holds where (see decisions.hpp).

#include <map>
#include <optional>
#include <set>
#include <string>
#include <utility>
#include <vector>

#include "pipeline/decisions.hpp"
#include "store/decision_store.hpp"
#include "store/deviation_store.hpp"

namespace apograph::pipeline::internal {

/// "accepted:14" and the like.
std::string StateToken(FindingStatus status, const std::optional<Decision>& decision);
Decision ToDecision(const store::DecisionRow& row);
/// Canonical trade notation of a reading or argument, or nullopt.
std::optional<std::string> Canonical(const std::string& text);

class DecisionContext {
 public:
  /// Loads the table's decisions and its current transcriptions (or takes
  /// `given`, which must outlive nothing: it is copied).
  DecisionContext(store::Database& db, const std::string& table_id,
                  const std::vector<Transcription>* given = nullptr);

  const std::string& table_id() const { return table_id_; }
  /// Current transcriptions by siglum.
  const std::map<std::string, Transcription>& current() const { return current_; }
  /// The current row of a witness standing for `arg`, or nullopt.
  std::optional<int> RowAt(const std::string& siglum, const std::string& arg) const;
  /// The current reading (as typed) at a witness's cell, or nullopt.
  std::optional<std::string> ReadingAt(const std::string& siglum, const std::string& column,
                                       const std::string& arg) const;

  /// Decisions not withdrawn (undo rows excluded), oldest first.
  const std::vector<const store::DecisionRow*>& InForce() const { return in_force_; }
  /// A decision by id, or nullptr.
  const store::DecisionRow* Find(std::int64_t id) const;
  std::optional<std::int64_t> WithdrawnBy(std::int64_t id) const;

  /// One finding (the proposals sharing its first proposal's id) with its status.
  FindingState Evaluate(const std::vector<store::EmendationRecord>& group);
  /// Every finding of the table (of one witness), identical proposals of
  /// earlier revisions marked superseded.
  std::vector<FindingState> EvaluateAll(const std::optional<std::string>& witness);
  /// The overrides and conjectures in force, latest per cell.
  std::vector<EditedCellDecision> EditedCells() const;

  /// Brings emendation.status in step with the decisions (one witness or all).
  void RefreshMirrors(const std::optional<std::string>& witness);

 private:
  std::string ArgumentOf(const store::EmendationRecord& e);
  int CurrentRevision(const std::string& siglum);
  FindingCell MakeCell(const store::EmendationRecord& e);
  const store::DecisionRow* Match(const std::string& siglum, const std::string& column,
                                  const FindingCell& c) const;
  const store::DecisionRow* EarlierOnCell(const std::string& siglum, const std::string& column,
                                          const FindingCell& c) const;
  void Judge(FindingState& f, const std::vector<const store::DecisionRow*>& per_cell);

  store::Database& db_;
  std::string table_id_;
  std::vector<store::DecisionRow> rows_;
  std::map<std::int64_t, std::int64_t> undone_;  // decision -> the undo withdrawing it
  std::vector<const store::DecisionRow*> in_force_;
  std::map<std::string, Transcription> current_;
  std::map<std::string, int> current_revision_;               // siglum -> number
  std::map<std::string, std::map<std::string, int>> row_of_;  // siglum -> argument -> row
  std::map<std::pair<std::string, int>, Transcription> revisions_;
};

}  // namespace apograph::pipeline::internal
