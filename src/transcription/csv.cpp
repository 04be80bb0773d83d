// Reading a CSV sheet in one pass: records are cut into fields that point
// into the text (only a quoted field with a doubled quote is copied), and
// each field is read into its cell at once, so a sheet reads at the speed of
// the transcription parser. The sheet's layout (which fields make which
// column: joins) is planned from the header before the first row.
#include "transcription/csv.hpp"

#include <algorithm>
#include <deque>
#include <filesystem>

#include "edition/names.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"
#include "transcription/csv_layout.hpp"
#include "transcription/syntax.hpp"

namespace apograph {
namespace {

using transcription::ColumnCounter;
using transcription::FoundChar;
using transcription::IsBlank;
using transcription::LineError;
using transcription::ReadingInfo;
using transcription::csv::Field;
using transcription::csv::PartGroup;
using transcription::csv::Plan;
using transcription::csv::PlannedColumn;

std::string PlacesWords(int n) {
  return std::to_string(n) + (n == 1 ? " fractional place" : " fractional places");
}

std::string_view Trimmed(std::string_view s, std::size_t* lead = nullptr) {
  std::size_t a = 0, b = s.size();
  while (a < b && IsBlank(s[a])) ++a;
  while (b > a && IsBlank(s[b - 1])) --b;
  if (lead) *lead = a;
  return s.substr(a, b - a);
}

/// The delimiter found most often outside quotes in the first line.
char DetectDelimiter(std::string_view text) {
  std::size_t counts[3] = {0, 0, 0};
  const char kCandidates[3] = {',', ';', '\t'};
  bool quoted = false;
  for (char c : text) {
    if (c == '"') quoted = !quoted;
    if (!quoted && c == '\n') break;
    for (int i = 0; i < 3; ++i) counts[i] += !quoted && c == kCandidates[i];
  }
  const auto best = std::max_element(counts, counts + 3) - counts;
  return counts[best] > 0 ? kCandidates[best] : ',';
}

/// The plan, with the header's names kept for messages.
struct SheetPlan : Plan {
  std::vector<std::string> header_names;
};

class CsvReader {
 public:
  CsvReader(std::string_view text, const std::string& file, const CsvOptions& options)
      : text_(text), file_(file), options_(options) {}
  TranscriptionFile Run();

 private:
  bool NextRecord(std::vector<Field>& record);
  void ReadQuoted(Field& field);
  void CheckFieldCount(const std::vector<Field>& record) const;
  Transcription MakeHead(const std::vector<Field>& header) const;
  Cell ReadCell(const std::vector<Field>& record, std::size_t column);
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
  std::vector<int> first_line_;  ///< per planned column: line of the reading that fixed its places
  int argument_places_ = 0;      ///< the most places an argument reading had
  std::size_t counter_start_ = std::string_view::npos;
  ColumnCounter counter_{std::string_view()};
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

void CsvReader::FailEmpty(std::string message) const {
  Diagnostic d;
  d.where = {file_, 1, 1, std::string(LineAt(0))};
  d.message = std::move(message);
  throw InputError(d);
}

void CsvReader::ReadQuoted(Field& field) {
  const int open_line = line_;
  const std::size_t open_start = line_start_;
  const std::size_t open = pos_ - line_start_;
  const std::size_t begin = ++pos_;
  bool escaped = false;
  for (;; ++pos_) {
    if (pos_ >= text_.size())
      Fail(open_line, open_start, open,
           "expected a closing '\"' for this field, found end of file");
    const char c = text_[pos_];
    if (c == '"' && pos_ + 1 < text_.size() && text_[pos_ + 1] == '"') {
      escaped = true;
      ++pos_;
    } else if (c == '"') {
      break;
    } else if (c == '\n') {
      ++line_;
      line_start_ = pos_ + 1;
    }
  }
  field.text = text_.substr(begin, pos_ - begin);
  if (escaped) {
    std::string& s = unquoted_.emplace_back();
    for (std::size_t i = 0; i < field.text.size(); ++i) {
      s += field.text[i];
      if (field.text[i] == '"') ++i;  // the second of a doubled quote
    }
    field.text = s;
  }
  ++pos_;  // the closing quote
  while (pos_ < text_.size() && IsBlank(text_[pos_])) ++pos_;
  if (pos_ < text_.size() && text_[pos_] != delimiter_ && text_[pos_] != '\n' &&
      text_[pos_] != '\r') {
    Fail(line_, line_start_, pos_ - line_start_,
         std::string("expected '") + (delimiter_ == '\t' ? "\\t" : std::string(1, delimiter_)) +
             "' or the end of the line after a quoted field, found " +
             FoundChar(LineAt(line_start_), pos_ - line_start_));
  }
}

/// The next non-empty record; false at the end of the text.
bool CsvReader::NextRecord(std::vector<Field>& record) {
  record.clear();
  unquoted_.clear();
  bool after_delimiter = false;  // a delimiter at the very end still opens a field
  while (pos_ < text_.size() || after_delimiter) {
    after_delimiter = false;
    Field& field = record.emplace_back();
    field.line = line_;
    field.line_start = line_start_;
    std::size_t quote = pos_;  // blanks around a quoted field are forgiven
    while (quote < text_.size() && IsBlank(text_[quote])) ++quote;
    if (quote < text_.size() && text_[quote] == '"') {
      pos_ = quote;
      field.offset = pos_ + 1 - line_start_;
      ReadQuoted(field);
    } else {
      field.offset = pos_ - line_start_;
      const std::size_t start = pos_;
      for (char c; pos_ < text_.size() && (c = text_[pos_]) != delimiter_ && c != '\n' && c != '\r';
           ++pos_) {
        if (c == '"') {
          Fail(line_, line_start_, pos_ - line_start_,
               "expected a field without '\"' (quote the whole field and double the quote), "
               "found '\"'");
        }
      }
      field.text = text_.substr(start, pos_ - start);
    }
    if (pos_ < text_.size() && text_[pos_] == delimiter_) {
      ++pos_;
      after_delimiter = true;
      continue;
    }
    if (pos_ < text_.size() && text_[pos_] == '\r') ++pos_;
    if (pos_ < text_.size()) {
      ++pos_;  // the '\n'
      ++line_;
      line_start_ = pos_;
    }
    if (record.size() == 1 && Trimmed(record[0].text).empty()) {
      record.clear();  // an empty line
      continue;
    }
    return true;
  }
  return false;
}

/// Remembers the places of a value column from its first reading, or checks
/// a later reading against them.
void CsvReader::FixPlaces(std::size_t column, const Field& f, const std::string& raw,
                          const ReadingInfo& info) {
  PlannedColumn& c = plan_.columns[column];
  if (!c.places) {
    c.places = info.fraction_places;
    first_line_[column] = f.line;
  } else if (*c.places != info.fraction_places) {
    std::size_t lead = 0;
    Trimmed(f.text, &lead);
    const std::string expected =
        first_line_[column] > 0
            ? PlacesWords(*c.places) + " like the first reading of column '" + c.name + "' (line " +
                  std::to_string(first_line_[column]) + ")"
            : "a reading with " + PlacesWords(*c.places) + " in column '" + c.name + "'";
    Fail(f, lead,
         "expected " + expected + ", found " + QuotedText(raw) + " (" +
             PlacesWords(info.fraction_places) + ")");
  }
}

Cell CsvReader::ReadCell(const std::vector<Field>& record, std::size_t column) {
  const PlannedColumn& c = plan_.columns[column];
  if (c.sources.size() > 1) return JoinedCell(record, column);
  const Field& f = record[c.sources[0]];
  std::size_t lead = 0;
  const std::string_view text = Trimmed(f.text, &lead);
  Cell cell;
  cell.raw = text.empty() ? std::string("_") : std::string(text);
  cell.line = f.line;
  cell.column = ColumnOf(f, lead);
  const bool argument = column == 0;
  const int places = c.places.value_or(-1);
  // Sheets often drop a whole 0 before the semicolon (`;4,10`, `-;9`): the
  // reading is parsed with the 0 restored; the cell keeps what the sheet shows.
  const std::size_t sign = !text.empty() && (text[0] == '-' || text[0] == '+') ? 1 : 0;
  const bool dropped = text.size() > sign && text[sign] == ';';
  std::string reading = cell.raw;
  if (dropped) reading.insert(sign, "0");
  ReadingInfo info;
  try {
    info = argument ? transcription::ParseArgumentReading(reading, places, 0)
                    : transcription::ParseReading(reading, places, 0);
  } catch (const LineError& e) {
    Fail(f, lead + (dropped && e.offset > sign ? e.offset - 1 : e.offset), e.message);
  }
  const bool has_places = info.state == CellState::kRead || info.state == CellState::kPartial;
  // An argument written with more places than declared is the same argument
  // when the extra places are zero (`3;0` in a column of whole degrees);
  // the cell keeps what the sheet shows.
  const bool same_value = argument && info.state == CellState::kRead && info.value && c.places &&
                          info.fraction_places > *c.places && info.value->places() > *c.places &&
                          info.value->Rounded(*c.places, Rounding::kTruncate) == *info.value;
  if (same_value) {
    info.value = info.value->Rounded(*c.places, Rounding::kTruncate);
    info.fraction_places = *c.places;
  }
  if (has_places && argument && c.places && info.fraction_places != *c.places) {
    Fail(f, lead,
         "expected a reading with " + PlacesWords(*c.places) + " in the argument '" + c.name +
             "', found " + QuotedText(cell.raw) + " (" + PlacesWords(info.fraction_places) + ")");
  }
  if (has_places && argument) argument_places_ = std::max(argument_places_, info.fraction_places);
  if (has_places && !argument) FixPlaces(column, f, cell.raw, info);
  cell.places = c.places.value_or(info.fraction_places);
  cell.state = info.state;
  cell.value = info.value;
  return cell;
}

/// The parts of a joined column as one reading in the blank-separated form
/// (`12 4 10`), which keeps what the sheet shows.
Cell CsvReader::JoinedCell(const std::vector<Field>& record, std::size_t column) {
  const PlannedColumn& c = plan_.columns[column];
  const Field& first = record[c.sources[0]];
  std::size_t lead = 0;
  Trimmed(first.text, &lead);
  Cell cell;
  cell.line = first.line;
  cell.column = ColumnOf(first, lead);
  cell.places = *c.places;
  // A sheet that drops a whole 0 leaves the degree field empty (or a lone
  // sign) beside filled places: that field reads 0.
  bool later_filled = false;
  for (std::size_t k = 1; k < c.sources.size(); ++k) {
    std::size_t at = 0;
    later_filled = later_filled || !Trimmed(record[c.sources[k]].text, &at).empty();
  }
  std::size_t empty = 0, unknown = 0;
  for (std::size_t k = 0; k < c.sources.size(); ++k) {
    const Field& f = record[c.sources[k]];
    std::size_t at = 0;
    std::string restored;
    std::string_view part = Trimmed(f.text, &at);
    if (k == 0 && later_filled && (part.empty() || part == "-" || part == "+")) {
      restored = std::string(part) + "0";
      part = restored;
    }
    empty += part.empty();
    unknown += part == "?";
    const bool sign = k == 0 && !part.empty() && (part[0] == '-' || part[0] == '+');
    const std::string_view digits = part.substr(sign ? 1 : 0);
    const bool place =
        digits == "?" ||
        (!digits.empty() && digits.find_first_not_of("0123456789") == std::string_view::npos);
    if (!part.empty() && !place) {
      Fail(f, at,
           "expected a whole number or '?' in '" + plan_.header_names[c.sources[k]] +
               "', one place of the joined column '" + c.name + "', found " + QuotedText(part));
    }
    if (!cell.raw.empty()) cell.raw += ' ';
    cell.raw += part.empty() ? std::string_view("?") : part;
  }
  if (empty == c.sources.size()) cell.raw = "_";
  if (unknown == c.sources.size()) cell.raw = "?";
  if (empty > 0 && empty < c.sources.size()) {
    for (std::size_t k = 0; k < c.sources.size(); ++k) {
      const Field& f = record[c.sources[k]];
      std::size_t at = 0;
      if (k > 0 && Trimmed(f.text, &at).empty()) {
        Fail(f, at,
             "expected a whole number or '?' in every part of the joined column '" + c.name +
                 "' (or all parts empty for a blank), found an empty part");
      }
    }
  }
  ReadingInfo info;
  try {
    info = transcription::ParseReading(cell.raw, *c.places, 0);
  } catch (const LineError& e) {
    Fail(first, lead, e.message + " (the joined column '" + c.name + "' reads '" + cell.raw + "')");
  }
  if (column == 0 && info.value) argument_places_ = std::max(argument_places_, *c.places);
  cell.state = info.state;
  cell.value = info.value;
  return cell;
}

int CsvReader::ColumnOf(const Field& f, std::size_t lead) {
  if (f.line_start != counter_start_) {
    counter_start_ = f.line_start;
    counter_ = ColumnCounter(LineAt(f.line_start));
  }
  return counter_.At(f.offset + lead);
}

void CsvReader::CheckFieldCount(const std::vector<Field>& record) const {
  const std::size_t n = plan_.fields;
  if (record.size() == n) return;
  const std::string message = "expected " + std::to_string(n) +
                              " fields (the argument and one per column), found " +
                              std::to_string(record.size());
  if (record.size() < n) Fail(record.back(), record.back().text.size(), message);
  Fail(record[n], 0, message);
}

/// Arguments written with fewer places than the most any has (`1` beside
/// `1;30`) take those places; the raw text stays as written.
void CsvReader::FinishArgument(Transcription& t) {
  if (plan_.columns[0].places) return;
  t.argument.places = argument_places_;
  for (auto& row : t.rows) {
    Cell& a = row.argument;
    a.places = argument_places_;
    if (a.value) a.value = a.value->Extended(argument_places_);
  }
}

/// A sheet whose columns say degrees, minutes (and seconds) of one value is
/// refused unless the editor joined them or chose to keep them apart: three
/// value columns imported without a word would be wrong everywhere after.
void CsvReader::CheckPartColumns(const std::vector<Field>& header, const Transcription& t) const {
  if (options_.keep_columns || !options_.joins.empty()) return;
  for (const auto& g : transcription::csv::FindPartGroups(header)) {
    if (!LooksLikeParts(g, t)) continue;
    std::string parts, list;
    for (std::size_t k = 0; k < g.count; ++k) {
      const std::string name = plan_.header_names[g.first + k];
      parts += (k ? "+" : "") + name;
      list += (k ? ", '" : "'") + name + "'";
    }
    Fail(header[g.first], 0,
         "expected one column per value, found columns " + list +
             " that read as the degrees, minutes" + (g.count == 3 ? " and seconds" : "") +
             " of one value; join them with --join '" + g.name + "=" + parts +
             "' or keep them apart with --keep-columns");
  }
}

/// True when the later parts hold whole numbers 0..59 and the first whole
/// numbers, on every row where they are read.
bool CsvReader::LooksLikeParts(const transcription::csv::PartGroup& g,
                               const Transcription& t) const {
  std::size_t read = 0;
  for (const auto& row : t.rows) {
    for (std::size_t k = 0; k < g.count; ++k) {
      const std::size_t field = g.first + k;
      const Cell& c = field == 0 ? row.argument : row.cells[field - 1];
      if (!c.value) continue;
      if (c.value->places() != 0) return false;
      if (k > 0 && (c.value->negative() || c.value->units() > 59)) return false;
      ++read;
    }
  }
  return read > 0;
}

Transcription CsvReader::MakeHead(const std::vector<Field>& header) const {
  const Transcription& head = options_.head;
  auto id = [](const std::string& value, const char* option, const char* what) {
    if (value.empty()) {
      throw InputError::ForOption(option,
                                  std::string("expected ") + what + " of the sheet, found none");
    }
    if (!IsSafeId(value)) {
      throw InputError::ForOption(option, std::string("expected ") + what + " of " + kSafeIdRule +
                                              ", found " + QuotedText(value));
    }
  };
  id(head.table_id, "--table", "a table id");
  id(head.witness.siglum, "--witness", "a siglum");
  if (!head.work.id.empty()) id(head.work.id, "--work", "a work id");
  if (!head.witness.script.empty()) {
    const std::string problem = CheckScriptName(head.witness.script, options_.read);
    if (!problem.empty()) throw InputError::ForOption("--script", problem);
  }
  if (!head.witness.kind.empty() && !WitnessKindFromString(head.witness.kind)) {
    throw InputError::ForOption("--kind", "expected manuscript, print or modern-edition, found " +
                                              QuotedText(head.witness.kind));
  }
  Transcription t;
  t.work = head.work;
  if (t.work.id.empty()) t.work.id = head.table_id;
  t.table_id = head.table_id;
  t.table_title = head.table_title;
  t.kind = head.kind;
  t.witness = head.witness;
  t.folios = head.folios;
  t.hand = head.hand;
  t.source_file = file_;
  t.argument = head.argument;
  t.argument.name = plan_.columns[0].name;
  if (!head.argument.name.empty() && head.argument.name != t.argument.name) {
    Fail(header[0], 0,
         "expected the argument '" + head.argument.name + "' as declared for this sheet, found " +
             QuotedText(t.argument.name));
  }
  t.argument.places = plan_.columns[0].places.value_or(0);
  for (std::size_t c = 1; c < plan_.columns.size(); ++c) {
    ColumnSpec column;
    column.name = plan_.columns[c].name;
    for (const auto& declared : head.columns) {
      if (declared.name == column.name) column.unit = declared.unit, column.title = declared.title;
    }
    t.columns.push_back(std::move(column));
  }
  for (const auto& declared : head.columns) {
    if (t.ColumnIndex(declared.name) < 0) {
      Fail(header[0], 0,
           "expected a column '" + declared.name + "' as declared for this sheet, found none");
    }
  }
  return t;
}

TranscriptionFile CsvReader::Run() {
  if (text_.empty()) FailEmpty("expected a CSV sheet, found an empty file");
  transcription::CheckText(text_, file_, options_.read.max_line_bytes);
  if (text_.substr(0, 3) == "\xEF\xBB\xBF") pos_ = line_start_ = 3;
  delimiter_ = options_.delimiter ? options_.delimiter : DetectDelimiter(text_.substr(pos_));
  std::vector<Field> header, record;
  if (!NextRecord(header)) FailEmpty("expected a header row, found only empty lines");
  for (const auto& f : header) plan_.header_names.push_back(std::string(Trimmed(f.text)));
  unquoted_header_ = std::move(unquoted_);  // header fields stay valid
  try {
    static_cast<Plan&>(plan_) = transcription::csv::PlanColumns(header, options_);
  } catch (const transcription::csv::HeaderError& e) {
    Fail(header[e.field], e.offset, e.message);
  }
  first_line_.assign(plan_.columns.size(), 0);
  Transcription t = MakeHead(header);
  // One allocation for the rows (a line is at most one row): growing the
  // vector by doubling left the heap so that each run faulted in its cells
  // afresh (csv_bench alone: 1.0 M cells/s CPU, 8 M with the reservation).
  t.rows.reserve(static_cast<std::size_t>(std::count(text_.begin() + pos_, text_.end(), '\n')) + 1);
  while (NextRecord(record)) {
    CheckFieldCount(record);
    Row& row = t.rows.emplace_back();
    row.line = record[0].line;
    row.argument = ReadCell(record, 0);
    row.cells.reserve(plan_.columns.size() - 1);
    for (std::size_t c = 1; c < plan_.columns.size(); ++c) row.cells.push_back(ReadCell(record, c));
  }
  if (t.rows.empty()) {
    Fail(header[0], 0, "expected at least one row after the header, found none");
  }
  FinishArgument(t);
  for (std::size_t c = 1; c < plan_.columns.size(); ++c) {
    t.columns[c - 1].places = plan_.columns[c].places.value_or(0);
  }
  for (auto& row : t.rows) {  // columns whose places were fixed after some blanks
    for (std::size_t c = 0; c < row.cells.size(); ++c) row.cells[c].places = t.columns[c].places;
  }
  if (plan_.columns.size() == plan_.fields) CheckPartColumns(header, t);
  t.source_text = std::string(text_);
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
  const std::string text = ReadTextFile(path, options.read.max_file_bytes, "a CSV sheet");
  return ReadCsv(text, path, options);
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
