#pragma once
/// The editor's decisions: the one record that report, apparatus (every
/// format), collation and stemma read. The tool proposes, the editor
/// decides; this module is where deciding happens, for the command line
/// (`apograph emendation`, `apograph apparatus --override`) and for any
/// other front end (a review web page) alike.
///
/// What can be decided:
///  - a finding (a proposed emendation of one witness's cell, or a whole
///    displaced run): Action::kAccept adopts the proposed readings as the
///    editor's (the witness's readings are errors), kReject keeps the
///    witness's readings (they are not errors). Every cell of a run is
///    decided by one decision.
///  - a cell of the edited table: kOverride adopts a reading there (usually
///    one a witness has); kConjecture restores one no witness has.
///  - kUndo withdraws the decision in force on a finding or a cell.
/// Every decision records who (`editor`), when (the database's UTC clock)
/// and why (`note`). Nothing is updated or deleted: an undo is a decision.
///
/// Revisions: a decision on a finding names each cell by witness, column,
/// the argument its row stands for and the reading as it was. It carries
/// over to a later revision where that reading is unchanged; where it has
/// changed, the finding's status is kReview and the decision is not applied.
///
/// For a web handler, every call below is one transaction (BEGIN IMMEDIATE)
/// and refuses a stale decision: pass the `state` you listed as
/// `expected_state`; if another editor decided in between, Decide throws
/// StaleDecision (an InputError, message for the editor) and writes nothing.
///
///     store::Database db("edition.sqlite");
///     auto findings = pipeline::ListFindings(db, {.table_id = "sun-eq"});
///     pipeline::DecisionRequest r;
///     r.action = pipeline::Action::kAccept;
///     r.target.emendation = findings[0].id;
///     r.editor = "A. Editor";
///     r.note = "B and C agree";
///     r.expected_state = findings[0].state;   // "proposed"
///     pipeline::Decision d = pipeline::Decide(db, r);
///     // later: undo it
///     pipeline::DecisionRequest u{pipeline::Action::kUndo, {.emendation = findings[0].id}};
///     u.editor = "A. Editor";
///     pipeline::Decide(db, u);

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "collate/collation.hpp"
#include "edition/transcription.hpp"
#include "store/deviation_store.hpp"
#include "support/input_error.hpp"

namespace apograph::pipeline {

enum class Action { kAccept, kReject, kOverride, kConjecture, kUndo };
/// "accept", "reject", "override", "conjecture", "undo".
const char* ToString(Action action);
std::optional<Action> ActionFromString(const std::string& text);

/// One cell a decision on a finding covers.
struct DecisionCell {
  std::string witness;
  std::string column;
  std::string arg;       ///< the argument the row stands for, trade notation
  std::string reading;   ///< the witness's reading as typed when decided
  std::string proposed;  ///< the proposed reading
};

/// One decision as recorded.
struct Decision {
  std::int64_t id = 0;
  Action action = Action::kAccept;
  std::string table_id;
  std::string editor;      ///< who
  std::string decided_at;  ///< when (UTC, ISO 8601)
  std::string note;        ///< why, in the editor's words
  /// accept, reject: the finding (its first proposal's id), its witness and
  /// the revision decided on, and every cell.
  std::optional<std::int64_t> finding;
  std::string witness;
  std::optional<int> revision;
  std::vector<DecisionCell> cells;
  /// override, conjecture: the edited cell and the adopted reading.
  std::string arg;
  std::string column;
  std::string reading;
  std::optional<std::int64_t> undoes;        ///< undo: the decision withdrawn
  std::optional<std::int64_t> withdrawn_by;  ///< the undo that withdrew this one
};

enum class FindingStatus {
  kProposed,    ///< no decision yet
  kAccepted,    ///< the proposed readings are the editor's
  kRejected,    ///< the witness's readings are kept
  kReview,      ///< decided, but a cell's reading has changed since: look again
  kSuperseded,  ///< an undecided proposal for a reading no longer transcribed
};
/// "proposed", "accepted", "rejected", "review", "superseded".
const char* ToString(FindingStatus status);

/// One cell of a finding.
struct FindingCell {
  std::int64_t emendation = 0;  ///< the proposal's id
  int row = 0;                  ///< 0-based row of the revision proposed for
  std::string written_arg;      ///< the argument as written
  std::string arg;              ///< the argument the row stands for
  std::string tabulated;        ///< the reading proposed for, as typed
  std::string proposed;
  /// The current revision's reading when it differs from `tabulated`
  /// ("" when the row or column is gone); nullopt when unchanged.
  std::optional<std::string> now;
};

/// A finding with its status: what a review page lists.
struct FindingState {
  std::int64_t id = 0;  ///< the finding: its first proposal's id
  std::string table_id;
  std::string witness;
  int revision = 0;          ///< the revision it was proposed for
  int current_revision = 0;  ///< the witness's current revision
  std::string column;
  std::string cls;  ///< slip class ("confusion", "displaced-run", ...)
  std::string evidence;
  double score = 0;
  std::string model;
  std::string proposed_at;
  std::vector<FindingCell> cells;  ///< row order; a run has several
  FindingStatus status = FindingStatus::kProposed;
  std::optional<Decision> decision;  ///< the decision in force, if any
  /// The decision was made on another proposal with the same readings (an
  /// earlier revision, or a run proposed again).
  bool carried = false;
  std::string review;  ///< for kReview (and proposals replacing one): why, in words
  /// The state a caller passes back as DecisionRequest::expected_state:
  /// "proposed", "superseded", or status:decision ("accepted:14").
  std::string state;
};

/// An override or conjecture in force on a cell of the edited table.
struct EditedCellDecision {
  std::string table_id;
  std::string arg;  ///< the row's argument, canonical trade notation
  std::string column;
  std::string reading;  ///< canonical trade notation
  Decision decision;
  std::string state;  ///< "override:21" or "conjecture:22"
};

struct FindingFilter {
  std::optional<std::string> table_id;
  std::optional<std::string> witness;
  /// Only findings with this status; by default every status but superseded.
  std::optional<FindingStatus> status;
};

/// The findings recorded by `apograph errors` with their status, by table,
/// witness, column and row. A proposal of an earlier revision whose cells
/// are unchanged is listed (once: an identical later proposal replaces it).
std::vector<FindingState> ListFindings(store::Database& db, const FindingFilter& filter = {});

/// The overrides and conjectures in force for a table, by argument and column.
std::vector<EditedCellDecision> ListEditedCells(store::Database& db, const std::string& table_id);

/// Every decision of a table, undos included, newest first.
std::vector<Decision> DecisionLog(store::Database& db, const std::string& table_id);

/// What a decision is about.
struct DecisionTarget {
  std::optional<std::int64_t> emendation;  ///< any proposal of a finding (accept, reject, undo)
  std::string table_id;                    ///< a cell of the edited table (override, conjecture,
  std::string arg;                         ///< undo): the row's argument in trade notation
  std::string column;                      ///< and the column's name
  std::optional<std::int64_t> decision;    ///< undo: this decision
  /// How the caller named the cell, for messages ("--cell", "--override").
  std::string option = "--cell";
};

struct DecisionRequest {
  Action action = Action::kAccept;
  DecisionTarget target;
  std::string reading;  ///< override, conjecture: the reading adopted (trade notation)
  std::string editor;   ///< required (see DefaultEditor)
  std::string note;     ///< why
  /// The target's `state` as the caller saw it; nullopt: no check.
  std::optional<std::string> expected_state;
};

/// Refused because the target changed since the caller looked at it.
class StaleDecision : public InputError {
 public:
  using InputError::InputError;
};

/// Records one decision in one transaction and returns it. Throws
/// StaleDecision (the expected state no longer holds) or InputError (no
/// such proposal, cell or decision; a superseded proposal; a conjecture a
/// witness already reads; nothing to undo; no editor); nothing is written
/// then.
Decision Decide(store::Database& db, const DecisionRequest& request);
/// Several decisions in one transaction: all or none.
std::vector<Decision> DecideAll(store::Database& db, const std::vector<DecisionRequest>& requests);

/// Records proposals (apograph errors) and brings the status copies in
/// `emendation.status` up to date (decisions carried over), in one
/// transaction.
store::RecordResult RecordProposals(store::Database& db,
                                    const std::vector<store::EmendationRecord>& proposals);

/// The editor's name: `option` when given, else the environment variable
/// APOGRAPH_EDITOR, else the login name. Throws InputError (option
/// --editor) when none is known.
std::string DefaultEditor(const std::string& option = "");

/// A decision on a finding as it bears on the current transcriptions.
struct WitnessCellDecision {
  DecisionCell cell;
  Decision decision;  ///< accept or reject
  int row = -1;       ///< the current row at that argument, -1 if none
  int column = -1;    ///< the column's index in the witness
  /// The current reading is the one decided on: the decision holds. False:
  /// the reading changed since (the finding is under review; not applied).
  bool applies = false;
  std::string now;  ///< the current reading
};

/// The decisions in force for one table, matched to its current
/// transcriptions: what the analysis applies.
struct TableDecisions {
  std::vector<WitnessCellDecision> witness_cells;  ///< oldest first
  std::vector<EditedCellDecision> edited_cells;
  /// The applying decision on a witness's cell (the latest), or nullptr.
  const WitnessCellDecision* At(const std::string& witness, const std::string& column,
                                const std::string& arg) const;
  const EditedCellDecision* EditedAt(const std::string& arg, const std::string& column) const;
  /// Every editor named by a decision in force, in order of first decision.
  std::vector<std::string> Editors() const;
};

/// Loads the decisions in force for a table and matches them to
/// `transcriptions` (its current ones, or a subset of witnesses).
TableDecisions LoadTableDecisions(store::Database& db, const std::string& table_id,
                                  const std::vector<Transcription>& transcriptions);

/// Applies the decisions to the collation's judgements: an accepted
/// emendation makes the witness's reading an error (restored to the
/// proposed reading), a rejected one makes it right, an override or
/// conjecture makes every reading but the adopted one an error. Each such
/// judgement names the editor, so collation, stemma and apparatus show it.
void ApplyDecisions(const TableDecisions& decisions,
                    const std::vector<Transcription>& transcriptions,
                    collate::CollateOptions& options);

}  // namespace apograph::pipeline
