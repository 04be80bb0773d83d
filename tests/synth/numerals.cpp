// Numeral scripts and look-alike lists of the generator (see numerals.hpp).
// Weights are relative within a hand (judgement: how readily the shapes
// are taken for each other).
#include "numerals.hpp"

#include <array>
#include <stdexcept>

namespace apograph::synth {
namespace {

using Glyphs9 = std::array<const char*, 9>;

struct Alphabet {
  Glyphs9 units, tens, hundreds;
  const char* zero;
};

const Alphabet kGreek = {{"α", "β", "γ", "δ", "ε", "ϛ", "ζ", "η", "θ"},
                         {"ι", "κ", "λ", "μ", "ν", "ξ", "ο", "π", "ϙ"},
                         {"ρ", "σ", "τ", "υ", "φ", "χ", "ψ", "ω", "ϡ"},
                         "ō"};
// Hebrew 500-900 are written with ת plus the rest (WriteAlphabetic).
const Alphabet kHebrew = {{"א", "ב", "ג", "ד", "ה", "ו", "ז", "ח", "ט"},
                          {"י", "כ", "ל", "מ", "נ", "ס", "ע", "פ", "צ"},
                          {"ק", "ר", "ש", "ת", "", "", "", "", ""},
                          "0"};
const Alphabet kAbjad = {{"ا", "ب", "ج", "د", "ه", "و", "ز", "ح", "ط"},
                         {"ي", "ك", "ل", "م", "ن", "س", "ع", "ف", "ص"},
                         {"ق", "ر", "ش", "ت", "ث", "خ", "ذ", "ض", "ظ"},
                         "0"};

const Alphabet* AlphabetOf(Script s) {
  switch (s) {
    case Script::kGreek:
      return &kGreek;
    case Script::kHebrew:
      return &kHebrew;
    case Script::kArabicAbjad:
      return &kAbjad;
    default:
      return nullptr;
  }
}

std::string Hundreds(const Alphabet& a, int h) {
  if (h == 0) return "";
  if (*a.hundreds[static_cast<std::size_t>(h - 1)])
    return a.hundreds[static_cast<std::size_t>(h - 1)];
  return std::string(a.hundreds[3]) + Hundreds(a, h - 4);  // Hebrew: 500 = 400 + 100
}

std::string WriteAlphabetic(Script s, const Alphabet& a, int v) {
  if (v == 0) return a.zero;
  std::string out = Hundreds(a, v / 100);
  const int rest = v % 100;
  if (s == Script::kHebrew && (rest == 15 || rest == 16)) {  // from memory: 9+6, 9+7
    return out + a.units[8] + a.units[static_cast<std::size_t>(rest - 10)];
  }
  if (rest / 10) out += a.tens[static_cast<std::size_t>(rest / 10 - 1)];
  if (rest % 10) out += a.units[static_cast<std::size_t>(rest % 10 - 1)];
  return out;
}

std::string WriteRoman(int v) {
  if (v == 0) return "0";
  std::string out;
  for (const auto& [value, glyph] : std::array<std::pair<int, const char*>, 5>{
           {{100, "c"}, {50, "l"}, {10, "x"}, {5, "v"}, {1, "i"}}}) {
    for (; v >= value; v -= value) out += glyph;
  }
  return out;
}

std::optional<int> GlyphValue(Script s, const std::string& g) {
  if (s == Script::kHinduArabic || s == Script::kPrinted) {
    if (g.size() == 1 && g[0] >= '0' && g[0] <= '9') return g[0] - '0';
    return std::nullopt;
  }
  if (s == Script::kRoman) {
    for (const auto& [glyph, value] : std::array<std::pair<const char*, int>, 6>{
             {{"0", 0}, {"i", 1}, {"v", 5}, {"x", 10}, {"l", 50}, {"c", 100}}}) {
      if (g == glyph) return value;
    }
    return std::nullopt;
  }
  const Alphabet& a = *AlphabetOf(s);
  if (g == a.zero) return 0;
  for (int i = 0; i < 9; ++i) {
    if (g == a.units[static_cast<std::size_t>(i)]) return i + 1;
    if (g == a.tens[static_cast<std::size_t>(i)]) return 10 * (i + 1);
    if (*a.hundreds[static_cast<std::size_t>(i)] && g == a.hundreds[static_cast<std::size_t>(i)])
      return 100 * (i + 1);
  }
  return std::nullopt;
}

void Both(std::vector<Confusion>& out, const char* a, const char* b, double w, const char* basis) {
  out.push_back({a, b, w, basis});
  out.push_back({b, a, w, basis});
}

std::vector<Confusion> ManuscriptDigits() {
  std::vector<Confusion> c;
  Both(c, "1", "7", 1, "judgement");    // a 7 with a short bar
  Both(c, "2", "3", 1, "from memory");  // Eastern forms differ by one tooth
  Both(c, "7", "8", 1, "from memory");  // Eastern forms: a V and an inverted V
  Both(c, "4", "5", 0.7, "judgement");  // Western hooked forms
  Both(c, "4", "8", 0.5, "judgement");  // the looped Western 4
  Both(c, "0", "5", 0.5, "judgement");  // Eastern dot zero and ring five
  Both(c, "6", "0", 0.5, "judgement");
  Both(c, "9", "0", 0.3, "judgement");
  return c;
}

std::vector<Confusion> TypeSlips() {
  std::vector<Confusion> c;
  Both(c, "6", "9", 1.5, "from memory");  // a turned sort
  Both(c, "3", "8", 0.8, "judgement");    // worn or broken type
  Both(c, "5", "6", 0.5, "judgement");
  for (const char* pair : {"12", "23", "45", "78", "89"}) {  // neighbouring compartments
    const std::string a(1, pair[0]), b(1, pair[1]);
    c.push_back({a, b, 0.3, "judgement"});
    c.push_back({b, a, 0.3, "judgement"});
  }
  return c;
}

std::vector<Confusion> RecognitionErrors() {
  std::vector<Confusion> c;
  Both(c, "1", "7", 1.2, "from memory");
  Both(c, "3", "8", 1.2, "from memory");
  Both(c, "5", "6", 1, "from memory");
  Both(c, "0", "6", 0.8, "from memory");
  Both(c, "0", "9", 0.8, "from memory");
  Both(c, "8", "0", 0.4, "judgement");
  Both(c, "4", "1", 0.3, "judgement");
  Both(c, "2", "7", 0.3, "judgement");
  return c;
}

std::vector<Confusion> GreekLetters() {
  std::vector<Confusion> c;
  Both(c, "α", "λ", 1, "from memory");  // uncial: the crossbar
  Both(c, "δ", "λ", 1, "from memory");  // uncial: the base stroke
  Both(c, "α", "δ", 0.8, "judgement");  // minuscule bowls
  Both(c, "ε", "θ", 0.8, "judgement");  // round letters with a bar
  Both(c, "μ", "ν", 0.8, "judgement");
  Both(c, "η", "κ", 0.6, "judgement");
  Both(c, "ι", "γ", 0.5, "judgement");
  Both(c, "β", "κ", 0.4, "judgement");
  Both(c, "ζ", "ξ", 0.4, "from memory");
  Both(c, "γ", "τ", 0.3, "judgement");
  Both(c, "ō", "ο", 0.5, "judgement");  // the zero sign and omicron
  return c;
}

std::vector<Confusion> HebrewLetters() {
  std::vector<Confusion> c;
  Both(c, "ב", "כ", 1, "from memory");
  Both(c, "ד", "ר", 1, "from memory");
  Both(c, "ה", "ח", 1, "from memory");
  Both(c, "ו", "ז", 1, "from memory");
  Both(c, "ו", "י", 0.8, "from memory");
  Both(c, "ח", "ת", 0.6, "from memory");
  Both(c, "ג", "נ", 0.5, "judgement");
  Both(c, "ט", "מ", 0.4, "judgement");
  Both(c, "כ", "נ", 0.4, "judgement");
  Both(c, "ה", "ת", 0.4, "judgement");
  return c;
}

std::vector<Confusion> AbjadLetters() {  // letters that differ by their dots
  std::vector<Confusion> c;
  Both(c, "ب", "ن", 1, "from memory");
  Both(c, "ب", "ي", 1, "from memory");
  Both(c, "ن", "ي", 1, "from memory");
  Both(c, "ج", "ح", 1, "from memory");
  Both(c, "ر", "ز", 1, "from memory");
  Both(c, "ب", "ت", 0.7, "from memory");
  Both(c, "ت", "ث", 0.7, "from memory");
  Both(c, "ح", "خ", 0.7, "from memory");
  Both(c, "د", "ذ", 0.6, "from memory");
  Both(c, "س", "ش", 0.6, "from memory");
  Both(c, "ف", "ق", 0.6, "from memory");
  Both(c, "ط", "ظ", 0.5, "from memory");
  Both(c, "ص", "ض", 0.5, "from memory");
  Both(c, "ه", "و", 0.4, "judgement");
  Both(c, "ك", "ل", 0.4, "judgement");
  return c;
}

std::vector<Confusion> RomanLetters() {
  std::vector<Confusion> c;
  c.push_back({"i", "ii", 1, "judgement"});  // a minim added
  c.push_back({"ii", "i", 1, "judgement"});  // a minim lost
  Both(c, "v", "x", 0.5, "judgement");
  Both(c, "l", "i", 0.3, "judgement");  // a tall minim
  return c;
}

}  // namespace

const char* ScriptName(Script s) {
  switch (s) {
    case Script::kHinduArabic:
      return "hindu-arabic";
    case Script::kGreek:
      return "greek";
    case Script::kHebrew:
      return "hebrew";
    case Script::kArabicAbjad:
      return "arabic-abjad";
    case Script::kRoman:
      return "roman";
    case Script::kPrinted:
      return "printed";
  }
  return "";
}

std::optional<Script> ScriptFromName(const std::string& name) {
  for (Script s : {Script::kHinduArabic, Script::kGreek, Script::kHebrew, Script::kArabicAbjad,
                   Script::kRoman, Script::kPrinted}) {
    if (name == ScriptName(s)) return s;
  }
  return std::nullopt;
}

const char* ApographScriptName(Script s) {
  switch (s) {
    case Script::kGreek:
      return "greek-alphabetic";
    case Script::kHebrew:
      return "hebrew-alphabetic";
    case Script::kArabicAbjad:
      return "arabic-abjad";
    case Script::kRoman:
      return "roman";
    default:
      return "hindu-arabic";
  }
}

const char* HandKindName(HandKind k) {
  switch (k) {
    case HandKind::kManuscript:
      return "manuscript";
    case HandKind::kPrint:
      return "print";
    case HandKind::kDigitised:
      return "digitised";
  }
  return "";
}

std::string WriteNumber(Script s, int value) {
  if (value < 0) throw std::logic_error("WriteNumber: negative");
  if (const Alphabet* a = AlphabetOf(s)) {
    if (value > 999) throw std::logic_error("WriteNumber: alphabetic numbers up to 999");
    return WriteAlphabetic(s, *a, value);
  }
  if (s == Script::kRoman) return WriteRoman(value);
  return std::to_string(value);
}

std::vector<std::string> SplitGlyphs(Script, const std::string& written) {
  std::vector<std::string> out;
  for (std::size_t i = 0; i < written.size();) {
    const auto c = static_cast<unsigned char>(written[i]);
    const std::size_t n = c < 0x80 ? 1 : c < 0xE0 ? 2 : c < 0xF0 ? 3 : 4;
    out.push_back(written.substr(i, n));
    i += n;
  }
  return out;
}

std::optional<int> ReadNumber(Script s, const std::string& written) {
  const auto glyphs = SplitGlyphs(s, written);
  if (glyphs.empty()) return std::nullopt;
  const bool digits = s == Script::kHinduArabic || s == Script::kPrinted;
  int v = 0;
  for (const auto& g : glyphs) {
    const auto x = GlyphValue(s, g);
    if (!x) return std::nullopt;
    v = digits ? 10 * v + *x : v + *x;
  }
  return v;
}

const std::vector<std::string>& Glyphs(Script s) {
  static const auto kTables = [] {
    std::array<std::vector<std::string>, 6> t;
    for (int d = 0; d <= 9; ++d) t[0].push_back(std::to_string(d));
    t[5] = t[0];
    for (const char* g : {"0", "i", "v", "x", "l", "c"}) t[4].push_back(g);
    const Alphabet* alphabets[] = {&kGreek, &kHebrew, &kAbjad};
    for (int k = 0; k < 3; ++k) {
      auto& out = t[static_cast<std::size_t>(k + 1)];
      out.push_back(alphabets[k]->zero);
      for (const auto* list :
           {&alphabets[k]->units, &alphabets[k]->tens, &alphabets[k]->hundreds}) {
        for (const char* g : *list) {
          if (*g) out.push_back(g);
        }
      }
    }
    return t;
  }();
  return kTables[static_cast<std::size_t>(s)];
}

const std::vector<Confusion>& Confusions(const Hand& hand) {
  static const auto kManuscript = ManuscriptDigits();
  static const auto kType = TypeSlips();
  static const auto kRecognition = RecognitionErrors();
  static const auto kGreekList = GreekLetters();
  static const auto kHebrewList = HebrewLetters();
  static const auto kAbjadList = AbjadLetters();
  static const auto kRomanList = RomanLetters();
  if (hand.kind == HandKind::kDigitised) return kRecognition;
  switch (hand.script) {
    case Script::kGreek:
      return kGreekList;
    case Script::kHebrew:
      return kHebrewList;
    case Script::kArabicAbjad:
      return kAbjadList;
    case Script::kRoman:
      return kRomanList;
    case Script::kPrinted:
      return kType;
    case Script::kHinduArabic:
      return hand.kind == HandKind::kPrint ? kType : kManuscript;
  }
  return kManuscript;
}

bool Listed(const Hand& hand, const std::string& from, const std::string& to) {
  for (const auto& c : Confusions(hand)) {
    if (c.from == from && c.to == to) return true;
  }
  return false;
}

}  // namespace apograph::synth
