#pragma once
// The demo's transcriptions (corpora/demo: an invented tradition, 4 tables x
// 5 witnesses), read once per call: what the tests' demo databases import.
#include <string>
#include <vector>

#include "edition/transcription.hpp"
#include "test_paths.hpp"
#include "transcription/parser.hpp"

namespace apograph::testing {

inline std::vector<Transcription> DemoTranscriptions() {
  std::vector<Transcription> all;
  for (const char* siglum : {"A", "B", "C", "D", "E"}) {
    auto parsed = ReadTranscriptionFile(std::string(APOGRAPH_SOURCE_DIR) + "/corpora/demo/" +
                                        siglum + ".apo");
    for (auto& t : parsed.tables) all.push_back(std::move(t));
  }
  return all;
}

}  // namespace apograph::testing
