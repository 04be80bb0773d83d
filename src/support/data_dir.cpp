#include "support/data_dir.hpp"

#include <cstdlib>

namespace apograph {

std::string DataDir() {
  const char* env = std::getenv("APOGRAPH_DATA");
  return env && *env ? env : APOGRAPH_DATA_DIR;
}

}  // namespace apograph
