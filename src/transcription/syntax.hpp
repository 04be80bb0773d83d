#pragma once
// Internal to src/transcription: the line-level pieces that the Spirit X3
// translation units (parser_x3.cpp, cell_x3.cpp) recognise and the driver
// (parser.cpp, csv.cpp) assembles. No Spirit types appear here.

#include <cstddef>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "edition/transcription.hpp"

namespace apograph::transcription {

/// "1 fractional place", "3 fractional places": for messages.
inline std::string PlacesWords(int n) {
  return std::to_string(n) + (n == 1 ? " fractional place" : " fractional places");
}

/// A blank of the trade's plain text: a space or a TAB (what separates
/// fields and pads cells in transcriptions and sheets).
inline bool IsBlank(char c) { return c == ' ' || c == '\t'; }

/// A syntax error inside one line: byte offset in the line and the message
/// ("expected ..., found ..."). The driver turns it into a Diagnostic.
struct LineError {
  std::size_t offset = 0;
  std::string message;
};

/// `'x'` for the character at `offset` (a whole UTF-8 sequence), or
/// "end of line" past the end.
std::string FoundChar(std::string_view line, std::size_t offset);
/// The token starting at `offset` up to a blank or one of `|{}#=`, quoted;
/// "end of line" past the end.
std::string FoundToken(std::string_view line, std::size_t offset);

/// Checks that `text` is UTF-8 without NUL or control characters other than
/// TAB, LF and the CR of CR LF, and that no line is longer than
/// `max_line_bytes`. Throws InputError at the first bad byte (line and
/// column in code points), or at the line that is too long. Returns the
/// number of line ends (LF) it passed: a reader sizes its rows by it
/// without a second pass over the text.
std::size_t CheckText(std::string_view text, const std::string& file,
                      std::size_t max_line_bytes = std::size_t{1} << 20);

/// Converts byte offsets of one line into 1-based columns in code points,
/// cheaply when asked in increasing order.
class ColumnCounter {
 public:
  explicit ColumnCounter(std::string_view line) : line_(line) {}
  int At(std::size_t offset);

 private:
  std::string_view line_;
  std::size_t offset_ = 0;
  int column_ = 1;
};

/// One NAME=VALUE of a directive; value unescaped.
struct AttributeAst {
  std::string name;
  std::string value;
  std::size_t name_offset = 0;
  std::size_t value_offset = 0;
};

/// A directive line: `@keyword [id] {name=value}`.
struct DirectiveAst {
  std::string keyword;             ///< without '@'
  std::size_t keyword_offset = 0;  ///< where '@' stands
  std::string id;                  ///< empty when none was written
  std::size_t id_offset = 0;
  std::size_t end_offset = 0;  ///< where the directive ends (comment or end of line)
  std::vector<AttributeAst> attributes;
};

/// Parses the directive starting at `offset` ('@'). Throws LineError.
DirectiveAst ParseDirective(std::string_view line, std::size_t offset);

/// What a reading (the text of a cell without its marks) says.
struct ReadingInfo {
  CellState state = CellState::kRead;
  std::optional<Sexagesimal> value;  ///< when state == kRead
  int fraction_places = 0;           ///< places written after the integer part
};

/// Parses a trimmed, non-empty reading: `_`, `?`, or a number (trade,
/// degree or blank-separated form; places may be `?`). `places` is the
/// column's places, needed to split the blank-separated form; -1 when not
/// known (then that form is refused). `base` is the reading's offset in its
/// line, for error positions. Throws LineError.
ReadingInfo ParseReading(std::string_view text, int places, std::size_t base);

/// ParseReading by the grammar alone, without its fast path for the plain
/// trade form (which must agree with it; for the tests that check so).
ReadingInfo ParseReadingByGrammar(std::string_view text, int places, std::size_t base);

/// Parses the reading of an argument cell. Besides ParseReading's forms it
/// takes a decimal (`88.5` is 88;30: every decimal fraction is an exact
/// sexagesimal one) and fewer places than the argument's (`1` in an argument
/// of 1 place is 1;0), as sheets and modern editions write arguments; the
/// value is then given the argument's places (when `places` >= 0) and
/// fraction_places reports them. Throws LineError.
ReadingInfo ParseArgumentReading(std::string_view text, int places, std::size_t base);

/// Parses one cell of a row starting at `pos` (blanks allowed): its reading
/// and marks, up to '|', '#' or the end of the line, where `pos` is left.
/// Fills raw, state, value and marks of `cell`; returns the reading's
/// fraction places. An `argument` cell is read by ParseArgumentReading. `reading_offset` receives
/// where the reading starts. Throws LineError.
ReadingInfo ParseCell(std::string_view line, std::size_t& pos, int places, Cell& cell,
                      std::size_t& reading_offset, bool argument = false);

/// Parses a quoted string at `pos` ('"'), unescaping \" and \\; `pos` is
/// left after the closing quote. Throws LineError.
std::string ParseQuoted(std::string_view line, std::size_t& pos);

}  // namespace apograph::transcription
