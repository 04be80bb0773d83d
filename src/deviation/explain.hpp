#pragma once
/// Explaining deviations: for each entry that differs from the model by more
/// than the tolerance, the copying slips (or the author's inaccuracy) that
/// account for it, ranked, each with a proposed original reading and a
/// sentence of evidence an editor can paste into a note.
///
/// The stage is driven by plain values: a Transcription, and per column the
/// model's value of every row (computed by the caller with the author's
/// practice applied) and, optionally, the model's exact value for the
/// evidence. It knows nothing of the database or of how the model was chosen.
///
/// Every explanation is scored by evidence (src/deviation/scoring.hpp holds
/// each constant with its basis): the likelihood of the story is how often a
/// copyist makes that kind of slip (its share of all slips), times how likely
/// this particular change is within the kind (which symbol of the entry, the
/// weight of the confused pair in the witness's script, the size of the
/// change), times how well the emended reading then fits: exactly (the model's
/// reading, or the reading the other witnesses agree on), or within the
/// author's typical departure from the model (then as likely as the author's
/// departure there). The author's own departure is a story too (how often the
/// author departs by that much, more when a neighbour shares it, when the exact
/// value lies near a rounding boundary, or when the other witnesses read the
/// same; far less when they read the model's value). A finding's score is the
/// best story's share of all the stories told plus a constant share for the
/// stories not thought of: in [0, 1], high when one story clearly wins.
/// Slips that span rows (displaced runs, systematic runs) and blank or
/// illegible cells carry fixed scores (see their files).

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "deviation/numeral_script.hpp"
#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::deviation {

/// What produced a deviation.
enum class SlipClass {
  kConfusion,      ///< one or two symbols confused in the witness's script
  kTransposition,  ///< the two digits of a place transposed (43 for 34)
  kPlace,          ///< a place omitted, added or moved (minutes written as seconds)
  kDisplacedRun,   ///< a run of entries slid by one or more rows (eye-skip)
  kSystematic,     ///< one slip repeated over consecutive rows (a place dropped, a constant error)
  kRepetition,     ///< a neighbouring entry (or one of its places) repeated
  kBlank,          ///< nothing written
  kIllegible,      ///< written but not (fully) readable
  kComputational,  ///< the author's own inaccuracy: belongs in the edition
  kUnexplained,    ///< no explanation reaches the model's value
};

/// Stable names used in JSON, CSV and the database: "confusion",
/// "transposition", "place", "displaced-run", "systematic", "repetition",
/// "blank", "illegible", "computational", "unexplained".
const char* ToString(SlipClass cls);
std::optional<SlipClass> SlipClassFromString(const std::string& text);
/// True for every class that is a copyist's doing (all but computational):
/// those call for an emendation.
bool IsCopyingSlip(SlipClass cls);

/// What the other witnesses of the table read at one cell (the tradition's
/// view, filled by the caller; see pipeline::ExplainTradition). Modern
/// editions are left out: they may have recomputed the table.
struct TraditionCell {
  int witnesses = 0;  ///< other witnesses with a reading at this cell
  int same = 0;       ///< of them, reading this witness's value
  int model = 0;      ///< of them, reading the model's reading
  /// The reading more than half of them share (at the column's places).
  std::optional<Sexagesimal> consensus;
  int agree = 0;  ///< of them, reading the consensus
};

/// The model's values for one column, row by row (same length as the table).
struct ColumnValues {
  int column = 0;
  /// The model's value with the author's practice applied (usually at the
  /// column's places; more places are allowed and then the tolerance absorbs
  /// rounding). nullopt: no value for this row.
  std::vector<std::optional<Sexagesimal>> computed;
  /// The model's exact values (NaN: none), quoted in the evidence; may be empty.
  std::vector<double> exact;
  /// The other witnesses' readings, row by row; empty when the witness is
  /// explained alone. With them, a departure the others share is the
  /// author's, and one they do not share is a copyist's.
  std::vector<TraditionCell> tradition;
  /// Per row, why the model's value there rests on a doubtful argument (the
  /// row's argument in use, or that of a row the model is computed from,
  /// out of step with its neighbour's: a miscopied argument), in words;
  /// empty where it does not, or when not known (then the vector may be
  /// empty). The model and the other witnesses (aligned by argument) are
  /// compared there at an argument the row may not stand for: a deviation
  /// is kept, not emended on their word.
  std::vector<std::string> argument_doubt;
};

struct ExplainOptions {
  double tolerance = 0.5;  ///< units of the last place an entry may differ
  int max_confusions = 2;  ///< symbol confusions combined in one explanation
  int max_shift = 3;       ///< rows a displaced run may have slid
  /// The author's typical departure is measured on the column (1 unit, or
  /// 2 when the column shows enough 2-unit departures); never above this.
  double computational_units = 2;
};

/// One candidate explanation.
struct Explanation {
  SlipClass cls = SlipClass::kUnexplained;
  double score = 0;
  std::optional<Sexagesimal> emendation;  ///< the proposed original reading
  std::string evidence;                   ///< a sentence for a critical note
};

/// One cell a finding covers.
struct FindingCell {
  std::size_t row = 0;
  std::string arg;                        ///< the argument as written (or expected)
  std::string tabulated;                  ///< the reading as transcribed (`_`, `?` included)
  std::optional<Sexagesimal> value;       ///< the tabulated value when read
  std::optional<Sexagesimal> computed;    ///< the model's value
  double diff_units = 0;                  ///< tabulated - computed, units of the last place
  std::optional<Sexagesimal> emendation;  ///< proposed reading for this cell
};

/// A deviation (one cell, or one displaced run) with its ranked explanations.
struct Finding {
  int column = 0;
  std::string column_name;
  int places = 0;
  std::vector<FindingCell> cells;         ///< in row order
  std::vector<Explanation> explanations;  ///< best first; never empty
  /// A reading every other witness shares, beyond the author's departure and
  /// out of every slip's reach, kept against the model (class computational,
  /// no emendation): evidence against the reference at this row, which the
  /// guard counts as a flagged row (guard.hpp), though nothing is emended.
  bool kept_against_model = false;
  /// Kept against the model because the model there rests on a doubtful
  /// argument (ColumnValues::argument_doubt): evidence against the row's
  /// argument, not against the reference, so the guard does not count it.
  bool argument_doubted = false;

  const Explanation& best() const { return explanations.front(); }
  /// The other classes the evidence cannot tell from the best's: copying
  /// slips proposing the same reading with a score within a factor of two of
  /// the best's (0;44 read 44;0: the places swapped, or the degrees' 0 left
  /// out and the minutes moved up). Empty when the best stands alone.
  std::vector<SlipClass> Undecided() const;
  /// One line reading like a critical note, e.g.
  /// "12 equation: 0;14 A] read 0;44 - tens of minutes: ... [confusion 0.54]".
  std::string Note(const std::string& siglum) const;
};

/// Explains the deviations of one column, in row order. `tradition_scripts`:
/// the numeral scripts other witnesses of the tradition write; a slip may have
/// been made by an ancestor writing one of them and inherited (their listed
/// confusions are tried too, weighed down, and, where no path of any list
/// reaches the place, one symbol changed outside their lists).
std::vector<Finding> ExplainColumn(const Transcription& table, const ColumnValues& values,
                                   const NumeralScript& script, const ExplainOptions& options = {},
                                   const std::vector<const NumeralScript*>& tradition_scripts = {});

/// Name of fractional place p of a column (0 -> "degrees" or "units" by the
/// column's unit, 1 -> "minutes", 2 -> "seconds", 3 -> "thirds", ...).
std::string PlaceName(int place, const std::string& unit);

}  // namespace apograph::deviation
