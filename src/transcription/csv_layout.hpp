#pragma once
// Internal to src/transcription: which fields of a CSV sheet make which
// column (csv.cpp reads the rows by this plan), and the header columns that
// look like the degrees, minutes and seconds of one value.

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "transcription/csv.hpp"

namespace apograph::transcription::csv {

/// One field as it stood in the file.
struct Field {
  std::string_view text;  ///< unquoted
  int line = 0;
  std::size_t line_start = 0;  ///< byte offset of its line in the file
  std::size_t offset = 0;      ///< byte offset of its content in that line
};

/// A problem with one header field (index into the header), turned into a
/// positioned InputError by the reader.
struct HeaderError {
  std::size_t field = 0;
  std::size_t offset = 0;  ///< bytes into the field
  std::string message;
};

/// A column of the table and the fields it is read from.
struct PlannedColumn {
  std::string name;
  std::vector<std::size_t> sources;  ///< one field, or the parts of a join
  std::optional<int> places;         ///< given by option, or fixed by the first reading
};

/// Column 0 is the argument.
struct Plan {
  std::vector<PlannedColumn> columns;
  std::size_t fields = 0;  ///< fields per record (the header's)
};

/// Checks the header's names (distinct, without blanks, quotes or #{}|=)
/// and plans the columns: joins (CsvOptions::joins) and places given by
/// option. Throws HeaderError, or InputError naming --places/--join.
Plan PlanColumns(const std::vector<Field>& header, const CsvOptions& options);

/// Adjacent header columns whose names say degrees, minutes[, seconds] of
/// one value (`eq_d, eq_m, eq_s`; `deg, min, sec`; `lat deg`...).
struct PartGroup {
  std::size_t first = 0;  ///< header field of the degrees
  std::size_t count = 0;  ///< 2 or 3
  std::string name;       ///< the name to suggest for the joined value
};
std::vector<PartGroup> FindPartGroups(const std::vector<Field>& header);

}  // namespace apograph::transcription::csv
