// Linked into the binaries of a sanitizer build only (APOGRAPH_SANITIZE): a
// sanitizer's report must never read as exit code 1 ("success with
// findings") to a test or a script, so each sanitizer exits with its own code.
// The environment (ASAN_OPTIONS, UBSAN_OPTIONS) can still add options.

extern "C" {
// Called by the AddressSanitizer runtime at start-up.
const char* __asan_default_options() { return "exitcode=86:detect_leaks=1"; }
// Called by the UndefinedBehaviorSanitizer runtime at start-up.
const char* __ubsan_default_options() { return "exitcode=87:halt_on_error=1:print_stacktrace=1"; }
}
