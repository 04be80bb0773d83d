#include "support/input_error.hpp"

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

}  // namespace

std::string Diagnostic::Render() const {
  std::string out = Headline(*this);
  if (where.line > 0 && !where.line_text.empty()) {
    out += "\n" + where.line_text;
    if (where.column > 0) out += "\n" + CaretLine(where.line_text, where.column);
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

}  // namespace apograph
