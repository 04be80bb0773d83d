// Checks that a transcription is text: UTF-8, no NUL, no control characters.
#include "transcription/syntax.hpp"

#include <algorithm>
#include <cstdio>

#include "support/input_error.hpp"

namespace apograph::transcription {
namespace {

/// Length of the valid UTF-8 sequence at `i`, or 0 (RFC 3629: no overlong
/// forms, no surrogates, nothing above U+10FFFF).
std::size_t ValidSequence(std::string_view text, std::size_t i) {
  const auto byte = [&](std::size_t k) {
    return i + k < text.size() ? static_cast<unsigned char>(text[i + k]) : 0u;
  };
  const unsigned c = byte(0);
  auto cont = [&](std::size_t k, unsigned lo = 0x80, unsigned hi = 0xBF) {
    return byte(k) >= lo && byte(k) <= hi;
  };
  if (c >= 0xC2 && c <= 0xDF) return cont(1) ? 2 : 0;
  if (c == 0xE0) return cont(1, 0xA0) && cont(2) ? 3 : 0;
  if (c == 0xED) return cont(1, 0x80, 0x9F) && cont(2) ? 3 : 0;
  if (c >= 0xE1 && c <= 0xEF) return cont(1) && cont(2) ? 3 : 0;
  if (c == 0xF0) return cont(1, 0x90) && cont(2) && cont(3) ? 4 : 0;
  if (c >= 0xF1 && c <= 0xF3) return cont(1) && cont(2) && cont(3) ? 4 : 0;
  if (c == 0xF4) return cont(1, 0x80, 0x8F) && cont(2) && cont(3) ? 4 : 0;
  return 0;
}

constexpr std::size_t kShownBytes = 200;

std::string Hex(unsigned value, int digits) {
  char buffer[16];
  std::snprintf(buffer, sizeof buffer, "%0*X", digits, value);
  return buffer;
}

/// What a bad byte is, in words.
std::string Describe(unsigned char c) {
  if (c == 0) return "expected text, found a NUL byte (is this a binary file?)";
  if (c == '\r') return "expected a line end (LF or CR LF), found a lone CR";
  if (c < 0x20 || c == 0x7F) return "expected text, found control character U+" + Hex(c, 4);
  return "expected UTF-8 text, found byte 0x" + Hex(c, 2) + " (convert the file to UTF-8)";
}

[[noreturn]] void Reject(std::string_view text, std::size_t bad, std::size_t line_start, int line,
                         const std::string& file) {
  Diagnostic d;
  d.where.file = file;
  d.where.line = line;
  const std::string_view prefix = text.substr(line_start, bad - line_start);
  ColumnCounter counter(prefix);
  d.where.column = counter.At(prefix.size());
  // Binary junk can make one very long "line": then only the position is given.
  if (prefix.size() <= kShownBytes) {
    d.where.line_text = std::string(prefix) + "\xEF\xBF\xBD";  // U+FFFD stands for the bad byte
  }
  d.message = Describe(static_cast<unsigned char>(text[bad]));
  throw InputError(d);
}

[[noreturn]] void TooLong(std::string_view text, std::size_t line_start, int line,
                          const std::string& file, std::size_t max_line_bytes) {
  Diagnostic d;
  d.where.file = file;
  d.where.line = line;
  d.where.column = 1;
  std::size_t end = text.find('\n', line_start);
  if (end == std::string_view::npos) end = text.size();
  // Only the start is echoed (Render cuts it to a window anyway).
  d.where.line_text = std::string(text.substr(line_start, std::min(end - line_start, kShownBytes)));
  d.message = "expected a line of at most " + std::to_string(max_line_bytes) +
              " bytes, found one of " + std::to_string(end - line_start) +
              " (raise the limit with --max-line-kb)";
  throw InputError(d);
}

}  // namespace

int ColumnCounter::At(std::size_t offset) {
  if (offset < offset_) {
    offset_ = 0;
    column_ = 1;
  }
  for (; offset_ < offset && offset_ < line_.size(); ++offset_) {
    if ((static_cast<unsigned char>(line_[offset_]) & 0xC0) != 0x80) ++column_;
  }
  if (offset > offset_) column_ += static_cast<int>(offset - offset_), offset_ = offset;
  return column_;
}

std::size_t CheckText(std::string_view text, const std::string& file, std::size_t max_line_bytes) {
  int line = 1;
  std::size_t line_start = 0;
  const std::size_t n = text.size();
  for (std::size_t i = 0; i < n;) {
    const auto c = static_cast<unsigned char>(text[i]);
    if (c >= 0x20 && c < 0x7F) {
      ++i;
      continue;
    }
    if (c == '\n') {
      if (i - line_start > max_line_bytes) TooLong(text, line_start, line, file, max_line_bytes);
      ++line;
      line_start = ++i;
      continue;
    }
    if (c == '\t' || (c == '\r' && i + 1 < n && text[i + 1] == '\n')) {
      ++i;
      continue;
    }
    const std::size_t len = c >= 0x80 ? ValidSequence(text, i) : 0;
    if (len == 0) Reject(text, i, line_start, line, file);
    i += len;
  }
  if (n - line_start > max_line_bytes) TooLong(text, line_start, line, file, max_line_bytes);
  return static_cast<std::size_t>(line - 1);
}

}  // namespace apograph::transcription
