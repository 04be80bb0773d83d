// The transcription driver: splits the text into lines, hands directive and
// row lines to the X3 parsers (parser_x3.cpp, cell_x3.cpp), keeps track of
// the current work, witness and table, and validates what the grammar alone
// cannot (see "Validation" in grammar/transcription.ebnf).
#include "transcription/parser.hpp"

#include <algorithm>
#include <array>
#include <cstdint>
#include <filesystem>
#include <fstream>
#include <initializer_list>
#include <iterator>
#include <unordered_map>

#include "edition/names.hpp"
#include "support/data_dir.hpp"
#include "transcription/syntax.hpp"

namespace apograph {
namespace transcription {
namespace {

constexpr const char* kDirectives =
    "@work, @witness, @table, @argument, @argument2, @column, @rows";
constexpr std::string_view kByteOrderMark = "\xEF\xBB\xBF";

std::string Quote(std::string_view s) { return QuotedText(s); }

/// An argument as written, with its value in the table's notation when it
/// was written otherwise (`'88.5' (88;30)`).
std::string ArgumentText(const Cell& a) {
  std::string out = Quote(a.raw);
  if (a.value && a.value->ToString() != a.raw) out += " (" + a.value->ToString() + ")";
  return out;
}

std::string PlacesWords(int n) {
  return std::to_string(n) + (n == 1 ? " fractional place" : " fractional places");
}

/// Hash key of an exact value at a fixed number of places.
struct UnitsHash {
  std::size_t operator()(Sexagesimal::Units u) const {
    const auto low = static_cast<std::uint64_t>(u);
    const auto high = static_cast<std::uint64_t>(static_cast<unsigned __int128>(u) >> 64);
    return std::hash<std::uint64_t>()(low ^ (high * 0x9E3779B97F4A7C15ull));
  }
};

class Parser {
 public:
  Parser(std::string_view text, const std::string& file, const ReadOptions& options)
      : text_(text), file_(file), options_(options) {}
  TranscriptionFile Run();

 private:
  void Line(std::string_view line);
  void Directive(std::string_view line, std::size_t at);
  void RowLine(std::string_view line, std::size_t at);
  void ParseRowCells(std::string_view line, std::size_t pos, Row& row,
                     std::size_t& argument_offset);
  void CheckArgument(const Row& row, std::string_view line, std::size_t offset);
  void OpenTable(const DirectiveAst& d, std::string_view line);
  void CloseTable(const std::string& found);
  void SetWork(const DirectiveAst& d, std::string_view line);
  void SetWitness(const DirectiveAst& d, std::string_view line);
  void SetArgument(const DirectiveAst& d, std::string_view line, bool second);
  void AddColumn(const DirectiveAst& d, std::string_view line);
  void StartRows(const DirectiveAst& d, std::string_view line);
  void RequireLayout(const DirectiveAst& d, std::string_view line);

  void RequireId(const DirectiveAst& d, std::string_view line, const char* what);
  void RequireSafeId(const DirectiveAst& d, std::string_view line, const char* what);
  void CheckScript(const AttributeAst& a, std::string_view line);
  void CheckAttributes(const DirectiveAst& d, std::string_view line,
                       std::initializer_list<std::string_view> allowed);
  int Places(const AttributeAst& a, std::string_view line);
  Sexagesimal Number(const AttributeAst& a, std::string_view line);
  std::string ColumnList() const;

  Diagnostic Make(Severity severity, int line_no, std::string_view line, std::size_t offset,
                  std::string message) const;
  [[noreturn]] void Fail(std::string_view line, std::size_t offset, std::string message) const {
    throw InputError(Make(Severity::kError, line_no_, line, offset, std::move(message)));
  }

  enum class Phase { kOutside, kLayout, kRows };

  std::string_view text_;
  const std::string& file_;
  const ReadOptions& options_;
  int line_no_ = 0;
  std::size_t line_start_ = 0;
  TranscriptionFile out_;

  WorkInfo work_;
  bool have_work_ = false;
  WitnessInfo witness_;
  bool have_witness_ = false;

  Phase phase_ = Phase::kOutside;
  Transcription table_;
  bool have_argument_ = false;
  int table_line_ = 0;
  std::string table_line_text_;
  std::size_t table_start_ = 0;
  std::size_t table_end_ = 0;
  int rows_line_ = 0;
  std::string rows_line_text_;
  std::unordered_map<Sexagesimal::Units, int, UnitsHash> seen_arguments_;
  struct RowSource {
    std::string_view line;
    std::size_t argument_offset;
  };
  std::vector<RowSource> row_sources_;  ///< per row of the open table, for warnings
  void CheckSequence();
};

Diagnostic Parser::Make(Severity severity, int line_no, std::string_view line, std::size_t offset,
                        std::string message) const {
  Diagnostic d;
  d.severity = severity;
  d.where.file = file_;
  d.where.line = line_no;
  d.where.line_text = std::string(line);
  d.where.column = ColumnCounter(line).At(offset);
  d.message = std::move(message);
  return d;
}

TranscriptionFile Parser::Run() {
  CheckText(text_, file_, options_.max_line_bytes);
  std::size_t pos = text_.substr(0, 3) == kByteOrderMark ? 3 : 0;
  for (;;) {
    const std::size_t newline = text_.find('\n', pos);
    const std::size_t end = newline == std::string_view::npos ? text_.size() : newline;
    std::string_view line = text_.substr(pos, end - pos);
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    ++line_no_;
    line_start_ = pos;
    Line(line);
    if (newline == std::string_view::npos) break;
    pos = newline + 1;
  }
  CloseTable("end of file");
  std::stable_sort(
      out_.warnings.begin(), out_.warnings.end(),
      [](const Diagnostic& a, const Diagnostic& b) { return a.where.line < b.where.line; });
  if (out_.tables.empty()) {
    throw InputError::ForFile(file_, "expected at least one @table section, found none");
  }
  return std::move(out_);
}

void Parser::Line(std::string_view line) {
  std::size_t at = 0;
  while (at < line.size() && IsBlank(line[at])) ++at;
  if (at == line.size() || line[at] == '#') return;
  if (line[at] == '@') {
    Directive(line, at);
  } else {
    RowLine(line, at);
  }
}

void Parser::Directive(std::string_view line, std::size_t at) {
  DirectiveAst d;
  try {
    d = ParseDirective(line, at);
  } catch (const LineError& e) {
    Fail(line, e.offset, e.message);
  }
  const std::string& k = d.keyword;
  if (k == "work" || k == "witness" || k == "table") {
    CloseTable(FoundToken(line, at));
    if (k == "work") SetWork(d, line);
    if (k == "witness") SetWitness(d, line);
    if (k == "table") OpenTable(d, line);
  } else if (k == "argument" || k == "argument2" || k == "column" || k == "rows") {
    RequireLayout(d, line);
    if (k == "argument" || k == "argument2") SetArgument(d, line, k == "argument2");
    if (k == "column") AddColumn(d, line);
    if (k == "rows") StartRows(d, line);
  } else {
    Fail(line, at,
         std::string("expected a directive (") + kDirectives + "), found " + FoundToken(line, at));
  }
}

void Parser::RequireId(const DirectiveAst& d, std::string_view line, const char* what) {
  if (!d.id.empty()) return;
  const std::size_t at = d.attributes.empty() ? d.end_offset : d.attributes[0].name_offset;
  Fail(line, at,
       std::string("expected ") + what + " after @" + d.keyword + ", found " +
           (d.attributes.empty() ? FoundChar(line, at) : FoundToken(line, at)));
}

void Parser::RequireSafeId(const DirectiveAst& d, std::string_view line, const char* what) {
  RequireId(d, line, what);
  if (!IsSafeId(d.id)) {
    Fail(line, d.id_offset,
         std::string("expected ") + what + " of " + kSafeIdRule + ", found " + QuotedText(d.id));
  }
}

void Parser::CheckScript(const AttributeAst& a, std::string_view line) {
  const std::string problem = CheckScriptName(a.value, options_);
  if (!problem.empty()) Fail(line, a.value_offset, problem);
}

void Parser::CheckAttributes(const DirectiveAst& d, std::string_view line,
                             std::initializer_list<std::string_view> allowed) {
  for (std::size_t i = 0; i < d.attributes.size(); ++i) {
    const AttributeAst& a = d.attributes[i];
    bool known = false;
    std::string list;
    for (std::string_view name : allowed) {
      known = known || a.name == name;
      list += (list.empty() ? "" : ", ") + std::string(name);
    }
    if (!known) {
      Fail(line, a.name_offset,
           "expected an attribute of @" + d.keyword + " (" + list + "), found " + Quote(a.name));
    }
    for (std::size_t j = 0; j < i; ++j) {
      if (d.attributes[j].name == a.name) {
        Fail(line, a.name_offset, "expected each attribute once, found a second " + Quote(a.name));
      }
    }
  }
}

int Parser::Places(const AttributeAst& a, std::string_view line) {
  const std::string& v = a.value;
  const bool digits =
      !v.empty() && v.size() <= 2 && v.find_first_not_of("0123456789") == std::string::npos;
  const int n = digits ? std::stoi(v) : -1;
  if (n < 0 || n > Sexagesimal::kMaxPlaces) {
    Fail(line, a.value_offset,
         "expected places from 0 to " + std::to_string(Sexagesimal::kMaxPlaces) + ", found " +
             Quote(v));
  }
  return n;
}

Sexagesimal Parser::Number(const AttributeAst& a, std::string_view line) {
  NumberSyntaxError error;
  auto value = Sexagesimal::Parse(a.value, &error);
  if (!value) {
    Fail(line, a.value_offset,
         "expected a number such as 0;30 for " + a.name + "=, found " + Quote(a.value));
  }
  return *value;
}

void Parser::SetWork(const DirectiveAst& d, std::string_view line) {
  RequireSafeId(d, line, "a work id");
  CheckAttributes(d, line, {"title", "author"});
  work_ = WorkInfo{};
  work_.id = d.id;
  for (const auto& a : d.attributes) (a.name == "title" ? work_.title : work_.author) = a.value;
  have_work_ = true;
}

void Parser::SetWitness(const DirectiveAst& d, std::string_view line) {
  RequireSafeId(d, line, "a siglum");
  CheckAttributes(d, line, {"library", "shelfmark", "date", "script", "note", "kind"});
  witness_ = WitnessInfo{};
  witness_.siglum = d.id;
  for (const auto& a : d.attributes) {
    if (a.name == "library") witness_.library = a.value;
    if (a.name == "shelfmark") witness_.shelfmark = a.value;
    if (a.name == "date") witness_.date = a.value;
    if (a.name == "script") {
      CheckScript(a, line);
      witness_.script = a.value;
    }
    if (a.name == "note") witness_.note = a.value;
    if (a.name == "kind") {
      if (!WitnessKindFromString(a.value)) {
        Fail(line, a.value_offset,
             "expected kind=manuscript, print or modern-edition, found " + Quote(a.value));
      }
      witness_.kind = a.value;
    }
    if (a.name == "date" && !a.value.empty() && !ParseWitnessDate(a.value)) {
      out_.warnings.push_back(Make(Severity::kWarning, line_no_, line, a.value_offset,
                                   "expected a date such as 1461, c. 1420, 1450-1475 or late 15th "
                                   "century, found " +
                                       Quote(a.value) +
                                       "; kept as written, but no date order is inferred from it"));
    }
  }
  have_witness_ = true;
}

void Parser::OpenTable(const DirectiveAst& d, std::string_view line) {
  if (!have_work_ || !have_witness_) {
    Fail(line, d.keyword_offset,
         std::string("expected ") + (have_work_ ? "@witness" : "@work") +
             " before @table, found '@table'");
  }
  RequireSafeId(d, line, "a table id");
  CheckAttributes(d, line, {"title", "kind", "folios", "hand"});
  table_ = Transcription{};
  table_.work = work_;
  table_.witness = witness_;
  table_.table_id = d.id;
  for (const auto& a : d.attributes) {
    if (a.name == "title") table_.table_title = a.value;
    if (a.name == "kind") table_.kind = a.value;
    if (a.name == "folios") table_.folios = a.value;
    if (a.name == "hand") table_.hand = a.value;
  }
  table_.source_file = file_;
  phase_ = Phase::kLayout;
  have_argument_ = false;
  table_line_ = line_no_;
  table_line_text_ = std::string(line);
  table_start_ = line_start_;
  seen_arguments_.clear();
}

void Parser::RequireLayout(const DirectiveAst& d, std::string_view line) {
  const std::string found = "'@" + d.keyword + "'";
  if (phase_ == Phase::kOutside) {
    Fail(line, d.keyword_offset, "expected @table before @" + d.keyword + ", found " + found);
  }
  if (phase_ == Phase::kRows) {
    Fail(line, d.keyword_offset,
         "expected a row, @table, @work or @witness after the rows of table '" + table_.table_id +
             "', found " + found);
  }
}

void Parser::SetArgument(const DirectiveAst& d, std::string_view line, bool second) {
  const bool again = second ? table_.argument2.has_value() : have_argument_;
  if (again)
    Fail(line, d.keyword_offset, "expected one @" + d.keyword + " per table, found a second one");
  if (second && !table_.columns.empty()) {
    Fail(line, d.keyword_offset,
         "expected @argument2 before the @column lines, found '@argument2'");
  }
  RequireId(d, line, "an argument name");
  if (second) {
    CheckAttributes(d, line, {"unit", "places"});
  } else {
    CheckAttributes(d, line, {"unit", "places", "start", "step"});
  }
  ArgumentSpec spec;
  spec.name = d.id;
  for (const auto& a : d.attributes) {
    if (a.name == "unit") spec.unit = a.value;
    if (a.name == "places") spec.places = Places(a, line);
    if (a.name == "start") spec.start = Number(a, line);
    if (a.name == "step" && a.value == kListedStep) spec.listed = true;
    if (a.name == "step" && a.value != kListedStep) spec.step = Number(a, line);
  }
  if (spec.listed && spec.start) {
    for (const auto& a : d.attributes) {
      if (a.name == "start") {
        Fail(line, a.name_offset,
             "expected no start= for arguments declared step=list (they are taken as written), "
             "found 'start'");
      }
    }
  }
  if (second) {
    table_.argument2 = spec;
  } else {
    table_.argument = spec;
    have_argument_ = true;
  }
}

void Parser::AddColumn(const DirectiveAst& d, std::string_view line) {
  RequireId(d, line, "a column name");
  CheckAttributes(d, line, {"unit", "places", "title", "arg2"});
  if (table_.ColumnIndex(d.id) >= 0 || (have_argument_ && table_.argument.name == d.id)) {
    Fail(line, d.id_offset, "expected a new column name, found " + Quote(d.id) + " again");
  }
  ColumnSpec column;
  column.name = d.id;
  for (const auto& a : d.attributes) {
    if (a.name == "unit") column.unit = a.value;
    if (a.name == "places") column.places = Places(a, line);
    if (a.name == "title") column.title = a.value;
    if (a.name == "arg2") {
      if (!table_.argument2) {
        Fail(line, a.name_offset, "expected @argument2 before a column with arg2=, found 'arg2'");
      }
      column.arg2 = Number(a, line);
    }
  }
  if (table_.argument2 && !column.arg2) {
    Fail(line, d.end_offset,
         "expected arg2=VALUE on each column of a table with @argument2, found " +
             FoundChar(line, d.end_offset));
  }
  table_.columns.push_back(std::move(column));
}

void Parser::StartRows(const DirectiveAst& d, std::string_view line) {
  if (!d.id.empty() || !d.attributes.empty()) {
    const std::size_t at = d.id.empty() ? d.attributes[0].name_offset : d.id_offset;
    Fail(line, at, "expected nothing after @rows, found " + FoundToken(line, at));
  }
  if (!have_argument_)
    Fail(line, d.keyword_offset, "expected @argument before @rows, found '@rows'");
  if (table_.columns.empty()) {
    Fail(line, d.keyword_offset, "expected at least one @column before @rows, found '@rows'");
  }
  phase_ = Phase::kRows;
  rows_line_ = line_no_;
  rows_line_text_ = std::string(line);
  table_end_ = line_start_ + line.size();
}

void Parser::CloseTable(const std::string& found) {
  if (phase_ == Phase::kOutside) return;
  if (phase_ == Phase::kLayout) {
    throw InputError(
        Make(Severity::kError, table_line_, table_line_text_, 0,
             "expected a @rows line in table '" + table_.table_id + "', found " + found));
  }
  if (table_.rows.empty()) {
    throw InputError(Make(Severity::kError, rows_line_, rows_line_text_, 0,
                          "expected at least one row after @rows, found " + found));
  }
  table_.source_text = std::string(text_.substr(table_start_, table_end_ - table_start_));
  CheckSequence();
  out_.tables.push_back(std::move(table_));
  table_ = Transcription{};
  phase_ = Phase::kOutside;
}

std::string Parser::ColumnList() const {
  std::string list;
  constexpr std::size_t kShown = 6;
  for (std::size_t i = 0; i < table_.columns.size() && i < kShown; ++i) {
    list += (i ? ", " : "") + table_.columns[i].name;
  }
  if (table_.columns.size() > kShown) list += ", ...";
  return list;
}

void Parser::RowLine(std::string_view line, std::size_t at) {
  if (phase_ != Phase::kRows) {
    if (phase_ == Phase::kLayout) {
      Fail(line, at, "expected @rows before the first row, found " + FoundToken(line, at));
    }
    Fail(line, at,
         std::string("expected a directive (") + kDirectives + "), found " + FoundToken(line, at));
  }
  Row row;
  row.line = line_no_;
  row.cells.reserve(table_.columns.size());
  std::size_t argument_offset = 0;
  try {
    ParseRowCells(line, at, row, argument_offset);
  } catch (const LineError& e) {
    Fail(line, e.offset, e.message);
  }
  CheckArgument(row, line, argument_offset);
  table_.rows.push_back(std::move(row));
  row_sources_.push_back({line, argument_offset});
  table_end_ = line_start_ + line.size();
}

void Parser::ParseRowCells(std::string_view line, std::size_t pos, Row& row,
                           std::size_t& argument_offset) {
  ColumnCounter columns(line);
  const std::size_t wanted = table_.columns.size();
  for (std::size_t n = 0;; ++n) {
    if (n > wanted) {
      while (pos < line.size() && IsBlank(line[pos])) ++pos;
      throw LineError{pos, "expected " + std::to_string(wanted) + " value cells (" + ColumnList() +
                               "), found an extra cell"};
    }
    const bool is_argument = n == 0;
    const int places = is_argument ? table_.argument.places : table_.columns[n - 1].places;
    Cell& cell = is_argument ? row.argument : row.cells.emplace_back();
    std::size_t offset = 0;
    const ReadingInfo info = ParseCell(line, pos, places, cell, offset, is_argument);
    cell.places = places;
    cell.line = line_no_;
    cell.column = columns.At(offset);
    if (is_argument) argument_offset = offset;
    const bool has_places = info.state == CellState::kRead || info.state == CellState::kPartial;
    if (has_places && info.fraction_places != places) {
      const std::string where = is_argument ? "the argument '" + table_.argument.name + "'"
                                            : "column '" + table_.columns[n - 1].name + "'";
      throw LineError{offset, "expected a reading with " + PlacesWords(places) + " in " + where +
                                  ", found " + Quote(cell.raw) + " (" +
                                  PlacesWords(info.fraction_places) + ")"};
    }
    if (pos >= line.size() || line[pos] == '#') break;
    ++pos;  // the '|'
  }
  if (row.cells.size() < wanted) {
    std::size_t end = pos;
    while (end > 0 && IsBlank(line[end - 1])) --end;
    throw LineError{end, "expected " + std::to_string(wanted) + " value cells (" + ColumnList() +
                             "), found " + std::to_string(row.cells.size())};
  }
}

void Parser::CheckArgument(const Row& row, std::string_view line, std::size_t offset) {
  const Cell& a = row.argument;
  if (a.state != CellState::kRead) return;
  // Every argument has the argument's places, so units compare exactly.
  auto [it, inserted] = seen_arguments_.emplace(a.value->units(), line_no_);
  if (!inserted) {
    out_.warnings.push_back(Make(Severity::kWarning, line_no_, line, offset,
                                 "expected each argument once, found " + ArgumentText(a) +
                                     " again (first in line " + std::to_string(it->second) + ")"));
  }
}

// Arguments are evidence, so a break in their sequence is a warning, said
// once where it happens: a miscopied argument (the row keeps its place), or a
// gap or a step back in the sequence (rows missing or out of order).
void Parser::CheckSequence() {
  if (!table_.argument.step) {
    row_sources_.clear();
    return;
  }
  const Sexagesimal step = *table_.argument.step;
  std::optional<Sexagesimal> previous;
  for (std::size_t i = 0; i < table_.rows.size(); ++i) {
    const Row& row = table_.rows[i];
    const RowSource& src = row_sources_[i];
    std::optional<Sexagesimal> in_use, expected;
    try {
      in_use = table_.ArgumentInUse(i);
      expected = previous ? std::optional(*previous + step) : table_.argument.start;
    } catch (const std::overflow_error&) {
      // Beyond the range of exact values: nothing to compare.
      in_use.reset();
      expected.reset();
    }
    const auto& written = row.argument.value;
    if (written && in_use && *written != *in_use) {
      out_.warnings.push_back(Make(Severity::kWarning, row.line, src.line, src.argument_offset,
                                   "expected argument " + in_use->ToString() +
                                       " (it breaks the sequence of its neighbours), found " +
                                       ArgumentText(row.argument) +
                                       "; the row is taken as argument " + in_use->ToString()));
    } else if (written && in_use && expected && *in_use != *expected) {
      const std::string why =
          *in_use > *expected ? "a row seems to be missing" : "rows out of order";
      out_.warnings.push_back(Make(Severity::kWarning, row.line, src.line, src.argument_offset,
                                   "expected argument " + expected->ToString() + ", found " +
                                       ArgumentText(row.argument) + " (" + why + ")"));
    }
    previous = in_use ? in_use : expected;
  }
  row_sources_.clear();
}

}  // namespace
}  // namespace transcription

std::string CheckScriptName(const std::string& name, const ReadOptions& options) {
  const std::vector<std::string> found = options.scripts ? *options.scripts : ScriptNames();
  if (IsSafeId(name) && std::find(found.begin(), found.end(), name) != found.end()) return "";
  std::string list;
  for (const auto& s : found) list += (list.empty() ? "" : ", ") + s;
  return "expected a numeral script (" + (list.empty() ? std::string("none found") : list) +
         "), found " + QuotedText(name);
}

TranscriptionFile ParseTranscription(std::string_view text, const std::string& file_name,
                                     const ReadOptions& options) {
  if (text.empty()) {
    Diagnostic d;
    d.where = {file_name, 1, 1, ""};
    d.message = "expected a transcription, found an empty file";
    throw InputError(d);
  }
  return transcription::Parser(text, file_name, options).Run();
}

namespace {

std::string SizeWords(std::size_t bytes) {
  if (bytes >= (std::size_t{1} << 20) && bytes % (std::size_t{1} << 20) == 0)
    return std::to_string(bytes >> 20) + " MB";
  return std::to_string(bytes) + " bytes";
}

}  // namespace

std::string ReadTextFile(const std::string& path, std::size_t max_bytes, const std::string& what) {
  std::error_code ec;
  if (std::filesystem::is_directory(path, ec)) {
    throw InputError::ForFile(path, "expected " + what + ", found a directory");
  }
  std::ifstream in(path, std::ios::binary);
  if (!in)
    throw InputError::ForFile(path,
                              "expected a readable file, found none (missing or not permitted)");
  // Read in chunks up to the limit: a device (/dev/zero) has no size to ask.
  // A regular file's size reserves the string once; each chunk is appended
  // as read (resizing by a whole chunk first zero-filled a mebibyte for
  // every small sheet: a fifth of importing 1,000 sheets, measured).
  std::string text;
  if (std::filesystem::is_regular_file(path, ec)) {
    const auto size = std::filesystem::file_size(path, ec);
    if (!ec) text.reserve(static_cast<std::size_t>(std::min<std::uintmax_t>(size, max_bytes) + 1));
  }
  constexpr std::size_t kChunk = std::size_t{1} << 16;
  std::array<char, kChunk> chunk;
  while (in) {
    in.read(chunk.data(), static_cast<std::streamsize>(kChunk));
    text.append(chunk.data(), static_cast<std::size_t>(in.gcount()));
    if (text.size() > max_bytes) {
      throw InputError::ForFile(path, "expected " + what + " of at most " + SizeWords(max_bytes) +
                                          ", found more (raise the limit with --max-file-mb)");
    }
  }
  if (in.bad()) throw InputError::ForFile(path, "expected a readable file, found a read error");
  return text;
}

TranscriptionFile ReadTranscriptionFile(const std::string& path, const ReadOptions& options) {
  const std::string text = ReadTextFile(path, options.max_file_bytes, "a transcription file");
  return ParseTranscription(text, path, options);
}

}  // namespace apograph
