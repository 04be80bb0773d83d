// Built in sanitizer builds only: commits one error of the kind named on the
// command line, so that ctest can check that each sanitizer exits with its
// own code (86 AddressSanitizer, 87 UndefinedBehaviorSanitizer), never 1.
#include <cstring>
#include <vector>

int main(int argc, char** argv) {
  if (argc < 2) return 0;
  if (std::strcmp(argv[1], "heap") == 0) {
    std::vector<int> v(4);
    volatile int* p = v.data();
    return p[argc + 3];  // one past the end
  }
  if (std::strcmp(argv[1], "float-cast") == 0) {
    volatile double big = 1e300 * argc;
    return static_cast<int>(big);
  }
  return 0;
}
