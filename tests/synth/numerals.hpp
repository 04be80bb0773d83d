#pragma once
/// How a hand writes one place of a number, and which symbols it confuses.
///
/// The confusion tables here are the generator's own, written from the
/// shapes of letters and digits (each pair marked "judgement" or "from
/// memory"), independently of the numeral scripts the explainer reads
/// (corpora/scripts/), so that a benchmark does not grade the explainer
/// with its own lists.

#include <optional>
#include <string>
#include <vector>

namespace apograph::synth {

enum class Script {
  kHinduArabic,  ///< manuscript digits (Western and Eastern forms)
  kGreek,        ///< alphabetic, Greek letter order (zero sign ō)
  kHebrew,       ///< alphabetic, Hebrew letter order (15 and 16 as 9+6, 9+7)
  kArabicAbjad,  ///< alphabetic, Arabic abjad order
  kRoman,        ///< additive Roman numerals (iiii, viiii, xxxx)
  kPrinted,      ///< typeset Hindu-Arabic digits
};

enum class HandKind {
  kManuscript,  ///< a scribe: the script's look-alike letters or digits
  kPrint,       ///< a compositor: type and typesetting slips
  kDigitised,   ///< text recognition of a printed page
};

/// A hand: who writes, in which numeral script.
struct Hand {
  HandKind kind = HandKind::kManuscript;
  Script script = Script::kHinduArabic;
  bool operator==(const Hand&) const = default;
};

/// "hindu-arabic", "greek", "hebrew", "arabic-abjad", "roman", "printed".
const char* ScriptName(Script script);
std::optional<Script> ScriptFromName(const std::string& name);
/// The script's name as apograph's witnesses declare it (`script=`): the
/// files of corpora/scripts/ ("greek-alphabetic", ...). Printed digits are
/// declared `hindu-arabic` until apograph has a printed script.
const char* ApographScriptName(Script script);
/// "manuscript", "print", "digitised".
const char* HandKindName(HandKind kind);

/// One look-alike pair: `from` may be written as `to` (glyph strings).
struct Confusion {
  std::string from, to;
  double weight = 1;
  const char* basis = "judgement";  ///< "judgement" or "from memory"
};

/// A non-negative number (a place 0..59, or an integer part; alphabetic
/// scripts up to 999) as the script writes it: "23", "κγ", "כג", "xxiii".
std::string WriteNumber(Script script, int value);
/// The value a reader takes from written glyphs (alphabetic and Roman:
/// the sum of the letters), or nothing if a glyph is not the script's.
std::optional<int> ReadNumber(Script script, const std::string& written);
/// Every glyph of the script (for slips outside the look-alike lists).
const std::vector<std::string>& Glyphs(Script script);
/// The glyphs of a written number, in order.
std::vector<std::string> SplitGlyphs(Script script, const std::string& written);
/// The look-alike list of a hand (both directions listed).
const std::vector<Confusion>& Confusions(const Hand& hand);
/// Whether from -> to is in the hand's list.
bool Listed(const Hand& hand, const std::string& from, const std::string& to);

}  // namespace apograph::synth
