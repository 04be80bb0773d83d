// The one doctest binary: every tests/**/*_test.cpp is linked in.
#define DOCTEST_CONFIG_IMPLEMENT_WITH_MAIN
#include <doctest/doctest.h>
