#pragma once
/// Collation: all witnesses of one table aligned row by row (by argument),
/// every cell's readings grouped by witness, and the readings that are errors
/// marked with the basis of that judgement.
///
/// The stage is driven by plain values: the witnesses' transcriptions, and
/// optionally a recomputed value per row and column (from a model) or the
/// caller's own judgement of every cell (from the deviation stage). Nothing
/// here reads the database.
///
///     collate::CollateOptions options;
///     options.reference = collate::Reference{"solar eq. e=2;4,48", fn};
///     collate::Collation c = collate::Collate(transcriptions, options);
///     for (const auto& row : c.rows) ...

#include <functional>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::collate {

/// On what ground a cell's readings were called right or wrong.
enum class Basis {
  kCaller,         ///< the caller's judgement (e.g. explained deviations)
  kEditor,         ///< the editor's recorded decision on at least one reading
  kRecomputation,  ///< distance from a recomputed value beyond the tolerance
  kMajority,       ///< no model: a minority reading against a clear majority
  kUndetermined,   ///< no model and no clear majority: no reading is marked
};
const char* ToString(Basis basis);

/// The caller's judgement of one witness's cell (from the deviation stage).
struct CellJudgement {
  bool error = false;
  std::optional<Sexagesimal> computed;  ///< the recomputed value, when known
  double units_off = 0;                 ///< reading - computed, in units of the last place
  std::string slip;                     ///< slip explanation in words ("3 read as 8"); may be empty
  /// A slip copyists make independently (look-alike symbols of the script,
  /// an off-by-one in the last place): weak evidence of common descent.
  bool common_slip = false;
  /// The slip class by its stable name ("confusion", "displaced-run"; see
  /// deviation::ToString(SlipClass)); empty when the reading is right. For
  /// an author's departure, "computational".
  std::string cause;
  /// The reading the explanation restores (the proposed emendation).
  std::optional<Sexagesimal> emendation;
  /// Set when the editor decided this judgement: who, and what in words
  /// ("accepted the emendation to 2;4,1: B agrees").
  std::string editor;
  std::string decision;
};

/// One witness's judgements, indexed [row of its transcription][column].
using JudgementGrid = std::vector<std::vector<std::optional<CellJudgement>>>;

/// Recomputed values for the aligned rows.
struct Reference {
  std::string description;  ///< shown to the editor ("solar_equation e=2.08, rounded")
  /// The recomputed value at `argument` for column index `column` (of the
  /// collation's column list); nullopt where the model gives none.
  std::function<std::optional<Sexagesimal>(const Sexagesimal& argument, int column)> value;
};

struct CollateOptions {
  std::optional<Reference> reference;
  /// A reading more than this many units of the last place from the
  /// recomputed value is an error (1 leaves the author's own rounding alone).
  double tolerance_units = 1;
  /// Per siglum; takes precedence over the reference where given.
  std::map<std::string, JudgementGrid> judgements;
};

enum class ReadingKind {
  kValue,      ///< a value read in full
  kBlank,      ///< nothing written (an omission of the entry)
  kPartial,    ///< partly legible: not compared
  kIllegible,  ///< not legible: not compared
  kOmitted,    ///< the witness lacks the whole row
};
const char* ToString(ReadingKind kind);

/// One reading of a cell and the witnesses that carry it.
struct Reading {
  std::string
      text;  ///< canonical trade notation, the raw text if partial, or "blank"/"illeg."/"om."
  ReadingKind kind = ReadingKind::kValue;
  std::optional<Sexagesimal> value;
  std::vector<std::string> sigla;  ///< in the collation's witness order
  bool error = false;
  std::optional<double> units_off;  ///< from the recomputed value, when known
  std::string slip;                 ///< the caller's slip explanation, if any
  std::string cause;                ///< the caller's slip class (CellJudgement::cause)
  bool common_slip = false;
  std::optional<Sexagesimal> emendation;  ///< the reading the explanation restores
  std::string editor;                     ///< who decided this judgement (empty: the tool)
  std::string decision;                   ///< the editor's decision in words
  std::string why;                        ///< the evidence in plain words
  /// Legible readings take part in comparison (values and blanks).
  bool Comparable() const { return kind == ReadingKind::kValue || kind == ReadingKind::kBlank; }
};

struct CollatedCell {
  int column = 0;
  std::optional<Sexagesimal> computed;
  Basis basis = Basis::kUndetermined;
  std::vector<Reading> readings;  ///< comparable first, most witnesses first
  /// Two or more different comparable readings.
  bool Varies() const;
  /// The reading of a siglum, or nullptr.
  const Reading* ReadingOf(const std::string& siglum) const;
};

struct CollatedRow {
  Sexagesimal argument;  ///< the expected (canonical) argument
  /// Per witness (collation order): index into its transcription's rows, -1 if missing.
  std::vector<int> source_row;
  std::vector<CollatedCell> cells;  ///< one per collation column
};

/// Something the alignment had to decide, reported to the editor.
struct AlignmentNote {
  std::string siglum;
  std::string kind;  ///< "missing row", "extra row", "miscopied argument"
  int row = -1;      ///< aligned row (-1 for extra rows)
  int source_row = -1;
  int line = 0;  ///< line in the witness's source file, when known
  std::string text;
};

/// A run of a column copied one row off in one witness (the eye slipped).
struct Slide {
  std::string siglum;
  int column = 0;
  int first_row = 0;  ///< aligned rows, inclusive
  int last_row = 0;
  /// +1: the witness has the next row's values (slid up); -1: the previous row's.
  int offset = 0;
  std::string text;
  bool Covers(const std::string& s, int row, int col) const {
    return s == siglum && col == column && row >= first_row && row <= last_row;
  }
};

struct Collation {
  std::string table_id;
  std::string table_title;
  WorkInfo work;
  std::vector<WitnessInfo> witnesses;  ///< collation order
  ArgumentSpec argument;
  std::vector<ColumnSpec> columns;
  std::vector<CollatedRow> rows;
  std::vector<AlignmentNote> notes;
  std::vector<Slide> slides;
  std::string reference_description;  ///< empty when no model was used
  double tolerance_units = 1;

  int WitnessIndex(const std::string& siglum) const;
  /// The slide covering a witness's cell, or nullptr.
  const Slide* SlideAt(const std::string& siglum, int row, int column) const;
  /// Counts of cells per basis, for the summary line.
  std::map<Basis, int> BasisCounts() const;
};

/// Aligns the witnesses (all of one table) and judges their readings.
/// Throws InputError when the witnesses are of different tables or none.
Collation Collate(const std::vector<Transcription>& witnesses, const CollateOptions& options = {});

}  // namespace apograph::collate
