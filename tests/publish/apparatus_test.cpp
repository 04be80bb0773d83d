#include "publish/apparatus.hpp"

#include <doctest/doctest.h>

#include <unistd.h>

#include <cstdlib>
#include <filesystem>
#include <fstream>

#ifdef APOGRAPH_HAVE_TINYXML2
#include <tinyxml2.h>
#endif

#include "../store/store_test_util.hpp"
#include "collate/collation.hpp"
#include "lineage/synthetic.hpp"
#include "store/apparatus_store.hpp"
#include "store/edition_store.hpp"

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
  return ws;
}

}  // namespace

TEST_CASE("the lemma is the reading of the majority of branches that is not an error") {
  const auto c = collate::Collate(Tradition());
  const auto a = publish::BuildApparatus(c, {}, {});
  const auto& e3 = a.cells[2][0];
  CHECK(e3.lemma_sigla == std::vector<std::string>{"A", "D", "E"});
  REQUIRE(e3.variants.size() == 1);
  CHECK(e3.variants[0].sigla == std::vector<std::string>{"B", "C"});
  CHECK(e3.variants[0].error);
  CHECK_FALSE(a.cells[0][0].HasVariants());
  CHECK(a.cells[6][0].variants[0].kind == collate::ReadingKind::kIllegible);
  // With the stemma's branches {B, C, D} and {A} and {E}: the branch votes
  // decide for the reading of B and C at row 3 only if it were not an
  // error; here it is, so the lemma stays.
  const auto b = publish::BuildApparatus(c, {{"B", "C", "D"}, {"A"}, {"E"}}, {});
  CHECK(b.cells[2][0].lemma == a.cells[2][0].lemma);
}

TEST_CASE("branch votes decide between readings no model judges") {
  auto ws = Tradition();
  ws.resize(4);  // A B C D: at row 3, A D against B C: a tie on witnesses
  const auto c = collate::Collate(ws);
  REQUIRE(c.rows[2].cells[0].basis == collate::Basis::kUndetermined);
  const auto a = publish::BuildApparatus(c, {{"A"}, {"B"}, {"C"}, {"D"}}, {});
  const auto b = publish::BuildApparatus(c, {{"A", "D"}, {"B"}, {"C"}}, {});
  CHECK(b.cells[2][0].lemma_sigla == std::vector<std::string>{"B", "C"});
  CHECK(b.cells[2][0].note == "no model and no majority: undetermined");
  (void)a;
}

TEST_CASE("TEI P5 output is well formed and carries app, lem, rdg and listWit") {
  const auto a = publish::BuildApparatus(collate::Collate(Tradition()), {}, {});
  const std::string tei = publish::ToTei(a);
#ifdef APOGRAPH_HAVE_TINYXML2
  tinyxml2::XMLDocument doc;
  REQUIRE(doc.Parse(tei.c_str()) == tinyxml2::XML_SUCCESS);
  auto* root = doc.RootElement();
  CHECK(std::string(root->Name()) == "TEI");
  CHECK(std::string(root->Attribute("xmlns")) == "http://www.tei-c.org/ns/1.0");
  auto* list = root->FirstChildElement("teiHeader")
                   ->FirstChildElement("fileDesc")
                   ->FirstChildElement("sourceDesc")
                   ->FirstChildElement("listWit");
  REQUIRE(list);
  int witnesses = 0;
  for (auto* w = list->FirstChildElement("witness"); w; w = w->NextSiblingElement("witness"))
    ++witnesses;
  CHECK(witnesses == 5);
  CHECK(std::string(list->FirstChildElement("witness")->FirstChildElement("idno")->GetText()) ==
        "Cod. A <7>");
  auto* table =
      root->FirstChildElement("text")->FirstChildElement("body")->FirstChildElement("table");
  REQUIRE(table);
  int apps = 0, rows = 0;
  std::string wit_b;
  for (auto* row = table->FirstChildElement("row"); row; row = row->NextSiblingElement("row")) {
    ++rows;
    for (auto* cell = row->FirstChildElement("cell"); cell;
         cell = cell->NextSiblingElement("cell")) {
      if (auto* app = cell->FirstChildElement("app")) {
        ++apps;
        REQUIRE(app->FirstChildElement("lem"));
        REQUIRE(app->FirstChildElement("rdg"));
        if (rows == 4) wit_b = app->FirstChildElement("rdg")->Attribute("wit");
      }
    }
  }
  CHECK(rows == 13);
  CHECK(apps == 3);
  CHECK(wit_b == "#B #C");
#else
  CHECK(tei.find("<app><lem wit=\"#A #D #E\">") != std::string::npos);
  CHECK(tei.find("<rdg wit=\"#B #C\">") != std::string::npos);
#endif
  CHECK(publish::XmlId("2b") == "w2b");
  CHECK(publish::XmlId("P 1") == "P_1");
}

TEST_CASE("LaTeX output: a document with the table and its apparatus notes") {
  const auto a = publish::BuildApparatus(collate::Collate(Tradition()), {}, {});
  const std::string tex = publish::ToLatex(a);
  CHECK(tex.find("\\begin{longtable}{rr}") != std::string::npos);
  CHECK(tex.find("Bibliotheca Inventa \\& Co") != std::string::npos);
  CHECK(tex.find("\\textsuperscript{3}") != std::string::npos);
  CHECK(tex.find("\\textsuperscript{4}") == std::string::npos);
  CHECK(tex.rfind("\\end{document}\n") == tex.size() - 15);
  if (std::system("command -v pdflatex > /dev/null 2>&1") == 0) {
    const auto dir = std::filesystem::temp_directory_path() /
                     ("apograph-latex-test-" + std::to_string(::getpid()));
    std::filesystem::create_directories(dir);
    std::ofstream(dir / "t.tex") << tex;
    const std::string cmd =
        "cd '" + dir.string() +
        "' && pdflatex -interaction=nonstopmode -halt-on-error t.tex > /dev/null 2>&1";
    CHECK(std::system(cmd.c_str()) == 0);
    CHECK(std::filesystem::exists(dir / "t.pdf"));
    std::filesystem::remove_all(dir);
  }
}

TEST_CASE("CSV and text outputs") {
  const auto a = publish::BuildApparatus(collate::Collate(Tradition()), {}, {});
  const std::string csv = publish::ToCsv(a);
  CHECK(csv.rfind("argument,column,lemma,lemma_sigla,editor,variants,note\r\n", 0) == 0);
  CHECK(csv.find(",A D E,,") != std::string::npos);
  const std::string text = publish::ToText(a);
  CHECK(text.find("Apparatus\n[1] 3, c1: ") != std::string::npos);
}

TEST_CASE("an editor's override is stored, applied, and withdrawn (round trip)") {
  apograph::testing::TempDb tmp("apparatus");
  const auto ws = Tradition();
  {
    apograph::store::Database db(tmp.path());
    apograph::store::Import(db, ws);
    const std::string adopted = ws[1].rows[2].cells[0].value->ToString();  // B's reading at row 3
    apograph::store::SaveApparatusDecision(
        db, {"T1", "3", "c1", adopted, "B and C preserve the author's slip", ""});
    apograph::store::SaveApparatusDecision(db, {"T1", "5", "c1", "9;9", "", ""});
  }
  apograph::store::Database db(tmp.path());
  auto saved = apograph::store::LoadApparatusOverrides(db, "T1");
  REQUIRE(saved.size() == 2);
  CHECK(saved[0].row_argument == "3");
  CHECK(saved[0].note == "B and C preserve the author's slip");
  std::vector<publish::Override> overrides;
  for (const auto& d : saved) overrides.push_back({d.row_argument, d.column, d.reading, d.note});
  const auto a = publish::BuildApparatus(collate::Collate(ws), {}, overrides);
  CHECK(a.cells[2][0].lemma_sigla == std::vector<std::string>{"B", "C"});
  CHECK(a.cells[2][0].editor);
  CHECK(a.cells[4][0].emendation);
  CHECK(a.cells[4][0].lemma == "9;9");
  CHECK(a.cells[4][0].variants.size() == 2);
  // Withdrawn: the default lemma comes back.
  apograph::store::SaveApparatusDecision(db, {"T1", "3", "c1", "", "", ""});
  saved = apograph::store::LoadApparatusOverrides(db, "T1");
  REQUIRE(saved.size() == 1);
  CHECK(saved[0].row_argument == "5");
  CHECK_THROWS_AS(apograph::store::SaveApparatusDecision(db, {"T9", "3", "c1", "1", "", ""}),
                  apograph::InputError);
  CHECK_THROWS_AS(publish::BuildApparatus(collate::Collate(ws), {}, {{"99", "c1", "1", ""}}),
                  apograph::InputError);
  CHECK_THROWS_AS(publish::BuildApparatus(collate::Collate(ws), {}, {{"3", "nope", "1", ""}}),
                  apograph::InputError);
}
