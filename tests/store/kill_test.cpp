// A child process importing a large transcription is killed (SIGKILL) at
// seeded random points; the database must then pass PRAGMA integrity_check
// and hold the import whole or not at all. Bounded: a few kills, each
// after at most about one full import's time.
#include <fcntl.h>
#include <signal.h>
#include <spawn.h>
#include <sys/wait.h>
#include <unistd.h>

#include <doctest/doctest.h>

#include <chrono>
#include <fstream>
#include <random>
#include <thread>

#include "cli_runner.hpp"
#include "store/edition_store.hpp"
#include "store_test_util.hpp"

extern char** environ;

namespace {

namespace store = apograph::store;

constexpr int kTables = 3;
constexpr int kRows = 4000;
constexpr int kColumns = 8;

/// Three tables of 4,000 rows x 8 columns (96,000 cells) in one file.
std::string BigTranscription() {
  std::string text = "@work kill title=\"Killed import (invented)\"\n@witness K\n";
  for (int t = 0; t < kTables; ++t) {
    text += "@table t" + std::to_string(t) + "\n@argument n places=0 start=1 step=1\n";
    for (int c = 0; c < kColumns; ++c) text += "@column c" + std::to_string(c) + " places=2\n";
    text += "@rows\n";
    for (int r = 0; r < kRows; ++r) {
      text += std::to_string(r + 1);
      for (int c = 0; c < kColumns; ++c) {
        const int v = (r * 7 + c * 13 + t) % 216000;
        text += " | " + std::to_string(v / 3600) + ";" + std::to_string(v / 60 % 60) + "," +
                std::to_string(v % 60);
      }
      text += '\n';
    }
  }
  return text;
}

pid_t StartImport(const std::string& file, const std::string& db) {
  posix_spawn_file_actions_t actions;
  posix_spawn_file_actions_init(&actions);
  posix_spawn_file_actions_addopen(&actions, 1, "/dev/null", O_WRONLY, 0);
  posix_spawn_file_actions_addopen(&actions, 2, "/dev/null", O_WRONLY, 0);
  const std::string binary = APOGRAPH_BINARY;
  std::vector<std::string> words = {binary, "import", file, "--db", db};
  std::vector<char*> argv;
  for (auto& w : words) argv.push_back(w.data());
  argv.push_back(nullptr);
  pid_t pid = 0;
  const int rc = posix_spawn(&pid, binary.c_str(), &actions, nullptr, argv.data(), environ);
  posix_spawn_file_actions_destroy(&actions);
  REQUIRE(rc == 0);
  return pid;
}

int WaitFor(pid_t pid) {
  int status = 0;
  waitpid(pid, &status, 0);
  return status;
}

/// integrity_check's verdict and the number of revisions and table rows.
struct State {
  std::string integrity;
  std::int64_t revisions = 0;
  std::int64_t rows = 0;
};

State Inspect(const std::string& path) {
  State s;
  if (!std::filesystem::exists(path)) return s;
  store::Database db(path);  // rolls back a hot journal left by the kill
  auto check = db.Prepare("PRAGMA integrity_check");
  while (check.Step()) s.integrity += check.Text(0);
  auto count = db.Prepare(
      "SELECT (SELECT count(*) FROM revision), "
      "(SELECT coalesce(sum(json_array_length(rows)), 0) FROM revision_cells)");
  count.Step();
  s.revisions = count.Int(0);
  s.rows = count.Int(1);
  return s;
}

}  // namespace

TEST_CASE("an import killed at random points leaves the database whole and all or nothing") {
  apograph::testing::ScratchDir dir("kill");
  const std::string file = (dir / "big.apo").string();
  std::ofstream(file) << BigTranscription();
  // One full import sets the range of kill times (not a timing assertion).
  const std::string reference = (dir / "reference.sqlite").string();
  const auto start = std::chrono::steady_clock::now();
  const int status = WaitFor(StartImport(file, reference));
  const auto full = std::chrono::steady_clock::now() - start;
  REQUIRE(WIFEXITED(status));
  REQUIRE(WEXITSTATUS(status) == 0);
  const State whole = Inspect(reference);
  REQUIRE(whole.revisions == kTables);
  REQUIRE(whole.rows == kTables * kRows);

  std::mt19937 rng(20261202);  // seeds of the kill points, fixed
  const auto full_us = std::chrono::duration_cast<std::chrono::microseconds>(full).count();
  std::uniform_int_distribution<long> when(0, full_us + full_us / 5);
  int killed_midway = 0;
  for (int run = 0; run < 8; ++run) {
    CAPTURE(run);
    const std::string db = (dir / ("killed-" + std::to_string(run) + ".sqlite")).string();
    const pid_t pid = StartImport(file, db);
    std::this_thread::sleep_for(std::chrono::microseconds(when(rng)));
    kill(pid, SIGKILL);
    const int killed = WaitFor(pid);
    killed_midway += WIFSIGNALED(killed);
    const State s = Inspect(db);
    if (!s.integrity.empty()) CHECK(s.integrity == "ok");
    CHECK(((s.revisions == 0 && s.rows == 0) ||
           (s.revisions == whole.revisions && s.rows == whole.rows)));
    // The killed import can be run again to the end.
    REQUIRE(WEXITSTATUS(WaitFor(StartImport(file, db))) == 0);
    const State again = Inspect(db);
    CHECK(again.revisions == whole.revisions);
    CHECK(again.rows == whole.rows);
  }
  MESSAGE("imports killed before they ended: " << killed_midway << " of 8");
}
