// synth_draw end to end: the same seed writes the same bytes, every file
// parses, and apograph imports the draw.
#include <doctest/doctest.h>

#include <filesystem>
#include <nlohmann/json.hpp>

#include "cli_runner.hpp"
#include "test_paths.hpp"
#include "transcription/parser.hpp"

namespace fs = std::filesystem;
using apograph::testing::CliResult;
using apograph::testing::ReadWholeFile;
using apograph::testing::ScratchDir;

namespace {

CliResult SynthDraw(const std::string& args, const fs::path& dir) {
  const fs::path program = fs::path(APOGRAPH_BINARY).parent_path() / "synth_draw";
  const std::string cmd = "cd '" + dir.string() + "' && '" + program.string() + "' " + args +
                          " > .synth-out.txt 2> .synth-err.txt";
  const int status = std::system(cmd.c_str());
  CliResult r{WIFEXITED(status) ? WEXITSTATUS(status) : -1, ReadWholeFile(dir / ".synth-out.txt"),
              ReadWholeFile(dir / ".synth-err.txt")};
  fs::remove(dir / ".synth-out.txt");
  fs::remove(dir / ".synth-err.txt");
  return r;
}

std::vector<std::string> Files(const fs::path& dir, const std::string& extension) {
  std::vector<std::string> out;
  for (const auto& e : fs::directory_iterator(dir)) {
    if (e.path().extension() == extension) out.push_back(e.path().filename().string());
  }
  std::sort(out.begin(), out.end());
  return out;
}

}  // namespace

TEST_CASE(
    "synth_draw: the same seed writes the same bytes; every file parses; apograph imports it") {
  ScratchDir dir("synth-draw");
  for (const char* out : {"a", "b"}) {
    const CliResult r =
        SynthDraw(std::string("--seed 5 --out ") + out + " --witnesses 6 --tables 2", dir.path());
    REQUIRE(r.code == 0);
  }
  const auto files = Files(dir / "a", ".apo");
  CHECK(files.size() == 6);
  for (const auto& e : fs::directory_iterator(dir / "a")) {
    const std::string name = e.path().filename().string();
    CHECK(ReadWholeFile(e.path()) == ReadWholeFile(dir / "b" / name));
  }
  const auto key = nlohmann::json::parse(ReadWholeFile(dir / "a" / "truth.json"));
  CHECK(key["seed"] == 5);
  CHECK(key["witnesses"].size() == 6);
  CHECK(key["tables"].size() == 2);
  CHECK(key["sheets"].size() == 12);
  for (const auto& sheet : key["sheets"])
    CHECK(fs::exists(dir / "a" / sheet["file"].get<std::string>()));
  std::string args = "import --db e.sqlite";
  for (const auto& f : files) {
    CHECK(apograph::ReadTranscriptionFile((dir / "a" / f).string()).tables.size() == 2);
    args += " " + f;
  }
  REQUIRE(apograph::testing::RunBinary("init --db e.sqlite", dir / "a").code == 0);
  const CliResult imported = apograph::testing::RunBinary(args, dir / "a");
  // 1: success with warnings to look at (duplicated or missing rows, miscopied arguments).
  CHECK((imported.code == 0 || imported.code == 1));
  CHECK(imported.out.find("12 new revision") != std::string::npos);
}

TEST_CASE("synth_draw --kind table: one copy of the author's table, rate 0 gives it unchanged") {
  ScratchDir dir("synth-table");
  REQUIRE(SynthDraw("--seed 9 --out t --kind table --family sine --rate 0", dir.path()).code == 0);
  const auto key = nlohmann::json::parse(ReadWholeFile(dir / "t" / "truth.json"));
  CHECK(key["kind"] == "table");
  CHECK(key["witnesses"] == nlohmann::json::array({"A"}));
  CHECK(key["tables"][0]["family"] == "sine");
  const auto file = apograph::ReadTranscriptionFile((dir / "t" / "A.apo").string());
  const auto& tabulated = key["tables"][0]["columns"][0]["tabulated"];
  REQUIRE(file.tables[0].rows.size() == tabulated.size());
  for (std::size_t r = 0; r < tabulated.size(); ++r)
    CHECK(file.tables[0].rows[r].cells[0].raw == tabulated[r]);
}

TEST_CASE("synth_draw: bad options are refused with exit code 2, naming the option") {
  ScratchDir dir("synth-bad");
  const CliResult family = SynthDraw("--seed 1 --out x --family nonsense", dir.path());
  CHECK(family.code == 2);
  CHECK(family.err.find("--family") != std::string::npos);
  const CliResult set = SynthDraw("--seed 1 --out x --set no_such_option=1", dir.path());
  CHECK(set.code == 2);
  CHECK(set.err.find("--set") != std::string::npos);
  CHECK(SynthDraw("--out x", dir.path()).code == 2);
  CHECK_FALSE(fs::exists(dir / "x"));
}
