#pragma once
/// Numeral scripts as data: how a witness writes a number, and which of its
/// symbols a copyist easily confuses.
///
/// A script is read from a small line-based file under corpora/scripts/
/// (format documented at the top of every shipped file and in
/// ParseNumeralScript below). The deviation stage asks a script two things:
/// how a place (0..59, or an integer part up to 999) is written, and which
/// other readings a copyist reaches from a written place by one or two
/// confusions, each with a weight in (0, 1].

#include <map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "edition/transcription.hpp"

namespace apograph::deviation {

/// How the symbols of a place combine.
enum class Writing {
  kPositional,  ///< base-ten digits: 43 is "4" "3" (Hindu-Arabic)
  kAdditive,    ///< a hundreds, a tens and a units symbol summed: 43 = 40 + 3
  kRoman,       ///< Roman numerals with subtraction: 44 = XLIV
};

/// Where a confusion's weight comes from, stated in every explanation.
enum class ConfusionSource { kCommonPractice, kFromMemory };

const char* ToString(ConfusionSource source);  // "common practice" / "from memory"

/// "`written` stands in the copy where `intended` was meant". An empty
/// string is "nothing": a symbol dropped (written empty) or added (intended
/// empty).
struct Confusion {
  std::string intended;
  std::string written;
  double weight = 0;
  ConfusionSource source = ConfusionSource::kFromMemory;
  int line = 0;  ///< line in the script file, for the editor who wants to change it
};

/// One symbol changed in a written place.
struct ConfusionStep {
  std::string intended;  ///< the symbol of the original ("" when the copy added one)
  std::string written;   ///< the symbol in the copy ("" when the copy dropped one)
  double weight = 0;
  ConfusionSource source = ConfusionSource::kFromMemory;
};

/// A reading a copyist may have started from: the copy shows `copy`, the
/// original may have been `original`, via `steps`.
struct PlaceVariant {
  int original = 0;
  double weight = 0;  ///< product of the steps' weights
  std::vector<ConfusionStep> steps;
};

class NumeralScript {
 public:
  const std::string& name() const { return name_; }
  const std::string& title() const { return title_; }
  Writing writing() const { return writing_; }
  const std::vector<Confusion>& confusions() const { return confusions_; }
  const std::string& file() const { return file_; }

  /// The symbols that write `value` (0..MaxWritten()), most significant
  /// first; a zero is the script's zero sign. Example (greek-alphabetic):
  /// 43 -> {"μ", "γ"}; (hindu-arabic) 3141 -> {"3", "1", "4", "1"}.
  std::vector<std::string> Write(int value) const;
  /// The largest value Write takes: 999 (how the script writes thousands is
  /// not in its file), but a positional script writes any whole part digit by
  /// digit (a sine to a radius of 3438 reads "3141"), up to 99,999.
  int MaxWritten() const;
  /// The symbols joined: 43 -> "μγ".
  std::string WriteText(int value) const;
  /// The value of a written place, when it is a regular writing of one.
  std::optional<int> Read(const std::vector<std::string>& symbols) const;
  /// Every regular way of writing `value`: Write(value), and for Roman
  /// numerals also the additive form many hands use (19 as XVIIII beside
  /// XIX).
  std::vector<std::vector<std::string>> Writings(int value) const;
  /// The value a reader takes from any sequence of the script's symbols,
  /// regular or not: digits read positionally, letters summed, Roman symbols
  /// summed with a smaller one before a larger one subtracted. So a slip that
  /// leaves an irregular writing is still read (Hebrew כח 28 with its כ read
  /// as ב gives בח, read 10). nullopt for an unknown symbol or nothing.
  std::optional<int> ValueOf(const std::vector<std::string>& symbols) const;
  /// The symbols' values summed (how some readers take an irregular Roman
  /// writing such as "ic" for 101); nullopt for an unknown symbol, nothing, or
  /// a positional script.
  std::optional<int> SumOf(const std::vector<std::string>& symbols) const;
  /// Every symbol of the script (the zero sign included).
  std::vector<std::string> Glyphs() const;

  /// The originals from which a copy reading `copy` is reached by one (or, with
  /// max_steps = 2, two) confusions, with values in [0, limit). Each original
  /// appears once, with its most likely path; sorted by weight, highest first.
  /// Example (hindu-arabic): copy 41 -> original 44 via 4 read as 1 if the file
  /// lists that confusion.
  std::vector<PlaceVariant> OriginalsOf(int copy, int limit, int max_steps = 1) const;

  /// The weight of the listed confusion writing `written` where `intended`
  /// was meant (either may be "" for a dropped or added symbol); 0 when the
  /// script does not list it.
  double ListedWeight(const std::string& intended, const std::string& written) const;
  /// The mean, over the script's symbols, of the total weight of the
  /// confusions that start from a symbol: what a listed confusion's weight is
  /// measured against when its likelihood is computed.
  double MeanConfusionWeight() const;
  /// How many symbols may stand in one slot of a written place (every
  /// symbol of the script): a slip outside the lists is one of
  /// `SlotSize() - 1` wrong symbols.
  int SlotSize() const;

 private:
  friend NumeralScript ParseNumeralScript(std::string_view, const std::string&);
  void BuildReadings();
  std::vector<std::vector<std::string>> Neighbours(const std::vector<std::string>& symbols,
                                                   std::vector<ConfusionStep>& steps_out) const;

  struct Symbol {
    std::string glyph;
    int value = 0;
  };
  std::string name_;
  std::string title_;
  std::string file_;
  Writing writing_ = Writing::kPositional;
  std::string zero_;
  std::vector<Symbol> symbols_;
  std::vector<std::pair<int, std::vector<std::string>>> specials_;
  std::vector<Confusion> confusions_;
  std::vector<std::vector<std::string>> writings_;    // index = value, 0..999
  std::map<std::vector<std::string>, int> readings_;  // the inverse of writings_
};

/// Parses a script file's text; throws InputError positioned at the bad token
/// (`FILE:LINE:COL: error: expected ..., found ...`).
///
/// Format, one statement per line, `#` starts a comment, tokens separated by
/// blanks:
///
///     script NAME                       name witnesses use (= file name)
///     title TEXT...                     readable name
///     writing positional|additive|roman how symbols combine in a place
///     symbol GLYPH VALUE [NAME...]      a symbol and its value
///     zero GLYPH                        the sign written for an empty place
///     special VALUE GLYPH...            an irregular writing (Hebrew 15 = ט ו)
///     confuse A B WEIGHT SOURCE [one-way]
///         A and B are easily confused (B written for A and, unless one-way,
///         A for B); `-` as A or B is "no symbol" (dropped or added);
///         WEIGHT in (0, 1]; SOURCE is common-practice or from-memory.
NumeralScript ParseNumeralScript(std::string_view text, const std::string& file);

/// Reads a script file (InputError when unreadable or malformed).
NumeralScript LoadNumeralScript(const std::string& path);

/// The folder searched for scripts: $APOGRAPH_SCRIPTS when set, else the
/// corpora/scripts folder of the source tree this binary was built from.
std::string DefaultScriptDir();

/// Loads `<dir>/<name>.script`; an empty name means hindu-arabic. InputError
/// names the option `--scripts`/the witness's script when the file is missing.
NumeralScript FindNumeralScript(const std::string& name,
                                const std::string& dir = DefaultScriptDir());

/// The script a witness's slips are read in: the one it declares; but a
/// print or a modern edition that declares Hindu-Arabic digits, or nothing,
/// is read in `printed` (a typesetter's and a recognition program's slips
/// are not a scribe's); a manuscript that declares nothing, in hindu-arabic.
/// Example: {kind "print", script ""} -> "printed".
std::string ScriptNameFor(const WitnessInfo& witness);

/// FindNumeralScript(ScriptNameFor(witness), dir).
NumeralScript FindWitnessScript(const WitnessInfo& witness,
                                const std::string& dir = DefaultScriptDir());

}  // namespace apograph::deviation
