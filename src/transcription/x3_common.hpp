#pragma once
// Internal to the Spirit X3 translation units of src/transcription (never
// include it elsewhere): shared rules and the conversion of X3's
// expectation failures into LineError.

#include <boost/spirit/home/x3.hpp>

#include <string>
#include <string_view>

#include "transcription/syntax.hpp"

namespace apograph::transcription::x3g {

namespace x3 = boost::spirit::x3;
using Iterator = std::string_view::const_iterator;

/// A quoted string: `"text with \" and \\"`; the attribute is unescaped.
inline const auto kEscaped = x3::rule<class escaped_id, char>{"\\\" or \\\\ after the backslash"} =
    x3::char_("\"\\");
inline const auto kClosingQuote = x3::rule<class closing_quote_id>{"a closing '\"'"} = x3::lit('"');
inline const auto kQuoted = x3::rule<class quoted_id, std::string>{"a quoted string"} =
    x3::lit('"') > *((x3::lit('\\') > kEscaped) | ~x3::char_("\"\\")) > kClosingQuote;

/// Runs `parser` at `pos`; on an expectation failure throws LineError
/// "expected WHAT, found X" at the failing position. Returns whether the
/// parser matched; `pos` advances on a match.
template <typename Parser, typename Attribute>
bool Run(std::string_view line, std::size_t& pos, const Parser& parser, Attribute& attribute) {
  Iterator first = line.begin() + static_cast<std::ptrdiff_t>(pos);
  try {
    if (!x3::parse(first, line.end(), parser, attribute)) return false;
  } catch (const x3::expectation_failure<Iterator>& failure) {
    const auto at = static_cast<std::size_t>(failure.where() - line.begin());
    throw LineError{at, "expected " + failure.which() + ", found " + FoundChar(line, at)};
  }
  pos = static_cast<std::size_t>(first - line.begin());
  return true;
}

template <typename Parser>
bool Run(std::string_view line, std::size_t& pos, const Parser& parser) {
  x3::unused_type unused;
  return Run(line, pos, parser, unused);
}

}  // namespace apograph::transcription::x3g
