#pragma once
/// Relations between individual witnesses read off the characters:
/// candidate direct copies and contaminated witnesses (two exemplars).
/// Both read a character's state 1 as the reading that arose below the
/// archetype, so they take a matrix oriented by a stemma (ancestral.hpp,
/// Orient) and use only directed characters.

#include <string>
#include <vector>

#include "lineage/characters.hpp"

namespace apograph::lineage {

/// "B may be a copy of A": B carries every reading of A's that arose below
/// the archetype (its errors), wherever B can be read, and readings of its
/// own; B is not dated wholly before A; A is not a modern edition when B
/// is older in kind (a manuscript or print).
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

/// Candidates, strongest first. A needs at least `min_errors` errors (fewer
/// prove nothing: every witness "contains" a nearly faultless one).
/// `correctors` (sigla) may read right where their exemplar errs.
std::vector<CopyCandidate> FindCopies(const CharacterMatrix& oriented,
                                      const std::vector<std::string>& correctors = {},
                                      int min_errors = 2);

/// Pairs that hold every error of each other's but whose dates forbid the
/// copy in one direction are still reported by FindCopies in the other;
/// this lists the containments the dates refused, for the report:
/// "D holds all of C's errors, but D (1420) is older than C (1461)".
std::vector<std::string> CopiesRefusedByDates(const CharacterMatrix& oriented, int min_errors = 2);

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
/// such that C shares with X errors that Y can be read at and lacks, and
/// shares with Y errors that X can be read at and lacks, at least two such
/// errors and `min_evidence` weight on each side. Copied along a tree, C
/// could share errors with both only through errors made twice
/// independently (rare for distinctive errors, hence the weights), since
/// every group containing C and X and every group containing C and Y are
/// nested. Only directed characters of weight 1 or more count (one-unit
/// differences and common look-alike slips arise independently too often).
/// X and Y must not descend from C (hold all its errors). A witness whose
/// conflicting errors all come from a contaminated witness it descends
/// from (it holds all that witness's errors) inherits the contamination and
/// is not flagged again. The stretches say where C follows which: its
/// shared errors in order along the table(s), grouped by the relative they
/// side with.
struct Contamination {
  std::string witness;
  std::string primary, secondary;  ///< the relatives: followed for more, for less evidence
  double primary_evidence = 0, secondary_evidence = 0;
  std::vector<ContaminationSegment> segments;
  std::vector<std::string> inherited_by;  ///< witnesses descending from it with its mixture
  std::string text;  ///< "C follows A in rows 10 to 200 and B in rows 210 to 360 (...)"
};

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

/// `suspected` (when given) receives the witnesses that meet the criterion
/// at kSuspectedContaminationEvidence but not at `min_evidence`.
std::vector<Contamination> FindContamination(const CharacterMatrix& oriented,
                                             double min_evidence = kMinContaminationEvidence,
                                             std::vector<Contamination>* suspected = nullptr);

/// The matrix with each contaminated witness made unknown where it follows
/// its secondary relative (each character goes with the nearest stretch),
/// so that the stemma places it by its primary exemplar.
CharacterMatrix MaskSecondaryExemplar(const CharacterMatrix& matrix,
                                      const std::vector<Contamination>& contamination);

}  // namespace apograph::lineage
