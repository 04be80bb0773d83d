#include "cli/demo_folder.hpp"

#include <fstream>
#include <vector>

#include "cli/output_files.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {
namespace {

namespace fs = std::filesystem;

constexpr const char* kHeader =
    "# written by apograph demo: the files listed below are the demo's own; the next demo\n"
    "# replaces them and leaves every other file in this folder alone\n";

/// The plain file names the manifest lists (anything else in it is ignored:
/// a hand-edited manifest must not reach outside the folder).
std::vector<std::string> ListedFiles(const fs::path& marker) {
  std::vector<std::string> names;
  std::ifstream in(marker);
  for (std::string line; std::getline(in, line);) {
    const bool plain = !line.empty() && line[0] != '.' && line.find('/') == std::string::npos &&
                       line.find('\\') == std::string::npos;
    if (plain) names.push_back(line);
  }
  return names;
}

void RemoveListed(const fs::path& dir, const std::vector<std::string>& names) {
  for (const auto& name : names) {
    const fs::path file = dir / name;
    std::vector<fs::path> all = TemporariesOf(file);
    all.push_back(file);
    for (const char* journal : {"-journal", "-wal", "-shm"}) all.push_back(file.string() + journal);
    for (const auto& f : all) {
      std::error_code ec;
      if (!fs::is_directory(f, ec)) fs::remove(f, ec);
    }
  }
}

void StartManifest(const fs::path& dir) {
  std::ofstream out(dir / kDemoMarker, std::ios::trunc);
  out << kHeader;
  if (!out.flush()) {
    throw InputError::ForOption("--output",
                                ExpectedFound("a writable folder", "'" + dir.string() + "'"));
  }
}

}  // namespace

void PrepareDemoFolder(const fs::path& dir) {
  if (fs::exists(dir) && !fs::is_directory(dir)) {
    throw InputError::ForOption("--output",
                                ExpectedFound("a folder", "the file '" + dir.string() + "'"));
  }
  const fs::path marker = dir / kDemoMarker;
  if (fs::exists(marker)) {
    RemoveListed(dir, ListedFiles(marker));
  } else if (fs::exists(dir) && !fs::is_empty(dir)) {
    throw InputError::ForOption(
        "--output",
        ExpectedFound(std::string("an empty folder or one an earlier demo wrote (with its ") +
                          kDemoMarker + " file)",
                      "'" + dir.string() + "' holding other files, which the demo leaves alone"));
  }
  MakeOutputFolder(dir);
  StartManifest(dir);
}

void RecordDemoFile(const fs::path& dir, const fs::path& file) {
  std::ofstream out(dir / kDemoMarker, std::ios::app);
  out << file.filename().string() << "\n";
  if (!out.flush()) {
    throw InputError::ForOption("--output",
                                ExpectedFound("a writable folder", "'" + dir.string() + "'"));
  }
}

}  // namespace apograph::cli
