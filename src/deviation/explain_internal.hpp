#pragma once
// Internal to the deviation stage: what the candidate generators share.

#include <cmath>
#include <cstdint>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "deviation/explain.hpp"
#include "deviation/scoring.hpp"

namespace apograph::deviation::internal {

// Fixed scores of findings that are not ranked against alternatives.
constexpr double kScoreBlank = 0.95;  // judgement: a blank or illegible cell is what it is
// Judgement: a reading the whole tradition shares that no slip joins to the
// model is kept, one story of two (the reference misses the row, or an
// archetype's slip outside every list): undecided between them.
constexpr double kScoreTraditionKept = 0.5;

/// A value as its places: d[0] the integer part, d[1..] the fractions.
struct Digits {
  bool negative = false;
  std::vector<std::int64_t> d;
};
Digits ToDigits(const Sexagesimal& value, int places);
/// nullopt when a place is out of range (fractions 0..59, a whole part below
/// 0). A whole part may exceed 999: a sine to a radius of 3438 reads 3141.
std::optional<Sexagesimal> FromDigits(const Digits& digits);
/// `value` at exactly `places` places (extended, or rounded).
Sexagesimal AtPlaces(const Sexagesimal& value, int places);

/// One story for a deviant cell, with its unnormalised likelihood (the
/// copy's slip rate, or the author's departure rate, times the rest).
struct Candidate {
  Explanation explanation;
  double likelihood = 0;
};

/// Everything a generator needs about one deviant cell.
struct CellContext {
  const Transcription* table = nullptr;
  const NumeralScript* script = nullptr;
  const ExplainOptions* options = nullptr;
  const AuthorProfile* author = nullptr;
  const TraditionCell* tradition = nullptr;  // null: explained alone
  std::size_t row = 0;
  int column = 0;
  int places = 0;
  std::string unit;
  Sexagesimal tabulated;      // at the column's places
  Sexagesimal computed;       // as given
  Sexagesimal model_reading;  // computed at the column's places
  /// The reading the other witnesses agree on, when it differs from this
  /// copy's and lies within the author's departure of the model: the
  /// original most likely had it.
  std::optional<Sexagesimal> tradition_reading;
  double exact = NAN;  // NaN when not given
  double diff = 0;     // tabulated - computed, units
  /// The same counted as the author departs (see AuthorDiff): in steps of
  /// the column's grid, or in the last place the reading or the model uses.
  double author_diff = 0;
  int grid = 1;                   // the step the author writes the last place in (units)
  double slip_rate = 0;           // the copy's share of entries beyond the author's departure
  int symbols = 1;                // symbols written in the copy's entry
  bool shared_neighbour = false;  // a neighbour departs the same way, within the author's departure
  bool shared = false;            // every other witness reads this copy's value
  const std::vector<bool>* deviant = nullptr;  // rows beyond the author's departure
  /// The readings the exemplar most likely had at the rows above and below
  /// (ColumnContext::Original: the tradition's, else the model's): what a
  /// copyist repeating a neighbouring line saw, whatever this copy wrote there.
  std::optional<Sexagesimal> exemplar_above, exemplar_below;
  /// Other scripts of the tradition, whose listed confusions an ancestor may
  /// have made (may be null).
  const std::vector<const NumeralScript*>* other_scripts = nullptr;

  /// The reading the original most likely had: the tradition's, else the model's.
  const Sexagesimal& Expected() const {
    return tradition_reading ? *tradition_reading : model_reading;
  }
  /// How well `reading` fits as the original: 1 when it is the expected
  /// reading; the author's departure rate (and boundary) when it lies within
  /// the author's typical departure of the model; nullopt beyond.
  std::optional<double> Fit(const Sexagesimal& reading) const;
  /// "the model gives 0;41,12, the emended reading 0;41 is within half a unit".
  std::string ModelClause(const Sexagesimal& reading) const;
  /// The tabulated value of another row of this column, when read.
  std::optional<Sexagesimal> Neighbour(std::ptrdiff_t offset) const;
  /// A slip's likelihood: the copy's slip rate x the class's share x the
  /// chance of this change within the class x the fit of the reading.
  double SlipLikelihood(double share, double change, double fit) const {
    return slip_rate * share * change * fit;
  }
};

/// Symbol slips: the script's listed confusions (one or two), or one symbol
/// changed, dropped or added outside the lists (symbol_slips.cpp).
std::vector<Candidate> ConfusionCandidates(const CellContext& c);
std::vector<Candidate> TranspositionCandidates(const CellContext& c);
std::vector<Candidate> PlaceCandidates(const CellContext& c);
std::vector<Candidate> RepetitionCandidates(const CellContext& c);
/// The author's own departure (nullopt beyond the author's typical departure).
std::optional<Candidate> AuthorCandidate(const CellContext& c);
/// The tradition's reading kept against the model: every other witness (two
/// or more) reads this copy's value, and no copying slip reaches the model's
/// reading from it (the caller has found none). Then the model, not the
/// whole tradition, is the suspect at this row: a derived column's model
/// computed from source entries that carry an archetype's slip, a fitted
/// reference that misses a row, or the author computing otherwise. An
/// editor does not emend every witness on the model's word alone: the
/// reading is kept (class computational, no emendation), the evidence
/// saying why. nullopt when the tradition does not share the reading.
std::optional<Candidate> TraditionKeptCandidate(const CellContext& c);
/// No listed slip: the expected reading proposed, the change described by its
/// places and size.
Candidate UnexplainedCandidate(const CellContext& c);

/// Tabulated - computed per row in units (NaN where either is missing).
struct DiffColumn {
  std::vector<double> diff;
};
DiffColumn Diffs(const Transcription& table, const ColumnValues& values, int places);

/// A row whose entry lies near the line through its nearest neighbours
/// that read the model (rows `lo` and `hi`) while the model lies far off it.
struct OffCurve {
  std::size_t lo = 0, hi = 0;
  double reading_off = 0;  ///< units from the line to the entry
  double model_off = 0;    ///< units from the line to the model
};

/// What the column tells about its author and its copyist.
struct ColumnContext {
  DiffColumn diffs;
  /// The step the author writes the column's last place in, in units of it:
  /// 10 when he writes thirds in tens ("0;5,24,20"); 1 when no grid shows
  /// (see MeasureGrid in grid.cpp).
  int grid = 1;
  /// Per row, tabulated - computed counted as the author departs: in steps
  /// of the grid when the reading lies on it, else in units (as `diffs`).
  std::vector<double> departure;
  AuthorProfile author;
  double slip_rate = kSlipRatePrior;
  /// Rows departing beyond the author's typical departure (and not read
  /// so by every other witness within computational_units).
  std::vector<bool> deviant;
  /// Rows whose reading the other witnesses read too (all but perhaps one in
  /// four: a corrector, or a slip of its own).
  std::vector<bool> shared;
  /// Rows whose reading every other witness (two or more) contradicts with
  /// one reading of their own.
  std::vector<bool> contradicted;
  /// Per row, the reading the other witnesses agree on (more than half of
  /// them), at the column's places, when they have one.
  std::vector<std::optional<Sexagesimal>> consensus;
  /// Per row, that reading when it differs from this copy's and lies within
  /// the author's departure of the model: the original most likely had it.
  std::vector<std::optional<Sexagesimal>> tradition_reading;
  /// Per row, the rows [first, last] (two or three, this one among them)
  /// over which the tradition's firm reading departs from the model beyond
  /// the author's departure in both directions and the departures cancel
  /// (CompensatingRows): the model, not the tradition, misses those rows.
  std::vector<std::optional<std::pair<std::size_t, std::size_t>>> compensating;
  /// Per row beyond the author's departure, where the model, not the entry,
  /// leaves the column's curve (ModelOffCurve).
  std::vector<std::optional<OffCurve>> off_curve;
  /// The original's most likely reading of a row: the tradition's when it
  /// lies within the author's departure of the model, else the model's.
  std::optional<Sexagesimal> Original(std::size_t row, const ColumnValues& values,
                                      const ExplainOptions& options, int places) const;
};
ColumnContext MeasureColumn(const Transcription& table, const ColumnValues& values,
                            const ExplainOptions& options, int places);
/// Per row, the window of two or three consecutive rows in which the
/// reading every other witness but perhaps one in four agrees on (two
/// witnesses at least) departs from the model beyond the author's typical
/// departure at this row and, the other way, at another row of the window,
/// the departures over the window summing to within the author's departure:
/// one entry of a source the model is computed from (a difference column's
/// base) that the author had otherwise, or a fitted reference off over two
/// rows. Two slips of an archetype on neighbouring rows that cancel are far
/// rarer. A window where an entry beyond the author's departure reads its
/// neighbour's value while the model is smoother there than the tradition
/// (a line repeated into both neighbours, two lines exchanged) is a slip
/// and is left out; a column constant by nature (a mean motion's step)
/// repeats its neighbour wherever the model spikes, and is not.
std::vector<std::optional<std::pair<std::size_t, std::size_t>>> CompensatingRows(
    const ColumnValues& values, const ExplainOptions& options, const AuthorProfile& author,
    int places);
/// Per row beyond the author's departure and not contradicted by the other
/// witnesses' consensus, the line through the nearest rows (two at most each
/// side) whose readings lie within the author's departure of the model: set
/// where the model lies kSpikeRatio times farther from it than the entry
/// does. A copy's slip leaves that line, the model staying on it; here the
/// model leaves it (a derived model computed from a miscopied source entry or
/// argument, a fitted reference off at the row), so the entry is not emended
/// on the model's word.
std::vector<std::optional<OffCurve>> ModelOffCurve(const Transcription& table,
                                                   const ColumnValues& values,
                                                   const ColumnContext& column, int places);
/// The finding of such a row: kept against the model, no emendation.
Finding OffCurveFinding(const Transcription& table, const ColumnValues& values,
                        const ColumnContext& column, std::size_t row, int places);
/// The finding of a deviant row whose model rests on a doubtful argument
/// (ColumnValues::argument_doubt): kept against the model, no emendation.
Finding ArgumentDoubtFinding(const Transcription& table, const ColumnValues& values,
                             const ColumnContext& column, std::size_t row, int places);
/// The finding of a row this copy reads as the tradition does where the
/// model misses it in a compensating window (ColumnContext::compensating):
/// kept against the model, no emendation.
Finding CompensatedFinding(const Transcription& table, const ColumnValues& values,
                           const ColumnContext& column, std::size_t row, int places);
/// `reading` - `computed` in units of the last place either uses (its last
/// place that is not 0; the model's at all its places), when that is above
/// `places`: a column written to one more place than it was computed to
/// (a difference of entries to seconds written "0;14,54,0") departs by
/// seconds, not by 60 thirds. Else in units of `places`.
double CoarseDiff(const Sexagesimal& reading, const Sexagesimal& computed, int places);
/// `reading` - `computed` in steps of `grid` units of the last place when
/// `grid` > 1 and the reading lies on the grid (its units a multiple of it):
/// an author who writes his thirds in tens and misses the model by one step
/// departs by one step, not by ten units. nullopt otherwise.
std::optional<double> GridSteps(const Sexagesimal& reading, const Sexagesimal& computed, int places,
                                int grid);
/// The author's departure of `reading` from `computed`: in grid steps when
/// the reading lies on the grid, else as CoarseDiff.
double AuthorDiff(const Sexagesimal& reading, const Sexagesimal& computed, int places, int grid);
/// `reading` - `computed` in grid steps when the reading lies on the grid,
/// else in units of `places` (as DiffUnits).
double DepartureDiff(const Sexagesimal& reading, const Sexagesimal& computed, int places, int grid);
/// The step the author writes a column's last place in (units of it): the
/// coarsest divisor of 60 that nearly every reading lies on (the others'
/// consensus where there is one, else this copy's); 1 when none (grid.cpp).
int MeasureGrid(const Transcription& table, const ColumnValues& values, int places);
/// Units beyond the exact landing: 0 within the tolerance, 1 for one more unit...
int UnitsOff(double diff, double tolerance);

CellContext MakeContext(const Transcription& table, const ColumnValues& values,
                        const NumeralScript& script, const ExplainOptions& options,
                        const ColumnContext& column, std::size_t row, int places);
FindingCell MakeCell(const Transcription& table, const ColumnValues& values, std::size_t row,
                     int places);
Finding NewFinding(const Transcription& table, const ColumnValues& values, int places);
/// A finding for one row whose reading is kept against the model (no
/// emendation), with the evidence said.
Finding KeptAgainstModel(const Transcription& table, const ColumnValues& values, std::size_t row,
                         int places, std::string evidence);

Finding SingleFinding(const CellContext& c, const ColumnValues& values);
/// A blank, illegible or partly read cell.
Finding MissingFinding(const Transcription& table, const ColumnValues& values,
                       const ColumnContext& column, std::size_t row, int places);
/// Runs of entries slid by rows; marks the rows they cover in `claimed`.
std::vector<Finding> DisplacedRuns(const Transcription& table, const ColumnValues& values,
                                   const ExplainOptions& options, const ColumnContext& column,
                                   std::vector<bool>& claimed);
/// One slip repeated over consecutive rows (a place dropped, moved or
/// doubled; a place held at one value; a constant error); marks the rows.
std::vector<Finding> SystematicRuns(const Transcription& table, const ColumnValues& values,
                                    const ExplainOptions& options, const ColumnContext& column,
                                    std::vector<bool>& claimed);
/// Joins neighbouring computational findings of one sign into one finding.
void MergeComputationalRuns(std::vector<Finding>& findings);

/// "within half a unit", "within 1 unit", "within 2 units".
std::string ToleranceWords(double tolerance);
/// "+1", "-2.5".
std::string Signed(double units);
/// "+1 unit", "-2 units".
std::string SignedUnits(double units);
/// The model's value as quoted in evidence: exact at one more place when
/// known, else the computed value.
std::string ModelText(const Sexagesimal& computed, double exact, int places);
/// "4 read as 1" / "β (2) read as μ (40)" / "an I dropped".
std::string StepWords(const ConfusionStep& step, const NumeralScript& script);
/// "tens of minutes" (positional scripts, one digit changed) or "minutes".
std::string DigitPlaceWords(const NumeralScript& script, int from, int to, int place,
                            const std::string& unit);
/// The symbols writing place `place` of a value: a fractional place of a
/// positional script as two digits ("05").
std::vector<std::string> PlaceSymbols(const NumeralScript& script, std::int64_t value, int place);

}  // namespace apograph::deviation::internal
