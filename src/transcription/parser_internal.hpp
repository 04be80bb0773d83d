#pragma once
// The transcription parser's state machine, shared by its three files:
// parser.cpp (the driver: lines, directives dispatched, tables closed),
// parser_directives.cpp (each directive's checks) and parser_rows.cpp (row
// lines and the argument sequence). Not for other stages: they use
// parser.hpp.

#include <cstdint>
#include <initializer_list>
#include <string>
#include <string_view>
#include <unordered_map>
#include <vector>

#include "transcription/parser.hpp"
#include "transcription/syntax.hpp"

namespace apograph::transcription {

inline constexpr const char* kDirectives =
    "@work, @witness, @table, @argument, @argument2, @column, @rows";
inline constexpr std::string_view kByteOrderMark = "\xEF\xBB\xBF";

inline std::string Quote(std::string_view s) { return QuotedText(s); }

/// An argument as written, with its value in the table's notation when it
/// was written otherwise (`'88.5' (88;30)`).
inline std::string ArgumentText(const Cell& a) {
  std::string out = Quote(a.raw);
  if (a.value && a.value->ToString() != a.raw) out += " (" + a.value->ToString() + ")";
  return out;
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

}  // namespace apograph::transcription
