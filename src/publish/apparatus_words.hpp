#pragma once
// Internal to src/publish/: the words of the apparatus (why a lemma was
// preferred, what caused each error, the editorial marks), shared by the
// lemma choice and every format, so that TEI, LaTeX, CSV and text say the
// same thing.

#include <string>
#include <vector>

#include "publish/apparatus.hpp"

namespace apograph::publish::internal {

/// A slip class in plain words ("digits transposed"); the class itself when unknown.
std::string CauseWords(const std::string& cause);

std::string EditorReason(LemmaSource source, const std::string& editor, const std::string& note);
std::string AcceptedReason(const collate::Reading& accepted, bool in_a_witness);
/// Why a reading that is not an error was preferred.
std::string RightReason(const collate::CollatedCell& cell, const std::vector<int>& votes,
                        int chosen);
/// Where every reading that can be read is an error. `restored`: the
/// lemma is the restoration.
std::string DeviatesReason(const collate::Collation& c, const collate::CollatedCell& cell,
                           bool restored);
/// A variant's cause in a few words.
std::string VariantWhy(const collate::Reading& r);

/// Adds the editorial marks of one witness's cell.
void AppendMarks(const std::string& siglum, const Cell& cell, std::vector<WitnessMark>& marks);

/// "A B C".
std::string Sigla(const std::vector<std::string>& sigla);
/// "conj.", "em.", "suppl." or "" after a lemma, as the trade marks them.
std::string LemmaMark(LemmaSource source);
/// The marks of the given witnesses as "A: in the margin; C: corrected from 2;0,59".
std::string MarksOf(const std::vector<WitnessMark>& marks, const std::vector<std::string>& sigla);
/// A witness in one line: library, shelfmark, folios of the table, date.
std::string WitnessLine(const WitnessInfo& w, const std::string& folios);
/// The key of a cell's note: "46" or "46 declination" when the table has several columns.
std::string NoteKey(const Apparatus& a, std::size_t row, std::size_t column);

/// One apparatus note in plain text: "lemma sigla mark (reason)] variant sigla (why); ...;
/// marks". `escape` is applied to every piece of text taken from the data.
std::string NoteBody(const ApparatusEntry& e, std::string (*escape)(const std::string&),
                     const std::string& italic_open, const std::string& italic_close);

}  // namespace apograph::publish::internal
