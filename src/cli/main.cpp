// The thin entry point: everything else is in the library.
#include <unistd.h>

#include <iostream>

#include "cli/command.hpp"
#include "support/allocator.hpp"

int main(int argc, char** argv) {
  apograph::KeepFreedMemory();  // before any thread: see allocator.hpp
  std::ios::sync_with_stdio(false);
  apograph::cli::Io io{std::cout, std::cerr, isatty(STDOUT_FILENO) != 0,
                       isatty(STDERR_FILENO) != 0};
  const int code = apograph::cli::Dispatch(std::vector<std::string>(argv + 1, argv + argc), io);
  std::cout.flush();
  return code;
}
