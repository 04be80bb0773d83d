#pragma once
/// A guard on the reference: when too much of a column deviates from its
/// model, the model (or its parameters, or the practice) is wrong, not the
/// witness. Then no entry is explained against it and no emendation is
/// proposed; the caller shows the model-free screen (screen.hpp) instead.
///
/// Four tests, the first two with their stated share:
///  - one witness: the share of its compared entries that its findings flag
///    (copying slips and unexplained deviations, blanks left out);
///  - the tradition: the share of rows that every witness flags (a copy's
///    slips, even those of a lost ancestor, are in some witnesses only; a
///    row flagged in all is an archetype's error or the reference's);
///  - the trend: rows that most witnesses flag, lying on a smooth hill of
///    the tradition's difference from the model (it grows, by a unit or two
///    a row, from within the author's rounding). A reference close to right
///    (a parameter slightly off, a mean motion's rate a little wrong) misses
///    by a difference that varies smoothly with the argument; a copy's slip
///    is isolated, or jumps at once to its size over a run, and is read by
///    some witnesses only;
///  - the agreed runs: runs of consecutive rows, more than a few percent of
///    the column, where most witnesses read alike a value off the model that
///    no listed slip reaches (a reference that misses blocks of rows by far,
///    the rest right).
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
  /// The trend test. Judgement: the author's rounding leaves up to a unit
  /// between his value and a right model's, so a hill that starts (or ends)
  /// within a unit has grown out of the rounding; a reference close enough
  /// to pass the shares above misses by an error whose slope is a fraction
  /// of a unit a row, so its rounded difference steps by one unit at most (a
  /// copy's run inherited by most witnesses jumps by its whole size).
  int trend_start = 1;
  int trend_step = 1;
  /// Judgement: rows beyond the rounding that most witnesses flag on one
  /// such hill before the hill, not the copies, is taken to be the cause (as
  /// min_rows). Right references it refuses on the benchmark are counted in
  /// DEVELOPERS.md.
  int trend_rows = 3;
  /// Judgement: a trend grows in proportion to what it has reached (an error
  /// of rate or parameter grows with the argument, and faster where the
  /// function is steep), so a step inside a hill may be up to this share of
  /// the smaller of its two sides beyond `trend_step`; a copy's run that
  /// jumps from the rounding (0 or 1) to its size of 3 or more still fails.
  double trend_growth = 0.5;
  /// Judgement: a hill whose differences are proportional to the argument
  /// (a mean motion's rate off: the error is the argument times the rate's)
  /// within this many units at every flagged row, growing at least twofold
  /// over the hill, is a trend however irregular the arguments' steps.
  double trend_proportional = 1.5;
  /// The agreed-run test. Judgement, as min_rows: consecutive rows that most
  /// witnesses read alike off the model where no listed slip reaches their
  /// reading; a copy's slip outside the lists is one witness's (or one
  /// branch's) at a row or two, not most witnesses' over a run. Right
  /// references it refuses on the benchmark are counted in DEVELOPERS.md.
  int agreed_rows = 3;
  /// Judgement, informed by two columns of the benchmark (DEVELOPERS.md,
  /// sixth round): a lost archetype's run, inherited by every witness,
  /// covers a few rows of a column (6 rows of 301, 2%, on seeds 41-60); a
  /// reference that misses blocks of rows covered 20 of 173 (12%) on seeds
  /// 121-140. The rows in such runs must exceed this share of the column.
  double agreed_share = 0.05;
};

/// One row of the tradition for the trend test, in the order of the argument.
struct TrendRow {
  std::string arg;
  double units = 0;     ///< the median over the witnesses of reading minus model, in units
  int readers = 0;      ///< witnesses with a reading compared with the model
  int flaggers = 0;     ///< of them, flagging the row
  double x = 0;         ///< the argument as a number (for a difference growing with it)
  int unexplained = 0;  ///< of the flaggers, those whose reading no listed slip reaches
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

/// The trend test on the rows of a tradition (see the header's comment):
/// refused when one smooth hill of the difference carries at least
/// `trend_rows` rows beyond the author's rounding that most witnesses flag.
/// The difference is first smoothed by a running median of three rows, so
/// that one of the author's departures (or one row's slip) inside a ramp
/// does not break it into hills; a hill is smooth when it grows out of the
/// rounding by steps of at most `trend_step` plus `trend_growth` of what it
/// has reached, or when it is proportional to the argument.
ReferenceVerdict GuardTrend(const std::vector<TrendRow>& rows, const GuardOptions& options = {});

/// The agreed-run test on the rows of a tradition: refused when runs of at
/// least `agreed_rows` consecutive rows, each flagged by most of its readers
/// (two at least) as a deviation that no listed slip explains, cover more
/// than `agreed_share` of the rows. Where the
/// tradition agrees on a reading off the model over a run of rows and no
/// copying slip reaches it, the archetype (the author) departs from the
/// reference there: the reference misses those rows (or the author computed
/// otherwise), and emending every witness to it restores no copy's slip.
ReferenceVerdict GuardAgreedRun(const std::vector<TrendRow>& rows,
                                const GuardOptions& options = {});

}  // namespace apograph::deviation
