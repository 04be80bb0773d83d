#include "edition/names.hpp"

namespace apograph {
namespace {

bool IsAsciiWordChar(unsigned char c) {
  return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9');
}

}  // namespace

bool IsSafeId(std::string_view id) {
  if (id.empty() || id.find("..") != std::string_view::npos) return false;
  const auto first = static_cast<unsigned char>(id[0]);
  if (!IsAsciiWordChar(first) && first < 0x80) return false;
  std::size_t characters = 0;
  for (const char ch : id) {
    const auto c = static_cast<unsigned char>(ch);
    if ((c & 0xC0) != 0x80) ++characters;
    if (c >= 0x80 || IsAsciiWordChar(c) || c == '-' || c == '_' || c == '.') continue;
    return false;
  }
  return characters <= kMaxIdCharacters;
}

}  // namespace apograph
