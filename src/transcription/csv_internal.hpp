#pragma once
// The CSV sheet reader's state, shared by its three files: csv.cpp (the
// sheet: header, plan, rows, checks), csv_records.cpp (records cut into
// fields, RFC 4180 quoting) and csv_cells.cpp (fields read into cells,
// joined parts, places). Not for other stages: they use csv.hpp.

#include <deque>
#include <string>
#include <string_view>
#include <vector>

#include "support/input_error.hpp"
#include "transcription/csv.hpp"
#include "transcription/csv_layout.hpp"
#include "transcription/syntax.hpp"

namespace apograph::transcription::csv {

inline std::string_view Trimmed(std::string_view s, std::size_t* lead = nullptr) {
  std::size_t a = 0, b = s.size();
  while (a < b && IsBlank(s[a])) ++a;
  while (b > a && IsBlank(s[b - 1])) --b;
  if (lead) *lead = a;
  return s.substr(a, b - a);
}

/// The plan, with the header's names kept for messages.
struct SheetPlan : Plan {
  std::vector<std::string> header_names;
};

class CsvReader {
 public:
  CsvReader(std::string_view text, const std::string& file, const CsvOptions& options)
      : text_(text), file_(file), options_(options) {}
  /// Reads `text` and keeps it as the table's source text without a copy.
  CsvReader(std::string&& text, const std::string& file, const CsvOptions& options)
      : owned_(std::move(text)), owns_(true), text_(owned_), file_(file), options_(options) {}
  TranscriptionFile Run();
  /// Rows to reuse (their cells' memory) before allocating new ones.
  void ReuseRows(std::vector<Row>&& rows) { spare_ = std::move(rows); }

 private:
  /// A blank that is not the delimiter: in a tab-separated sheet the tab
  /// around a quoted field ends it (skipped as a blank, it joined two fields).
  bool IsBlankHere(char c) const { return c != delimiter_ && IsBlank(c); }
  bool NextRecord(std::vector<Field>& record);
  void ReadQuoted(Field& field);
  void CheckFieldCount(const std::vector<Field>& record) const;
  Transcription MakeHead(const std::vector<Field>& header) const;
  /// Reads the field(s) of `column` into `cell` (a fresh Cell).
  void ReadCell(const std::vector<Field>& record, std::size_t column, Cell& cell);
  Cell JoinedCell(const std::vector<Field>& record, std::size_t column);
  int ColumnOf(const Field& f, std::size_t lead);
  void FixPlaces(std::size_t column, const Field& f, const std::string& raw,
                 const ReadingInfo& info);
  void FinishArgument(Transcription& t);
  void CheckPartColumns(const std::vector<Field>& header, const Transcription& t) const;
  bool LooksLikeParts(const transcription::csv::PartGroup& g, const Transcription& t) const;
  std::string_view LineAt(std::size_t line_start) const;
  [[noreturn]] void Fail(int line, std::size_t line_start, std::size_t offset,
                         std::string message) const;
  [[noreturn]] void Fail(const Field& f, std::size_t extra, std::string message) const {
    Fail(f.line, f.line_start, f.offset + extra, std::move(message));
  }
  [[noreturn]] void FailEmpty(std::string message) const;

  std::string owned_;  ///< the text, when the reader was given it to keep
  bool owns_ = false;
  std::string_view text_;
  const std::string& file_;
  const CsvOptions& options_;
  char delimiter_ = ',';
  std::size_t pos_ = 0;
  int line_ = 1;
  std::size_t line_start_ = 0;
  std::deque<std::string> unquoted_;  ///< fields of this record that needed unescaping
  std::deque<std::string> unquoted_header_;
  SheetPlan plan_;
  std::vector<Row> spare_;
  std::vector<int> first_line_;  ///< per planned column: line of the reading that fixed its places
  int argument_places_ = 0;      ///< the most places an argument reading had
  std::size_t counter_start_ = std::string_view::npos;
  ColumnCounter counter_{std::string_view()};
};

}  // namespace apograph::transcription::csv
