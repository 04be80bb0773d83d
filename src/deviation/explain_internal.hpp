#pragma once
// Internal to the deviation stage: what the candidate generators share.

#include <cmath>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "deviation/explain.hpp"

namespace apograph::deviation::internal {

// Scores: see the table in explain.hpp.
constexpr double kPriorConfusion = 0.9;
constexpr double kPriorTransposition = 0.75;
constexpr double kPriorTranspositionOther = 0.3;
constexpr double kPriorPlaceOmitted = 0.7;
constexpr double kPriorPlaceMoved = 0.65;
constexpr double kPriorPlaceAdded = 0.6;
constexpr double kPriorRepetition = 0.85;
constexpr double kPriorPlaceRepeated = 0.55;
constexpr double kPriorBlank = 0.95;
constexpr double kNearOnly = 0.8;  // within the tolerance but not the model's reading

/// A value as its places: d[0] the integer part, d[1..] the fractions.
struct Digits {
  bool negative = false;
  std::vector<std::int64_t> d;
};
Digits ToDigits(const Sexagesimal& value, int places);
/// nullopt when a place is out of range (fractions 0..59, integer 0..999).
std::optional<Sexagesimal> FromDigits(const Digits& digits);

/// Everything a generator needs about one deviant cell.
struct CellContext {
  const Transcription* table = nullptr;
  const NumeralScript* script = nullptr;
  const ExplainOptions* options = nullptr;
  std::size_t row = 0;
  int column = 0;
  int places = 0;
  std::string unit;
  Sexagesimal tabulated;      // at the column's places
  Sexagesimal computed;       // as given
  Sexagesimal model_reading;  // computed at the column's places
  double exact = NAN;         // NaN when not given
  double diff = 0;            // tabulated - computed, units

  /// Within the tolerance of the model's value.
  bool Reaches(const Sexagesimal& reading) const;
  /// 1 when the reading is the model's reading, kNearOnly otherwise.
  double Closeness(const Sexagesimal& reading) const;
  /// "the model gives 0;41,12, the emended reading 0;41 is within half a unit".
  std::string ModelClause(const Sexagesimal& reading) const;
  /// The tabulated value of another row of this column, when read.
  std::optional<Sexagesimal> Neighbour(std::ptrdiff_t offset) const;
};

std::vector<Explanation> ConfusionCandidates(const CellContext& c);
std::vector<Explanation> TranspositionCandidates(const CellContext& c);
std::vector<Explanation> PlaceCandidates(const CellContext& c);
std::vector<Explanation> RepetitionCandidates(const CellContext& c);

/// Tabulated - computed per row in units (NaN where either is missing).
struct DiffColumn {
  std::vector<double> diff;
};
DiffColumn Diffs(const Transcription& table, const ColumnValues& values, int places);

/// Score from which a computational candidate counts as "shared by its
/// neighbours" and halves the copying candidates.
constexpr double kSharedComputational = 0.7;

CellContext MakeContext(const Transcription& table, const ColumnValues& values,
                        const NumeralScript& script, const ExplainOptions& options, std::size_t row,
                        int places);
FindingCell MakeCell(const Transcription& table, const ColumnValues& values, std::size_t row,
                     int places);
Finding NewFinding(const Transcription& table, const ColumnValues& values, int places);

std::optional<Explanation> ComputationalCandidate(const CellContext& c, const DiffColumn& diffs);
Finding SingleFinding(const CellContext& c, const ColumnValues& values, const DiffColumn& diffs);
/// A blank, illegible or partly read cell.
Finding MissingFinding(const Transcription& table, const ColumnValues& values, std::size_t row,
                       int places, const ExplainOptions& options);
/// Runs of entries slid by rows; marks the rows they cover in `claimed`.
std::vector<Finding> DisplacedRuns(const Transcription& table, const ColumnValues& values,
                                   const NumeralScript& script, const ExplainOptions& options,
                                   const DiffColumn& diffs, std::vector<bool>& claimed);
/// Joins neighbouring computational findings of one sign into one finding.
void MergeComputationalRuns(std::vector<Finding>& findings, const ExplainOptions& options);

/// "within half a unit", "within 1 unit", "within 2 units".
std::string ToleranceWords(double tolerance);
/// The model's value as quoted in evidence: exact at one more place when
/// known, else the computed value.
std::string ModelText(const Sexagesimal& computed, double exact, int places);
/// "4 read as 1" / "β (2) read as μ (40)" / "an I dropped".
std::string StepWords(const ConfusionStep& step, const NumeralScript& script);
/// "tens of minutes" (positional scripts, one digit changed) or "minutes".
std::string DigitPlaceWords(const NumeralScript& script, int from, int to, int place,
                            const std::string& unit);

}  // namespace apograph::deviation::internal
