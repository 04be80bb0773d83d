// Every malformed input in tests/bad/NAME.apo fails with exactly the message
// in tests/bad/NAME.expected (the full rendering of the first diagnostic).
#include <doctest/doctest.h>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "test_paths.hpp"
#include "transcription/parser.hpp"

namespace {

std::string Slurp(const std::filesystem::path& path) {
  std::ifstream in(path, std::ios::binary);
  std::stringstream buffer;
  buffer << in.rdbuf();
  return buffer.str();
}

std::string WithoutFinalNewline(std::string text) {
  while (!text.empty() && text.back() == '\n') text.pop_back();
  return text;
}

}  // namespace

TEST_CASE("malformed transcriptions give their expected message word for word") {
  const std::filesystem::path folder = std::string(APOGRAPH_SOURCE_DIR) + "/tests/bad";
  std::vector<std::filesystem::path> inputs;
  for (const auto& entry : std::filesystem::directory_iterator(folder)) {
    if (entry.path().extension() == ".apo") inputs.push_back(entry.path());
  }
  std::sort(inputs.begin(), inputs.end());
  REQUIRE(inputs.size() >= 12);
  for (const auto& input : inputs) {
    const std::string name = input.filename().string();
    CAPTURE(name);
    auto expected_path = input;
    expected_path.replace_extension(".expected");
    REQUIRE(std::filesystem::exists(expected_path));
    const std::string expected = WithoutFinalNewline(Slurp(expected_path));
    std::string actual = "(no error)";
    try {
      // A fixed list of scripts, so that adding one to corpora/scripts does
      // not change the expected messages.
      apograph::ReadOptions options;
      options.scripts = std::vector<std::string>{"greek-alphabetic", "hindu-arabic"};
      apograph::ParseTranscription(Slurp(input), name, options);
    } catch (const apograph::InputError& e) {
      actual = e.diagnostics().front().Render();
    }
    CHECK(actual == expected);
  }
}

TEST_CASE("reading a file: missing file, directory and empty file are input errors") {
  const std::string missing = std::string(APOGRAPH_SOURCE_DIR) + "/tests/bad/no-such-file.apo";
  CHECK_THROWS_WITH_AS(apograph::ReadTranscriptionFile(missing),
                       (missing + ": error: expected a readable file, found none (missing or "
                                  "not permitted)")
                           .c_str(),
                       apograph::InputError);
  const std::string folder = std::string(APOGRAPH_SOURCE_DIR) + "/tests/bad";
  CHECK_THROWS_WITH_AS(
      apograph::ReadTranscriptionFile(folder),
      (folder + ": error: expected a transcription file, found a directory").c_str(),
      apograph::InputError);
  const std::string empty = folder + "/empty.apo";
  CHECK_THROWS_WITH_AS(
      apograph::ReadTranscriptionFile(empty),
      (empty + ":1:1: error: expected a transcription, found an empty file").c_str(),
      apograph::InputError);
}
