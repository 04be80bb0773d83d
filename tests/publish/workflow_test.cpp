// One witness taken through the editor's decisions with the real binary:
// reject, accept (a displaced run, as one decision), override, conjecture,
// undo, and a re-import with one corrected cell; after each step the
// report, TEI, LaTeX and CSV say what the editor decided.
//
// The tradition is invented for the test: a sine table (R = 60, every 3
// degrees to 90) in four witnesses. All four share a transposition at 81
// (an archetype error); D transposes at 15 and 48 and slides 60-66 by one
// row; B slips at 27; A has a reading in the margin, B a doubtful one, C a
// scribal correction, a note and a miswritten argument, D a damaged cell.
#include <doctest/doctest.h>

#include <cmath>
#include <fstream>
#include <map>
#include <nlohmann/json.hpp>
#include <string>

#include "cli_runner.hpp"
#include "json_schema.hpp"
#include "latex_check.hpp"
#include "number/sexagesimal.hpp"
#include "tei_rules.hpp"

namespace {

using apograph::Sexagesimal;
using apograph::testing::RunBinary;
using apograph::testing::ScratchDir;

std::string Sine(int row) {  // row 1..30 stands for 3 * row degrees
  return Sexagesimal::FromDouble(60 * std::sin(3.0 * row * M_PI / 180), 2).ToString();
}

/// The minutes' two digits transposed (15;31,45 -> 15;13,45).
std::string SwapMinutes(const std::string& v) {
  const auto semi = v.find(';'), comma = v.find(',');
  std::string m = v.substr(semi + 1, comma - semi - 1);
  if (m.size() == 1) m = "0" + m;
  std::string swapped{m[1], m[0]};
  if (swapped[0] == '0') swapped.erase(0, 1);
  return v.substr(0, semi + 1) + swapped + v.substr(comma);
}

std::string Witness(const std::string& siglum, std::map<int, std::string> values,
                    std::map<int, std::string> marks = {}, std::map<int, int> args = {}) {
  values.emplace(27, SwapMinutes(Sine(27)));  // the archetype's error at 81
  std::string out = "# Witness " + siglum + " of an invented sine table (test scenario)\n" +
                    "@work quire title=\"The Quire Tables (invented)\"\n" + "@witness " + siglum +
                    " library=\"Invented Library\" shelfmark=\"MS " + siglum +
                    "\" script=hindu-arabic\n" + "@table sines title=\"Sines\" folios=\"" +
                    std::to_string(siglum[0] - 60) + "r-" + std::to_string(siglum[0] - 60) +
                    "v\"\n" +
                    "@argument arc unit=deg places=0 start=3 step=3\n"
                    "@column sine unit=parts places=2\n@rows\n";
  for (int r = 1; r <= 30; ++r) {
    const std::string arg = std::to_string(args.count(r) ? args[r] : 3 * r);
    out += arg + " | " + (values.count(r) ? values[r] : Sine(r)) +
           (marks.count(r) ? " " + marks[r] : "") + "\n";
  }
  return out;
}

std::map<int, std::string> DValues(bool corrected) {
  std::map<int, std::string> d{
      {16, SwapMinutes(Sine(16))}, {20, Sine(21)}, {21, Sine(22)}, {22, Sine(23)}};
  if (!corrected) d[5] = SwapMinutes(Sine(5));
  return d;
}

struct Outputs {
  std::string report, tei, latex, csv;
};

class Session {
 public:
  Session() {
    std::ofstream(dir_ / "A.apo") << Witness("A", {}, {{3, "{margin}"}});
    std::ofstream(dir_ / "B.apo") << Witness("B", {{9, "27;14,27"}}, {{14, "{doubt}"}});
    std::ofstream(dir_ / "C.apo") << Witness(
        "C", {}, {{8, "{was 8;12,1}"}, {18, "{note \"faded\"}"}}, {{14, 33}});
    std::ofstream(dir_ / "D.apo") << Witness("D", DValues(false), {{11, "{damaged}"}});
    REQUIRE(Run("import A.apo B.apo C.apo D.apo").code == 1);  // 1: the warning about C's argument
  }

  apograph::testing::CliResult Run(const std::string& args) {
    return RunBinary(args + " --db e.sqlite", dir_.path());
  }
  /// A decision by Ann Editor; must succeed.
  void Decide(const std::string& args) {
    const auto r = Run("emendation " + args + " --editor 'Ann Editor'");
    INFO(r.out << r.err);
    REQUIRE(r.code == 0);
  }
  Outputs Snapshot() {
    Outputs o;
    o.report = Run("report --table sines").out;
    o.tei = Run("apparatus --table sines --auto --format tei --editor 'Ann Editor'").out;
    o.latex = Run("apparatus --table sines --auto --format latex --editor 'Ann Editor'").out;
    o.csv = Run("apparatus --table sines --auto --format csv --editor 'Ann Editor'").out;
    CHECK(apograph::testing::TeiChecker().Check(o.tei) == std::vector<std::string>{});
    return o;
  }
  nlohmann::json List(const std::string& args = "") {
    const auto j = nlohmann::json::parse(Run("emendation list --format json " + args).out);
    CHECK(schemas_.Validate("emendation-list.json", j) == std::vector<std::string>{});
    return j;
  }
  /// The finding id of D's proposal at an argument.
  long long FindingAt(const std::string& arg) {
    const auto list = List("--witness D");
    for (const auto& e : list["emendations"]) {
      if (e["arg"] == arg) return e["finding"].get<long long>();
    }
    FAIL("no proposal at " << arg << " in " << list.dump());
    return 0;
  }
  long long ProposalAt(const std::string& arg) {
    const auto list = List("--witness D");
    for (const auto& e : list["emendations"]) {
      if (e["arg"] == arg) return e["id"].get<long long>();
    }
    FAIL("no proposal at " << arg << " in " << list.dump());
    return 0;
  }
  ScratchDir& dir() { return dir_; }

 private:
  ScratchDir dir_{"workflow"};
  apograph::testing::JsonSchemas schemas_;
};

bool Has(const std::string& text, const std::string& what) {
  return text.find(what) != std::string::npos;
}

void CheckLatexCompiles(const Outputs& o) {
  if (!apograph::testing::HaveLatexTools()) {
    MESSAGE("LaTeX not compiled: pdflatex or pdffonts not on PATH");
    return;
  }
  const auto pdf = apograph::testing::CompileLatex(o.latex);
  REQUIRE_MESSAGE(pdf.compiled, pdf.log);
  CHECK(pdf.fonts.find("Type 3") == std::string::npos);
}

}  // namespace

TEST_CASE("a witness through reject, accept, override, conjecture, undo and a new revision") {
  Session s;
  REQUIRE(s.Run("errors --table sines --witness D --auto").code == 1);

  // Before any decision: the archetype's error at 81 is restored by
  // recomputation, marked as a conjecture the editor has yet to confirm.
  auto o = s.Snapshot();
  CHECK(Has(o.report, "15 sine: 15;13,45 D] read 15;31,45"));
  CHECK(Has(o.report, "- undecided"));
  CHECK(Has(o.report, "- 81 sine: 59;15,41 (every witness deviates from recomputation"));
  CHECK(Has(o.tei, "<lem type=\"conjecture\">59;15,41</lem>"));
  CHECK(Has(o.latex, "\\textbf{81}\\quad 59;15,41 \\textit{conj.} (every witness deviates"));
  CHECK(Has(o.csv,
            "\n81,sine,lemma,\"59;15,41\",,value,0,,\"every witness deviates from "
            "recomputation: restored by recomputation, a conjecture for the editor to "
            "confirm\",,restored,\r\n"));
  // The marks, the miswritten argument and the folios are there from the start.
  CHECK(Has(o.tei, "<witDetail wit=\"#A\" type=\"margin\">in the margin</witDetail>"));
  CHECK(Has(o.tei, "<witDetail wit=\"#C\" type=\"correction\">corrected from 8;12,1</witDetail>"));
  CHECK(Has(o.tei, "<witDetail wit=\"#D\" type=\"damaged\">"));
  CHECK(Has(o.tei, "<witDetail wit=\"#B\" type=\"doubtful\">"));
  CHECK(Has(o.tei, "<witDetail wit=\"#C\" type=\"note\">faded</witDetail>"));
  CHECK(Has(o.tei, "<lem>42</lem><rdg wit=\"#C\">33</rdg>"));
  CHECK(Has(o.tei, "fols. <locus>5r-5v</locus>"));
  CHECK(Has(o.latex, "\\textbf{42} \\textit{arg.}] 33 C"));
  CHECK(Has(o.csv, "\n42,arc,argument,33,C,value,1,,argument miswritten,,,\r\n"));
  CheckLatexCompiles(o);

  // 1. Reject the transposition at 15: D's reading is kept, not an error.
  s.Decide("reject " + std::to_string(s.ProposalAt("15")) + " --note 'D stands'");
  o = s.Snapshot();
  CHECK(Has(o.report, "- rejected by Ann Editor on "));
  CHECK(Has(o.report, ": D stands; the reading is kept"));
  CHECK(Has(o.tei, "<rdg wit=\"#D\" resp=\"#ed-Ann_Editor\">15;13,45</rdg>"));
  CHECK(Has(o.tei, "<editor xml:id=\"ed-Ann_Editor\">Ann Editor</editor>"));
  CHECK(Has(o.latex, "15;13,45 D (kept by Ann Editor, who rejected the proposed emendation)"));
  CHECK(Has(o.csv,
            "\n15,sine,variant,\"15;13,45\",D,value,0,,\"kept by Ann Editor, who rejected "
            "the proposed emendation\",,,Ann Editor\r\n"));
  // Collation and stemma read the decision too: D's reading is no error.
  const auto collated =
      nlohmann::json::parse(s.Run("collate --table sines --auto --format json").out);
  const auto& cell15 = collated["rows"][4]["cells"][0];
  REQUIRE(collated["rows"][4]["arg"] == "15");
  CHECK(cell15["basis"] == "editor");
  for (const auto& r : cell15["readings"]) CHECK(r["error"] == false);
  CHECK(s.Run("stemma --table sines --auto --format json").code <= 1);

  // 2. Accept the displaced run by the id of its second cell: one decision
  // covers all three cells.
  s.Decide("accept " + std::to_string(s.ProposalAt("63")) + " --note 'eye-skip'");
  const auto accepted = s.List("--status accepted")["emendations"];
  REQUIRE(accepted.size() == 3);
  CHECK(accepted[0]["decision"] == accepted[2]["decision"]);
  CHECK(accepted[1]["editor"] == "Ann Editor");
  o = s.Snapshot();
  CHECK(Has(o.report, "60-66 sine: 53;27,37 54;48,46 56;0,53 D] read"));
  CHECK(Has(o.report, "- accepted by Ann Editor on "));
  CHECK(Has(o.tei,
            "<lem wit=\"#A #B #C\" resp=\"#ed-Ann_Editor\">53;27,37</lem><rdg wit=\"#D\" "
            "cause=\"displaced-run\" resp=\"#ed-Ann_Editor\">54;48,46</rdg>"));
  CHECK(Has(o.latex,
            "\\textbf{66}\\quad 54;48,46 A B C (confirmed by Ann Editor, who accepted "
            "it as the emendation of D's 56;0,53)]"));
  CHECK(Has(o.csv,
            "\n63,sine,variant,\"54;48,46\",D,value,1,displaced-run,\"eye-skip: a "
            "neighbouring row's entry; confirmed by Ann Editor\",,,Ann Editor\r\n"));
  // A stale decision is refused: the run is no longer "proposed".
  const auto stale = s.Run("emendation reject " + std::to_string(s.FindingAt("60")) +
                           " --expect proposed --editor 'Bo Other'");
  CHECK(stale.code == 2);
  CHECK(Has(stale.err, "it changed meanwhile"));

  // 3. Override at 27: the editor adopts B's reading.
  s.Decide("override --table sines --cell 27:sine --reading '27;14,27' --note 'B preserves it'");
  o = s.Snapshot();
  CHECK(Has(o.report, "the edited text reads 27;14,27 (override by Ann Editor"));
  CHECK(Has(o.report, "1 readings adopted"));
  CHECK(Has(o.tei, "<lem wit=\"#B\" resp=\"#ed-Ann_Editor\">27;14,27</lem>"));
  CHECK(Has(o.latex, "\\textbf{27}\\quad 27;14,27 B (adopted by Ann Editor: B preserves it)]"));
  CHECK(Has(o.csv,
            "\n27,sine,lemma,\"27;14,27\",B,value,0,,adopted by Ann Editor: B preserves "
            "it,,editor,Ann Editor\r\n"));

  // 4. Conjecture at 81: the restoration becomes the editor's.
  s.Decide("conjecture --table sines --cell 81:sine --reading '59;15,41' --note recomputed");
  o = s.Snapshot();
  CHECK(Has(o.report, "1 conjectures"));
  CHECK(Has(o.tei, "<lem type=\"conjecture\" resp=\"#ed-Ann_Editor\">59;15,41</lem>"));
  CHECK(Has(o.latex, "59;15,41 \\textit{conj.} (conjecture of Ann Editor: recomputed)]"));
  CHECK(Has(o.csv,
            "\n81,sine,lemma,\"59;15,41\",,value,0,,conjecture of Ann Editor: "
            "recomputed,,conjecture,Ann Editor\r\n"));
  // A conjecture is a reading no witness has.
  CHECK(s.Run("emendation conjecture --table sines --cell 81:sine --reading '59;51,41'").code == 2);

  // 5. Undo the override: the reading of the witnesses comes back.
  s.Decide("undo --table sines --cell 27:sine --note 'B is alone'");
  o = s.Snapshot();
  CHECK(Has(o.report, "0 readings adopted"));
  CHECK(Has(o.tei, "<lem wit=\"#A #C #D\">27;14,22</lem>"));
  CHECK_FALSE(Has(o.tei, "resp=\"#ed-Ann_Editor\">27;14,27"));
  CHECK(Has(o.latex, "\\textbf{27}\\quad 27;14,22 A C D (agrees with recomputation)] 27;14,27 B"));
  CHECK(Has(o.csv,
            "\n27,sine,lemma,\"27;14,22\",A C D,value,0,,agrees with "
            "recomputation,,witnesses,\r\n"));
  const auto log_json = nlohmann::json::parse(s.Run("emendation log --format json").out);
  CHECK(apograph::testing::JsonSchemas().Validate("emendation-log.json", log_json).empty());
  const auto log = log_json["decisions"];
  REQUIRE(log.size() == 5);
  CHECK(log[0]["action"] == "undo");
  CHECK(log[0]["editor"] == "Ann Editor");
  CHECK(log[0]["note"] == "B is alone");
  CHECK(log[2]["withdrawn_by"] == log[0]["id"]);

  // 6. D re-imported with the cell at 15 corrected (a transcription
  // mistake): the accepted run carries over, the rejection is to review.
  std::ofstream(s.dir() / "D.apo") << Witness("D", DValues(true), {{11, "{damaged}"}});
  REQUIRE(s.Run("import D.apo").code == 0);
  REQUIRE(s.Run("errors --table sines --witness D --auto").code == 1);
  const auto list = s.List("--witness D")["emendations"];
  int carried = 0, review = 0, old = 0;
  for (const auto& e : list) {
    carried += e["status"] == "accepted" && e["carried"] == true && e["revision"] == 2;
    review += e["status"] == "review";
    old += e["revision"] == 1 && e["status"] != "review";
  }
  CHECK(carried == 3);
  CHECK(review == 1);
  CHECK(old == 0);  // revision 1's proposals are superseded by revision 2's
  o = s.Snapshot();
  CHECK(Has(o.report, "- review: decision 1 (reject by Ann Editor on "));
  CHECK(Has(o.report, "was made when it read 15;13,45; it now reads 15;31,45"));
  CHECK_FALSE(Has(o.report, "15 sine: 15;13,45 D]"));
  CHECK(Has(o.report, "60-66 sine: 53;27,37 54;48,46 56;0,53 D] read"));
  CHECK(Has(o.tei, "<row><cell role=\"label\">15</cell><cell>15;31,45</cell></row>"));
  CHECK(Has(o.tei, "<lem wit=\"#A #B #C\" resp=\"#ed-Ann_Editor\">53;27,37</lem>"));
  CHECK_FALSE(Has(o.csv, "\n15,sine,variant,"));
  CHECK(Has(o.csv, "\n63,sine,lemma,\"53;27,37\",A B C,value,0,,\"confirmed by Ann Editor"));
  CHECK(Has(o.latex, "\\textbf{81}\\quad 59;15,41 \\textit{conj.} (conjecture of Ann Editor"));
  CheckLatexCompiles(o);
}
