#pragma once
/// Evidence of descent: the error characters of a tradition.
///
/// A character is one error: a wrong reading at one cell (or one slid run of
/// a column), with the witnesses that carry it (state 1), those that read
/// the cell otherwise (state 0) and those where it cannot be told (-1:
/// illegible, partial, row omitted). Only cells where witnesses disagree
/// give characters, so right readings shared by witnesses never count. A
/// witness with a different error at the same cell is unknown (-1) for this
/// error: its own slip may have been made on it. The
/// stemma methods root the tree at a virtual archetype carrying no error,
/// so only shared errors (derived states) group witnesses.
///
/// Weights (what one error is worth as evidence of common descent):
///
///   3    a run of a column slid by a row (one event, counted once);
///   3    a distinctive error: several symbols or a whole place changed;
///   2    an error the caller explains as a slip that is not a common one;
///   1    one symbol changed or two adjacent symbols transposed (a common
///        confusion copyists make independently), an entry left blank, or a
///        slip the caller marks as common;
///   0.5  one unit off in the last place (arises independently from
///        rounding or recomputing).
///
/// Cells where no reading can be called right (no model, no majority) give
/// no character; they are counted in `undetermined_cells`.

#include <string>
#include <vector>

#include "collate/collation.hpp"

namespace apograph::lineage {

struct Character {
  std::string label;                ///< "T1 20 eq: 0;45 (0;40)" - cell and the error
  std::string block;                ///< resampling unit for the bootstrap: table and row
  std::string row_label;            ///< the row's argument, for reports ("20")
  int position = 0;                 ///< order along the table(s), for contamination
  std::vector<signed char> states;  ///< per taxon: 1 carries the error, 0 not, -1 unknown
  double weight = 1;
  std::string weight_reason;
  /// The error is an entry left blank: a copyist may fill it in (from the
  /// model or another copy), so a copy that reads it does not refute descent.
  bool omission = false;
};

struct CharacterMatrix {
  std::vector<std::string> taxa;  ///< sigla (the archetype is not a taxon here)
  std::vector<Character> characters;
  int undetermined_cells = 0;

  /// Errors (characters in state 1) of a taxon.
  int ErrorCount(int taxon) const;
};

/// Weight of one error reading against the right reading (see the table above).
/// `units_off` is the distance from the recomputed value when known.
double ErrorWeight(const collate::Reading& error, const std::string& right_text,
                   std::string* reason);

/// The error characters of one collation.
CharacterMatrix BuildErrorCharacters(const collate::Collation& collation);

/// Joins the matrices of several tables of one work (taxa united; a taxon
/// absent from a table is unknown there).
CharacterMatrix MergeMatrices(const std::vector<CharacterMatrix>& parts);

}  // namespace apograph::lineage
