// Written transcriptions re-parse to the same content.
#include "transcription/writer.hpp"

#include <doctest/doctest.h>

#include <algorithm>
#include <filesystem>

#include "test_paths.hpp"
#include "transcription/parser.hpp"

namespace {

void CheckRoundTrip(const std::vector<apograph::Transcription>& tables) {
  const std::string text = apograph::WriteTranscription(tables);
  CAPTURE(text);
  apograph::TranscriptionFile again;
  try {
    again = apograph::ParseTranscription(text, "written.apo");
  } catch (const apograph::InputError& e) {
    FAIL(e.Render());
  }
  REQUIRE(again.tables.size() == tables.size());
  for (std::size_t i = 0; i < tables.size(); ++i) CHECK(again.tables[i].SameContent(tables[i]));
  // Writing is canonical: the written text writes back to itself.
  CHECK(apograph::WriteTranscription(again.tables) == text);
}

}  // namespace

TEST_CASE("every grammar example survives write and re-parse") {
  std::vector<std::filesystem::path> files;
  for (const auto& entry : std::filesystem::directory_iterator(std::string(APOGRAPH_SOURCE_DIR) +
                                                               "/grammar/examples")) {
    if (entry.path().extension() == ".apo") files.push_back(entry.path());
  }
  std::sort(files.begin(), files.end());
  REQUIRE(files.size() >= 6);
  for (const auto& path : files) {
    CAPTURE(path.string());
    CheckRoundTrip(apograph::ReadTranscriptionFile(path.string()).tables);
  }
}

TEST_CASE("the writer keeps marks, states and metadata, and escapes quotes") {
  const auto file = apograph::ParseTranscription(
      "@work w title=\"a \\\"b\\\" \\\\ c\"\n@witness K\n@table t\n@argument a places=1 start=0;30 "
      "step=0;30\n"
      "@column c places=2\n@rows\n"
      "0;30 | 0;1,? {was 0;1,2} {damaged} {doubt} {interlinear} {note \"said \\\"so\\\"\"}\n",
      "t.apo");
  const std::string text = apograph::WriteTranscription(file.tables);
  CHECK(text ==
        "@work w title=\"a \\\"b\\\" \\\\ c\"\n"
        "@witness K\n"
        "@table t\n"
        "@argument a places=1 start=0;30 step=0;30\n"
        "@column c places=2\n"
        "@rows\n"
        "0;30 | 0;1,? {was 0;1,2} {damaged} {doubt} {interlinear} {note \"said \\\"so\\\"\"}\n");
  CheckRoundTrip(file.tables);
}

TEST_CASE("an id that is not a word cannot be written") {
  apograph::Transcription t;
  t.work.id = "w";
  t.witness.siglum = "K";
  t.table_id = "two words";
  CHECK_THROWS_AS(apograph::WriteTranscription(t), apograph::InputError);
}

TEST_CASE("a TAB inside a quoted value survives the round trip") {
  // Found by the fuzz target: TAB is text, not a control character to drop.
  const auto file = apograph::ParseTranscription(
      "@work w\n@witness K\n@table t kind=\"mean\tmotion\"\n@argument a\n@column c\n@rows\n"
      "1 | 2 {note \"a\tb\"}\n",
      "t.apo");
  CheckRoundTrip(file.tables);
}
