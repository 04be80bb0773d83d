#pragma once
/// Relations between individual witnesses read off the characters:
/// candidate direct copies and contaminated witnesses (two exemplars).
/// Both read a character's state 1 as the reading that arose below the
/// archetype, so they take a matrix oriented by a stemma (ancestral.hpp,
/// Orient) and use only directed characters.

#include <functional>
#include <string>
#include <vector>

#include "lineage/characters.hpp"

namespace apograph::lineage {

/// "B may be a copy of A": B carries every reading of A's that arose below
/// the archetype (its errors), wherever B can be read, and readings of its
/// own; B is not dated wholly before A; A is not a modern edition when B
/// is older in kind (a manuscript or print). (Tolerating errors of A's that
/// B lacks was measured and not adopted: DEVELOPERS.md, "Lineage accuracy".)
struct CopyCandidate {
  std::string copy;         ///< B
  std::string exemplar;     ///< A
  int exemplar_errors = 0;  ///< A's errors, all found in B
  int own_errors = 0;       ///< B's errors not in A
  int unreadable = 0;       ///< A's errors where B cannot be compared (illegible or another error)
  int filled = 0;           ///< entries A leaves blank that B reads (a copyist may fill them in)
  int corrected = 0;        ///< A's errors B reads right (B corrects against the model)
  /// Both carry exactly the same errors and their dates do not tell which
  /// is older: either copied the other, or both a lost exemplar.
  bool twins = false;
  /// The direction comes from the dates (the same errors, one witness older).
  bool dated = false;
  std::string text;
};

/// A witness descending from a contaminated one (inheriting its mixture)
/// holds its errors but for at most one in kErrorsPerLackedError (a copyist
/// mends a few; the slips of a transcription, of text recognition or of
/// the printing, no copy inherits). Judgement from the shared generator (a
/// copy lacks one to three of its exemplar's 8-13 errors).
inline constexpr int kErrorsPerLackedError = 4;

/// Every pair (A, B) where B may be a copy of A, by the criterion above
/// (as FindCopies, but all exemplars of each copy, unranked).
std::vector<CopyCandidate> CopyCandidates(const CharacterMatrix& oriented,
                                          const std::vector<std::string>& correctors = {},
                                          int min_errors = 2);

/// One exemplar per copy from `candidates`, among those `admissible` (all
/// when empty) accepts: the one whose errors the copy holds most. A copy
/// with two such exemplars (as many errors held) is no claim: it goes to
/// `undecided` as a note for the editor. Strongest first.
std::vector<CopyCandidate> ChooseCopies(
    const CharacterMatrix& oriented, const std::vector<CopyCandidate>& candidates,
    const std::function<bool(const CopyCandidate&)>& admissible = {},
    std::vector<std::string>* undecided = nullptr);

/// Candidates, strongest first. A needs at least `min_errors` errors (fewer
/// prove nothing: every witness "contains" a nearly faultless one), one of
/// them more than a unit off (all of them when B reads right more of A's
/// errors than it holds).
/// `correctors` (sigla) may read right where their exemplar errs.
std::vector<CopyCandidate> FindCopies(const CharacterMatrix& oriented,
                                      const std::vector<std::string>& correctors = {},
                                      int min_errors = 2);

/// Pairs that hold every error of each other's but whose dates forbid the
/// copy in one direction are still reported by FindCopies in the other;
/// this lists the containments the dates refused, for the report:
/// "D holds all of C's errors, but D (1420) is older than C (1461)".
std::vector<std::string> CopiesRefusedByDates(const CharacterMatrix& oriented, int min_errors = 2);

/// Whether witness `copy` cannot descend from witness `exemplar` by their
/// catalogue dates (the copy wholly older) or kinds (a manuscript or print
/// from a modern edition); false when the matrix carries no witness data.
bool CannotDescend(const CharacterMatrix& matrix, int copy, int exemplar);

/// One stretch of a contaminated witness and the relative it follows there.
struct ContaminationSegment {
  std::string relative;
  std::string first_row, last_row;  ///< row labels (arguments) of the stretch
  int first_position = 0, last_position = 0;
  int shared = 0;   ///< errors shared with the relative in the stretch
  int against = 0;  ///< of those, errors the other relative lacks
};

/// The criterion (stated in full; tested on uncontaminated traditions):
/// witness C is contaminated when there are two other witnesses X and Y
/// such that
///  - C shares with X errors that Y can be read at and lacks, and shares
///    with Y errors that X can be read at and lacks: at least three such
///    slips (two on the weaker side of a clean switch, kCleanSwitchSlips)
///    and `min_evidence` weight on each side. Copied along a tree,
///    C could share errors with both only through errors made twice
///    independently or mended by one of X, Y, since every group
///    containing C and X and every group containing C and Y are nested;
///  - and the two sets lie in stretches of their own along the table(s)
///    (C changed exemplar part-way, or between tables): in table order,
///    at most kMaxStretchChanges + 1 stretches, each following X or Y,
///    with at most one error in kMisfitsPerStretchError of the weaker
///    side's siding with the other relative inside a stretch. Chance
///    agreements and corrections (a witness reading right where its group
///    errs) fall anywhere in the table, among the errors of C's own line;
///    a change of exemplar separates them.
/// Only characters of weight 1 or more directed by the model or by a
/// majority count: not one-unit differences (rounding and recomputing
/// reach them independently), and not characters a first stemma oriented
/// (a wrong or mis-rooted first tree makes its own conflicts). X and Y
/// must not descend from C (hold all its errors). A witness whose
/// conflicting errors all come from a contaminated witness it descends
/// from (it holds all that witness's errors) inherits the contamination and
/// is not flagged again (it may lack one in kErrorsPerLackedError of them;
/// when each holds the other's so, the one lacking fewer is the copy),
/// and neither is a witness that names a contaminated one, with a stronger
/// mixture, as one of its two relatives (an exemplar of it, or a witness
/// of the line it changed to); of two witnesses that name each other, the
/// one that cannot descend from the other (wholly older by its dates, or a
/// manuscript beside a modern edition) gives way whatever the weights: a
/// copyist turns to a book that exists. Nor is C called when, in the
/// stretch where it seems to have turned to its second relative, that
/// relative holds every one of C's errors (two or more) and C lacks some of
/// the relative's: the relative copied C there (C is its source); C goes
/// to `suspected` with that said. Not asked of the first relative: a
/// sibling C began with holds C's line errors too, and where C made no
/// slip of its own the pattern is the same. Measured on the lineage
/// benchmark (cached characters; DEVELOPERS.md, "Lineage accuracy",
/// twentieth round): contamination precision 0.794 -> 0.824 (seeds
/// 1-100), 1.000 unchanged (101-200), 0.787 -> 0.844 (201-300); witnesses
/// rightly called 27 -> 28, 16, 37 -> 38; false alarms unchanged.
/// Errors siding with the same relative in neighbouring rows count as one
/// slip. The stretches say where C follows which.

/// Changes of exemplar a contaminated witness may show (two: a stretch
/// from the second exemplar inside the table, or one at each end).
/// Judgement: the generator and the traditions we know change once or
/// come back; more changes than that is indistinguishable from chance.
inline constexpr int kMaxStretchChanges = 2;
/// Errors of the weaker side per chance agreement tolerated inside the
/// stretches (an error siding with the other relative where C follows
/// one): judgement, then measured on the lineage benchmark (see
/// DEVELOPERS.md, "Lineage accuracy").
inline constexpr int kMisfitsPerStretchError = 4;
/// Slips enough on the weaker side when the errors make exactly two
/// stretches (one change of exemplar, within a table or between tables)
/// with no error siding against its stretch, and the stronger side shows
/// kMinSideSlips + 1 or more: a single clean switch is what a copyist who
/// turned to a second exemplar leaves, and chance agreements rarely line
/// up so (two coincidences and four line errors fall into two clean blocks
/// with chance 2 / C(6, 2) = 0.13 even before the two-line condition).
/// Not when a relative, in its part of the table, holds every error of C's
/// there while C lacks some of its: that relative copied C (seed 89 of the
/// benchmark: A, the second exemplar of E, looked like a switch to E).
/// Measured on the lineage benchmark (cached characters; DEVELOPERS.md,
/// "Lineage accuracy", thirteenth round): contaminated witnesses found
/// 10 -> 13 (seeds 1-53), 1 -> 2 (101-130), 7 -> 14 (131-200), precision up
/// on all three; false alarms on uncontaminated draws 1 -> 2 of 53, 0 of 30
/// and 1 of 70 unchanged. A stronger side of 3 or of 5 did worse.
inline constexpr int kCleanSwitchSlips = 2;

struct Contamination {
  std::string witness;
  /// The relatives: followed where the text begins (the exemplar, by which
  /// the stemma places the witness), and turned to later (the second
  /// exemplar); empty for a line with no surviving witness (the one-line
  /// criterion).
  std::string primary, secondary;
  double primary_evidence = 0, secondary_evidence = 0;
  std::vector<ContaminationSegment> segments;
  std::vector<std::string> inherited_by;  ///< witnesses descending from it with its mixture
  std::string text;  ///< "C follows A in rows 10 to 200 and B in rows 210 to 360 (...)"
  /// For a suspected mixture only: what it lacks to be called ("2 slips on
  /// the weaker side, 3 needed", "weight 2 on the weaker side, 3 needed");
  /// empty when the two sets are mixed along the table (the text says so).
  std::string shortfall;
  /// For a suspected mixture only: the criterion holds, but the text says
  /// why the witness is not called (its second relative copied it); the
  /// note then does not say "too little".
  bool direction_refused = false;
};

/// The stretch of `c` nearest to the character at `position` (the one it
/// lies in, else the closest): where the witness follows which relative
/// there. Null when `c` has no stretches.
const ContaminationSegment* NearestSegment(const Contamination& c, int position);

/// The one-line criterion (a second one, for a witness that takes one part
/// from a line with no surviving witness, or the archetype's own, where it
/// has no second relative): witness C is contaminated when there is a
/// witness X (neither descending from the other) such that
///  - C and X share at least kOneLineShared errors, and the longest stretch
///    of their errors (those of either, both legible, in table order)
///    without a shared one is so long that shared errors spread at random
///    would leave it with chance (shared + 1) (1 - gap / all)^shared at
///    most kOneLineChance;
///  - in that stretch C has kMinSideSlips errors or more and at most one in
///    kMisfitsPerStretchError of them is held by any witness other than X
///    and the descendants of C and X (C has no relative there);
///  - and X's line goes on there (two or more of X's errors in the stretch
///    held by such a witness), or, outside it, C holds a larger share of
///    X's errors than X of C's (C is below X there): otherwise X may be
///    the one that changed exemplar.
/// Copied along a tree, C would share its line's errors with X all along
/// the table. Segments: X's stretch(es), and the stretch of the lost line
/// with an empty relative; primary is the one followed first.
/// Measured on the lineage benchmark, seeds 1-150 with and without
/// contamination (DEVELOPERS.md, "Lineage accuracy"): at 0.001, 0.003 and
/// 0.01 no false alarm on seeds 1-60, found 2, 4, 5 more contaminated
/// witnesses there; on seeds 61-150 none more at 0.003, one false alarm
/// more at 0.01.
inline constexpr double kOneLineChance = 0.003;
/// Shared errors the one-line criterion asks. Measured on the lineage
/// benchmark, seeds 1-300: with three, false alarms on 2 more of 300
/// uncontaminated draws (three or four shared errors in a few neighbouring
/// rows, one event, against a stretch of 80-95 errors), none with five.
inline constexpr int kOneLineShared = 5;
/// A witness erring in the stretch more than this many times as often per
/// row as elsewhere differs there by something systematic (a misread
/// script, a recomputed column), not by its exemplar; it is not flagged.
/// Judgement (seed 46 of the benchmark: a witness with 217 errors in one
/// table and 5 elsewhere).
inline constexpr double kOneLineRateRatio = 5;

/// The line-join criterion (a third one, for a witness whose own line
/// shows too few errors for the two-line criterion): witness C is
/// contaminated when there are two witnesses X and Z (neither descending
/// from C, neither flagged by the criteria above) such that, along the
/// errors X and Z share where C can be read (in table order; neighbours C
/// reads alike counted once), C reads right at every one of a run of
/// kMinSideSlips or more at one end of the table and holds kMinSideSlips
/// or more of the others, and held errors spread at random would leave
/// such a run with chance at most kJoinChance (hypergeometric, either end).
/// Copied along one line, C would hold the errors of X and Z's common
/// ancestors throughout or nowhere; C follows their line in one part only.
/// Segments: X's stretch, and C's own line (an empty relative).
/// Judgement on kOneLineChance's scale, checked on the lineage benchmark
/// (seeds 1-100, cached characters; DEVELOPERS.md "Lineage accuracy",
/// seventh round): the lowest chance of a witness of an uncontaminated
/// draw was 0.0046 (a run of two, which kMinSideSlips refuses), then
/// 0.014; of contaminated witnesses 4.5e-7, 0.0017, 0.0025, 0.0035, 0.0043.
inline constexpr double kJoinChance = 0.003;

/// Weight (each side) from which two lines of errors in one witness are
/// called contamination. Judgement, then checked on uncontaminated draws of
/// the lineage benchmark (tests/bench/lineage_accuracy_bench.cpp): one
/// distinctive error or three common slips on each side.
inline constexpr double kMinContaminationEvidence = 3;

/// Weight (each side, two errors or more) from which a mixture below
/// kMinContaminationEvidence is still worth telling the editor as
/// undecided: two common slips on each side (judgement: two coincidences
/// on a tree are not rare enough to call it, but the editor should look).
inline constexpr double kSuspectedContaminationEvidence = 2;

/// `suspected` (when given) receives the witnesses that fail the criterion
/// but share errors with two lines, two or more and
/// kSuspectedContaminationEvidence weight on each side, wherever they lie
/// (a question for the editor, never a finding).
std::vector<Contamination> FindContamination(const CharacterMatrix& oriented,
                                             double min_evidence = kMinContaminationEvidence,
                                             std::vector<Contamination>* suspected = nullptr);

/// The matrix with each contaminated witness, and each it handed its
/// mixture down to (Contamination::inherited_by), made unknown where it
/// follows its secondary relative (each character goes with the nearest
/// stretch), so that the stemma places it by its primary exemplar. Kept
/// there: the readings of characters whose every carrier is the witness or
/// one holding its errors (its own errors and its copies'), which did not
/// come from the second exemplar and tell a copy from a twin. Measured on
/// the lineage benchmark (cached characters, fifteenth round): copies
/// right 90 -> 91 of 123 (1-53), 42 -> 44 of 60 (101-130), wrong claims 14
/// -> 13 (131-200).
CharacterMatrix MaskSecondaryExemplar(const CharacterMatrix& matrix,
                                      const std::vector<Contamination>& contamination);

}  // namespace apograph::lineage
