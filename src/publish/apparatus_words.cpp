#include "publish/apparatus_words.hpp"

#include <algorithm>

namespace apograph::publish::internal {
namespace {

std::string WithNote(std::string words, const std::string& note) {
  return note.empty() ? words : words + ": " + note;
}

bool IsValue(const collate::Reading& r) { return r.kind == collate::ReadingKind::kValue; }

}  // namespace

std::string CauseWords(const std::string& cause) {
  static const std::pair<const char*, const char*> kWords[] = {
      {"confusion", "look-alike symbols confused"},
      {"transposition", "digits transposed"},
      {"place", "a place omitted, added or moved"},
      {"displaced-run", "eye-skip: a neighbouring row's entry"},
      {"repetition", "a neighbouring entry repeated"},
      {"blank", "left blank"},
      {"illegible", "not legible"},
      {"computational", "the author's own value"},
      {"unexplained", "differs from recomputation, cause unexplained"},
      {"lone-departure", "a small slip of this witness alone"},
  };
  for (const auto& [name, words] : kWords) {
    if (cause == name) return words;
  }
  return cause;
}

std::string EditorReason(LemmaSource source, const std::string& editor, const std::string& note) {
  const std::string who = editor.empty() ? "the editor" : editor;
  switch (source) {
    case LemmaSource::kConjecture:
      return WithNote("conjecture of " + who, note);
    case LemmaSource::kEmendation:
      return WithNote("emended by " + who, note);
    default:
      return WithNote("adopted by " + who, note);
  }
}

std::string AcceptedReason(const collate::Reading& accepted, bool in_a_witness) {
  std::string out = in_a_witness ? "confirmed by " + accepted.editor +
                                       ", who accepted it as the "
                                       "emendation of " +
                                       Sigla(accepted.sigla) + "'s " + accepted.text
                                 : "emendation of " + Sigla(accepted.sigla) + "'s " +
                                       accepted.text + " accepted by " + accepted.editor;
  return out;
}

std::string RightReason(const collate::CollatedCell& cell, const std::vector<int>& votes,
                        int chosen) {
  const auto& r = cell.readings[static_cast<std::size_t>(chosen)];
  if (cell.basis == collate::Basis::kUndetermined) return "no model and no majority: undetermined";
  std::string out = r.why;
  if (out.empty() && cell.basis == collate::Basis::kMajority)
    out = "the reading of the majority of the witnesses";
  if (out.empty()) out = "not judged an error";
  for (std::size_t k = 0; k < cell.readings.size(); ++k) {
    const auto& other = cell.readings[k];
    if (static_cast<int>(k) == chosen || !other.Comparable() || other.error) continue;
    out += votes[k] < votes[static_cast<std::size_t>(chosen)]
               ? "; preferred to " + other.text + " as the reading of more independent branches"
               : "; preferred to " + other.text + " as the reading of more witnesses";
  }
  return out;
}

std::string DeviatesReason(const collate::Collation& c, const collate::CollatedCell& cell,
                           bool restored) {
  std::vector<std::string> legible;
  for (const auto& r : cell.readings) {
    if (r.Comparable()) legible.insert(legible.end(), r.sigla.begin(), r.sigla.end());
  }
  const std::string from = cell.computed ? " from recomputation" : "";
  std::string out = legible.size() == c.witnesses.size() ? "every witness deviates" + from
                                                         : "every witness that can be read here (" +
                                                               Sigla(legible) + ") deviates" + from;
  if (!restored) return out + "; no restoration differs from them";
  return out + ": restored by recomputation, a conjecture for the editor to confirm";
}

std::string VariantWhy(const collate::Reading& r) {
  if (!r.editor.empty() && !r.error && IsValue(r))
    return "kept by " + r.editor + ", who rejected the proposed emendation";
  std::string out;
  if (!r.cause.empty())
    out = CauseWords(r.cause);
  else if (r.kind == collate::ReadingKind::kOmitted)
    out = "the row is missing";
  else if (r.kind == collate::ReadingKind::kIllegible)
    out = "not legible";
  else if (r.kind == collate::ReadingKind::kPartial)
    out = "partly legible";
  else if (!r.editor.empty())
    return "set aside by " + r.editor;
  else if (!r.error && IsValue(r))
    out = "also not an error";
  else
    out = r.why;
  if (!r.editor.empty()) out += (out.empty() ? "" : "; ") + std::string("confirmed by ") + r.editor;
  return out;
}

void AppendMarks(const std::string& siglum, const Cell& cell, std::vector<WitnessMark>& marks) {
  if (cell.addition == Addition::kMargin) marks.push_back({siglum, "margin", "in the margin"});
  if (cell.addition == Addition::kInterlinear)
    marks.push_back({siglum, "interlinear", "written between the lines"});
  if (cell.corrected_from)
    marks.push_back({siglum, "correction", "corrected from " + *cell.corrected_from});
  if (cell.damaged) marks.push_back({siglum, "damaged", "the support is damaged"});
  if (cell.doubtful) marks.push_back({siglum, "doubtful", "the reading is doubtful"});
  if (!cell.note.empty()) marks.push_back({siglum, "note", cell.note});
}

std::string Sigla(const std::vector<std::string>& sigla) {
  std::string o;
  for (const auto& s : sigla) o += (o.empty() ? "" : " ") + s;
  return o;
}

std::string LemmaMark(LemmaSource source) {
  switch (source) {
    case LemmaSource::kConjecture:
    case LemmaSource::kRestored:
      return "conj.";
    case LemmaSource::kEmendation:
      return "em.";
    case LemmaSource::kSupplied:
      return "suppl.";
    default:
      return "";
  }
}

std::string MarksOf(const std::vector<WitnessMark>& marks, const std::vector<std::string>& sigla) {
  std::string out;
  for (const auto& m : marks) {
    if (!sigla.empty() && std::find(sigla.begin(), sigla.end(), m.siglum) == sigla.end()) continue;
    out += (out.empty() ? "" : "; ") + m.siglum + ": " + m.text;
  }
  return out;
}

std::string WitnessLine(const WitnessInfo& w, const std::string& folios) {
  std::string out;
  for (const auto* part : {&w.library, &w.shelfmark}) {
    if (!part->empty()) out += (out.empty() ? "" : ", ") + *part;
  }
  if (!folios.empty()) out += (out.empty() ? "" : ", ") + std::string("fols. ") + folios;
  if (!w.date.empty()) out += (out.empty() ? "" : " ") + std::string("(") + w.date + ")";
  return out;
}

std::string NoteKey(const Apparatus& a, std::size_t row, std::size_t column) {
  std::string key = a.arguments[row].ToString();
  if (a.columns.size() > 1) key += " " + a.columns[column].name;
  return key;
}

std::string NoteBody(const ApparatusEntry& e, std::string (*escape)(const std::string&),
                     const std::string& italic_open, const std::string& italic_close) {
  std::string t = escape(e.lemma.empty() ? "--" : e.lemma);
  if (!e.lemma_sigla.empty()) t += " " + escape(Sigla(e.lemma_sigla));
  const std::string mark = LemmaMark(e.source);
  if (!mark.empty()) t += " " + italic_open + mark + italic_close;
  if (!e.reason.empty()) t += " (" + escape(e.reason) + ")";
  t += "]";
  for (std::size_t k = 0; k < e.variants.size(); ++k) {
    const auto& v = e.variants[k];
    t += (k ? "; " : " ") + escape(v.text) + " " + escape(Sigla(v.sigla));
    if (!v.why.empty()) t += " (" + escape(v.why) + ")";
  }
  if (e.variants.empty()) t += " " + italic_open + "no variant" + italic_close;
  const std::string marks = MarksOf(e.marks, {});
  if (!marks.empty()) t += ". " + escape(marks);
  return t;
}

}  // namespace apograph::publish::internal
