#include "deviation/numeral_script.hpp"

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <sstream>

#include <doctest/doctest.h>

#include <unistd.h>

#include "support/input_error.hpp"
#include "test_paths.hpp"

using apograph::InputError;
using namespace apograph::deviation;

namespace {

const std::string kDir = std::string(APOGRAPH_SOURCE_DIR) + "/corpora/scripts";

std::string Slurp(const std::string& path) {
  std::ifstream in(path);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

bool HasOriginal(const std::vector<PlaceVariant>& v, int original) {
  for (const auto& x : v) {
    if (x.original == original) return true;
  }
  return false;
}

}  // namespace

TEST_CASE("every shipped script loads from its file and writes 0..59 and back") {
  for (const char* name : {"hindu-arabic", "greek-alphabetic", "hebrew-alphabetic", "arabic-abjad",
                           "arabic-abjad-western", "roman", "printed"}) {
    CAPTURE(name);
    const NumeralScript s = FindNumeralScript(name, kDir);
    CHECK(s.name() == name);
    for (int v = 0; v < 1000; ++v) {
      const auto w = s.Write(v);
      REQUIRE_FALSE(w.empty());
      CHECK(s.Read(w) == v);
    }
    CHECK_FALSE(s.confusions().empty());
  }
}

TEST_CASE("places are written in each script's own way") {
  // Alphabetic numerals: tens letter + units letter (common practice).
  CHECK(FindNumeralScript("greek-alphabetic", kDir).WriteText(43) == "μγ");
  CHECK(FindNumeralScript("greek-alphabetic", kDir).WriteText(0) == "ō");
  CHECK(FindNumeralScript("hebrew-alphabetic", kDir).WriteText(15) ==
        "טו");  // 9 + 6 (common practice)
  CHECK(FindNumeralScript("hebrew-alphabetic", kDir).WriteText(42) == "מב");
  CHECK(FindNumeralScript("hebrew-alphabetic", kDir).WriteText(500) == "תק");
  CHECK(FindNumeralScript("arabic-abjad", kDir).WriteText(60) == "س");
  CHECK(FindNumeralScript("arabic-abjad-western", kDir).WriteText(60) == "ص");
  CHECK(FindNumeralScript("roman", kDir).WriteText(49) == "XLIX");
  CHECK(FindNumeralScript("roman", kDir).WriteText(38) == "XXXVIII");
  CHECK(FindNumeralScript("hindu-arabic", kDir).WriteText(7) == "7");
  CHECK(FindNumeralScript("hindu-arabic", kDir).WriteText(107) == "107");
}

TEST_CASE("originals reachable by one or two confusions, with weights") {
  const NumeralScript ha = FindNumeralScript("hindu-arabic", kDir);
  auto one = ha.OriginalsOf(45, 60, 1);
  CHECK(HasOriginal(one, 44));  // 4 read as 5
  CHECK(HasOriginal(one, 55));  // 5 read as 4 in the tens
  CHECK(HasOriginal(one, 40));  // 0 read as 5
  CHECK_FALSE(HasOriginal(one, 54));
  CHECK_FALSE(HasOriginal(one, 45));
  auto two = ha.OriginalsOf(45, 60, 2);
  CHECK(HasOriginal(two, 54));  // both digits
  for (const auto& v : two) {
    CHECK(v.original < 60);
    CHECK(v.weight > 0);
  }
  // Roman: a minim dropped (VII copied for VIII).
  const NumeralScript roman = FindNumeralScript("roman", kDir);
  auto r = roman.OriginalsOf(7, 60, 1);
  CHECK(HasOriginal(r, 8));
  CHECK(HasOriginal(r, 6));
  // Hebrew: dalet/resh do not reach inside a place (resh is 200), bet/kaf do.
  const NumeralScript he = FindNumeralScript("hebrew-alphabetic", kDir);
  CHECK(HasOriginal(he.OriginalsOf(2, 60, 1), 20));
  CHECK(HasOriginal(he.OriginalsOf(4, 1000, 1), 200));
  CHECK_FALSE(HasOriginal(he.OriginalsOf(4, 60, 1), 200));
}

TEST_CASE("a user-edited confusion set takes effect") {
  const std::string text = Slurp(kDir + "/hindu-arabic.script");
  NumeralScript stock = ParseNumeralScript(text, "hindu-arabic.script");
  CHECK_FALSE(HasOriginal(stock.OriginalsOf(41, 60, 1), 44));  // 4/1 is not a stock confusion
  double stock_weight = 0;
  for (const auto& v : stock.OriginalsOf(45, 60, 1)) {
    if (v.original == 44) stock_weight = v.weight;
  }
  CHECK(stock_weight == doctest::Approx(0.6));

  auto tmp = std::filesystem::temp_directory_path() /
             ("apograph_script_test_" + std::to_string(::getpid()));
  std::filesystem::create_directories(tmp);
  std::string edited = text;
  edited.replace(edited.find("confuse 4 5 0.6"), 15, "confuse 4 5 0.2");
  edited += "confuse 4 1 0.9 from-memory\n";
  std::ofstream(tmp / "hindu-arabic.script") << edited;
  NumeralScript mine = FindNumeralScript("hindu-arabic", tmp.string());
  CHECK(HasOriginal(mine.OriginalsOf(41, 60, 1), 44));
  for (const auto& v : mine.OriginalsOf(45, 60, 1)) {
    if (v.original == 44) CHECK(v.weight == doctest::Approx(0.2));
  }
  std::filesystem::remove_all(tmp);
}

TEST_CASE("malformed script files are reported with their position") {
  auto message = [](const std::string& text) {
    try {
      ParseNumeralScript(text, "x.script");
    } catch (const InputError& e) {
      return e.Render();
    }
    return std::string("no error");
  };
  CHECK(message("script x\nwriting positional\nsymbol 1 1\nconfuse 1 2 0.5 from-memory\n") ==
        "x.script:4:11: error: expected a symbol declared by a 'symbol' line, found '2'\n"
        "confuse 1 2 0.5 from-memory\n"
        "          ^");
  CHECK(message("script x\nwriting sideways\n") ==
        "x.script:2:9: error: expected positional, additive or roman, found 'sideways'\n"
        "writing sideways\n"
        "        ^");
  CHECK(message("script x\nwriting positional\nsymbol 1 1\nconfuse 1 - 1.5 from-memory\n") ==
        "x.script:4:13: error: expected a weight greater than 0 and at most 1, found '1.5'\n"
        "confuse 1 - 1.5 from-memory\n"
        "            ^");
  CHECK(message("script x\nwriting positional\nsymbol 1 1\nconfuse 1 -  0.5\n") ==
        "x.script:4:17: error: expected common-practice or from-memory, found end of line\n"
        "confuse 1 -  0.5\n"
        "                ^");
  CHECK(message("writing positional\nsymbol 1 1\n") ==
        "x.script: error: expected a 'script NAME' line, found none");
  CHECK(message("script x\nwriting positional\nsymbl 1 1\n")
            .find("x.script:3:1: error: expected script, title") == 0);
}
