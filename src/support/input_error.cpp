#include "support/input_error.hpp"

#include <algorithm>
#include <utility>

namespace apograph {
namespace {

std::string Headline(const Diagnostic& d) {
  std::string out = d.where.file;
  if (d.where.line > 0) out += ":" + std::to_string(d.where.line);
  if (d.where.line > 0 && d.where.column > 0) out += ":" + std::to_string(d.where.column);
  if (!out.empty()) out += ": ";
  out += d.severity == Severity::kError ? "error: " : "warning: ";
  return out + d.message;
}

/// Spaces up to the column, keeping tabs so the caret lines up in a terminal.
std::string CaretLine(const std::string& text, int column) {
  std::string out;
  int seen = 1;
  for (std::size_t i = 0; i < text.size() && seen < column; ++i) {
    const auto c = static_cast<unsigned char>(text[i]);
    if ((c & 0xC0) == 0x80) continue;  // UTF-8 continuation byte
    out += c == '\t' ? '\t' : ' ';
    ++seen;
  }
  while (seen < column) {
    out += ' ';
    ++seen;
  }
  return out + "^";
}

/// Byte offset of the code point numbered `column` (1-based) in `text`.
std::size_t OffsetOfColumn(std::string_view text, int column) {
  int seen = 0;
  for (std::size_t i = 0; i < text.size(); ++i) {
    if ((static_cast<unsigned char>(text[i]) & 0xC0) != 0x80 && ++seen == column) return i;
  }
  return text.size();
}

/// Backs `offset` up to the start of the UTF-8 sequence it stands in.
std::size_t SequenceStart(std::string_view text, std::size_t offset) {
  while (offset > 0 && offset < text.size() &&
         (static_cast<unsigned char>(text[offset]) & 0xC0) == 0x80) {
    --offset;
  }
  return offset;
}

/// The echoed line and caret column: a long line (a 10 MB line of junk) is
/// cut to a window around the column, with "..." where text was left out.
std::pair<std::string, int> EchoedLine(const std::string& text, int column) {
  if (text.size() <= kEchoedLineBytes) return {text, column};
  const std::size_t at = OffsetOfColumn(text, std::max(column, 1));
  const std::size_t before = kEchoedLineBytes / 3;
  std::size_t from = at > before ? SequenceStart(text, at - before) : 0;
  std::size_t to = SequenceStart(text, std::min(text.size(), from + kEchoedLineBytes));
  if (to <= from) to = std::min(text.size(), from + kEchoedLineBytes);
  std::string shown =
      (from > 0 ? "..." : "") + text.substr(from, to - from) + (to < text.size() ? "..." : "");
  int skipped = 0;
  for (std::size_t i = 0; i < from; ++i) {
    if ((static_cast<unsigned char>(text[i]) & 0xC0) != 0x80) ++skipped;
  }
  return {std::move(shown), column > 0 ? column - skipped + (from > 0 ? 3 : 0) : column};
}

}  // namespace

std::string Diagnostic::Render() const {
  std::string out = Headline(*this);
  if (where.line > 0 && !where.line_text.empty()) {
    const auto [text, column] = EchoedLine(where.line_text, where.column);
    out += "\n" + text;
    if (column > 0) out += "\n" + CaretLine(text, column);
  }
  return out;
}

InputError::InputError(Diagnostic diagnostic)
    : InputError(std::vector<Diagnostic>{std::move(diagnostic)}) {}

InputError::InputError(std::vector<Diagnostic> diagnostics)
    : std::runtime_error(diagnostics.empty() ? "input error" : diagnostics.front().Render()),
      diagnostics_(std::move(diagnostics)) {}

InputError InputError::ForFile(const std::string& file, const std::string& message) {
  Diagnostic d;
  d.where.file = file;
  d.message = message;
  return InputError(d);
}

InputError InputError::ForOption(const std::string& option, const std::string& message) {
  Diagnostic d;
  d.where.file = option;
  d.message = message;
  return InputError(d);
}

std::string InputError::Render() const {
  std::string out;
  for (const auto& d : diagnostics_) {
    if (!out.empty()) out += "\n";
    out += d.Render();
  }
  return out;
}

std::string ExpectedFound(const std::string& expected, const std::string& found) {
  return "expected " + expected + ", found " + found;
}

std::string QuotedText(std::string_view text) {
  if (text.size() <= kQuotedTextBytes) return "'" + std::string(text) + "'";
  std::size_t cut = kQuotedTextBytes;
  while (cut > 0 && (static_cast<unsigned char>(text[cut]) & 0xC0) == 0x80) --cut;
  return "'" + std::string(text.substr(0, cut)) + "...' (" + std::to_string(text.size()) +
         " bytes)";
}

}  // namespace apograph
