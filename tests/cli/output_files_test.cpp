// Files written only where the editor said (issue items 6, 7 and 10): never
// outside the --output folder, never over the open database, never over an
// existing file without --force, and no decision stored when the file fails.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <string>

#include "cli/hardening_support.hpp"
#include "pipeline/decisions.hpp"

namespace {

namespace fs = std::filesystem;
using apograph::testing::Contains;
using apograph::testing::ReadWholeFile;
using apograph::testing::RunBinary;
using apograph::testing::ScratchDir;

/// Renames a table in the database behind the import's back, as an older or
/// hand-edited database may hold it.
void RenameTable(const fs::path& db, const std::string& from, const std::string& to) {
  apograph::store::Database d(db.string());
  d.Execute("PRAGMA foreign_keys = OFF");
  d.Execute("UPDATE edition_table SET id = '" + to + "' WHERE id = '" + from + "'");
  d.Execute("UPDATE transcription SET table_id = '" + to + "' WHERE table_id = '" + from + "'");
}

std::size_t Overrides(const fs::path& dir) {
  apograph::store::Database db((dir / "edition.sqlite").string());
  return apograph::pipeline::ListEditedCells(db, "decl").size();
}

}  // namespace

TEST_CASE("no command writes over the open edition database") {
  ScratchDir dir("over-db");
  apograph::testing::ImportDemo(dir.path());
  const std::string before = ReadWholeFile(dir / "edition.sqlite");
  const std::string refused =
      "error: expected a file other than the open edition database, "
      "found 'edition.sqlite'\n";
  auto r = RunBinary("export --table decl --witness A --output edition.sqlite --force", dir.path());
  CHECK(r.code == 2);
  CHECK(r.err == "--output" + std::string(": ") + refused);
  r = RunBinary("apparatus --table decl --output edition.sqlite --force", dir.path());
  CHECK(r.err == "--output: " + refused);
  r = RunBinary("stemma --table decl --svg edition.sqlite --force", dir.path());
  CHECK(r.err == "--svg: " + refused);
  // The same file under another name (a link) is still the database.
  fs::create_symlink("edition.sqlite", dir / "alias.sqlite");
  r = RunBinary("export --table decl --witness A --db alias.sqlite --output edition.sqlite --force",
                dir.path());
  CHECK(r.code == 2);
  CHECK(Contains(r.err, "a file other than the open edition database"));
  CHECK(ReadWholeFile(dir / "edition.sqlite") == before);
}

TEST_CASE("an existing file is replaced only with --force") {
  ScratchDir dir("force");
  apograph::testing::ImportDemo(dir.path());
  { std::ofstream(dir / "mine.apo") << "the editor's file\n"; }
  auto r = RunBinary("export --table decl --witness A --output mine.apo", dir.path());
  CHECK(r.code == 2);
  CHECK(r.err ==
        "--output: error: expected a new file (or --force to replace it), found the "
        "existing file 'mine.apo'\n");
  CHECK(ReadWholeFile(dir / "mine.apo") == "the editor's file\n");
  r = RunBinary("apparatus --table decl --output mine.apo", dir.path());
  CHECK(r.code == 2);
  r = RunBinary("export --table decl --witness A --output mine.apo --force", dir.path());
  CHECK(r.code == 0);
  CHECK(Contains(ReadWholeFile(dir / "mine.apo"), "@table decl"));
  r = RunBinary("report --table decl --output out", dir.path());
  CHECK(r.code <= 1);  // success (1: with the table's findings)
  r = RunBinary("report --table decl --output out", dir.path());
  CHECK(r.code == 2);
  CHECK(Contains(r.err, "found the existing file 'out/decl.md'"));
  CHECK(RunBinary("report --table decl --output out --force", dir.path()).code <= 1);
  // For a work too: an existing file stops the command, it is no skipped table.
  r = RunBinary("report --work lantern --findings 1 --output out", dir.path());
  CHECK(r.code == 2);
  CHECK(r.err ==
        "--output: error: expected a new file (or --force to replace it), found the "
        "existing file 'out/decl.md'\n");
}

TEST_CASE("report files stay inside the --output folder whatever the database says") {
  ScratchDir dir("escape");
  apograph::testing::ImportDemo(dir.path());
  RenameTable(dir / "edition.sqlite", "decl", "../escaped");
  fs::create_directories(dir / "out");
  auto r = RunBinary("report --table ../escaped --output out", dir.path());
  CHECK(r.code == 2);
  CHECK(Contains(r.err, "--output: error: expected an id that names a file inside the folder"));
  CHECK(Contains(r.err, "found '../escaped' in the database"));
  CHECK_FALSE(fs::exists(dir / "escaped.md"));
  CHECK(fs::is_empty(dir / "out"));
  const std::string absolute = (dir / "abs").string();
  RenameTable(dir / "edition.sqlite", "../escaped", absolute);
  r = RunBinary("report --table '" + absolute + "' --output out", dir.path());
  CHECK(r.code == 2);
  CHECK_FALSE(fs::exists(absolute + ".md"));
}

TEST_CASE("an override is read like a transcription's cell before it is stored") {
  ScratchDir dir("override");
  apograph::testing::ImportDemo(dir.path());
  const auto refused = [&](const std::string& reading, const std::string& message) {
    CAPTURE(reading);
    const auto r =
        RunBinary("apparatus --table decl --override '46:declination=" + reading + "'", dir.path());
    CHECK(r.code == 2);
    CHECK(r.err == "--override: error: in the reading '" + reading + "': " + message + "\n");
  };
  refused("garbage",
          "at character 1: expected a reading (a number such as 0;4,10, '_' or '?'), found 'g'");
  refused("16;41,57,3", "expected a value of 2 places, as its column has, found 3");
  refused("?", "expected a value read in full, found '?'");
  const auto place =
      RunBinary("apparatus --table decl --override '46:declination=0;1,60'", dir.path());
  CHECK(place.code == 2);
  CHECK(place.err ==
        "--override: error: in the reading '0;1,60': at character 5: expected a "
        "place from 0 to 59, found '60'\n");
  CHECK(Overrides(dir.path()) == 0);
  // A good reading in another form is stored in trade notation.
  const auto ok =
      RunBinary("apparatus --table decl --override '46:declination=16 41 57'", dir.path());
  CHECK(ok.code == 0);
  CHECK(Contains(ok.out, "16;41,57"));
}

TEST_CASE("a failing apparatus command stores nothing") {
  ScratchDir dir("override-fail");
  apograph::testing::ImportDemo(dir.path());
  const auto r = RunBinary(
      "apparatus --table decl --override '46:declination=16;41,57' --output no/such/dir/x.tei",
      dir.path());
  CHECK(r.code == 2);
  CHECK(r.err ==
        "--output: error: expected a file in an existing folder, found "
        "'no/such/dir/x.tei'\n");
  CHECK(Overrides(dir.path()) == 0);
  // A write that fails after every check passed (its temporary file's name
  // is taken by a folder, so the write itself fails): the override is not
  // stored either (it was, before the decisions were held until the write).
  fs::create_directories(dir / "late.tei.tmp" / "inside");
  const auto late = RunBinary(
      "apparatus --table decl --override '46:declination=16;41,57' --output late.tei", dir.path());
  CHECK(late.code >= 2);
  CHECK_FALSE(fs::exists(dir / "late.tei"));
  CHECK(Overrides(dir.path()) == 0);
  CHECK(RunBinary("apparatus --table decl --override '46:declination=16;41,57' --output x.tei",
                  dir.path())
            .code == 0);
  CHECK(Overrides(dir.path()) == 1);
}
