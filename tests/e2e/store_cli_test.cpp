// End-to-end: the real binary's init, import, export and list on files.
#include <doctest/doctest.h>

#include <sys/wait.h>
#include <unistd.h>

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <string>

#include <nlohmann/json.hpp>

#include "cli_runner.hpp"
#include "test_paths.hpp"

namespace fs = std::filesystem;

namespace {

std::string ReadFile(const fs::path& p) { return apograph::testing::ReadWholeFile(p); }

void WriteFile(const fs::path& p, const std::string& text) {
  std::ofstream(p, std::ios::binary) << text;
}

using Result = apograph::testing::CliResult;

/// A scratch folder; commands run inside it.
class Scratch : public apograph::testing::ScratchDir {
 public:
  Result Run(const std::string& args) const { return apograph::testing::RunBinary(args, path()); }
};

const std::string kSource = APOGRAPH_SOURCE_DIR;
const std::string kExample = kSource + "/grammar/examples/editorial_marks.apo";
const std::string kSeveral = kSource + "/grammar/examples/several_tables.apo";

const char* kGood =
    "@work harbour title=\"The Harbour Tables\"\n"
    "@witness K library=\"Nordhafen, Town Library\"\n"
    "@table sun-eq kind=\"solar equation\"\n"
    "@argument anomaly unit=deg places=0 start=1 step=1\n"
    "@column equation unit=deg places=2\n"
    "@rows\n"
    "1 | 0;2,5\n"
    "2 | 0;4,10\n";

}  // namespace

TEST_CASE("e2e: init creates a database and is harmless when repeated") {
  Scratch s;
  auto r = s.Run("init --db ed.sqlite");
  CHECK(r.code == 0);
  CHECK(r.out.find("created ed.sqlite (schema version") == 0);
  CHECK(fs::exists(s / "ed.sqlite"));
  r = s.Run("init --db ed.sqlite");
  CHECK(r.code == 0);
  CHECK(r.out.find("opened ed.sqlite") == 0);
}

TEST_CASE("e2e: import reports new revisions, then unchanged; list counts cells") {
  Scratch s;
  auto r = s.Run("import '" + kExample + "' '" + kSeveral + "'");
  CHECK(r.code <= 1);  // warnings allowed, never an error
  CHECK(r.out.find("new revision") != std::string::npos);
  CHECK(r.out.find(" unchanged ") == std::string::npos);
  CHECK(r.out.find("3 table(s) into edition.sqlite: 3 new revision(s), 0 unchanged") !=
        std::string::npos);
  CHECK(fs::exists(s / "edition.sqlite"));

  r = s.Run("import '" + kExample + "' --format json");
  CHECK(r.code <= 1);
  const auto j = nlohmann::json::parse(r.out);
  REQUIRE(j["tables"].size() == 1);
  CHECK(j["tables"][0]["status"] == "unchanged");
  CHECK(j["tables"][0]["table"] == "moon-eq");
  CHECK(j["tables"][0]["witness"] == "M");
  CHECK(j["tables"][0]["siglum"] == "M");  // the deprecated alias
  CHECK(j["tables"][0]["cells"] == 20);
  CHECK(j["cells_written"] == 0);

  r = s.Run("list tables --format csv");
  CHECK(r.code == 0);
  CHECK(r.out.find("table,work,title,kind,witnesses,cells\r\n") == 0);  // RFC 4180 line ends
  CHECK(r.out.find("moon-eq,harbour,Equation of the moon,lunar equation,1,20\r\n") !=
        std::string::npos);

  r = s.Run("list witnesses --table moon-eq --format json");
  CHECK(r.code == 0);
  const auto w = nlohmann::json::parse(r.out);
  REQUIRE(w["witnesses"].size() == 1);
  CHECK(w["witnesses"][0]["witness"] == "M");
  CHECK(w["witnesses"][0]["shelfmark"] == "Cod. 305");

  r = s.Run("list works");
  CHECK(r.code == 0);
  CHECK(r.out.find("harbour") != std::string::npos);
}

TEST_CASE("e2e: an edited file adds a revision and both revisions export") {
  Scratch s;
  WriteFile(s / "k.apo", kGood);
  REQUIRE(s.Run("import k.apo").code == 0);
  std::string edited = kGood;
  edited.replace(edited.find("0;4,10"), 6, "0;4,11 {doubt}");
  WriteFile(s / "k.apo", edited);
  auto r = s.Run("import k.apo");
  CHECK(r.code == 0);
  CHECK(r.out.find("new revision") != std::string::npos);

  r = s.Run("list revisions --table sun-eq --witness K --format csv");
  CHECK(r.out.find("sun-eq,K,1,2,2,2,") != std::string::npos);
  CHECK(r.out.find("sun-eq,K,2,2,2,2,") != std::string::npos);

  CHECK(s.Run("export --table sun-eq --witness K --revision 1").out.find("0;4,10") !=
        std::string::npos);
  r = s.Run("export --table sun-eq --witness K");
  CHECK(r.code == 0);
  CHECK(r.out.find("0;4,11 {doubt}") != std::string::npos);

  r = s.Run("export --table sun-eq --witness K --format json --output k.json");
  CHECK(r.code == 0);
  const auto j = nlohmann::json::parse(ReadFile(s / "k.json"));
  CHECK(j["revision"] == 2);
  CHECK(j["rows"][1]["cells"][0]["value"] == "0;4,11");
  CHECK(j["rows"][1]["cells"][0]["doubtful"] == true);
  CHECK(j["rows"][1]["argument"]["raw"] == "2");

  r = s.Run("export --table sun-eq --witness K --format csv");
  CHECK(r.code == 0);
  CHECK(r.out.find("anomaly,equation") == 0);
}

TEST_CASE("e2e: exported text re-imports without a new revision") {
  Scratch s;
  REQUIRE(s.Run("import '" + kExample + "'").code <= 1);
  REQUIRE(s.Run("export --table moon-eq --witness M --output m.apo").code == 0);
  auto r = s.Run("import m.apo --format csv");
  CHECK(r.code <= 1);
  CHECK(r.out.find(",moon-eq,M,unchanged,1,10,20") != std::string::npos);
}

TEST_CASE("e2e: an error in the second file writes nothing and exits 2") {
  Scratch s;
  WriteFile(s / "good.apo", kGood);
  std::string bad = kGood;
  bad.replace(bad.find("@table sun-eq"), 13, "@table decl");
  bad.replace(bad.find("0;4,10"), 6, "0;60,10");
  WriteFile(s / "bad.apo", bad);

  SUBCASE("on a fresh path no database is created") {
    auto r = s.Run("import good.apo bad.apo");
    CHECK(r.code == 2);
    CHECK(r.err.find("bad.apo:8:") == 0);
    CHECK(r.err.find("error: expected") != std::string::npos);
    CHECK(r.err.find("\n2 | 0;60,10\n") != std::string::npos);  // the line, then a caret
    CHECK(r.err.find('^') != std::string::npos);
    CHECK_FALSE(fs::exists(s / "edition.sqlite"));
  }
  SUBCASE("an existing database stays byte for byte the same") {
    REQUIRE(s.Run("import '" + kExample + "'").code <= 1);
    const std::string before = ReadFile(s / "edition.sqlite");
    auto r = s.Run("import good.apo bad.apo");
    CHECK(r.code == 2);
    CHECK(ReadFile(s / "edition.sqlite") == before);
    CHECK(s.Run("list tables --format csv").out.find("sun-eq") == std::string::npos);
  }
}

TEST_CASE("e2e: CSV sheets import with their options") {
  Scratch s;
  WriteFile(s / "sun.csv", "anomaly,equation\n1,\"0;2,5\"\n2,?\n3,\n");
  auto r = s.Run("import --csv sun.csv --table sun-eq --witness K --script hindu-arabic");
  CHECK(r.code == 0);
  CHECK(r.out.find("new revision") != std::string::npos);
  r = s.Run("export --table sun-eq --witness K --format json");
  const auto j = nlohmann::json::parse(r.out);
  CHECK(j["witness"] == "K");
  CHECK(j["script"] == "hindu-arabic");
  CHECK(j["columns"][0]["places"] == 2);
  CHECK(j["rows"][1]["cells"][0]["state"] == "illegible");
  CHECK(j["rows"][2]["cells"][0]["state"] == "blank");

  CHECK(s.Run("import --csv sun.csv --table sun-eq").code == 2);  // no --witness
  CHECK(s.Run("import --table sun-eq --witness K").code == 2);    // no --csv
  r = s.Run("import --csv sun.csv --table t --witness K --places x=1=2");
  CHECK(r.code == 2);
  CHECK(r.err.find("--places") != std::string::npos);
}

TEST_CASE("e2e: bad usage and missing things are bad input") {
  Scratch s;
  CHECK(s.Run("import").code == 2);
  CHECK(s.Run("import missing.apo").code == 2);
  CHECK(s.Run("list tables").code == 2);  // no database yet
  CHECK_FALSE(fs::exists(s / "edition.sqlite"));
  WriteFile(s / "k.apo", kGood);
  REQUIRE(s.Run("import k.apo").code == 0);
  CHECK(s.Run("list everything").code == 2);
  CHECK(s.Run("list --format xml").code == 2);
  auto r = s.Run("export --table sun-eq --witness Z");
  CHECK(r.code == 2);
  CHECK(r.err.find("witness 'Z'") != std::string::npos);
  CHECK(s.Run("export --table sun-eq --witness K --revision 5").code == 2);
  CHECK(s.Run("export --table sun-eq").code == 2);
  CHECK(s.Run("export --table sun-eq --witness K --output no/such/dir/x.apo").code == 2);
}

TEST_CASE("e2e: every store command has --help with an example") {
  Scratch s;
  for (const char* command : {"init", "import", "export", "list"}) {
    CAPTURE(command);
    auto r = s.Run(std::string(command) + " --help");
    CHECK(r.code == 0);
    CHECK(r.out.find("example") != std::string::npos);
    CHECK(r.out.find("--db") != std::string::npos);
  }
}

TEST_CASE("e2e: warnings are shown with positions, the import happens, exit code 1") {
  Scratch s;
  WriteFile(s / "w.apo",
            "@work w\n@witness K\n@table t\n@argument a places=0 start=1 step=1\n"
            "@column c places=1\n@rows\n1 | 0;1\n1 | 0;2\n");
  auto r = s.Run("import w.apo");
  CHECK(r.code == 1);
  CHECK(r.err.find("w.apo:8:1: warning: expected each argument once, found '1' again") !=
        std::string::npos);
  CHECK(r.err.find("\n1 | 0;2\n^") != std::string::npos);
  CHECK(r.out.find("new revision") != std::string::npos);
  CHECK(s.Run("list transcriptions --format csv").out.find("t,K,1,1,2,2,") != std::string::npos);
}

TEST_CASE("e2e: binary junk and empty files are positioned errors, nothing is written") {
  Scratch s;
  WriteFile(s / "junk.apo", std::string("@work w\n\x01\x02\xff\xfe\x00junk", 17));
  WriteFile(s / "empty.apo", "");
  WriteFile(s / "k.apo", kGood);
  for (const char* file : {"junk.apo", "empty.apo"}) {
    CAPTURE(file);
    auto r = s.Run(std::string("import k.apo ") + file);
    CHECK(r.code == 2);
    CHECK(r.err.find(std::string(file) + ":") == 0);
    CHECK(r.err.find("error: expected") != std::string::npos);
    CHECK_FALSE(fs::exists(s / "edition.sqlite"));
  }
}
