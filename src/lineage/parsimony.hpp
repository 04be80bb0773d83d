#pragma once
/// Maximum parsimony over the error characters (weighted Fitch parsimony on
/// binary characters, rooted at the archetype, which carries no error).
///
/// Search:
///  - up to `exact_limit` witnesses (default 12): exact branch-and-bound.
///    Taxa are added one at a time on every branch of the partial tree; a
///    partial tree is abandoned when its length plus a lower bound for the
///    taxa still to come (one step for every character whose error appears
///    only among them) exceeds the best length known. The first bound comes
///    from the heuristic below, so the search only proves or improves it.
///  - beyond: a heuristic. Stepwise addition (each witness, in order of
///    decreasing number of errors, on the branch where it costs least),
///    then subtree pruning and regrafting (SPR): every subtree is cut and
///    tried on every branch of the rest, and the best improvement is kept,
///    until a whole round improves nothing. Repeated from `starts` addition
///    orders (the first by errors, the others shuffled with `seed`).
///
/// Characters that no tree can use (an error in one witness only) are left
/// out of the search and added back as a constant; all characters count in
/// the branch lengths (one most parsimonious reconstruction, changes put as
/// late as Fitch's sets allow). Unsupported groups are contracted (see
/// tree_checks.hpp).

#include <cstdint>
#include <string>
#include <vector>

#include "lineage/characters.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

struct ParsimonyOptions {
  int exact_limit = 12;  ///< witnesses up to which the search is exact
  int starts = 3;        ///< addition orders tried by the heuristic
  unsigned seed = 1;
};

struct ParsimonyResult {
  Stemma stemma;
  double length = 0;                ///< weighted length of the best tree (all characters)
  bool exact = false;               ///< proved optimal by branch-and-bound
  std::int64_t trees_examined = 0;  ///< partial or complete trees evaluated
  std::string search;               ///< "branch-and-bound" or "stepwise addition + SPR"
};

/// The most parsimonious stemma. `weights` (one per character) replaces the
/// characters' own weights when not empty (the bootstrap passes resampled ones).
ParsimonyResult Parsimony(const CharacterMatrix& matrix, const ParsimonyOptions& options = {},
                          const std::vector<double>& weights = {});

}  // namespace apograph::lineage
