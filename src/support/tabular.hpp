#pragma once
/// A table of strings for command output, rendered as aligned text or CSV.
/// (JSON output is built with nlohmann::json by each command, since its
/// field names are documented per command.)

#include <string>
#include <vector>

namespace apograph {

struct Tabular {
  std::vector<std::string> headers;
  std::vector<std::vector<std::string>> rows;
  /// Columns to align right (numbers); by index.
  std::vector<bool> right_aligned;

  void Add(std::vector<std::string> row) { rows.push_back(std::move(row)); }
  /// Aligned columns separated by two spaces, with a rule under the headers.
  std::string RenderText() const;
  /// RFC 4180 CSV with a header row.
  std::string RenderCsv() const;
};

/// Quotes a field for CSV (RFC 4180) when it holds a comma, a quote or a
/// line break, and also a semicolon (the trade's separator, and the
/// delimiter of spreadsheets in many locales) or blanks at either end
/// (which some readers trim). The one CSV quoter of the project.
std::string CsvField(const std::string& field);
/// Width of a UTF-8 string in code points (for alignment).
std::size_t DisplayWidth(const std::string& text);

}  // namespace apograph
