#include "edition/witness_date.hpp"

#include <doctest/doctest.h>

#include "edition/transcription.hpp"
#include "transcription/parser.hpp"

namespace apograph {
namespace {

YearRange R(int a, int b) { return {a, b}; }

TEST_CASE("catalogue dates are read as ranges of years") {
  CHECK(ParseWitnessDate("1461") == R(1461, 1461));
  CHECK(ParseWitnessDate("1461 (dated)") == R(1461, 1461));
  CHECK(ParseWitnessDate("c. 1420") == R(1410, 1430));
  CHECK(ParseWitnessDate("ca. 1420") == R(1410, 1430));
  CHECK(ParseWitnessDate("1450-1475") == R(1450, 1475));
  CHECK(ParseWitnessDate("1450\xE2\x80\x93"
                         "1475") == R(1450, 1475));  // en dash
  CHECK(ParseWitnessDate("before 1500") == R(0, 1499));
  CHECK(ParseWitnessDate("after 1450") == R(1451, 9999));
  CHECK(ParseWitnessDate("15th century") == R(1400, 1499));
  CHECK(ParseWitnessDate("late 15th century") == R(1468, 1499));
  CHECK(ParseWitnessDate("early 14th century") == R(1300, 1333));
  CHECK(ParseWitnessDate("second half of the 15th century") == R(1450, 1499));
  CHECK(ParseWitnessDate("mid 15th century") == R(1434, 1467));
  CHECK(ParseWitnessDate("mid-15th century") == R(1434, 1467));
  CHECK(ParseWitnessDate("s. XV ex.") == R(1468, 1499));
  CHECK(ParseWitnessDate("s. XIV 2") == R(1350, 1399));
  CHECK(ParseWitnessDate("1899") == R(1899, 1899));
}

TEST_CASE("dates that are not understood give no range") {
  CHECK_FALSE(ParseWitnessDate(""));
  CHECK_FALSE(ParseWitnessDate("unknown"));
  CHECK_FALSE(ParseWitnessDate("1475-1450"));
  CHECK_FALSE(ParseWitnessDate("sometime later"));
}

TEST_CASE("a copy dated wholly after its exemplar") {
  CHECK(R(1400, 1499).WhollyBefore(R(1500, 1500)));
  CHECK_FALSE(R(1410, 1430).WhollyBefore(R(1420, 1420)));
}

TEST_CASE("a witness declares its kind; an unknown kind is an error, an odd date a warning") {
  const std::string text =
      "@work w\n@witness P date=\"early print of uncertain year\" kind=print\n"
      "@table t\n@argument a places=0\n@column c places=1\n@rows\n1 | 0;1\n";
  const auto file = ParseTranscription(text, "p.apo");
  REQUIRE(file.tables.size() == 1);
  CHECK(file.tables[0].witness.Kind() == WitnessKind::kPrint);
  CHECK_FALSE(file.tables[0].witness.Dates());
  REQUIRE(file.warnings.size() == 1);
  CHECK(file.warnings[0].message.find("expected a date such as 1461") != std::string::npos);
  CHECK(file.warnings[0].where.line == 2);

  const std::string bad = "@work w\n@witness P kind=codex\n";
  try {
    ParseTranscription(bad, "bad.apo");
    FAIL("accepted kind=codex");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()).find("bad.apo:2:17: error: expected kind=manuscript, print or "
                                     "modern-edition, found 'codex'") != std::string::npos);
  }
}

TEST_CASE("a witness without a declared kind is a manuscript") {
  WitnessInfo w;
  CHECK(w.Kind() == WitnessKind::kManuscript);
  w.kind = "modern-edition";
  CHECK(w.Kind() == WitnessKind::kModernEdition);
}

}  // namespace
}  // namespace apograph
