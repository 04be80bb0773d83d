#pragma once
/// Spreadsheet import and export of one witness's table as CSV (RFC 4180
/// quoting: fields with commas, quotes or line breaks are quoted, quotes
/// doubled). Readings use the trade's notation, so `0;4,10` must be quoted
/// in the file ("0;4,10") because of its comma.
///
/// Layout: the header row names the argument, then the value columns; each
/// further row holds the argument and one cell per column. An empty cell is
/// blank in the manuscript (stored with raw `_`), `?` is illegible, `0;?,10`
/// partly legible. CSV has no place for editorial marks or metadata beyond
/// what CsvOptions gives.

#include <map>
#include <optional>
#include <string>
#include <string_view>

#include "edition/transcription.hpp"

namespace apograph {

struct CsvOptions {
  std::string table_id;  ///< required: the table the sheet transcribes
  std::string work_id;   ///< the work; empty = the table id (a sheet names no work)
  std::string siglum;    ///< required: the witness
  std::string script;    ///< numeral script of the witness, may be empty
  /// Places of every value column; when absent they are read off the cells
  /// (all readings of a column must then have the same places).
  std::optional<int> places;
  /// Places of one column by its header name (the argument's too); wins
  /// over `places`. The argument's places are otherwise read off its cells.
  std::map<std::string, int> column_places;
};

/// Reads CSV text into one Transcription (in TranscriptionFile::tables).
/// Throws InputError with file, line and column for bad input, or naming
/// the option (--table, --witness, --places) for bad options.
TranscriptionFile ReadCsv(std::string_view text, const std::string& file,
                          const CsvOptions& options);

/// Reads a CSV file (unreadable, empty or non-UTF-8 files are InputErrors).
TranscriptionFile ReadCsvFile(const std::string& path, const CsvOptions& options);

/// The table as CSV: header, then argument and cells by their raw reading
/// (blank as an empty field). Marks and metadata are not written.
std::string WriteCsv(const Transcription& table);

}  // namespace apograph
