// The heap setting `main` makes before anything else (support/allocator.hpp).
#include <doctest/doctest.h>

#include <cstdlib>

#include "support/allocator.hpp"

// AddressSanitizer serves malloc with its own allocator, which ignores the
// C library's settings (GCC defines __SANITIZE_ADDRESS__, Clang has the
// feature test).
#if defined(__SANITIZE_ADDRESS__)
#define APOGRAPH_OWN_ALLOCATOR 1
#elif defined(__has_feature)
#if __has_feature(address_sanitizer)
#define APOGRAPH_OWN_ALLOCATOR 1
#endif
#endif

TEST_CASE("the heap keeps freed memory for reuse on glibc (a batch command's tables)") {
#if defined(APOGRAPH_OWN_ALLOCATOR)
  // The sanitizer's allocator: the setting does not apply, and nothing to check.
  (void)apograph::KeepFreedMemory();
#elif defined(__GLIBC__)
  // A build that silently skipped the setting (its guard not seeing glibc)
  // cost fit --all a quarter of its CPU time in page faults.
  CHECK(apograph::KeepFreedMemory());
#else
  CHECK_FALSE(apograph::KeepFreedMemory());
#endif
}
