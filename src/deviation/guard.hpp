#pragma once
/// A guard on the reference: when too much of a column deviates from its
/// model, the model (or its parameters, or the practice) is wrong, not the
/// witness. Then no entry is explained against it and no emendation is
/// proposed; the caller shows the model-free screen (screen.hpp) instead.
///
/// Two tests, each with its stated share:
///  - one witness: the share of its compared entries that its findings flag
///    (copying slips and unexplained deviations, blanks left out);
///  - the tradition: the share of rows that every witness flags (a copy's
///    slips, even those of a lost ancestor, are in some witnesses only; a
///    row flagged in all is an archetype's error or the reference's).
///
///     const auto verdict = deviation::GuardReference(compared, flagged, {});
///     if (!verdict.explains) std::cout << verdict.why;

#include <string>
#include <vector>

#include "deviation/explain.hpp"

namespace apograph::deviation {

struct GuardOptions {
  /// Judgement: realistic copies miscopy a few percent of their entries and
  /// late, careless ones up to about a fifth (realism notes); beyond 30% the
  /// deviations are the reference's.
  double witness_share = 0.3;
  int min_cells = 4;  ///< judgement: fewer flagged entries prove nothing
  /// Judgement: rows flagged in every witness are archetype errors when the
  /// reference is right, a few percent at most; beyond 15%, the reference
  /// misses the table.
  double consensus_share = 0.15;
  int min_rows = 3;  ///< judgement, as min_cells
};

/// Whether a reference explains a column, with the counts and the reason.
struct ReferenceVerdict {
  bool explains = true;
  bool consensus = false;  ///< decided on the tradition (rows), not one witness
  int compared = 0;        ///< entries (or rows) compared with the reference
  int flagged = 0;         ///< of them, flagged
  double limit = 0;        ///< the share above which the reference is refused
  std::string why;         ///< empty when it explains the column
};

/// Entries of `column` that the findings flag: copying slips and unexplained
/// deviations, blank and illegible cells left out (they say nothing about the
/// reference).
int FlaggedCells(const std::vector<Finding>& findings, int column);

/// The verdict on one witness's column (`consensus` false) or on the rows of
/// a tradition (`consensus` true).
ReferenceVerdict GuardReference(int compared, int flagged, const GuardOptions& options = {},
                                bool consensus = false);

}  // namespace apograph::deviation
