// The transcription driver: splits the text into lines, hands directive and
// row lines to the X3 parsers (parser_x3.cpp, cell_x3.cpp), keeps track of
// the current work, witness and table, and validates what the grammar alone
// cannot (see "Validation" in grammar/transcription.ebnf).
#include "transcription/parser.hpp"

#include <algorithm>

#include "edition/names.hpp"
#include "support/data_dir.hpp"
#include "transcription/parser_internal.hpp"

namespace apograph {
namespace transcription {

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

TranscriptionFile ReadTranscriptionFile(const std::string& path, const ReadOptions& options) {
  const std::string text = ReadTextFile(path, options.max_file_bytes, "a transcription file");
  return ParseTranscription(text, path, options);
}

}  // namespace apograph
