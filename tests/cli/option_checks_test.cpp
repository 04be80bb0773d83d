// Option values checked before anything runs (issue items 4 and 15): each
// case failed before (a crash, a silent default, or no cap).
#include <doctest/doctest.h>

#include <fstream>
#include <string>

#include "cli/hardening_support.hpp"

namespace {

using apograph::testing::Contains;
using apograph::testing::RunBinary;
using apograph::testing::RunInProcess;
using apograph::testing::ScratchDir;

}  // namespace

TEST_CASE("--threads takes 1 to 256") {
  for (const char* bad : {"-1", "0", "257", "100000"}) {
    CAPTURE(bad);
    const auto r = RunInProcess({"identify", "--all", "--threads", bad, "--db", "none.sqlite"});
    CHECK(r.code == 2);
    CHECK(r.err ==
          "--threads: error: expected a count from 1 to 256, found " + std::string(bad) + "\n");
  }
  ScratchDir dir("threads");
  apograph::testing::ImportDemo(dir.path());
  const auto r = RunBinary("identify --all --threads 256 --format csv", dir.path());
  CHECK(r.code <= 1);
  CHECK(Contains(r.out, "sun-eq"));
}

TEST_CASE("--places -1 is refused, not taken as the column's places") {
  const auto r = RunInProcess({"check", "--table", "t", "--witness", "A", "--model",
                               "solar-eccentric", "--places", "-1", "--db", "none.sqlite"});
  CHECK(r.code == 2);
  CHECK(r.err == "--places: error: expected 0 to 12, found -1\n");
}

TEST_CASE("collate refuses a negative tolerance as check does") {
  for (const char* command : {"collate", "stemma", "apparatus"}) {
    CAPTURE(command);
    const auto r =
        RunInProcess({command, "--table", "t", "--tolerance", "-5", "--db", "none.sqlite"});
    CHECK(r.code == 2);
    CHECK(r.err == "--tolerance: error: expected 0 or more, found '-5'\n");
  }
}

TEST_CASE("stemma --bootstrap is capped at 100000") {
  auto r =
      RunInProcess({"stemma", "--table", "t", "--bootstrap", "1000000000", "--db", "none.sqlite"});
  CHECK(r.code == 2);
  CHECK(r.err == "--bootstrap: error: expected a count from 0 to 100000, found 1000000000\n");
  r = RunInProcess({"stemma", "--table", "t", "--bootstrap", "100000", "--db", "none.sqlite"});
  CHECK(Contains(r.err, "--db: error"));  // the cap itself is allowed
}

TEST_CASE("check says so and exits 1 when nothing was compared") {
  ScratchDir dir("check-nothing");
  apograph::testing::ImportDemo(dir.path());
  const auto r =
      RunBinary("check --table sun-eq --witness A --formula 'sqrt(-1) + arg'", dir.path());
  CHECK(r.code == 1);
  CHECK(Contains(r.err, "apograph check: nothing was compared: none of the "));
  CHECK(Contains(r.err, "check the model, its parameters and the witness"));
  const auto good = RunBinary(
      "check --table sun-eq --witness A --model solar-eccentric --param 'e=2;16'", dir.path());
  CHECK_FALSE(Contains(good.err, "nothing was compared"));
}

TEST_CASE("report --work reports the other tables when one cannot be analysed") {
  ScratchDir dir("report-skip");
  apograph::testing::ImportDemo(dir.path());
  {
    std::ofstream(dir / "tiny.apo") << "@work lantern\n@witness A\n@table tiny\n"
                                       "@argument degree unit=deg places=0 start=1 step=1\n"
                                       "@column value unit=deg places=2\n@rows\n1 | 0;2,5\n";
  }
  REQUIRE(RunBinary("import tiny.apo", dir.path()).code <= 1);
  const auto r = RunBinary("report --work lantern --findings 1", dir.path());
  INFO(r.err);
  CHECK(r.code == 1);
  CHECK(Contains(r.out, "**Table tiny skipped**: "));
  CHECK(Contains(r.err, "apograph: table tiny skipped: "));
  CHECK(Contains(r.out, "## sun-eq: "));
  CHECK(Contains(r.out, "## Stemma of the work lantern"));
}

TEST_CASE("a parameter value is a sexagesimal or a plain decimal, nothing else") {
  for (const char* bad : {"0;1,60", "0x10", " 5", "garbage"}) {
    CAPTURE(bad);
    const auto r =
        RunInProcess({"check", "--table", "t", "--witness", "A", "--model", "solar-eccentric",
                      "--param", "e=" + std::string(bad), "--db", "none.sqlite"});
    CHECK(r.code == 2);
    CHECK(r.err == "--param e: error: expected a number such as 2;4,48 or 2.08, found '" +
                       std::string(bad) + "'\n");
  }
  const auto ok = RunInProcess({"check", "--table", "t", "--witness", "A", "--model",
                                "solar-eccentric", "--param", "e=2.25e0", "--db", "none.sqlite"});
  CHECK(Contains(ok.err, "--db: error"));  // the value passed; the database is what is missing
}
