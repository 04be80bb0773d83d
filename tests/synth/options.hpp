#pragma once
/// Setting any documented proportion by its field name, as
/// `synth_draw --set NAME=VALUE` does: the fields of TableOptions,
/// CopyOptions and TraditionOptions (names are distinct across the three).

#include <string>
#include <vector>

#include "tradition.hpp"

namespace apograph::synth {

/// Sets the option; false when no option has that name. Integer options
/// take the value's integer part, booleans 0 or 1.
bool SetOption(TraditionOptions& options, const std::string& name, double value);
/// Every name SetOption knows.
std::vector<std::string> OptionNames();

}  // namespace apograph::synth
