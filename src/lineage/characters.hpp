#pragma once
/// Evidence of descent: the characters of a tradition, one for every
/// variant reading at every place where the witnesses disagree.
///
/// A character is one reading at one cell (or one slid run of a column):
/// the witnesses that carry it (state 1), those that read the cell's base
/// reading (state 0) and those where it cannot be told (-1: illegible,
/// partial, row omitted, or a third reading, which may have been made on
/// this one). Only cells where witnesses disagree give characters, so right
/// readings that every witness shares never count.
///
/// The base reading (state 0) and the direction of the character:
///  - with a model (the collation judged the cell, Basis::kCaller or
///    kRecomputation), the base is a reading the model calls right and the
///    character is *directed* by the model (state 0 was the archetype's;
///    an error most witnesses share may yet be the archetype's own, the
///    others having corrected it: corrections.hpp finds such witnesses and
///    sets their right readings aside). Right readings that differ among
///    themselves (the author's departure of a unit against the recomputed
///    value, a modern edition's rounding) give characters too: directed,
///    with the recomputed value as base, when most witnesses read it;
///    otherwise most keep another right reading (the author's own, as a
///    rule), the recomputed value there is a correction that says nothing
///    of descent (its readers are counted in `recomputed` and left
///    unknown), and the other right readings give undirected characters;
///  - without a model, the base is the most frequent reading: directed by
///    the majority when more than half the legible witnesses read it,
///    undirected otherwise (a split of two against two).
/// Undirected characters still group witnesses (they tell the unrooted
/// tree); only directed ones say where the archetype stands.
///
/// Weights (what sharing the reading is worth as evidence of common
/// descent: the less likely two copyists reach it independently, the
/// more; judgement, ordered by how often such agreements arise by chance):
///
///   3    a run of a column slid by a row (one event, counted once);
///   3    a distinctive difference: several symbols or a whole place changed;
///   2    an error the caller explains as a slip that is not a common one;
///   1    one symbol changed or two adjacent symbols transposed (a common
///        confusion copyists make independently), an entry left blank, the
///        entry of the row above or below repeated, or a slip the caller
///        marks as common;
///   0.5  one unit in the last place (rounding and recomputing reach it
///        independently: weak, but not nothing).
///
/// Agreement in the right reading is no evidence: a witness that reads the
/// model's value where its relatives err may have corrected it (see
/// relations.hpp, FindCorrections), which is why every character records
/// whether its state 0 is a reading the model calls right.

#include <string>
#include <vector>

#include "collate/collation.hpp"
#include "edition/transcription.hpp"

namespace apograph::lineage {

/// What tells that state 0 was the archetype's.
enum class Direction {
  kModel,     ///< the model calls the base reading right
  kMajority,  ///< more than half the legible witnesses read the base
  kTree,      ///< undirected, then oriented by a rooted stemma (see Orient)
  kNone,      ///< nothing: the character only splits the witnesses
};
const char* ToString(Direction direction);  ///< "model", "majority", "tree", "none"

struct Character {
  std::string label;                ///< "T1 20 eq: 0;45 (0;40)" - cell and the reading
  std::string block;                ///< resampling unit for the bootstrap: table and row
  std::string row_label;            ///< the row's argument, for reports ("20")
  int position = 0;                 ///< order along the table(s), for contamination
  std::vector<signed char> states;  ///< per taxon: 1 carries the reading, 0 base, -1 unknown
  double weight = 1;
  std::string weight_reason;
  /// The reading is an entry left blank: a copyist may fill it in (from the
  /// model or another copy), so a copy that reads it does not refute descent.
  bool omission = false;
  Direction direction = Direction::kModel;
  /// State 0 is a reading the model calls right (a corrector may have reached it).
  bool base_is_right = false;
  /// The readings differ by one unit in the last place.
  bool one_unit = false;
  /// State 1 is a reading the model calls right too (a difference of
  /// rounding between two right readings).
  bool carrier_is_right = false;
  /// A copy of another character that keeps a corrector's right readings
  /// at a small weight (corrections.hpp); not counted as a character.
  bool tie_break = false;
  /// The carrier's slip class as the caller explained it ("systematic",
  /// "confusion", ...; empty when unexplained or not an error) and the
  /// column's name: what JoinRepeatedSlips reads.
  std::string cause, column;
  /// The row of its table (0 the first) and the rows it covers (one, or a
  /// run joined as one slip by JoinRepeatedSlips).
  int row = 0, rows = 1;

  bool Directed() const { return direction != Direction::kNone; }
};

struct CharacterMatrix {
  std::vector<std::string> taxa;  ///< sigla (the archetype is not a taxon here)
  /// Per taxon, the witness as catalogued (kind, date); may be empty.
  std::vector<WitnessInfo> witnesses;
  std::vector<Character> characters;
  /// Cells whose readings no model and no majority could call right (they
  /// give undirected characters).
  int undetermined_cells = 0;
  /// Per taxon: entries where it reads the recomputed value while two
  /// thirds of the witnesses or more keep another reading within the
  /// tolerance (the author's own departure, as a rule), and entries of that
  /// kind where it can be read.
  std::vector<int> recomputed, departure_cells;
  std::string title;  ///< the work's (or table's) title, for drawings

  /// Characters in state 1 of a taxon.
  int ErrorCount(int taxon) const;
  int TaxonIndex(const std::string& siglum) const;
};

/// Weight of one reading against the base reading (see the table above).
/// `units_off` is the distance from the base (or recomputed value) when known.
double ErrorWeight(const collate::Reading& error, const std::string& right_text,
                   std::string* reason);

/// One slip repeated row after row (a place left out, moved or held over a
/// run of a column: the explainer's "systematic" class) is one event, and
/// is counted once: the characters of consecutive rows of a column whose
/// carriers read such a slip, the same witnesses carrying it in every row,
/// are joined into one (a witness that reads the base in some rows and not
/// in others is unknown there). Its weight: that of its most distinctive
/// row, at most kRepeatedSlipWeight (one event, as a run of a column slid by
/// a row); at most kRepeatedSlipAtHead when the run begins in a column's
/// first kHeadRows rows, where copyists leave out or move the leading place
/// as a habit and independent copies land on the same readings.
/// Measured on the lineage benchmark (seeds 1-100 and 201-300, characters
/// built anew, DEVELOPERS.md "Lineage accuracy", seventeenth round): false
/// alarms on uncontaminated draws 3 -> 1 and 7 -> 4, groups 0.881 -> 0.884
/// and 0.814 -> 0.841; head rows 2, 4, 6 and 12 and no head at all within a
/// group and a false alarm of each other.
void JoinRepeatedSlips(CharacterMatrix& matrix);
inline constexpr double kRepeatedSlipAtHead = 1;
inline constexpr double kRepeatedSlipWeight = 3;
/// Rows at the head of a column where a repeated slip counts as a habit
/// (judgement: "the first rows of a column"; see above).
inline constexpr int kHeadRows = 6;

/// The characters of one collation.
CharacterMatrix BuildCharacters(const collate::Collation& collation);
/// The former name of BuildCharacters (kept for callers outside this stage).
inline CharacterMatrix BuildErrorCharacters(const collate::Collation& collation) {
  return BuildCharacters(collation);
}

/// Joins the matrices of several tables of one work (taxa united; a taxon
/// absent from a table is unknown there).
CharacterMatrix MergeMatrices(const std::vector<CharacterMatrix>& parts);

}  // namespace apograph::lineage
