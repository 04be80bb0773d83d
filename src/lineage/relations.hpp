#pragma once
/// Relations between individual witnesses read off the error characters:
/// candidate direct copies and contaminated witnesses (two exemplars).

#include <string>
#include <vector>

#include "lineage/characters.hpp"

namespace apograph::lineage {

/// "B may be a copy of A": B carries every error of A that can be read in B,
/// and errors of its own.
struct CopyCandidate {
  std::string copy;         ///< B
  std::string exemplar;     ///< A
  int exemplar_errors = 0;  ///< A's errors, all found in B
  int own_errors = 0;       ///< B's errors not in A
  int unreadable = 0;       ///< A's errors where B cannot be compared (illegible or another error)
  int filled = 0;           ///< entries A leaves blank that B reads (a copyist may fill them in)
  /// Both carry exactly the same errors: either copied the other, or both a
  /// lost exemplar.
  bool twins = false;
  std::string text;
};

/// Candidates, strongest first. A needs at least `min_errors` errors (fewer
/// prove nothing: every witness "contains" a nearly faultless one).
std::vector<CopyCandidate> FindCopies(const CharacterMatrix& matrix, int min_errors = 2);

/// One stretch of a contaminated witness and the relative it follows there.
struct ContaminationSegment {
  std::string relative;
  std::string first_row, last_row;  ///< row labels (arguments) of the stretch
  int first_position = 0, last_position = 0;
  int shared = 0;   ///< errors shared with the relative in the stretch
  int against = 0;  ///< of those, errors the other relative(s) lack
};

struct Contamination {
  std::string witness;
  std::vector<ContaminationSegment> segments;
  std::string text;  ///< "C follows A in rows 10 to 200 and B in rows 210 to 360 (...)"
};

/// Witnesses whose errors follow one relative in one stretch of the
/// table(s) and another elsewhere. Each stretch must hold at least
/// `min_evidence` weighted errors shared with its relative and absent from
/// the relative of the neighbouring stretch.
std::vector<Contamination> FindContamination(const CharacterMatrix& matrix,
                                             double min_evidence = 2.5);

}  // namespace apograph::lineage
