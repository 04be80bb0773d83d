#include "publish/apparatus.hpp"

#include <doctest/doctest.h>

#include "collate/collation.hpp"
#include "latex_check.hpp"
#include "lineage/synthetic.hpp"
#include "tei_rules.hpp"

namespace collate = apograph::collate;
namespace publish = apograph::publish;
namespace lineage = apograph::lineage;
using apograph::Sexagesimal;

namespace {

// Five witnesses of a 12-row table: B and C share an error at row 3, D has
// one of its own at row 5, E is illegible at row 7.
std::vector<apograph::Transcription> Tradition() {
  lineage::SyntheticOptions o;
  o.witnesses = 0;
  o.lost = 0;
  o.rows = 12;
  o.places = 1;
  auto t = lineage::SimulateTradition(o);
  for (const char* s : {"A", "B", "C", "D", "E"}) t.AddCopy(s, 0);
  auto ws = t.Witnesses();
  // Reset every copy to the archetype, then put the errors wanted.
  for (auto& w : ws) {
    for (int r = 0; r < 12; ++r) {
      w.rows[r].cells[0].value = t.values[0][r][0];
      w.rows[r].cells[0].raw = t.values[0][r][0].ToString();
    }
    w.witness.library = "Bibliotheca Inventa & Co";
    w.witness.shelfmark = "Cod. " + w.witness.siglum + " <7>";
  }
  auto shift = [](apograph::Cell& c, int units) {
    c.value = Sexagesimal::FromUnits(c.value->units() + units * 60, c.value->places());
    c.raw = c.value->ToString();
  };
  shift(ws[1].rows[2].cells[0], 5);
  shift(ws[2].rows[2].cells[0], 5);
  shift(ws[3].rows[4].cells[0], -3);
  ws[4].rows[6].cells[0].state = apograph::CellState::kIllegible;
  ws[4].rows[6].cells[0].value.reset();
  ws[4].rows[6].cells[0].raw = "?";
  ws[0].rows[1].cells[0].addition = apograph::Addition::kMargin;  // A: row 2 in the margin
  ws[2].rows[3].cells[0].corrected_from = "1;1";                  // C: row 4 corrected
  ws[3].rows[5].argument.raw = "9";                               // D: row 6's argument miswritten
  ws[3].rows[5].argument.value = Sexagesimal::ParseOrThrow("9");
  for (auto& w : ws) w.folios = "3r-4v";
  return ws;
}

publish::Apparatus Build(const collate::Collation& c,
                         const std::vector<apograph::Transcription>* ts,
                         std::vector<std::vector<std::string>> branches = {},
                         std::vector<publish::Override> overrides = {}) {
  publish::ApparatusOptions o;
  o.branches = std::move(branches);
  o.overrides = std::move(overrides);
  o.transcriptions = ts;
  o.editors = {"A. Editor"};
  return publish::BuildApparatus(c, o);
}

}  // namespace

TEST_CASE("the lemma is the reading of the majority of branches that is not an error") {
  const auto ws = Tradition();
  const auto c = collate::Collate(ws);
  const auto a = Build(c, &ws);
  const auto& e3 = a.cells[2][0];
  CHECK(e3.lemma_sigla == std::vector<std::string>{"A", "D", "E"});
  REQUIRE(e3.variants.size() == 1);
  CHECK(e3.variants[0].sigla == std::vector<std::string>{"B", "C"});
  CHECK(e3.variants[0].error);
  CHECK(e3.reason == "the reading of the majority of the witnesses");
  CHECK_FALSE(a.cells[0][0].HasVariants());
  CHECK(a.cells[6][0].variants[0].kind == collate::ReadingKind::kIllegible);
  // With the stemma's branches {B, C, D} and {A} and {E}: the branch votes
  // would decide for the reading of B and C at row 3 only if it were not an
  // error; here it is, so the lemma stays.
  const auto b = Build(c, &ws, {{"B", "C", "D"}, {"A"}, {"E"}});
  CHECK(b.cells[2][0].lemma == a.cells[2][0].lemma);
}

TEST_CASE("branch votes decide between readings no model judges") {
  auto ws = Tradition();
  ws.resize(4);  // A B C D: at row 3, A D against B C: a tie on witnesses
  const auto c = collate::Collate(ws);
  REQUIRE(c.rows[2].cells[0].basis == collate::Basis::kUndetermined);
  const auto b = Build(c, &ws, {{"A", "D"}, {"B"}, {"C"}});
  CHECK(b.cells[2][0].lemma_sigla == std::vector<std::string>{"B", "C"});
  CHECK(b.cells[2][0].reason == "no model and no majority: undetermined");
}

TEST_CASE("marks, miswritten arguments and folios reach the apparatus") {
  const auto ws = Tradition();
  const auto a = Build(collate::Collate(ws), &ws);
  REQUIRE(a.cells[1][0].marks.size() == 1);
  CHECK(a.cells[1][0].marks[0].siglum == "A");
  CHECK(a.cells[1][0].marks[0].kind == "margin");
  CHECK(a.cells[1][0].NeedsNote());  // no variant, but a mark
  REQUIRE(a.cells[3][0].marks.size() == 1);
  CHECK(a.cells[3][0].marks[0].text == "corrected from 1;1");
  REQUIRE(a.arg_variants[5].size() == 1);
  CHECK(a.arg_variants[5][0].text == "9");
  CHECK(a.arg_variants[5][0].sigla == std::vector<std::string>{"D"});
  CHECK(a.folios == std::vector<std::string>(5, "3r-4v"));
  const std::string text = publish::ToText(a);
  CHECK(text.find("2  ") != std::string::npos);
  CHECK(text.find("A: in the margin") != std::string::npos);
  CHECK(text.find("6 arg.] 9 D") != std::string::npos);
  CHECK(text.find("fols. 3r-4v") != std::string::npos);
}

/// The synthetic tradition judged against its archetype, with every witness
/// wrong at row 9 and none legible at row 10.
std::vector<apograph::Transcription> AllWrong() {
  auto ws = Tradition();
  for (auto& w : ws) {
    auto& c = w.rows[8].cells[0];
    c.value = Sexagesimal::FromUnits(c.value->units() + (w.witness.siglum < "C" ? 120 : 180),
                                     c.value->places());
    c.raw = c.value->ToString();
    auto& d = w.rows[9].cells[0];
    d.state = apograph::CellState::kIllegible;
    d.value.reset();
    d.raw = "?";
  }
  return ws;
}

collate::Collation Judged(const std::vector<apograph::Transcription>& ws) {
  const auto right = Tradition();
  collate::CollateOptions o;
  o.reference = collate::Reference{
      "the archetype", [right](const Sexagesimal& arg, int) {
        return right[0].rows[static_cast<std::size_t>(arg.ToDouble() - 1)].cells[0].value;
      }};
  return collate::Collate(ws, o);
}

TEST_CASE("where every witness errs the restoration is the lemma, marked a conjecture") {
  const auto ws = AllWrong();
  const auto c = Judged(ws);
  const auto a = Build(c, &ws);
  const auto& e = a.cells[8][0];
  CHECK(e.source == publish::LemmaSource::kRestored);
  CHECK(e.lemma == Tradition()[0].rows[8].cells[0].value->ToString());
  CHECK(e.lemma_sigla.empty());
  CHECK(e.variants.size() == 2);
  CHECK(e.reason.rfind("every witness deviates from recomputation: restored", 0) == 0);
  CHECK(e.resp.empty());  // the tool's proposal, not yet the editor's
  // Row 10: nothing legible, so the recomputed value is supplied.
  CHECK(a.cells[9][0].source == publish::LemmaSource::kSupplied);
  // "every witness deviates" is said only where every witness does: row 3
  // has B and C wrong, the others right.
  for (const auto& row : a.cells) {
    for (const auto& cell : row) {
      if (cell.reason.find("every witness deviates") != std::string::npos) {
        CHECK(&cell == &a.cells[8][0]);
      }
    }
  }
  const std::string tei = publish::ToTei(a);
  CHECK(tei.find("<lem type=\"conjecture\">" + e.lemma + "</lem>") != std::string::npos);
  CHECK(tei.find("<supplied reason=\"illegible\">") != std::string::npos);
  CHECK(tei.find("<lem/>") == std::string::npos);
  CHECK(apograph::testing::TeiChecker().Check(tei) == std::vector<std::string>{});
  CHECK(publish::ToText(a).find(e.lemma + " conj. (every witness deviates") != std::string::npos);
  // An editor's override wins; one in no witness is the editor's emendation.
  const auto o = Build(c, &ws, {},
                       {{"9", "c1", "9;9", "recomputed", false, "A. Editor"},
                        {"3", "c1", ws[1].rows[2].cells[0].raw, "", false, "A. Editor"}});
  CHECK(o.cells[8][0].source == publish::LemmaSource::kEmendation);
  CHECK(o.cells[8][0].resp == "A. Editor");
  CHECK(o.cells[8][0].reason == "emended by A. Editor: recomputed");
  CHECK(o.cells[2][0].source == publish::LemmaSource::kEditor);
  CHECK(o.cells[2][0].lemma_sigla == std::vector<std::string>{"B", "C"});
  const auto conj = Build(c, &ws, {}, {{"9", "c1", "9;9", "", true, "A. Editor"}});
  CHECK(conj.cells[8][0].source == publish::LemmaSource::kConjecture);
  const std::string tei2 = publish::ToTei(conj);
  CHECK(tei2.find("<lem type=\"conjecture\" resp=\"#ed-A._Editor\">9;9</lem>") !=
        std::string::npos);
  CHECK(apograph::testing::TeiChecker().Check(tei2) == std::vector<std::string>{});
  CHECK_THROWS_AS(Build(c, &ws, {}, {{"99", "c1", "1", ""}}), apograph::InputError);
  CHECK_THROWS_AS(Build(c, &ws, {}, {{"3", "nope", "1", ""}}), apograph::InputError);
}

TEST_CASE("TEI P5 output passes the content rules and carries app, lem, rdg, witDetail") {
  const auto ws = Tradition();
  const auto a = Build(collate::Collate(ws), &ws);
  const std::string tei = publish::ToTei(a);
  apograph::testing::TeiChecker checker;
  CHECK(checker.Check(tei) == std::vector<std::string>{});
  tinyxml2::XMLDocument doc;
  REQUIRE(doc.Parse(tei.c_str()) == tinyxml2::XML_SUCCESS);
  auto* root = doc.RootElement();
  auto* title = root->FirstChildElement("teiHeader")
                    ->FirstChildElement("fileDesc")
                    ->FirstChildElement("titleStmt");
  REQUIRE(title->FirstChildElement("editor"));
  CHECK(std::string(title->FirstChildElement("editor")->GetText()) == "A. Editor");
  auto* list = root->FirstChildElement("teiHeader")
                   ->FirstChildElement("fileDesc")
                   ->FirstChildElement("sourceDesc")
                   ->FirstChildElement("listWit");
  REQUIRE(list);
  CHECK(std::string(list->FirstChildElement("witness")->FirstChildElement("idno")->GetText()) ==
        "Cod. A <7>");
  CHECK(std::string(list->FirstChildElement("witness")->FirstChildElement("locus")->GetText()) ==
        "3r-4v");
  CHECK(tei.find("<witDetail wit=\"#A\" type=\"margin\">in the margin</witDetail>") !=
        std::string::npos);
  CHECK(tei.find("<witDetail wit=\"#C\" type=\"correction\">corrected from 1;1</witDetail>") !=
        std::string::npos);
  CHECK(tei.find("<cell role=\"label\"><app><lem>6</lem><rdg wit=\"#D\">9</rdg>") !=
        std::string::npos);
  CHECK(tei.find("<rdg wit=\"#E\" type=\"illegible\"><gap reason=\"illegible\"/></rdg>") !=
        std::string::npos);
  // A broken document is caught by the checker.
  CHECK_FALSE(checker
                  .Check("<TEI xmlns=\"http://www.tei-c.org/ns/1.0\"><text><app><lem/></app>"
                         "</text></TEI>")
                  .empty());
  std::string dangling = tei;
  dangling.replace(dangling.find("wit=\"#B #C\""), 11, "wit=\"#Q\"");
  CHECK_FALSE(checker.Check(dangling).empty());
  CHECK(publish::XmlId("2b") == "w2b");
  CHECK(publish::XmlId("P 1") == "P_1");
}

TEST_CASE(
    "LaTeX: numbers aligned by place, apparatus keyed by argument, a document or a fragment") {
  const auto ws = Tradition();
  const auto a = Build(collate::Collate(ws), &ws);
  const std::string tex = publish::ToLatex(a);
  CHECK(tex.find("\\usepackage[T1]{fontenc}\n\\usepackage{lmodern}") != std::string::npos);
  CHECK(tex.find("\\begin{longtable}{r@{\\hspace{2em}}r@{;}r}") != std::string::npos);
  CHECK(tex.find("Bibliotheca Inventa \\& Co") != std::string::npos);
  CHECK(tex.find("\\noindent\\textbf{3}\\quad ") != std::string::npos);
  CHECK(tex.find("\\textsuperscript") == std::string::npos);
  CHECK(tex.find("\\textbf{6} \\textit{arg.}] 9 D") != std::string::npos);
  CHECK(tex.rfind("\\end{document}\n") == tex.size() - 15);
  const std::string fragment = publish::ToLatex(a, {true});
  CHECK(fragment.find("\\documentclass") == std::string::npos);
  CHECK(fragment.find("\\begin{document}") == std::string::npos);
  if (!apograph::testing::HaveLatexTools()) {
    MESSAGE(
        "skipped: pdflatex or pdffonts not on PATH (Debian: texlive-latex-base lmodern "
        "poppler-utils)");
    return;
  }
  const auto doc = apograph::testing::CompileLatex(tex);
  REQUIRE_MESSAGE(doc.compiled, doc.log);
  CHECK(doc.fonts.find("Type 1") != std::string::npos);
  CHECK(doc.fonts.find("Type 3") == std::string::npos);
  const std::string book =
      "\\documentclass{book}\n\\usepackage[T1]{fontenc}\n\\usepackage{lmodern}\n"
      "\\usepackage{longtable}\n\\begin{document}\n\\chapter{Tables}\n\\input{table}\n"
      "\\end{document}\n";
  const auto in_book = apograph::testing::CompileLatex(book, {{"table.tex", fragment}});
  REQUIRE_MESSAGE(in_book.compiled, in_book.log);
  CHECK(in_book.fonts.find("Type 3") == std::string::npos);
}

/// A CSV's records as fields (the project's own reader parses RFC 4180).
std::vector<std::vector<std::string>> Records(const std::string& csv) {
  std::vector<std::vector<std::string>> out;
  std::vector<std::string> fields;
  std::string field;
  bool quoted = false;
  for (std::size_t i = 0; i < csv.size(); ++i) {
    const char ch = csv[i];
    if (quoted) {
      if (ch == '"' && i + 1 < csv.size() && csv[i + 1] == '"')
        field += '"', ++i;
      else if (ch == '"')
        quoted = false;
      else
        field += ch;
    } else if (ch == '"') {
      quoted = true;
    } else if (ch == ',') {
      fields.push_back(field), field.clear();
    } else if (ch == '\r') {
    } else if (ch == '\n') {
      fields.push_back(field), field.clear();
      out.push_back(fields), fields.clear();
    } else {
      field += ch;
    }
  }
  return out;
}

TEST_CASE("CSV: long form, one row per reading, quoted as RFC 4180 needs") {
  const auto ws = Tradition();
  const auto a = Build(collate::Collate(ws), &ws);
  const std::string csv = publish::ToCsv(a);
  CHECK(csv.rfind("arg,column,role,reading,witnesses,kind,error,cause,why,marks,source,editor\r\n",
                  0) == 0);
  const auto records = Records(csv);
  int witnesses = 0, lemmas = 0, variants = 0, arguments = 0;
  for (const auto& r : records) {
    REQUIRE(r.size() == 12);
    witnesses += r[2] == "witness";
    lemmas += r[2] == "lemma";
    variants += r[2] == "variant";
    arguments += r[2] == "argument";
    if (r[2] == "variant") CHECK(r[4].find(';') == std::string::npos);  // one reading per row
  }
  CHECK(witnesses == 5);
  CHECK(lemmas == 12);
  CHECK(variants == 3);  // B C at 3, D at 5, E illegible at 7
  CHECK(arguments == 1);
  // Every field with a comma, a quote, a semicolon (the trade's separator,
  // and a delimiter for some spreadsheets) or a line break is quoted.
  for (const auto& r : records) {
    for (const auto& f : r) {
      if (f.find_first_of(",;\"\n") != std::string::npos)
        CHECK(csv.find("\"" + f) != std::string::npos);
    }
  }
  CHECK(csv.find(",\"Bibliotheca Inventa & Co, Cod. A <7>, fols. 3r-4v\",") != std::string::npos);
}
