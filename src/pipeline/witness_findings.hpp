#pragma once
/// One witness against the references of its columns: the check summary
/// (exact / within one unit / flagged) and the explained deviations; and
/// those explanations turned into the collation's judgement of every cell,
/// so that descent is argued from the copyists' slips only.

#include <string>
#include <vector>

#include "collate/collation.hpp"
#include "deviation/explain.hpp"
#include "deviation/guard.hpp"
#include "deviation/numeral_script.hpp"
#include "deviation/screen.hpp"
#include "edition/transcription.hpp"
#include "model/check.hpp"
#include "pipeline/reference.hpp"

namespace apograph::pipeline {

/// The check of one column of one witness (model::Check's counts).
struct ColumnCheck {
  int column = 0;  ///< index in the witness's columns
  std::string column_name;
  model::CheckSummary summary;
};

/// Whether a column's reference explains it in one witness; when it does
/// not (deviation::GuardReference), the model-free screen of the column.
struct ColumnVerdict {
  int column = 0;  ///< index in the witness's columns
  std::string column_name;
  deviation::ReferenceVerdict verdict;
  std::vector<deviation::Suspect> screen;  ///< filled when the reference is refused
};

struct WitnessFindings {
  std::string siglum;
  std::string script;                        ///< the numeral script the findings were read in
  std::vector<ColumnCheck> checks;           ///< one per referenced column the witness has
  std::vector<deviation::Finding> findings;  ///< every column, in column then row order
  /// One per referenced column the witness has. A column whose reference is
  /// refused has no findings (nothing is explained against a wrong model).
  std::vector<ColumnVerdict> verdicts;
  /// The verdict of a column by name, or nullptr.
  const ColumnVerdict* VerdictOf(const std::string& column) const;
  /// True when the reference of the column (by name) is refused.
  bool Refused(const std::string& column) const;
  /// Findings whose best explanation is a copyist's slip (all but the
  /// author's computational departures), and those departures.
  int CopyingSlips() const;
  int Departures() const;
};

/// Checks and explains the columns of `witness` that have a reference
/// (matched by column name, so witnesses may order their columns
/// differently), alone: without the other witnesses' readings. The guard
/// refuses a reference that flags too much of the column.
/// `check_tolerance` is the check's flag threshold in units.
WitnessFindings ExplainWitness(const Transcription& witness,
                               const std::vector<ColumnReference>& references,
                               const deviation::NumeralScript& script,
                               const deviation::ExplainOptions& options = {},
                               double check_tolerance = 1,
                               const deviation::GuardOptions& guard = {});

/// Every witness of one table checked and explained with the tradition's
/// view (results in the order of `witnesses`): at each cell, what the other
/// witnesses read (deviation::TraditionCell, matched by column name and by
/// the argument each row stands for). So a departure within the author's
/// usual size that the others share is the author's in every witness, and
/// one they do not share is a copyist's; a slip on top of the author's
/// departure is emended to the author's reading. Each witness is read in its
/// own script (deviation::FindWitnessScript, from `scripts_dir`). The guard
/// refuses a column's reference for one witness (too much of it flagged) or
/// for all (too many rows flagged in most witnesses alike).
std::vector<WitnessFindings> ExplainTradition(const std::vector<Transcription>& witnesses,
                                              const std::vector<ColumnReference>& references,
                                              const std::string& scripts_dir,
                                              const deviation::ExplainOptions& options = {},
                                              double check_tolerance = 1,
                                              const deviation::GuardOptions& guard = {});

/// The author's departures of a table as a pattern: per column, the rows
/// where the witnesses' findings keep the author's reading, with the size of
/// each departure and the witnesses that read it.
struct DeparturePattern {
  std::string column_name;
  struct Row {
    std::string arg;
    double units = 0;  ///< the departure from the model, units of the last place
    std::vector<std::string> sigla;
  };
  std::vector<Row> rows;  ///< in table order
  /// "20 (+1), 97 (-1), 140-143 (+1 each)"
  std::string Text() const;
};
std::vector<DeparturePattern> AuthorsDepartures(const std::vector<WitnessFindings>& findings);

/// The collation's judgement of every readable cell (value or blank) of the
/// referenced columns of `witness`:
///  - no finding: right (error false), with the recomputed value;
///  - a copyist's slip or an unexplained deviation: an error, the slip in
///    words from the best explanation ("transposition: ...");
///  - the author's computational departure: NOT an error. Every witness
///    inherits it from the archetype, so it says nothing about descent;
///  - common_slip (weak evidence of descent, since copyists make it
///    independently) for a confusion of one symbol in one place of the
///    witness's script (the script file lists look-alikes) and for a slip
///    of one unit in the last place.
collate::JudgementGrid JudgementsFromFindings(const Transcription& witness,
                                              const std::vector<ColumnReference>& references,
                                              const std::vector<deviation::Finding>& findings);

/// Collation options judging every witness by its findings (`findings` in
/// the order of `witnesses`; a column whose reference the guard refused is
/// not judged, and refused in every witness it has no reference value), with
/// the references as recomputed values
/// (shown beside the readings, and used where no judgement is given). A
/// reading explained as the author's departure in one witness is judged so
/// in every witness that has it at the same cell (the same value cannot be
/// the author's in one copy and a copyist's slip in another); but one that
/// a single witness reads while two or more others read the model's value
/// was not in the archetype: it is judged a copyist's (common) slip.
collate::CollateOptions JudgedCollateOptions(const std::vector<Transcription>& witnesses,
                                             const std::vector<ColumnReference>& references,
                                             const std::vector<WitnessFindings>& findings,
                                             double tolerance_units = 1);

}  // namespace apograph::pipeline
