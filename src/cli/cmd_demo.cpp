// Placeholder until this subcommand is written: it refuses plainly.
#include "cli/command.hpp"

#include <ostream>

namespace apograph::cli {

extern const char kDemoUsage[] = "apograph demo (not yet available)";

int RunDemo(const std::vector<std::string>& args, Io& io) {
  (void)args;
  io.err << "apograph demo: not yet available in this build\n";
  return kInternal;
}

}  // namespace apograph::cli
