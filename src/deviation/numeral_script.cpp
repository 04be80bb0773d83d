#include "deviation/numeral_script.hpp"

#include <algorithm>
#include <cstdlib>
#include <fstream>
#include <map>
#include <sstream>

#include "edition/names.hpp"
#include "support/data_dir.hpp"
#include "support/input_error.hpp"

namespace apograph::deviation {
namespace {

struct Token {
  std::string text;
  int column = 0;  // 1-based, in code points
};

std::vector<Token> Tokenize(const std::string& line) {
  std::vector<Token> out;
  int column = 0;
  bool in_token = false;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const auto c = static_cast<unsigned char>(line[i]);
    if ((c & 0xC0) != 0x80) ++column;
    if (c == '#' && !in_token) break;
    if (c == ' ' || c == '\t' || c == '\r') {
      in_token = false;
      continue;
    }
    if (!in_token) out.push_back({"", column});
    in_token = true;
    out.back().text += line[i];
  }
  return out;
}

class LineReader {
 public:
  LineReader(const std::string& file, int line, std::string text, std::vector<Token> tokens)
      : file_(file), line_(line), text_(std::move(text)), tokens_(std::move(tokens)) {}

  [[noreturn]] void Fail(std::size_t index, const std::string& expected) const {
    Diagnostic d;
    d.where = {file_, line_, 0, text_};
    if (index < tokens_.size()) {
      d.where.column = tokens_[index].column;
      d.message = ExpectedFound(expected, "'" + tokens_[index].text + "'");
    } else {
      d.where.column = static_cast<int>(DisplayColumnAfterEnd());
      d.message = ExpectedFound(expected, "end of line");
    }
    throw InputError(d);
  }
  const std::string& Word(std::size_t index, const std::string& expected) const {
    if (index >= tokens_.size()) Fail(index, expected);
    return tokens_[index].text;
  }
  int Integer(std::size_t index, int low, int high, const std::string& expected) const {
    const std::string& w = Word(index, expected);
    char* end = nullptr;
    const long v = std::strtol(w.c_str(), &end, 10);
    if (w.empty() || *end != '\0' || v < low || v > high) Fail(index, expected);
    return static_cast<int>(v);
  }
  double Weight(std::size_t index) const {
    const std::string expected = "a weight greater than 0 and at most 1";
    const std::string& w = Word(index, expected);
    char* end = nullptr;
    const double v = std::strtod(w.c_str(), &end);
    if (w.empty() || *end != '\0' || !(v > 0) || v > 1) Fail(index, expected);
    return v;
  }
  void NoMore(std::size_t index) const {
    if (index < tokens_.size()) Fail(index, "end of line");
  }
  std::size_t size() const { return tokens_.size(); }
  std::string Rest(std::size_t index) const {
    std::string out;
    for (std::size_t i = index; i < tokens_.size(); ++i)
      out += (out.empty() ? "" : " ") + tokens_[i].text;
    return out;
  }
  int line() const { return line_; }

 private:
  std::size_t DisplayColumnAfterEnd() const {
    std::size_t n = 0;
    for (unsigned char c : text_) n += (c & 0xC0) != 0x80;
    return n + 1;
  }
  std::string file_;
  int line_;
  std::string text_;
  std::vector<Token> tokens_;
};

}  // namespace

const char* ToString(ConfusionSource source) {
  return source == ConfusionSource::kCommonPractice ? "common practice" : "from memory";
}

// The parser fills the script's private fields (it is the script's friend).
namespace {

struct ScriptBuilder {
  std::string name, title, zero;
  std::optional<Writing> writing;
  std::vector<std::pair<std::string, int>> symbols;
  std::vector<std::pair<int, std::vector<std::string>>> specials;
  std::vector<Confusion> confusions;
};

std::string Unit(const std::string& token) { return token == "-" ? std::string() : token; }

void ParseConfusion(const LineReader& r, ScriptBuilder& b) {
  const std::string a = Unit(r.Word(1, "a symbol or '-'"));
  const std::string c = Unit(r.Word(2, "a symbol or '-'"));
  if (a.empty() && c.empty()) r.Fail(2, "a symbol (both sides cannot be '-')");
  const double w = r.Weight(3);
  const std::string& src = r.Word(4, "common-practice or from-memory");
  ConfusionSource source;
  if (src == "common-practice") {
    source = ConfusionSource::kCommonPractice;
  } else if (src == "from-memory") {
    source = ConfusionSource::kFromMemory;
  } else {
    r.Fail(4, "common-practice or from-memory");
  }
  bool one_way = false;
  if (r.size() > 5) {
    if (r.Word(5, "one-way or end of line") != "one-way") r.Fail(5, "one-way or end of line");
    one_way = true;
    r.NoMore(6);
  }
  b.confusions.push_back({a, c, w, source, r.line()});
  if (!one_way) b.confusions.push_back({c, a, w, source, r.line()});
}

void ParseLine(const LineReader& r, ScriptBuilder& b) {
  const std::string& k = r.Word(0, "a statement");
  if (k == "script") {
    b.name = r.Word(1, "a script name");
    r.NoMore(2);
  } else if (k == "title") {
    b.title = r.Rest(1);
  } else if (k == "writing") {
    const std::string& w = r.Word(1, "positional, additive or roman");
    if (w == "positional")
      b.writing = Writing::kPositional;
    else if (w == "additive")
      b.writing = Writing::kAdditive;
    else if (w == "roman")
      b.writing = Writing::kRoman;
    else
      r.Fail(1, "positional, additive or roman");
    r.NoMore(2);
  } else if (k == "symbol") {
    const std::string& g = r.Word(1, "a symbol");
    if (g == "-") r.Fail(1, "a symbol other than '-'");
    b.symbols.emplace_back(g, r.Integer(2, 0, 1000, "a value from 0 to 1000"));
  } else if (k == "zero") {
    b.zero = r.Word(1, "the zero sign");
    r.NoMore(2);
  } else if (k == "special") {
    const int v = r.Integer(1, 1, 999, "a value from 1 to 999");
    std::vector<std::string> glyphs;
    for (std::size_t i = 2; i < r.size(); ++i) glyphs.push_back(r.Word(i, "a symbol"));
    if (glyphs.empty()) r.Fail(2, "a symbol");
    b.specials.emplace_back(v, glyphs);
  } else if (k == "confuse") {
    ParseConfusion(r, b);
  } else {
    r.Fail(0, "script, title, writing, symbol, zero, special or confuse");
  }
}

}  // namespace

NumeralScript ParseNumeralScript(std::string_view text, const std::string& file) {
  ScriptBuilder b;
  std::istringstream in{std::string(text)};
  std::string line;
  int number = 0;
  std::vector<std::string> lines;
  while (std::getline(in, line)) {
    ++number;
    lines.push_back(line);
    auto tokens = Tokenize(line);
    if (tokens.empty()) continue;
    ParseLine(LineReader(file, number, line, std::move(tokens)), b);
  }
  auto whole = [&](const std::string& what) {
    return InputError::ForFile(file, ExpectedFound(what, "none"));
  };
  if (b.name.empty()) throw whole("a 'script NAME' line");
  if (!b.writing) throw whole("a 'writing' line");
  if (b.symbols.empty()) throw whole("'symbol' lines");
  NumeralScript s;
  s.name_ = b.name;
  s.title_ = b.title.empty() ? b.name : b.title;
  s.file_ = file;
  s.writing_ = *b.writing;
  s.zero_ = b.zero;
  for (auto& [g, v] : b.symbols) s.symbols_.push_back({g, v});
  s.specials_ = b.specials;
  s.confusions_ = b.confusions;
  s.BuildReadings();
  // Every symbol a confusion names must belong to the script.
  for (const auto& c : s.confusions_) {
    for (const std::string* g : {&c.intended, &c.written}) {
      if (g->empty() || *g == s.zero_) continue;
      const bool known = std::any_of(s.symbols_.begin(), s.symbols_.end(),
                                     [&](const auto& sym) { return sym.glyph == *g; });
      if (!known) {
        auto tokens = Tokenize(lines[static_cast<std::size_t>(c.line - 1)]);
        std::size_t at = tokens.size() > 2 && tokens[2].text == *g ? 2 : 1;
        LineReader(file, c.line, lines[static_cast<std::size_t>(c.line - 1)], tokens)
            .Fail(at, "a symbol declared by a 'symbol' line");
      }
    }
  }
  return s;
}

NumeralScript LoadNumeralScript(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError::ForFile(path, "cannot read the numeral script file");
  std::stringstream buffer;
  buffer << in.rdbuf();
  return ParseNumeralScript(buffer.str(), path);
}

std::string DefaultScriptDir() {
  if (const char* env = std::getenv("APOGRAPH_SCRIPTS"); env && *env) return env;
  return DataDir() + "/scripts";
}

NumeralScript FindNumeralScript(const std::string& name, const std::string& dir) {
  const std::string n = name.empty() ? "hindu-arabic" : name;
  if (!IsSafeId(n)) {  // a database written before import checked names: never leave `dir`
    throw InputError::ForFile(dir, "expected a numeral script name, found " + QuotedText(n));
  }
  const std::string path = dir + "/" + n + ".script";
  if (!std::ifstream(path)) {
    throw InputError::ForFile(
        path, "no numeral script '" + n + "' (scripts are files NAME.script in " + dir + ")");
  }
  return LoadNumeralScript(path);
}

std::string ScriptNameFor(const WitnessInfo& witness) {
  const bool printed = witness.Kind() != WitnessKind::kManuscript;
  if (printed && (witness.script.empty() || witness.script == "hindu-arabic")) return "printed";
  return witness.script.empty() ? "hindu-arabic" : witness.script;
}

NumeralScript FindWitnessScript(const WitnessInfo& witness, const std::string& dir) {
  return FindNumeralScript(ScriptNameFor(witness), dir);
}

}  // namespace apograph::deviation
