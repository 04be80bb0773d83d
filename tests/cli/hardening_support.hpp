#pragma once
// What the hardening tests share: a scratch folder holding the demo
// tradition's database (corpora/demo, an invented tradition) as edition.sqlite.
#include <filesystem>
#include <string>
#include <vector>

#include "cli_runner.hpp"
#include "demo_corpus.hpp"
#include "store/database.hpp"
#include "store/edition_store.hpp"
#include "test_paths.hpp"
#include "transcription/parser.hpp"

namespace apograph::testing {

/// Imports the demo's transcriptions into `dir`/edition.sqlite.
inline void ImportDemo(const std::filesystem::path& dir) {
  store::Database db((dir / "edition.sqlite").string());
  store::Import(db, DemoTranscriptions());
}

inline bool Contains(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

}  // namespace apograph::testing
