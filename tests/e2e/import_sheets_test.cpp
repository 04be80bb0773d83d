// End-to-end: many CSV sheets in one import, manifests, attributes, names
// checked at once, and a second writer told to wait.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <string>

#include <nlohmann/json.hpp>

#include "cli_runner.hpp"
#include "store/database.hpp"

namespace fs = std::filesystem;

namespace {

void WriteFile(const fs::path& p, const std::string& text) {
  std::ofstream(p, std::ios::binary) << text;
}

class Scratch : public apograph::testing::ScratchDir {
 public:
  apograph::testing::CliResult Run(const std::string& args) const {
    return apograph::testing::RunBinary(args, path());
  }
};

nlohmann::json Export(const Scratch& s, const std::string& table, const std::string& siglum) {
  return nlohmann::json::parse(
      s.Run("export --db ed.sqlite --table " + table + " --witness " + siglum + " --format json")
          .out);
}

}  // namespace

TEST_CASE("e2e: many sheets in one import, table ids from the file names, attributes once") {
  Scratch s;
  WriteFile(s / "sun-eq.csv", "anomaly,equation\n1,\"0;2,5\"\n2,\"0;4,10\"\n");
  WriteFile(s / "decl.csv", "arg;decl\n0.5;\"0;12\"\n1;\"0;24\"\n\"1;30\";\"0;36\"\n");
  WriteFile(s / "mean-sun.csv", "days,motion\n1,\"0;59,8\"\n10,\"9;51,20\"\n100,\"98;33,20\"\n");
  auto r = s.Run(
      "import --db ed.sqlite --csv sun-eq.csv decl.csv mean-sun.csv --witness K --work lantern "
      "--date 'c. 1420' --kind print --library 'Marrow Hall' --script hindu-arabic");
  CHECK(r.code == 0);
  CHECK(r.err.empty());
  CHECK(r.out.find("3 table(s) into ed.sqlite: 3 new revision(s)") != std::string::npos);
  const auto decl = Export(s, "decl", "K");
  CHECK(decl["witness"]["date"] == "c. 1420");
  CHECK(decl["witness"]["kind"] == "print");
  CHECK(decl["work"]["id"] == "lantern");
  CHECK(decl["rows"][0]["argument"]["raw"] == "0.5");
  CHECK(decl["rows"][0]["argument"]["value"] == "0;30");
  CHECK(decl["rows"][2]["argument"]["value"] == "1;30");
}

TEST_CASE("e2e: a manifest names the sheets with what they cannot say") {
  Scratch s;
  fs::create_directories(s / "sheets");
  WriteFile(s / "sheets" / "mean-sun.csv",
            "days,motion\n1,\"0;59,8\"\n2,\"1;58,16\"\n10,\"9;51,20\"\n100,\"98;33,20\"\n");
  WriteFile(s / "sheets" / "decl.csv", "arg;d;m;s\n1;0;23;54\n2;0;47;48\n");
  WriteFile(s / "sheets" / "K.sheets",
            "# sheets of witness K (invented)\n"
            "@work lantern title=\"The Lantern Tables\"\n"
            "@witness K library=\"Marrow Hall\" date=1461 script=hindu-arabic kind=manuscript\n"
            "@table mean-sun sheet=mean-sun.csv title=\"Mean sun in days\"\n"
            "@argument days unit=day step=list\n"
            "@table decl sheet=decl.csv join=\"decl=d+m+s\" folios=3r\n"
            "@column decl unit=deg\n");
  auto r = s.Run("import --db ed.sqlite --manifest sheets/K.sheets");
  CHECK(r.code == 0);
  const auto mean = Export(s, "mean-sun", "K");
  CHECK(mean["title"] == "Mean sun in days");
  CHECK(mean["witness"]["library"] == "Marrow Hall");
  CHECK(mean["argument"]["listed"] == true);
  const auto decl = Export(s, "decl", "K");
  CHECK(decl["folios"] == "3r");
  CHECK(decl["columns"][0]["name"] == "decl");
  CHECK(decl["columns"][0]["places"] == 2);
  CHECK(decl["rows"][1]["cells"][0]["value"] == "0;47,48");
  // The argument list goes through collation without invented rows.
  r = s.Run("collate --db ed.sqlite --table mean-sun --format json");
  CHECK(r.out.find("missing row") == std::string::npos);

  WriteFile(s / "bad.sheets", "@witness K\n@table t sheet=x.csv colour=red\n");
  r = s.Run("import --db ed.sqlite --manifest bad.sheets");
  CHECK(r.code == 2);
  CHECK(r.err ==
        "bad.sheets:2:22: error: expected an attribute of @table in a sheet manifest (sheet, "
        "title, kind, folios, hand, delimiter, join), found 'colour'\n"
        "@table t sheet=x.csv colour=red\n"
        "                     ^\n");
}

TEST_CASE("e2e: one bad sheet of many writes nothing; names are checked at once") {
  Scratch s;
  WriteFile(s / "good.csv", "a,e\n1,2\n");
  WriteFile(s / "bad.csv", "a,e\n1,x\n");
  auto r = s.Run("import --db ed.sqlite --csv good.csv bad.csv --witness K");
  CHECK(r.code == 2);
  CHECK(r.err.find("bad.csv:2:3: error:") == 0);
  CHECK_FALSE(fs::exists(s / "ed.sqlite"));
  r = s.Run("import --db ed.sqlite --csv good.csv --witness K --script greek");
  CHECK(r.code == 2);
  CHECK(r.err.find("--script: error: expected a numeral script (") == 0);
  CHECK(r.err.find("greek-alphabetic") != std::string::npos);
  CHECK_FALSE(fs::exists(s / "ed.sqlite"));
  WriteFile(s / "two words.csv", "a,e\n1,2\n");
  r = s.Run("import --db ed.sqlite --csv 'two words.csv' --witness K");
  CHECK(r.code == 2);
  CHECK(r.err.find("expected a file name that is a table id") != std::string::npos);
  r = s.Run("import --db ed.sqlite --csv good.csv bad.csv --table t --witness K");
  CHECK(r.code == 2);
  CHECK(r.err.find("--table: error: expected one CSV sheet with --table") == 0);
}

TEST_CASE("e2e: a changed attribute is said, and the import is a new revision") {
  Scratch s;
  WriteFile(s / "sun.csv", "a,e\n1,2\n");
  REQUIRE(s.Run("import --db ed.sqlite --csv sun.csv --witness K --library 'Marrow Hall'").code ==
          0);
  auto r = s.Run("import --db ed.sqlite --csv sun.csv --witness K");
  CHECK(r.code == 0);  // nothing given, nothing changed
  CHECK(r.out.find("unchanged") != std::string::npos);
  r = s.Run("import --db ed.sqlite --csv sun.csv --witness K --library 'Harbour Hall'");
  CHECK(r.code == 1);
  CHECK(r.err ==
        "sun.csv: warning: witness 'K': library changed from 'Marrow Hall' to 'Harbour Hall' "
        "(earlier revisions keep the earlier value)\n");
  CHECK(r.out.find("new revision") != std::string::npos);
}

TEST_CASE("e2e: a second writer waits as long as --wait says, then says why it failed") {
  Scratch s;
  WriteFile(s / "sun.csv", "a,e\n1,2\n");
  REQUIRE(s.Run("import --db ed.sqlite --csv sun.csv --witness K").code == 0);
  apograph::store::Database holder((s / "ed.sqlite").string());
  {
    holder.Execute("BEGIN EXCLUSIVE");  // as a writer in the middle of its commit
    auto r = s.Run("import --db ed.sqlite --csv sun.csv --witness L --wait 0.2");
    CHECK(r.code == 3);
    CHECK(r.err.find("another process is using the database (waited 0.2 s); retry when it has "
                     "finished, or wait longer with --wait SECONDS") != std::string::npos);
    r = s.Run("--wait 0.1 list tables --db ed.sqlite");
    CHECK(r.code == 3);
    CHECK(r.err.find("waited 0.1 s") != std::string::npos);
    holder.Execute("ROLLBACK");
  }
  CHECK(s.Run("--wait 0.1 list tables --db ed.sqlite").code == 0);
  auto r = s.Run("--wait soon list tables");
  CHECK(r.code == 2);
  CHECK(r.err ==
        "--wait: error: expected seconds from 0 to 86400 (how long to wait for another process "
        "writing to the database), found 'soon'\n");
}
