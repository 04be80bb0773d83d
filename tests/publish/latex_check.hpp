#pragma once
// Compiles LaTeX with pdflatex and asks pdffonts which fonts the PDF uses:
// a publisher wants vector fonts (Type 1, TrueType, OpenType), never the
// bitmaps of Type 3. Needs pdflatex and pdffonts on PATH (Debian:
// texlive-latex-base, lmodern, poppler-utils); the caller skips otherwise,
// unless APOGRAPH_REQUIRE_LATEX is set (CI sets it, so that a machine without
// TeX fails instead of passing untested).
#include <unistd.h>

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <string>

#include <doctest/doctest.h>

#include "cli_runner.hpp"

namespace apograph::testing {

/// True when pdflatex and pdffonts are on PATH. False: the caller skips,
/// unless APOGRAPH_REQUIRE_LATEX is set, where the test fails here.
inline bool HaveLatexTools() {
  const bool have =
      std::system("command -v pdflatex > /dev/null 2>&1 && command -v pdffonts > /dev/null 2>&1") ==
      0;
  const char* require = std::getenv("APOGRAPH_REQUIRE_LATEX");
  REQUIRE_MESSAGE((have || !require || !*require),
                  "APOGRAPH_REQUIRE_LATEX is set but pdflatex or pdffonts is not on PATH (Debian: "
                  "texlive-latex-base lmodern poppler-utils)");
  return have;
}

struct LatexResult {
  bool compiled = false;
  std::string fonts;  ///< pdffonts' table
  std::string log;    ///< the end of pdflatex's log when it failed
};

/// Compiles `main` (a whole document) with the files given beside it.
inline LatexResult CompileLatex(
    const std::string& main, const std::vector<std::pair<std::string, std::string>>& files = {}) {
  ScratchDir dir("latex");
  std::ofstream(dir / "main.tex") << main;
  for (const auto& [name, text] : files) std::ofstream(dir / name) << text;
  const std::string cd = "cd '" + dir.path().string() + "' && ";
  LatexResult r;
  r.compiled = std::system((cd + "pdflatex -interaction=nonstopmode -halt-on-error main.tex > "
                                 "pdflatex.out 2>&1")
                               .c_str()) == 0 &&
               std::filesystem::exists(dir / "main.pdf");
  if (!r.compiled) {
    const std::string log = ReadWholeFile(dir / "pdflatex.out");
    r.log = log.substr(log.size() > 2000 ? log.size() - 2000 : 0);
    return r;
  }
  std::system((cd + "pdffonts main.pdf > fonts.txt 2>&1").c_str());
  r.fonts = ReadWholeFile(dir / "fonts.txt");
  return r;
}

}  // namespace apograph::testing
