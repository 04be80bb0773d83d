#pragma once
/// Copying an exemplar's text with slips under a hand (a scribe writing one
/// numeral script, a compositor, a text-recognition program), every slip
/// recorded in the key with its row, column, class and the readings before
/// and after.
///
/// Example:
///
///     apograph::synth::Rng rng(7);
///     auto author = apograph::synth::DrawTable(rng, {});
///     apograph::synth::TableText exemplar = apograph::synth::FromAuthor(author);
///     std::vector<apograph::synth::Slip> slips;
///     apograph::synth::CopyOptions o;
///     o.rate = 0.1;
///     auto copy = apograph::synth::CopyTable(exemplar, {apograph::synth::HandKind::kManuscript,
///                                            apograph::synth::Script::kGreek}, o, rng, slips);

#include <map>
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "numerals.hpp"
#include "random.hpp"
#include "tables.hpp"

namespace apograph::synth {

/// Slip classes, in the generator's own terms.
enum class SlipClass {
  kLookAlike,           ///< a symbol written as its look-alike in the hand's list
  kOtherSymbol,         ///< a symbol replaced by any other (outside every list)
  kTransposition,       ///< two adjacent digits of a place, or two adjacent places, swapped
  kPlaceDropped,        ///< a place left out (written 0) or dropped with the rest moved up
  kPlaceAdded,          ///< a place written twice, pushing the following places down
  kPlaceShifted,        ///< the whole number moved one place (minutes copied as seconds)
  kRepetition,          ///< the entry of the row above or below repeated
  kEyeSkip,             ///< a run of a column displaced by one or two rows
  kConstantRun,         ///< the same error in one place over a run of rows
  kBlank,               ///< nothing written (`_`)
  kIllegible,           ///< written but unreadable (`?`)
  kPartlyIllegible,     ///< one place unreadable (`2;?,10`)
  kRowOmitted,          ///< a whole row left out
  kRowDuplicated,       ///< a row written twice
  kArgumentMiswritten,  ///< a symbol slip in the argument
  kLastPlace,           ///< one unit in the last place (prints and editions)
};
const char* SlipName(SlipClass slip);
std::vector<SlipClass> AllSlipClasses();

/// One slip, as the key records it.
struct Slip {
  SlipClass slip = SlipClass::kLookAlike;
  std::string table;    ///< table id
  int origin_row = 0;   ///< the archetype row the cell stands for
  std::string arg;      ///< that row's argument in the archetype
  std::string column;   ///< column name; "@argument" for the argument; "" for a whole row
  int copy_row = -1;    ///< row index in the copy's text (-1: the row was omitted)
  std::string before;   ///< reading in the exemplar (a row's text for row slips)
  std::string after;    ///< reading in the copy ("" for an omitted row)
  int run = -1;         ///< slips of one run (eye-skip, constant, systematic) share an id
  int place = -1;       ///< symbol and place slips: 0 = integer part, 1 = first fraction ...
  std::string pair;     ///< symbol slips: "γ/ε" as written (from/to)
  bool listed = false;  ///< symbol slips: the pair is in the hand's look-alike list
  std::string detail;   ///< a few words: "digits", "leading place left out", "shift +1" ...
};

/// A table's text with the archetype row each of its rows stands for.
struct TableText {
  Transcription text;
  std::vector<int> origin;  ///< per row of text
  std::vector<std::string>
      archetype_args;  ///< per archetype row: its argument as the author wrote it
};
/// The author's table as a text whose rows stand for themselves.
TableText FromAuthor(const AuthorTable& table);

/// Every proportion of one copy, with its default (see README.md).
struct CopyOptions {
  double rate = 0.03;  ///< share of entries corrupted by this copy (0 .. 0.5; real: up to 0.2)
  double share_outside_list = 0.25;  ///< symbol slips that replace any symbol
  double share_systematic = 0.35;    ///< place slips that come as a run over rows
  double share_run_at_start = 0.6;   ///< systematic runs that start at a column's first row
  int max_run = 8;                   ///< longest run (eye-skip, constant, systematic)
  /// Relative weights of the classes; empty: DefaultWeights(hand.kind).
  std::map<SlipClass, double> weights;
};

/// The default weights of the classes for a kind of hand (judgement:
/// scribes confuse symbols and slip between rows; compositors transpose and
/// misplace sorts; recognition confuses shapes and loses nothing else).
std::map<SlipClass, double> DefaultWeights(HandKind kind);

/// Copies `exemplar` under `hand`, adding slips at `options.rate`; appends
/// them to `slips` (table id from the text). With rate 0 the copy equals
/// the exemplar.
TableText CopyTable(const TableText& exemplar, const Hand& hand, const CopyOptions& options,
                    Rng& rng, std::vector<Slip>& slips);

}  // namespace apograph::synth
