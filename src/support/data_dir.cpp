#include "support/data_dir.hpp"

#include <algorithm>
#include <cstdlib>
#include <filesystem>
#include <fstream>

namespace apograph {
namespace {

namespace fs = std::filesystem;

/// A build tree names the source tree's data folder in a file beside its
/// programs (written by CMake); an installed program has none.
std::string BuildTreeData(const fs::path& dir) {
  std::ifstream in(dir / kBuildDataFile);
  std::string path;
  if (in && std::getline(in, path) && !path.empty()) return path;
  return {};
}

std::string FindDataDir() {
  if (const char* env = std::getenv("APOGRAPH_DATA"); env && *env) return env;
  const fs::path dir = ProgramDir();
  if (dir.empty()) return {};
  std::error_code ec;
  const fs::path installed = (dir / ".." / "share" / "apograph").lexically_normal();
  if (fs::is_directory(installed, ec)) return installed.string();
  // A program at the top of a build tree, or one folder down in it.
  for (const fs::path& d : {dir, dir.parent_path()}) {
    if (std::string path = BuildTreeData(d); !path.empty()) return path;
  }
  return installed.string();  // where it should be: messages name it
}

}  // namespace

std::filesystem::path ProgramDir() {
  std::error_code ec;
  const fs::path exe = fs::read_symlink("/proc/self/exe", ec);
  return ec ? fs::path() : exe.parent_path();
}

std::string DataDir() {
  static const std::string dir = FindDataDir();
  return dir;
}

std::string ScriptDir() {
  if (const char* env = std::getenv("APOGRAPH_SCRIPTS"); env && *env) return env;
  return DataDir() + "/scripts";
}

std::vector<std::string> ScriptNames(const std::string& dir) {
  std::vector<std::string> names;
  std::error_code ec;
  for (fs::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
    if (it->path().extension() == ".script") names.push_back(it->path().stem().string());
  }
  std::sort(names.begin(), names.end());
  return names;
}

}  // namespace apograph
