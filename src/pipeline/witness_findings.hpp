#pragma once
/// One witness against the references of its columns: the check summary
/// (exact / within one unit / flagged) and the explained deviations; and
/// those explanations turned into the collation's judgement of every cell,
/// so that descent is argued from the copyists' slips only.

#include <string>
#include <vector>

#include "collate/collation.hpp"
#include "deviation/explain.hpp"
#include "deviation/numeral_script.hpp"
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

struct WitnessFindings {
  std::string siglum;
  std::string script;                        ///< the numeral script the findings were read in
  std::vector<ColumnCheck> checks;           ///< one per referenced column the witness has
  std::vector<deviation::Finding> findings;  ///< every column, in column then row order
  /// Findings whose best explanation is a copyist's slip (all but the
  /// author's computational departures), and those departures.
  int CopyingSlips() const;
  int Departures() const;
};

/// Checks and explains the columns of `witness` that have a reference
/// (matched by column name, so witnesses may order their columns
/// differently). `check_tolerance` is the check's flag threshold in units.
WitnessFindings ExplainWitness(const Transcription& witness,
                               const std::vector<ColumnReference>& references,
                               const deviation::NumeralScript& script,
                               const deviation::ExplainOptions& options = {},
                               double check_tolerance = 1);

/// The collation's judgement of every readable cell (value or blank) of the
/// referenced columns of `witness`:
///  - no finding: right (error false), with the recomputed value;
///  - a copyist's slip or an unexplained deviation: an error, with the best
///    explanation's evidence as `slip`, its class as `cause` and its
///    proposed reading as `emendation`;
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
/// the order of `witnesses`), with the references as recomputed values
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
