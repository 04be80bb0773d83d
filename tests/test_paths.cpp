#include "test_paths.hpp"

namespace apograph::testing {

const std::string& SourceDir() {
  static const std::string kDir = APOGRAPH_TEST_SOURCE_DIR;
  return kDir;
}

const std::string& BinaryPath() {
  static const std::string kBinary = APOGRAPH_TEST_BINARY;
  return kBinary;
}

}  // namespace apograph::testing
