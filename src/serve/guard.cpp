#include "serve/guard.hpp"

#include <cctype>
#include <cstdio>
#include <random>

namespace apograph::serve {
namespace {

int HexValue(char c) {
  if (c >= '0' && c <= '9') return c - '0';
  c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return c >= 'a' && c <= 'f' ? c - 'a' + 10 : -1;
}

bool PathChar(char c) {
  return std::isalnum(static_cast<unsigned char>(c)) || c == '-' || c == '/' || c == '_';
}

}  // namespace

std::string NewToken() {
  std::random_device device;  // the system's entropy source on Linux
  std::string token;
  char buf[9];
  for (int i = 0; i < 4; ++i) {
    std::snprintf(buf, sizeof buf, "%08x", static_cast<unsigned>(device()));
    token += buf;
  }
  return token;
}

bool TokenMatches(std::string_view expected, std::string_view given) {
  if (expected.empty() || given.size() != expected.size()) return false;
  unsigned char diff = 0;
  for (std::size_t i = 0; i < expected.size(); ++i)
    diff |= static_cast<unsigned char>(expected[i] ^ given[i]);
  return diff == 0;
}

bool SafeTarget(std::string_view target) {
  const std::string_view path = target.substr(0, target.find('?'));
  if (path.empty() || path.front() != '/' || path.find("//") != std::string_view::npos)
    return false;
  for (char c : path)
    if (!PathChar(c)) return false;
  // The query may hold any text, but never an encoded separator or NUL
  // that a later decoding could turn into a path.
  const std::string decoded = UrlDecode(target);
  return decoded.find("..") == std::string::npos && decoded.find('\\') == std::string::npos &&
         decoded.find('\0') == std::string::npos;
}

std::string UrlDecode(std::string_view text) {
  std::string out;
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (c == '+') {
      out += ' ';
    } else if (c == '%' && i + 2 < text.size() && HexValue(text[i + 1]) >= 0 &&
               HexValue(text[i + 2]) >= 0) {
      out += static_cast<char>(HexValue(text[i + 1]) * 16 + HexValue(text[i + 2]));
      i += 2;
    } else {
      out += c;
    }
  }
  return out;
}

std::string UrlEncode(std::string_view text) {
  std::string out;
  char buf[4];
  for (char c : text) {
    if (std::isalnum(static_cast<unsigned char>(c)) || c == '-' || c == '_' || c == '.' ||
        c == '~') {
      out += c;
    } else {
      std::snprintf(buf, sizeof buf, "%%%02X", static_cast<unsigned char>(c));
      out += buf;
    }
  }
  return out;
}

std::map<std::string, std::string> ParseForm(std::string_view text) {
  std::map<std::string, std::string> out;
  while (!text.empty()) {
    const std::size_t amp = text.find('&');
    const std::string_view pair = text.substr(0, amp);
    const std::size_t eq = pair.find('=');
    out[UrlDecode(pair.substr(0, eq))] =
        eq == std::string_view::npos ? "" : UrlDecode(pair.substr(eq + 1));
    if (amp == std::string_view::npos) break;
    text.remove_prefix(amp + 1);
  }
  return out;
}

bool IsLoopback(std::string_view host) {
  return host == "127.0.0.1" || host == "::1" || host == "localhost";
}

}  // namespace apograph::serve
