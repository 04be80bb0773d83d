#pragma once
// Test helpers shared by the suite: doctest prints exact values in the
// trade's notation when a check fails.
#include <doctest/doctest.h>

#include "number/sexagesimal.hpp"

namespace doctest {
template <>
struct StringMaker<apograph::Sexagesimal> {
  static String convert(const apograph::Sexagesimal& v) { return v.ToString().c_str(); }
};
}  // namespace doctest
