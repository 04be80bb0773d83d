#include "support/data_dir.hpp"

#include <algorithm>
#include <cstdlib>
#include <filesystem>

namespace apograph {

std::string DataDir() {
  const char* env = std::getenv("APOGRAPH_DATA");
  return env && *env ? env : APOGRAPH_DATA_DIR;
}

std::string ScriptDir() {
  if (const char* env = std::getenv("APOGRAPH_SCRIPTS"); env && *env) return env;
  return DataDir() + "/scripts";
}

std::vector<std::string> ScriptNames(const std::string& dir) {
  std::vector<std::string> names;
  std::error_code ec;
  for (std::filesystem::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
    if (it->path().extension() == ".script") names.push_back(it->path().stem().string());
  }
  std::sort(names.begin(), names.end());
  return names;
}

}  // namespace apograph
