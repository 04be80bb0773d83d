#pragma once
/// The plain values every stage passes along: one witness's copy of one
/// table, its layout, rows and cells with their editorial state.
///
/// A cell is addressed by (witness, row, column); every finding of a later
/// stage points at one. Values are exact (Sexagesimal); the raw text as typed
/// is kept beside them so that nothing the editor wrote is lost.

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "edition/witness_date.hpp"
#include "number/sexagesimal.hpp"
#include "support/input_error.hpp"

namespace apograph {

/// What the manuscript shows at a cell.
enum class CellState : std::uint8_t {
  kRead,       ///< read in full
  kPartial,    ///< some places read, others not (`2;?,10`)
  kIllegible,  ///< written but unreadable (`?`)
  kBlank,      ///< nothing written in the manuscript (`_`)
};

/// Where a cell's text stands if not in its place in the table body.
enum class Addition : std::uint8_t { kNone, kMargin, kInterlinear };

const char* ToString(CellState state);
const char* ToString(Addition addition);
std::optional<CellState> CellStateFromString(const std::string& text);
std::optional<Addition> AdditionFromString(const std::string& text);

/// One cell as transcribed.
struct Cell {
  std::string raw;                   ///< the reading as typed (`0;4,10`, `?`, `0;?,10`)
  std::optional<Sexagesimal> value;  ///< present when state == kRead
  int places = 0;                    ///< places of the column it stands in
  CellState state = CellState::kRead;
  bool damaged = false;   ///< the support is damaged here (reading given anyway)
  bool doubtful = false;  ///< the editor doubts the reading
  Addition addition = Addition::kNone;
  std::optional<std::string> corrected_from;  ///< scribal correction: reading before it
  std::string note;                           ///< the editor's note on this cell
  int line = 0;                               ///< provenance: line in the source file
  int column = 0;                             ///< provenance: column in the source file

  bool operator==(const Cell&) const = default;
  /// Same content, ignoring provenance (used to compare revisions).
  bool SameContent(const Cell& other) const;
};

/// How `@argument ... step=list` is written (see ArgumentSpec::listed).
inline constexpr const char* kListedStep = "list";

/// The argument of a table (the row argument, or the column argument of a
/// double-argument table).
struct ArgumentSpec {
  std::string name;
  std::string unit;
  int places = 0;
  std::optional<Sexagesimal> start;  ///< expected first argument
  std::optional<Sexagesimal> step;   ///< expected step between rows
  /// Declared as an explicit list (`step=list`): irregular arguments (a mean
  /// motion by 1, 2, ... 10, 20, ... days) taken as written; no step is
  /// inferred from them and no row is expected between them.
  bool listed = false;
  bool operator==(const ArgumentSpec&) const = default;
};

/// One value column. In a double-argument table each column stands for one
/// value of the column argument (`arg2`).
struct ColumnSpec {
  std::string name;
  std::string unit;
  int places = 0;
  std::string title;
  std::optional<Sexagesimal> arg2;
  bool operator==(const ColumnSpec&) const = default;
};

/// One row as written: the argument (which may be miscopied) and the cells.
struct Row {
  Cell argument;
  std::vector<Cell> cells;  ///< one per column, in layout order
  int line = 0;
  bool operator==(const Row&) const = default;
};

struct WorkInfo {
  std::string id;
  std::string title;
  std::string author;
  bool operator==(const WorkInfo&) const = default;
};

/// What kind of object a witness is: it decides which slips are likely (a
/// scribe's, a typesetter's) and whether it may have been recomputed.
enum class WitnessKind : std::uint8_t {
  kManuscript,     ///< copied by hand (the default)
  kPrint,          ///< an early printed edition
  kModernEdition,  ///< a modern (often recomputed) edition
};
const char* ToString(WitnessKind kind);  ///< "manuscript", "print", "modern-edition"
std::optional<WitnessKind> WitnessKindFromString(const std::string& text);

struct WitnessInfo {
  std::string siglum;
  std::string library;
  std::string shelfmark;
  std::string date;    ///< as the catalogue writes it ("c. 1420"); see Dates()
  std::string script;  ///< numeral script, by the name of its file under corpora/scripts
  std::string note;
  std::string kind;  ///< "manuscript", "print" or "modern-edition"; empty: not declared
  bool operator==(const WitnessInfo&) const = default;

  /// The declared kind, a manuscript when none was declared.
  WitnessKind Kind() const;
  /// The years `date` allows, or nullopt when it is empty or not understood.
  std::optional<YearRange> Dates() const;
};

/// One witness's copy of one table.
struct Transcription {
  WorkInfo work;
  std::string table_id;
  std::string table_title;
  std::string kind;  ///< free text: "solar equation", "declination", ...
  WitnessInfo witness;
  std::string folios;
  std::string hand;
  ArgumentSpec argument;
  std::optional<ArgumentSpec> argument2;  ///< set for double-argument tables
  std::vector<ColumnSpec> columns;
  std::vector<Row> rows;
  std::string source_file;
  std::string source_text;  ///< the section of the file as typed, kept with the revision

  /// Index of a column by name, or -1.
  int ColumnIndex(const std::string& name) const;
  /// The expected argument of row i from start and step, when declared.
  std::optional<Sexagesimal> ExpectedArgument(std::size_t row) const;
  /// The argument row i stands for, which every stage computes with. The
  /// written argument when it fits between its neighbours (so a missing or
  /// an extra row does not shift the rest of the table); otherwise, since
  /// arguments are miscopied too, the previous written argument plus the
  /// step (or the next minus the step); otherwise the expected one by
  /// position. Example: rows written 46, 41, 48 with step 1 stand for 46, 47,
  /// 48; rows written 70, 72, 73 stand for 70, 72, 73 (71 is missing).
  std::optional<Sexagesimal> ArgumentInUse(std::size_t row) const;
  /// Number of cells (argument cells not counted).
  std::size_t CellCount() const;
  /// Same layout, metadata and cell content, ignoring provenance and source.
  bool SameContent(const Transcription& other) const;

 private:
  std::optional<Sexagesimal> ResolveArgument(std::size_t row) const;
};

/// What reading a file produced: tables and warnings (never errors, which
/// are thrown as InputError).
struct TranscriptionFile {
  std::vector<Transcription> tables;
  std::vector<Diagnostic> warnings;
};

}  // namespace apograph
