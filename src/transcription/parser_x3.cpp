// Directive lines, written with Spirit X3: `@keyword [id] {name=value}`.
// See grammar/transcription.ebnf, rules `directive` to `quoted`.
#include "transcription/syntax.hpp"

#include "transcription/x3_common.hpp"

namespace apograph::transcription {
namespace {

namespace x3 = boost::spirit::x3;
using x3g::Iterator;

const auto kKeyword = x3::lit('@') >> x3::raw[*x3::char_("a-zA-Z0-9")];
const auto kBare = x3::raw[+~x3::char_(" \t\"#{}|=")];

std::string Text(const boost::iterator_range<Iterator>& range) {
  return std::string(range.begin(), range.end());
}

/// The value after `name=`: quoted or bare.
std::string ParseValue(std::string_view line, std::size_t& pos, const std::string& name) {
  if (pos < line.size() && line[pos] == '"') return ParseQuoted(line, pos);
  boost::iterator_range<Iterator> bare;
  if (!x3g::Run(line, pos, kBare, bare)) {
    throw LineError{pos, "expected a value after '" + name + "=', found " + FoundChar(line, pos)};
  }
  return Text(bare);
}

/// One item after the keyword: an id or NAME=VALUE.
void ParseItem(std::string_view line, std::size_t& pos, DirectiveAst& directive) {
  boost::iterator_range<Iterator> token;
  const std::size_t start = pos;
  if (!x3g::Run(line, pos, kBare, token)) {
    throw LineError{pos, "expected an id or NAME=VALUE, found " + FoundChar(line, pos)};
  }
  if (pos < line.size() && line[pos] == '=') {
    AttributeAst attribute;
    attribute.name = Text(token);
    attribute.name_offset = start;
    ++pos;
    attribute.value_offset = pos;
    attribute.value = ParseValue(line, pos, attribute.name);
    directive.attributes.push_back(std::move(attribute));
    return;
  }
  if (!directive.id.empty() || !directive.attributes.empty()) {
    throw LineError{start, "expected NAME=VALUE, found " + FoundToken(line, start)};
  }
  directive.id = Text(token);
  directive.id_offset = start;
}

}  // namespace

DirectiveAst ParseDirective(std::string_view line, std::size_t offset) {
  DirectiveAst directive;
  directive.keyword_offset = offset;
  std::size_t pos = offset;
  boost::iterator_range<Iterator> keyword;
  x3g::Run(line, pos, kKeyword, keyword);
  directive.keyword = Text(keyword);
  if (directive.keyword.empty()) return directive;  // the driver reports '@' alone
  for (;;) {
    const std::size_t before = pos;
    while (pos < line.size() && IsBlank(line[pos])) ++pos;
    if (pos >= line.size() || line[pos] == '#') break;
    if (pos == before) {
      throw LineError{pos, "expected a blank, found " + FoundChar(line, pos)};
    }
    ParseItem(line, pos, directive);
  }
  directive.end_offset = pos;
  return directive;
}

}  // namespace apograph::transcription
