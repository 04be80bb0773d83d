// The heap setting `main` makes before anything else (support/allocator.hpp).
#include <doctest/doctest.h>

#include <cstdlib>

#include "support/allocator.hpp"

TEST_CASE("the heap keeps freed memory for reuse on glibc (a batch command's tables)") {
#if defined(__GLIBC__)
  // A build that silently skipped the setting (its guard not seeing glibc)
  // cost fit --all a quarter of its CPU time in page faults.
  CHECK(apograph::KeepFreedMemory());
#else
  CHECK_FALSE(apograph::KeepFreedMemory());
#endif
}
