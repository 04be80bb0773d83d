#pragma once
/// Spreadsheet import and export of one witness's table as CSV (RFC 4180
/// quoting: fields with the delimiter, quotes or line breaks are quoted,
/// quotes doubled). Readings use the trade's notation, so `0;4,10` must be
/// quoted in a comma-separated file ("0;4,10") because of its comma, and in a
/// semicolon-separated one because of its semicolon.
///
/// Layout: the header row names the argument, then the value columns; each
/// further row holds the argument and one cell per column. An empty cell is
/// blank in the manuscript (stored with raw `_`), `?` is illegible, `0;?,10`
/// partly legible. Arguments may be written as decimals (`88.5`) or with
/// fewer places than others (`1` beside `1;30`): they are normalised to
/// sexagesimal values, the written form kept as the cell's raw text.
/// Several columns may be joined into one value (degrees, minutes, seconds
/// in three columns: CsvOptions::joins); a sheet that looks like that and
/// says nothing is refused with the option to give. What a sheet cannot say
/// (work, witness and table attributes, the argument's step) comes from
/// CsvOptions::head.

#include <map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "edition/transcription.hpp"
#include "transcription/parser.hpp"

namespace apograph {

/// Several sheet columns read as the places of one value: `parts` hold the
/// integer part, then the first fractional place, and so on (degrees,
/// minutes, seconds). The value takes the place of the first part; its
/// places are parts.size() - 1; its raw text is the parts separated by
/// blanks (`12 4 10`). Written on the command line `NAME=A+B+C`.
struct ColumnJoin {
  std::string name;
  std::vector<std::string> parts;
};

/// Parses `NAME=A+B[+C...]`; InputError naming `option` otherwise.
ColumnJoin ParseColumnJoin(const std::string& text, const std::string& option);

struct CsvOptions {
  /// What the sheet cannot say. Required: head.table_id and
  /// head.witness.siglum. head.work.id empty: the table id stands for the
  /// work. Taken from it: the work's, witness's and table's attributes,
  /// folios and hand; the argument's unit, start and step (or step=list)
  /// and, when head.argument.name is given, the name the sheet's argument
  /// column must have; the unit and title of columns listed in head.columns
  /// by name. Its rows are ignored.
  Transcription head;
  /// Places of every value column; when absent they are read off the cells
  /// (all readings of a column must then have the same places).
  std::optional<int> places;
  /// Places of one column by its header name (the argument's too); wins
  /// over `places`. The argument's places are otherwise the most any of its
  /// cells has.
  std::map<std::string, int> column_places;
  /// ',', ';' or '\t'; '\0' detects it from the header line (the one of the
  /// three found most often outside quotes; ',' when none is).
  char delimiter = '\0';
  std::vector<ColumnJoin> joins;
  /// Import columns that look like degrees, minutes and seconds of one value
  /// as separate columns anyway (otherwise such a sheet is refused).
  bool keep_columns = false;
  ReadOptions read;  ///< size limits and the numeral scripts known
};

/// Reads CSV text into one Transcription (in TranscriptionFile::tables).
/// Throws InputError with file, line and column for bad input, or naming
/// the option (--table, --witness, --places, --join) for bad options.
TranscriptionFile ReadCsv(std::string_view text, const std::string& file,
                          const CsvOptions& options);

/// Reads a CSV file (unreadable, empty, too large or non-UTF-8 files are
/// InputErrors).
TranscriptionFile ReadCsvFile(const std::string& path, const CsvOptions& options);

/// ReadCsvFile reusing the memory of `spare`'s rows (a table read before,
/// whose rows are taken and reset): a batch of sheets then allocates no
/// row's cells after its first sheets. The result is the same.
TranscriptionFile ReadCsvFile(const std::string& path, const CsvOptions& options,
                              Transcription& spare);

/// The table as CSV: header, then argument and cells by their raw reading
/// (blank as an empty field). Marks and metadata are not written.
std::string WriteCsv(const Transcription& table);

}  // namespace apograph
