#include "transcription/csv.hpp"

#include <filesystem>
#include <fstream>
#include <sstream>
#include <vector>

#include "support/input_error.hpp"
#include "support/tabular.hpp"
#include "transcription/syntax.hpp"

namespace apograph {
namespace {

using transcription::ColumnCounter;
using transcription::FoundChar;
using transcription::LineError;
using transcription::ReadingInfo;

/// One field as it stood in the file.
struct Field {
  std::string text;  ///< unquoted
  int line = 0;
  std::size_t line_start = 0;  ///< byte offset of its line in the file
  std::size_t offset = 0;      ///< byte offset of its content in that line
};
using Record = std::vector<Field>;

bool IsBlank(char c) { return c == ' ' || c == '\t'; }

bool IsWord(const std::string& s) {
  return !s.empty() && s.find_first_of(" \t\r\n\"#{}|=") == std::string::npos;
}

std::string PlacesWords(int n) {
  return std::to_string(n) + (n == 1 ? " fractional place" : " fractional places");
}

class CsvReader {
 public:
  CsvReader(std::string_view text, const std::string& file, const CsvOptions& options)
      : text_(text), file_(file), options_(options) {}
  TranscriptionFile Run();

 private:
  std::vector<Record> Records();
  void ReadQuoted(std::size_t& pos, int& line, std::size_t& line_start, Field& field);
  void CheckHeader(const Record& header);
  void CheckOptions(const Record& header);
  int PlacesOf(std::size_t column, const Record& header, const std::vector<Record>& records);
  Cell MakeCell(const Field& field, int places, const std::string& where, bool check_places);
  std::string_view LineAt(std::size_t line_start) const;
  [[noreturn]] void Fail(int line, std::size_t line_start, std::size_t offset,
                         std::string message) const;
  [[noreturn]] void Fail(const Field& f, std::size_t extra, std::string message) const {
    Fail(f.line, f.line_start, f.offset + extra, std::move(message));
  }

  std::string_view text_;
  const std::string& file_;
  const CsvOptions& options_;
};

std::string_view CsvReader::LineAt(std::size_t line_start) const {
  std::size_t end = text_.find('\n', line_start);
  if (end == std::string_view::npos) end = text_.size();
  std::string_view line = text_.substr(line_start, end - line_start);
  if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
  return line;
}

void CsvReader::Fail(int line, std::size_t line_start, std::size_t offset,
                     std::string message) const {
  Diagnostic d;
  d.where.file = file_;
  d.where.line = line;
  const std::string_view text = LineAt(line_start);
  d.where.line_text = std::string(text);
  d.where.column = ColumnCounter(text).At(offset);
  d.message = std::move(message);
  throw InputError(d);
}

void CsvReader::ReadQuoted(std::size_t& pos, int& line, std::size_t& line_start, Field& field) {
  const int open_line = line;
  const std::size_t open_start = line_start;
  const std::size_t open = pos - line_start;
  for (++pos;; ++pos) {
    if (pos >= text_.size())
      Fail(open_line, open_start, open,
           "expected a closing '\"' for this field, found end of file");
    const char c = text_[pos];
    if (c == '"' && pos + 1 < text_.size() && text_[pos + 1] == '"') {
      field.text += '"';
      ++pos;
    } else if (c == '"') {
      ++pos;
      break;
    } else {
      if (c == '\n') {
        ++line;
        line_start = pos + 1;
      }
      field.text += c;
    }
  }
  while (pos < text_.size() && IsBlank(text_[pos])) ++pos;
  if (pos < text_.size() && text_[pos] != ',' && text_[pos] != '\n' && text_[pos] != '\r') {
    Fail(line, line_start, pos - line_start,
         "expected ',' or the end of the line after a quoted field, found " +
             FoundChar(LineAt(line_start), pos - line_start));
  }
}

std::vector<Record> CsvReader::Records() {
  std::vector<Record> records;
  Record record;
  std::size_t pos = text_.substr(0, 3) == "\xEF\xBB\xBF" ? 3 : 0;
  int line = 1;
  std::size_t line_start = pos;
  for (;;) {
    Field field;
    field.line = line;
    field.line_start = line_start;
    std::size_t quote = pos;  // blanks around a quoted field are forgiven
    while (quote < text_.size() && IsBlank(text_[quote])) ++quote;
    if (quote < text_.size() && text_[quote] == '"') {
      pos = quote;
      field.offset = pos + 1 - line_start;
      ReadQuoted(pos, line, line_start, field);
    } else {
      field.offset = pos - line_start;
      const std::size_t start = pos;
      while (pos < text_.size() && text_[pos] != ',' && text_[pos] != '\n' && text_[pos] != '\r') {
        if (text_[pos] == '"') {
          Fail(line, line_start, pos - line_start,
               "expected a field without '\"' (quote the whole field and double the quote), found "
               "'\"'");
        }
        ++pos;
      }
      field.text = std::string(text_.substr(start, pos - start));
    }
    record.push_back(std::move(field));
    if (pos < text_.size() && text_[pos] == ',') {
      ++pos;
      continue;
    }
    if (pos < text_.size() && text_[pos] == '\r') ++pos;
    const bool empty_line = record.size() == 1 && record[0].text.empty();
    if (!empty_line) records.push_back(std::move(record));
    record.clear();
    if (pos >= text_.size()) break;
    ++pos;  // the '\n'
    ++line;
    line_start = pos;
    if (pos >= text_.size()) break;
  }
  return records;
}

std::string Trimmed(const std::string& s, std::size_t* lead = nullptr) {
  std::size_t a = 0;
  std::size_t b = s.size();
  while (a < b && IsBlank(s[a])) ++a;
  while (b > a && IsBlank(s[b - 1])) --b;
  if (lead) *lead = a;
  return s.substr(a, b - a);
}

void CsvReader::CheckHeader(const Record& header) {
  if (header.size() < 2) {
    Fail(header[0], header[0].text.size(),
         "expected a header naming the argument and at least one column, found " +
             std::to_string(header.size()) + " field");
  }
  for (std::size_t i = 0; i < header.size(); ++i) {
    const std::string name = Trimmed(header[i].text);
    if (!IsWord(name)) {
      Fail(header[i], 0,
           "expected a column name without blanks, quotes or #{}|=, found '" + name + "'");
    }
    for (std::size_t j = 0; j < i; ++j) {
      if (Trimmed(header[j].text) == name) {
        Fail(header[i], 0, "expected a new column name, found '" + name + "' again");
      }
    }
  }
}

void CsvReader::CheckOptions(const Record& header) {
  if (!IsWord(options_.table_id)) {
    throw InputError::ForOption(
        "--table", "expected a table id without blanks, found '" + options_.table_id + "'");
  }
  if (!IsWord(options_.siglum)) {
    throw InputError::ForOption(
        "--witness", "expected a siglum without blanks, found '" + options_.siglum + "'");
  }
  if (!options_.work_id.empty() && !IsWord(options_.work_id)) {
    throw InputError::ForOption(
        "--work", "expected a work id without blanks, found '" + options_.work_id + "'");
  }
  auto check = [](int places) {
    if (places < 0 || places > Sexagesimal::kMaxPlaces) {
      throw InputError::ForOption("--places",
                                  "expected places from 0 to 12, found " + std::to_string(places));
    }
  };
  if (options_.places) check(*options_.places);
  for (const auto& [name, places] : options_.column_places) {
    check(places);
    bool known = false;
    std::string names;
    for (const auto& f : header) {
      known = known || Trimmed(f.text) == name;
      names += (names.empty() ? "" : ", ") + Trimmed(f.text);
    }
    if (!known) {
      throw InputError::ForOption(
          "--places", "expected a column of the header (" + names + "), found '" + name + "'");
    }
  }
}

/// The places of a column: given by option, or those of its first reading
/// (every other reading must agree).
int CsvReader::PlacesOf(std::size_t column, const Record& header,
                        const std::vector<Record>& records) {
  const std::string name = Trimmed(header[column].text);
  if (auto it = options_.column_places.find(name); it != options_.column_places.end())
    return it->second;
  if (column > 0 && options_.places) return *options_.places;
  const Field* first = nullptr;
  int places = 0;
  for (std::size_t r = 1; r < records.size(); ++r) {
    const Field& f = records[r][column];
    std::size_t lead = 0;
    const std::string text = Trimmed(f.text, &lead);
    if (text.empty() || text == "?") continue;
    ReadingInfo info;
    try {
      info = transcription::ParseReading(text, -1, 0);
    } catch (const LineError& e) {
      Fail(f, lead + e.offset, e.message);
    }
    if (!first) {
      first = &f;
      places = info.fraction_places;
    } else if (info.fraction_places != places) {
      Fail(f, lead,
           "expected " + PlacesWords(places) + " like the first reading of column '" + name +
               "' (line " + std::to_string(first->line) + "), found '" + text + "' (" +
               PlacesWords(info.fraction_places) + ")");
    }
  }
  return places;
}

Cell CsvReader::MakeCell(const Field& f, int places, const std::string& where, bool check_places) {
  Cell cell;
  std::size_t lead = 0;
  const std::string text = Trimmed(f.text, &lead);
  cell.raw = text.empty() ? "_" : text;
  cell.places = places;
  cell.line = f.line;
  cell.column = ColumnCounter(LineAt(f.line_start)).At(f.offset + lead);
  ReadingInfo info;
  try {
    info = transcription::ParseReading(cell.raw, places, 0);
  } catch (const LineError& e) {
    Fail(f, lead + e.offset, e.message);
  }
  const bool has_places = info.state == CellState::kRead || info.state == CellState::kPartial;
  if (check_places && has_places && info.fraction_places != places) {
    Fail(f, lead,
         "expected a reading with " + PlacesWords(places) + " in " + where + ", found '" + text +
             "' (" + PlacesWords(info.fraction_places) + ")");
  }
  cell.state = info.state;
  cell.value = info.value;
  return cell;
}

TranscriptionFile CsvReader::Run() {
  if (text_.empty()) throw InputError::ForFile(file_, "expected a CSV file, found an empty file");
  transcription::CheckText(text_, file_);
  const std::vector<Record> records = Records();
  if (records.empty())
    throw InputError::ForFile(file_, "expected a header row, found only empty lines");
  const Record& header = records[0];
  CheckHeader(header);
  CheckOptions(header);
  if (records.size() < 2) {
    throw InputError::ForFile(file_, "expected at least one row after the header, found none");
  }
  Transcription t;
  t.work.id = options_.work_id.empty() ? options_.table_id : options_.work_id;
  t.table_id = options_.table_id;
  t.witness.siglum = options_.siglum;
  t.witness.script = options_.script;
  t.source_file = file_;
  t.source_text = std::string(text_);
  for (std::size_t r = 1; r < records.size(); ++r) {
    const Record& record = records[r];
    if (record.size() < header.size()) {
      const Field& last = record.back();
      Fail(last, last.text.size(),
           "expected " + std::to_string(header.size()) +
               " fields (the argument and one per column), found " + std::to_string(record.size()));
    }
    if (record.size() > header.size()) {
      Fail(record[header.size()], 0,
           "expected " + std::to_string(header.size()) +
               " fields (the argument and one per column), found " + std::to_string(record.size()));
    }
  }
  std::vector<int> places(header.size());
  for (std::size_t c = 0; c < header.size(); ++c) places[c] = PlacesOf(c, header, records);
  t.argument.name = Trimmed(header[0].text);
  t.argument.places = places[0];
  for (std::size_t c = 1; c < header.size(); ++c) {
    ColumnSpec column;
    column.name = Trimmed(header[c].text);
    column.places = places[c];
    t.columns.push_back(column);
  }
  for (std::size_t r = 1; r < records.size(); ++r) {
    Row row;
    row.line = records[r][0].line;
    row.argument =
        MakeCell(records[r][0], places[0], "the argument '" + t.argument.name + "'", true);
    for (std::size_t c = 1; c < header.size(); ++c) {
      row.cells.push_back(
          MakeCell(records[r][c], places[c], "column '" + t.columns[c - 1].name + "'", true));
    }
    t.rows.push_back(std::move(row));
  }
  TranscriptionFile out;
  out.tables.push_back(std::move(t));
  return out;
}

std::string CsvReading(const Cell& cell) {
  if (cell.state == CellState::kBlank) return "";
  if (cell.state == CellState::kIllegible) return "?";
  if (!cell.raw.empty()) return cell.raw;
  return cell.value ? cell.value->ToString() : "?";
}

}  // namespace

TranscriptionFile ReadCsv(std::string_view text, const std::string& file,
                          const CsvOptions& options) {
  return CsvReader(text, file, options).Run();
}

TranscriptionFile ReadCsvFile(const std::string& path, const CsvOptions& options) {
  std::error_code ec;
  if (std::filesystem::is_directory(path, ec)) {
    throw InputError::ForFile(path, "expected a CSV file, found a directory");
  }
  std::ifstream in(path, std::ios::binary);
  if (!in)
    throw InputError::ForFile(path,
                              "expected a readable file, found none (missing or not permitted)");
  std::stringstream buffer;
  buffer << in.rdbuf();
  return ReadCsv(buffer.str(), path, options);
}

std::string WriteCsv(const Transcription& table) {
  std::string out = CsvField(table.argument.name);
  for (const auto& c : table.columns) out += "," + CsvField(c.name);
  out += '\n';
  for (const auto& row : table.rows) {
    out += CsvField(CsvReading(row.argument));
    for (const auto& cell : row.cells) out += "," + CsvField(CsvReading(cell));
    out += '\n';
  }
  return out;
}

}  // namespace apograph
