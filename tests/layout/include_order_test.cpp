// Every include in src/ points down the pipeline: a stage includes only
// itself and the stages before it, in the order the contributor guide
// writes on its "Stage order:" line (DEVELOPERS.md). A new folder in src/
// must be placed in that order before it can be included anywhere.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <map>
#include <regex>
#include <sstream>
#include <string>
#include <vector>

#include "test_paths.hpp"

namespace {

namespace fs = std::filesystem;

/// The stages in order, read off the guide's "Stage order:" line.
std::vector<std::string> StageOrder() {
  std::ifstream in(fs::path(APOGRAPH_SOURCE_DIR) / "DEVELOPERS.md");
  std::string line;
  while (std::getline(in, line)) {
    const auto at = line.find("Stage order:");
    if (at == std::string::npos) continue;
    std::vector<std::string> stages;
    static const std::regex kStage("`([a-z_]+)/`");
    for (std::sregex_iterator it(line.begin(), line.end(), kStage), end; it != end; ++it)
      stages.push_back((*it)[1]);
    return stages;
  }
  return {};
}

}  // namespace

TEST_CASE("every include in src/ points down the stage order of the contributor guide") {
  const auto order = StageOrder();
  REQUIRE(order.size() >= 10);
  std::map<std::string, std::size_t> rank;
  for (std::size_t i = 0; i < order.size(); ++i) rank[order[i]] = i;

  const fs::path src = fs::path(APOGRAPH_SOURCE_DIR) / "src";
  static const std::regex kInclude(R"re(^\s*#\s*include\s+"([a-z_]+)/)re");
  std::size_t checked = 0;
  for (const auto& entry : fs::recursive_directory_iterator(src)) {
    if (!entry.is_regular_file()) continue;
    const std::string stage = fs::relative(entry.path(), src).begin()->string();
    INFO("file ", fs::relative(entry.path(), src).string());
    REQUIRE_MESSAGE(rank.count(stage), "src/" << stage << "/ is not in the guide's stage order");
    std::ifstream in(entry.path());
    std::string line;
    for (int n = 1; std::getline(in, line); ++n) {
      std::smatch m;
      if (!std::regex_search(line, m, kInclude)) continue;
      const std::string target = m[1];
      INFO("line ", n, ": ", line);
      REQUIRE_MESSAGE(rank.count(target), "includes an unknown stage " << target);
      CHECK_MESSAGE(rank[target] <= rank[stage],
                    stage << "/ includes the later stage " << target << "/");
      ++checked;
    }
  }
  CHECK(checked > 300);
}
