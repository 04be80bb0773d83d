// The apparatus as CSV (long form) and plain text.
#include <sstream>

#include "publish/apparatus.hpp"
#include "publish/apparatus_words.hpp"
#include "support/tabular.hpp"

namespace apograph::publish {
namespace {

using internal::MarksOf;
using internal::Sigla;

std::string Same(const std::string& s) { return s; }

void WitnessRows(const Apparatus& a, Tabular& t) {
  for (std::size_t k = 0; k < a.witnesses.size(); ++k) {
    const std::string folios = k < a.folios.size() ? a.folios[k] : "";
    t.Add({"", "", "witness", "", a.witnesses[k].siglum, "", "", "",
           internal::WitnessLine(a.witnesses[k], folios), "", "", ""});
  }
}

void CellRows(const Apparatus& a, std::size_t r, std::size_t c, Tabular& t) {
  const auto& e = a.cells[r][c];
  const std::string arg = a.arguments[r].ToString(), column = a.columns[c].name;
  t.Add({arg, column, "lemma", e.lemma, Sigla(e.lemma_sigla),
         e.lemma.empty() ? "" : collate::ToString(e.lemma_kind), e.lemma_error ? "1" : "0", "",
         e.NeedsNote() ? e.reason : "", MarksOf(e.marks, e.lemma_sigla), ToString(e.source),
         e.resp});
  for (const auto& v : e.variants) {
    t.Add({arg, column, "variant", v.text, Sigla(v.sigla), collate::ToString(v.kind),
           v.error ? "1" : "0", v.cause, v.why, MarksOf(e.marks, v.sigla), "", v.editor});
  }
}

}  // namespace

std::string ToCsv(const Apparatus& a) {
  Tabular t;
  t.headers = {"arg",   "column", "role", "reading", "witnesses", "kind",
               "error", "cause",  "why",  "marks",   "source",    "editor"};
  WitnessRows(a, t);
  for (std::size_t r = 0; r < a.arguments.size(); ++r) {
    if (r < a.arg_variants.size()) {
      for (const auto& v : a.arg_variants[r]) {
        t.Add({a.arguments[r].ToString(), a.argument.name, "argument", v.text, Sigla(v.sigla),
               "value", "1", "", "argument miswritten", "", "", ""});
      }
    }
    for (std::size_t c = 0; c < a.columns.size(); ++c) CellRows(a, r, c, t);
  }
  return t.RenderCsv();
}

std::string ToText(const Apparatus& a) {
  Tabular t;
  t.headers.push_back(a.argument.name.empty() ? "argument" : a.argument.name);
  for (const auto& c : a.columns) t.headers.push_back(c.name);
  t.right_aligned.assign(t.headers.size(), true);
  for (std::size_t r = 0; r < a.arguments.size(); ++r) {
    std::vector<std::string> row{a.arguments[r].ToString()};
    for (const auto& e : a.cells[r]) row.push_back(e.lemma.empty() ? "--" : e.lemma);
    t.Add(row);
  }
  std::ostringstream o;
  o << a.Title() << "\n\nWitnesses:\n";
  for (std::size_t k = 0; k < a.witnesses.size(); ++k) {
    o << "  " << a.witnesses[k].siglum << "  "
      << internal::WitnessLine(a.witnesses[k], k < a.folios.size() ? a.folios[k] : "") << "\n";
  }
  if (!a.editors.empty()) {
    o << "Edited by";
    for (std::size_t k = 0; k < a.editors.size(); ++k) o << (k ? ", " : " ") << a.editors[k];
    o << "\n";
  }
  o << "\n" << t.RenderText() << "\nApparatus\n";
  int n = 0;
  for (std::size_t r = 0; r < a.arguments.size(); ++r) {
    if (r < a.arg_variants.size()) {
      for (const auto& v : a.arg_variants[r]) {
        o << a.arguments[r].ToString() << " arg.] " << v.text << " " << Sigla(v.sigla) << "\n";
        ++n;
      }
    }
    for (std::size_t c = 0; c < a.columns.size(); ++c) {
      if (!a.cells[r][c].NeedsNote()) continue;
      o << internal::NoteKey(a, r, c) << "  " << internal::NoteBody(a.cells[r][c], Same, "", "")
        << "\n";
      ++n;
    }
  }
  if (n == 0) o << "no variants\n";
  return o.str();
}

}  // namespace apograph::publish
