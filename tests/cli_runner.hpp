#pragma once
// Running apograph from tests: the real binary in a shell (end-to-end), or
// the command table in-process (faster; same code path after main).
#include <sys/wait.h>
#include <unistd.h>

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <sstream>
#include <string>
#include <vector>

#include "cli/command.hpp"
#include "test_paths.hpp"

namespace apograph::testing {

struct CliResult {
  int code = -1;
  std::string out;
  std::string err;
};

inline std::string ReadWholeFile(const std::filesystem::path& p) {
  std::ifstream in(p, std::ios::binary);
  return std::string(std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>());
}

/// A scratch folder removed at the end of the test.
class ScratchDir {
 public:
  explicit ScratchDir(const std::string& tag = "e2e") {
    static int counter = 0;
    dir_ = std::filesystem::temp_directory_path() /
           ("apograph-" + tag + "-" + std::to_string(::getpid()) + "-" + std::to_string(++counter));
    std::filesystem::remove_all(dir_);
    std::filesystem::create_directories(dir_);
  }
  ~ScratchDir() { std::filesystem::remove_all(dir_); }
  ScratchDir(const ScratchDir&) = delete;
  ScratchDir& operator=(const ScratchDir&) = delete;
  std::filesystem::path operator/(const std::string& name) const { return dir_ / name; }
  const std::filesystem::path& path() const { return dir_; }

 private:
  std::filesystem::path dir_;
};

/// Runs the real binary with `args` (shell words, quoted by the caller)
/// inside `dir`, capturing standard output and error separately; `env`
/// (shell assignments such as `NAME='value'`) is set for that run only.
inline CliResult RunBinary(const std::string& args, const std::filesystem::path& dir,
                           const std::string& env = "") {
  const std::string cmd = "cd '" + dir.string() + "' && " + env + " '" + APOGRAPH_BINARY + "' " +
                          args + " > .apograph-out.txt 2> .apograph-err.txt";
  const int status = std::system(cmd.c_str());
  CliResult r{WIFEXITED(status) ? WEXITSTATUS(status) : -1,
              ReadWholeFile(dir / ".apograph-out.txt"), ReadWholeFile(dir / ".apograph-err.txt")};
  std::filesystem::remove(dir / ".apograph-out.txt");
  std::filesystem::remove(dir / ".apograph-err.txt");
  return r;
}

/// Runs the real binary in a fresh scratch folder (paths in `args` must be
/// absolute).
inline CliResult RunBinary(const std::string& args) {
  ScratchDir dir("run");
  return RunBinary(args, dir.path());
}

/// Runs a command through the command table in this process.
inline CliResult RunInProcess(const std::vector<std::string>& args) {
  std::ostringstream out, err;
  cli::Io io{out, err};
  CliResult r;
  r.code = cli::Dispatch(args, io);
  r.out = out.str();
  r.err = err.str();
  return r;
}

}  // namespace apograph::testing
