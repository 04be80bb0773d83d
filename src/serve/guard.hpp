#pragma once
/// The security checks of `apograph serve`, kept apart from the HTTP
/// library so that they are tested on their own: a random token every
/// request must carry, request targets that cannot leave the served pages,
/// a bound on request bodies, and form decoding.

#include <cstddef>
#include <map>
#include <string>
#include <string_view>

namespace apograph::serve {

/// Request bodies above this are refused (a decision form is a few hundred
/// bytes; judgement).
inline constexpr std::size_t kMaxBody = 16 * 1024;

/// 32 hex digits from the system's random device (128 bits).
std::string NewToken();

/// Compares in time independent of where the strings differ; false for an
/// empty `given` or `expected`.
bool TokenMatches(std::string_view expected, std::string_view given);

/// True when the raw request target (path and query, still percent-encoded)
/// names one of the served pages safely: an absolute path of letters,
/// digits, '-' and '/', with no "..", no backslash, no encoded '/', '\\',
/// '.' or NUL anywhere in it.
bool SafeTarget(std::string_view target);

/// Decodes %XX and '+' (as a blank); an invalid escape is kept as written.
std::string UrlDecode(std::string_view text);

/// Percent-encodes everything but letters, digits and "-_.~".
std::string UrlEncode(std::string_view text);

/// "a=1&b=x+y" -> {a: 1, b: "x y"} (the last value of a repeated key).
std::map<std::string, std::string> ParseForm(std::string_view text);

/// True for 127.0.0.1, ::1 and localhost.
bool IsLoopback(std::string_view host);

}  // namespace apograph::serve
