#include "support/allocator.hpp"

#include <cstdlib>  // defines __GLIBC__ on glibc

#if defined(__GLIBC__)
#include <malloc.h>
#endif

namespace apograph {

bool KeepFreedMemory() {
#if defined(__GLIBC__)
  return mallopt(M_TRIM_THRESHOLD, static_cast<int>(kKeptFreeHeap)) == 1;
#else
  return false;
#endif
}

}  // namespace apograph
