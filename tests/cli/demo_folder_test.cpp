// The demo's output folder (issue items 9 and 13): a later demo replaces only
// the files an earlier one listed, and a demo killed while Graphviz draws
// leaves no dot running and no temporary file that the next demo trips on.
#include <doctest/doctest.h>
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <string>
#include <thread>

#include "cli/hardening_support.hpp"

namespace {

namespace fs = std::filesystem;
using apograph::testing::Contains;
using apograph::testing::ReadWholeFile;
using apograph::testing::RunBinary;
using apograph::testing::ScratchDir;

int TemporaryFiles(const fs::path& dir) {
  int n = 0;
  for (const auto& e : fs::directory_iterator(dir)) n += e.path().extension() == ".tmp" ? 1 : 0;
  return n;
}

/// True while `pid` runs (a zombie waiting for its parent does not count).
bool Running(pid_t pid) {
  std::ifstream stat("/proc/" + std::to_string(pid) + "/stat");
  std::string line;
  if (!std::getline(stat, line)) return false;
  const auto close = line.rfind(')');
  return close != std::string::npos && close + 2 < line.size() && line[close + 2] != 'Z';
}

/// Waits up to `seconds` for `done` (the machine is shared: generous bounds).
template <typename F>
bool WaitFor(F done, int seconds) {
  for (int k = 0; k < seconds * 20; ++k) {
    if (done()) return true;
    std::this_thread::sleep_for(std::chrono::milliseconds(50));
  }
  return done();
}

/// A `dot` that records its pid and then draws for a long time.
fs::path SlowDot(const fs::path& dir) {
  fs::create_directories(dir / "bin");
  const fs::path dot = dir / "bin/dot";
  std::ofstream(dot) << "#!/bin/sh\necho $$ > \"$DOT_PID_FILE.part\"\n"
                        "mv \"$DOT_PID_FILE.part\" \"$DOT_PID_FILE\"\nexec sleep 60\n";
  fs::permissions(dot, fs::perms::owner_all);
  return dir / "bin";
}

/// Starts `apograph demo --output out` in `dir` with the slow dot first on PATH.
pid_t StartDemo(const fs::path& dir, const fs::path& bin) {
  const pid_t pid = ::fork();
  if (pid == 0) {
    if (::chdir(dir.c_str()) != 0) ::_exit(120);
    const std::string path = bin.string() + ":" + std::getenv("PATH");
    ::setenv("PATH", path.c_str(), 1);
    ::setenv("DOT_PID_FILE", (dir / "dot.pid").c_str(), 1);
    if (!std::freopen("/dev/null", "w", stdout) || !std::freopen("/dev/null", "w", stderr))
      ::_exit(121);
    ::execl(APOGRAPH_BINARY.c_str(), "apograph", "demo", "--output", "out",
            static_cast<char*>(nullptr));
    ::_exit(122);
  }
  return pid;
}

void KillWhileDrawing(int sig) {
  ScratchDir dir("demo-kill");
  const pid_t demo = StartDemo(dir.path(), SlowDot(dir.path()));
  REQUIRE(demo > 0);
  REQUIRE(WaitFor([&] { return fs::exists(dir / "dot.pid"); }, 300));
  const pid_t dot = std::stoi(ReadWholeFile(dir / "dot.pid"));
  REQUIRE(Running(dot));
  ::kill(demo, sig);
  int status = 0;
  ::waitpid(demo, &status, 0);
  CHECK(WIFSIGNALED(status));
  CHECK(WaitFor([&] { return !Running(dot); }, 10));            // dot dies with the demo
  if (sig != SIGKILL) CHECK(TemporaryFiles(dir / "out") == 0);  // SIGKILL: cleaned up next time
  const auto again = RunBinary("demo --output out", dir.path());
  CHECK(again.code == 1);  // success, with the demo's findings
  CHECK(TemporaryFiles(dir / "out") == 0);
}

}  // namespace

TEST_CASE("a second demo replaces only the files the first one wrote") {
  ScratchDir dir("demo-manifest");
  REQUIRE(RunBinary("demo --output out", dir.path()).code == 1);  // success, with findings
  { std::ofstream(dir / "out/notes.txt") << "the editor's notes\n"; }
  { std::ofstream(dir / "victim.txt") << "outside the folder\n"; }
  { std::ofstream(dir / "out/.apograph-demo", std::ios::app) << "../victim.txt\n/etc/hostname\n"; }
  const auto r = RunBinary("demo --output out", dir.path());
  CHECK(r.code == 1);
  CHECK(ReadWholeFile(dir / "out/notes.txt") == "the editor's notes\n");
  CHECK(fs::exists(dir / "victim.txt"));
  CHECK(fs::exists(dir / "out/edition.sqlite"));
  CHECK(fs::exists(dir / "out/sun-eq.md"));
  CHECK(Contains(ReadWholeFile(dir / "out/.apograph-demo"), "\nsun-eq.tei.xml\n"));
  // A file the editor put where the demo writes is not replaced.
  fs::remove(dir / "out/.apograph-demo");
  { std::ofstream(dir / "out/.apograph-demo") << "# written by apograph demo\n"; }
  const auto clash = RunBinary("demo --output out", dir.path());
  CHECK(clash.code == 2);
  CHECK(Contains(clash.err, "found the existing file 'out/edition.sqlite'"));
}

TEST_CASE("demo --help says what the demo deletes") {
  const auto r = apograph::testing::RunInProcess({"demo", "--help"});
  CHECK(Contains(r.out, "it never deletes a folder nor a file it did not write"));
}

TEST_CASE("a demo killed while Graphviz draws leaves neither dot nor temporaries") {
  SUBCASE("terminated") { KillWhileDrawing(SIGTERM); }
  SUBCASE("interrupted") { KillWhileDrawing(SIGINT); }
  SUBCASE("killed outright") { KillWhileDrawing(SIGKILL); }
}
