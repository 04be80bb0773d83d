// Shared helpers of the transcription parsers (no Spirit here).
#include "transcription/syntax.hpp"

namespace apograph::transcription {
namespace {

std::size_t SequenceLength(unsigned char c) {
  if (c >= 0xF0) return 4;
  if (c >= 0xE0) return 3;
  if (c >= 0xC0) return 2;
  return 1;
}

}  // namespace

std::string FoundChar(std::string_view line, std::size_t offset) {
  if (offset >= line.size()) return "end of line";
  const std::size_t len = SequenceLength(static_cast<unsigned char>(line[offset]));
  return "'" + std::string(line.substr(offset, len)) + "'";
}

std::string FoundToken(std::string_view line, std::size_t offset) {
  if (offset >= line.size()) return "end of line";
  std::size_t end = offset;
  while (end < line.size() &&
         std::string_view(" \t|{}#=").find(line[end]) == std::string_view::npos) {
    ++end;
  }
  if (end == offset) return FoundChar(line, offset);
  constexpr std::size_t kLongest = 40;
  if (end - offset > kLongest) {
    std::size_t cut = kLongest;
    while (cut > 0 && (static_cast<unsigned char>(line[offset + cut]) & 0xC0) == 0x80) --cut;
    return "'" + std::string(line.substr(offset, cut)) + "...'";
  }
  return "'" + std::string(line.substr(offset, end - offset)) + "'";
}

}  // namespace apograph::transcription
