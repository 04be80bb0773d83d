#pragma once
/// Internal to the store: writes an exact value in canonical trade notation
/// without allocating (the cell insert loop runs a million times a second).

#include <string_view>

#include "number/sexagesimal.hpp"

namespace apograph::store {

/// Room for the longest canonical value: sign, 13 integer digits and 12
/// places of ",NN".
inline constexpr int kValueTextSize = 64;

/// Writes `value` into `buffer` exactly as Sexagesimal::ToString() does
/// (`2;23,10`, `-0;5`, `90`) and returns the written text.
std::string_view FormatValue(const Sexagesimal& value, char (&buffer)[kValueTextSize]);

}  // namespace apograph::store
