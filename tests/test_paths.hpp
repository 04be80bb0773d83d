#pragma once
/// Paths the tests need: the source tree (for shipped files) and the binary
/// under test. Defined in test_paths.cpp only, so that the other test files
/// compile identically wherever the source tree sits.

#include <string>

namespace apograph::testing {
const std::string& SourceDir();
const std::string& BinaryPath();
}  // namespace apograph::testing

#define APOGRAPH_SOURCE_DIR (::apograph::testing::SourceDir())
#define APOGRAPH_BINARY (::apograph::testing::BinaryPath())
