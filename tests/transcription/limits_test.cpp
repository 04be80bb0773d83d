// Limits on what is read (file and line size) and on what is echoed back in
// a message; arguments as modern editions write them.
#include <doctest/doctest.h>

#include "support/input_error.hpp"
#include "transcription/parser.hpp"
#include "transcription/syntax.hpp"

using apograph::Diagnostic;
using apograph::InputError;
using apograph::ParseTranscription;
using apograph::Sexagesimal;

namespace {

std::string ErrorOf(const std::string& text, const apograph::ReadOptions& options = {}) {
  try {
    ParseTranscription(text, "k.apo", options);
  } catch (const InputError& e) {
    return e.diagnostics().front().Render();
  }
  return "(no error)";
}

constexpr const char* kHead =
    "@work w\n@witness K\n@table t\n@argument a places=1\n@column c places=1\n@rows\n";

}  // namespace

TEST_CASE("a 10 MB line is refused and echoed as a short window") {
  const std::string text = std::string(kHead) + "1 | " + std::string(10'000'000, '7') + "\n";
  const std::string error = ErrorOf(text);
  CHECK(error.rfind("k.apo:7:1: error: expected a line of at most 1048576 bytes, found one of "
                    "10000004 (raise the limit with --max-line-kb)\n1 | 777",
                    0) == 0);
  CHECK(error.size() < 400);
  // Under the limit, the error about the cell echoes a window around the caret.
  apograph::ReadOptions wide;
  wide.max_line_bytes = 20'000'000;
  const std::string cell = ErrorOf(text, wide);
  CHECK(cell.size() < 600);
  CHECK(cell.find("...") != std::string::npos);
}

TEST_CASE("a long line is echoed around its column with the caret under the same character") {
  Diagnostic d;
  d.where.file = "k.apo";
  d.where.line = 3;
  d.where.line_text = std::string(1000, 'a') + "X" + std::string(1000, 'b');
  d.where.column = 1001;
  d.message = "expected b, found 'X'";
  const std::string r = d.Render();
  const auto first = r.find('\n'), second = r.find('\n', first + 1);
  REQUIRE(second != std::string::npos);
  const std::string shown = r.substr(first + 1, second - first - 1);
  const std::string caret = r.substr(second + 1);
  CHECK(shown.size() <= apograph::kEchoedLineBytes + 6);
  CHECK(shown.substr(0, 3) == "...");
  CHECK(shown.substr(shown.size() - 3) == "...");
  REQUIRE(caret.size() >= 1);
  CHECK(shown[caret.size() - 1] == 'X');
  CHECK(caret.back() == '^');
}

TEST_CASE("a device without end is read only up to the file limit") {
  apograph::ReadOptions small;
  small.max_file_bytes = std::size_t{4} << 20;
  CHECK_THROWS_WITH_AS(apograph::ReadTranscriptionFile("/dev/zero", small),
                       "/dev/zero: error: expected a transcription file of at most 4 MB, found "
                       "more (raise the limit with --max-file-mb)",
                       InputError);
}

TEST_CASE("transcribed arguments may be decimals or have fewer places than declared") {
  const auto file =
      ParseTranscription(std::string(kHead) + "0.5 | 0;1\n1 | 0;2\n1;30 | 0;3\n", "k.apo");
  const auto& rows = file.tables.at(0).rows;
  REQUIRE(rows.size() == 3);
  CHECK(rows[0].argument.value->Identical(Sexagesimal::ParseOrThrow("0;30")));
  CHECK(rows[0].argument.raw == "0.5");
  CHECK(rows[1].argument.value->Identical(Sexagesimal::ParseOrThrow("1;0")));
  CHECK(rows[1].argument.raw == "1");
  CHECK(file.warnings.empty());
  // Value cells keep their exact places: the evidence of the column's places.
  CHECK(ErrorOf(std::string(kHead) + "1 | 2\n") ==
        "k.apo:7:5: error: expected a reading with 1 fractional place in column 'c', found '2' (0 "
        "fractional places)\n1 | 2\n    ^");
}

TEST_CASE("arguments declared step=list are taken as written, without sequence warnings") {
  const auto file = ParseTranscription(
      "@work w\n@witness K\n@table mean-sun\n@argument days places=0 step=list\n"
      "@column motion places=2\n@rows\n1 | 0;59,8\n2 | 1;58,17\n10 | 9;51,23\n100 | 98;33,53\n",
      "k.apo");
  const auto& t = file.tables.at(0);
  CHECK(t.argument.listed);
  CHECK_FALSE(t.argument.step.has_value());
  CHECK(file.warnings.empty());
  CHECK(t.ArgumentInUse(2) == Sexagesimal::ParseOrThrow("10"));
}

TEST_CASE("the text check counts the line ends it passes (a reader sizes its rows by them)") {
  using apograph::transcription::CheckText;
  CHECK(CheckText("", "k.csv") == 0);
  CHECK(CheckText("a,b", "k.csv") == 0);
  CHECK(CheckText("a,b\n", "k.csv") == 1);
  CHECK(CheckText("a,b\r\n1,2\r\n3,4", "k.csv") == 2);
  CHECK(CheckText("\xEF\xBB\xBF"
                  "a\n\n\n\xC3\xA9\n",
                  "k.csv") == 4);
}
