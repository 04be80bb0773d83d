// End-to-end: `apograph demo` and `apograph report` on the bundled demo
// tradition, against its answer key (corpora/demo/TRUTH.md).
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <string>

#include "cli_runner.hpp"
#include "publish/latex_check.hpp"
#include "publish/tei_rules.hpp"

namespace {

using apograph::testing::RunBinary;
using apograph::testing::ScratchDir;

bool Has(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

}  // namespace

TEST_CASE("the demo runs the whole pipeline and finds what the generator did") {
  ScratchDir dir("demo");
  const auto r = RunBinary("demo --findings 3", dir.path());
  INFO(r.err);
  REQUIRE(r.code == 1);  // success with findings: the demo tradition has slips to look at
  // Import, with the argument warnings that are evidence (TRUTH: B writes 41
  // for 47 in shadow; D lacks the row 71 of decl).
  CHECK(Has(r.out, "Imported 20 transcriptions (4 tables in 5 witnesses"));
  CHECK(Has(
      r.out,
      "B.apo:336: expected argument 47 (it breaks the sequence of its neighbours), found '41'"));
  CHECK(Has(r.out, "D.apo:265: expected argument 71, found '72' (a row seems to be missing)"));
  // How each table was computed (TRUTH: the generator's models and practices).
  CHECK(Has(r.out, "declination obliquity = 23;32,40, rounded to 2 places"));
  CHECK(Has(r.out, "shadow g = 12, truncated to 2 places"));
  CHECK(Has(r.out, " = 2;16, rounded to 2 places, exact every 6 and linear between"));
  CHECK(Has(r.out, "Built from the rounded unit value 0;59,8,20"));
  // Estimates with their errors beside the nearest attested value (the
  // catalog's 23;32,30 is the closest to the invented 23;32,40).
  CHECK(Has(r.out, "estimate from witness E: obliquity = 23;32,40"));
  CHECK(Has(r.out, "- attested obliquity = 23;32,30 (Latin tables of the 13th-14th centuries"));
  // A slip and the author's own departure, told apart.
  CHECK(Has(r.out,
            "7 declination: 2;47,52 A] read 2;47,25 - seconds: the digits of 25 transposed to 52"));
  CHECK(Has(r.out, "41 declination: 15;11,33 A] keep (the author's)"));
  // The stemma of the whole work: {A B} and {C D E} with {D E} inside it.
  const auto work = r.out.substr(r.out.find("## Stemma of the work lantern"));
  CHECK(Has(work, "group {C D E}"));
  CHECK(Has(work, "group {D E}"));
  CHECK(Has(work, "group {A B}"));
  CHECK(Has(work, "B may be a copy of A"));
  CHECK(Has(work, "contamination? E follows"));
  // The files for publication.
  for (const char* f : {"edition.sqlite", "sun-eq.md", "sun-eq.tei.xml", "sun-eq.tex", "sun-eq.csv",
                        "sun-eq.stemma.nwk", "sun-eq.stemma.dot", "lantern.stemma.nwk"}) {
    CAPTURE(f);
    CHECK(std::filesystem::exists(dir / ("apograph-demo/" + std::string(f))));
  }
  // The full report lists every deviation; the terminal shows a few per witness.
  CHECK(Has(r.out, "more (apograph errors --table"));
  CHECK_FALSE(Has(apograph::testing::ReadWholeFile(dir / "apograph-demo/decl.md"),
                  "more (apograph errors"));

  // The apparatus shows the transcriptions' editorial marks (TRUTH.md lists
  // them) and, where every witness errs (decl 46: A, B and E carry A's
  // eye-skip, C and D alpha's slip), the restoration as a conjecture.
  const std::string decl_tei = apograph::testing::ReadWholeFile(dir / "apograph-demo/decl.tei.xml");
  CHECK(Has(decl_tei, "<lem type=\"conjecture\">16;41,57</lem>"));
  CHECK(Has(decl_tei, "<witDetail wit=\"#A\" type=\"margin\">in the margin</witDetail>"));
  CHECK(apograph::testing::TeiChecker().Check(decl_tei) == std::vector<std::string>{});
  const std::string decl_tex = apograph::testing::ReadWholeFile(dir / "apograph-demo/decl.tex");
  CHECK(Has(decl_tex, "\\textbf{46}\\quad 16;41,57 \\textit{conj.} (every witness deviates"));
  const std::string sun_eq = apograph::testing::ReadWholeFile(dir / "apograph-demo/sun-eq.csv");
  CHECK(Has(sun_eq, ",\"C: corrected from 2;0,59\","));
  CHECK(Has(sun_eq, ",D: the support is damaged,"));
  const std::string sun_mm = apograph::testing::ReadWholeFile(dir / "apograph-demo/sun-mm.tex");
  CHECK(Has(sun_mm, "E: the reading is doubtful"));
  CHECK(Has(sun_mm, "D: ink faded, reading from the offset"));
  CHECK(Has(apograph::testing::ReadWholeFile(dir / "apograph-demo/shadow.tei.xml"),
            "<witDetail wit=\"#B\" type=\"interlinear\">"));
  CHECK(Has(r.out, "- 46 declination: 16;41,57 (every witness deviates from recomputation"));
  if (apograph::testing::HaveLatexTools()) {
    const auto pdf = apograph::testing::CompileLatex(decl_tex);
    REQUIRE_MESSAGE(pdf.compiled, pdf.log);
    CHECK(pdf.fonts.find("Type 3") == std::string::npos);
  } else {
    MESSAGE("LaTeX not compiled: pdflatex or pdffonts not on PATH");
  }

  SUBCASE("a second demo replaces the first one's folder") {
    // --zero-on-findings: a success with findings exits 0 for scripts and make.
    CHECK(RunBinary("--zero-on-findings demo", dir.path()).code == 0);
  }
  SUBCASE("report on one table of the demo database") {
    const auto rep =
        RunBinary("report --table sun-mm --db apograph-demo/edition.sqlite", dir.path());
    CHECK(rep.code == 1);  // its witnesses' slips are findings
    CHECK(Has(rep.out, "## sun-mm: Mean motion of the sun in days"));
    CHECK(Has(rep.out, "Off the pattern, to be explained as slips or as the author's: 19, 24, 28"));
  }
}

TEST_CASE("the demo refuses to write into a folder it did not make") {
  ScratchDir dir("demo-refuse");
  std::filesystem::create_directories(dir / "mine");
  { std::ofstream(dir / "mine/notes.txt") << "the editor's notes\n"; }
  const auto r = RunBinary("demo --output mine", dir.path());
  CHECK(r.code == 2);
  CHECK(r.err ==
        "--output: error: expected an empty folder or one an earlier demo wrote (with its "
        ".apograph-demo file), found 'mine' holding other files, which the demo leaves alone\n");
  CHECK(std::filesystem::exists(dir / "mine/notes.txt"));
}

TEST_CASE("report needs one of --table and --work, and an existing database") {
  ScratchDir dir("report-usage");
  auto r = RunBinary("report", dir.path());
  CHECK(r.code == 2);
  CHECK(r.err == "apograph report: error: expected one of --table or --work, found neither\n");
  r = RunBinary("report --table t --db none.sqlite", dir.path());
  CHECK(r.code == 2);
  CHECK(r.err ==
        "--db: error: expected an edition database, found no file 'none.sqlite' (create one with "
        "apograph init or apograph import)\n");
  CHECK_FALSE(std::filesystem::exists(dir / "none.sqlite"));
  // The same for a command that used to create an empty file on a typo.
  r = RunBinary("identify --table t --witness A --db typo.sqlite", dir.path());
  CHECK(r.code == 2);
  CHECK_FALSE(std::filesystem::exists(dir / "typo.sqlite"));
}
