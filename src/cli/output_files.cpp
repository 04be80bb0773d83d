#include "cli/output_files.hpp"

#include <sys/prctl.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cerrno>
#include <csignal>
#include <cstring>
#include <fstream>
#include <stdexcept>
#include <system_error>

#include "edition/names.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {
namespace {

namespace fs = std::filesystem;

// Temporary files being written and the Graphviz child, for the signal
// handler: an interrupted command removes them and stops dot before it dies.
// Fixed buffers, because a handler may not allocate.
constexpr int kSlots = 4;  // at most two temporaries are open at once (judgement: margin)
constexpr std::size_t kPathBytes = 4096;
char pending_path[kSlots][kPathBytes];
volatile std::sig_atomic_t pending_used[kSlots];
volatile pid_t child_pid = 0;

extern "C" void OnTerminatingSignal(int sig) {
  if (child_pid > 0) ::kill(child_pid, SIGKILL);
  for (int i = 0; i < kSlots; ++i) {
    if (pending_used[i]) ::unlink(pending_path[i]);
  }
  std::signal(sig, SIG_DFL);
  ::raise(sig);
}

void InstallHandlers() {
  static const bool installed = [] {
    for (int sig : {SIGINT, SIGTERM, SIGHUP}) {
      // A signal the shell set to be ignored (a background job's SIGINT) stays ignored.
      if (std::signal(sig, OnTerminatingSignal) == SIG_IGN) std::signal(sig, SIG_IGN);
    }
    return true;
  }();
  (void)installed;
}

/// A temporary file removed when it goes out of scope or a signal ends the process.
class Temporary {
 public:
  explicit Temporary(const fs::path& path) : path_(path) {
    InstallHandlers();
    const std::string s = path.string();
    for (int i = 0; i < kSlots && s.size() < kPathBytes; ++i) {
      if (pending_used[i]) continue;
      std::memcpy(pending_path[i], s.c_str(), s.size() + 1);
      pending_used[i] = 1;
      slot_ = i;
      break;
    }
  }
  ~Temporary() {
    std::error_code ec;
    fs::remove(path_, ec);
    if (slot_ >= 0) pending_used[slot_] = 0;
  }
  Temporary(const Temporary&) = delete;
  Temporary& operator=(const Temporary&) = delete;
  const fs::path& path() const { return path_; }

 private:
  fs::path path_;
  int slot_ = -1;
};

bool SameFile(const fs::path& a, const fs::path& b) {
  std::error_code ec;
  return !b.empty() && fs::exists(a, ec) && fs::exists(b, ec) && fs::equivalent(a, b, ec);
}

[[noreturn]] void Refuse(const OutputRules& rules, const std::string& expected,
                         const std::string& found) {
  throw InputError::ForOption(rules.option, ExpectedFound(expected, found));
}

void WriteText(const fs::path& path, const std::string& text, const OutputRules& rules) {
  std::ofstream out(path, std::ios::binary);
  out << text;
  out.flush();
  if (!out) Refuse(rules, "a writable file", "'" + path.string() + "'");
}

/// Moves the finished temporary into place, checking again (a file may have
/// appeared meanwhile).
void Publish(const Temporary& tmp, const fs::path& path, const OutputRules& rules) {
  CheckOutputFile(path, rules);
  std::error_code ec;
  fs::rename(tmp.path(), path, ec);
  if (ec) Refuse(rules, "a writable file", "'" + path.string() + "' (" + ec.message() + ")");
}

/// Runs dot as a child killed with this process (Linux: PR_SET_PDEATHSIG);
/// its exit status, or 127 when dot cannot be run.
int RunDot(const fs::path& in, const fs::path& out) {
  const pid_t parent = ::getpid();
  const pid_t pid = ::fork();
  if (pid < 0)
    throw std::runtime_error("cannot start Graphviz dot: " + std::string(strerror(errno)));
  if (pid == 0) {
    ::prctl(PR_SET_PDEATHSIG, SIGKILL);
    if (::getppid() != parent) ::_exit(126);  // the parent died before prctl
    ::execlp("dot", "dot", "-Tsvg", in.c_str(), "-o", out.c_str(), static_cast<char*>(nullptr));
    ::_exit(127);
  }
  child_pid = pid;
  int status = 0;
  while (::waitpid(pid, &status, 0) < 0 && errno == EINTR) {
  }
  child_pid = 0;
  return WIFEXITED(status) ? WEXITSTATUS(status) : 128;
}

}  // namespace

void MakeOutputFolder(const fs::path& dir, const std::string& option) {
  std::error_code ec;
  if (fs::is_directory(dir, ec)) return;
  if (!fs::exists(dir, ec)) fs::create_directories(dir, ec);
  if (!fs::is_directory(dir)) {
    throw InputError::ForOption(
        option, ExpectedFound("a folder (created if missing)",
                              "'" + dir.string() + "'" + (ec ? " (" + ec.message() + ")" : "")));
  }
}

void CheckOutputFile(const fs::path& path, const OutputRules& rules) {
  const std::string quoted = "'" + path.string() + "'";
  if (SameFile(path, rules.database))
    Refuse(rules, "a file other than the open edition database", quoted);
  std::error_code ec;
  if (fs::is_directory(path, ec)) Refuse(rules, "a file", "the folder " + quoted);
  if (fs::exists(path, ec) && !rules.force)
    Refuse(rules, "a new file (or --force to replace it)", "the existing file " + quoted);
  const fs::path parent = path.parent_path().empty() ? fs::path(".") : path.parent_path();
  if (!fs::is_directory(parent, ec)) Refuse(rules, "a file in an existing folder", quoted);
  if (::access(parent.c_str(), W_OK) != 0) Refuse(rules, "a file in a writable folder", quoted);
}

fs::path FileInFolder(const fs::path& dir, const std::string& id, const std::string& suffix,
                      const OutputRules& rules) {
  if (!IsSafeId(id)) {
    Refuse(rules, std::string("an id that names a file inside the folder (") + kSafeIdRule + ")",
           "'" + id + "' in the database");
  }
  return dir / (id + suffix);
}

void WriteOutputFile(const fs::path& path, const std::string& text, const OutputRules& rules) {
  CheckOutputFile(path, rules);
  if (rules.before_write) rules.before_write(path);
  const Temporary tmp(path.string() + ".tmp");
  if (SameFile(tmp.path(), rules.database))
    Refuse(rules, "a file other than the open edition database", "'" + tmp.path().string() + "'");
  WriteText(tmp.path(), text, rules);
  Publish(tmp, path, rules);
}

std::vector<fs::path> TemporariesOf(const fs::path& path) {
  return {path.string() + ".tmp", path.string() + ".dot.tmp"};
}

bool RenderSvgFile(const std::string& dot, const fs::path& svg_path, const OutputRules& rules) {
  CheckOutputFile(svg_path, rules);
  if (rules.before_write) rules.before_write(svg_path);
  const Temporary source(svg_path.string() + ".dot.tmp");
  const Temporary svg(svg_path.string() + ".tmp");
  for (const auto* t : {&source, &svg}) {
    if (SameFile(t->path(), rules.database))
      Refuse(rules, "a file other than the open edition database", "'" + t->path().string() + "'");
  }
  WriteText(source.path(), dot, rules);
  const int rc = RunDot(source.path(), svg.path());
  if (rc == 127) return false;
  if (rc != 0) throw std::runtime_error("Graphviz dot failed to render " + svg_path.string());
  Publish(svg, svg_path, rules);
  return true;
}

}  // namespace apograph::cli
