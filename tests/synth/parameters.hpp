#pragma once
/// Parameters of a drawn table: round sexagesimal values, values that look
/// attested in a tradition (recalled, "from memory"), and at a small share
/// non-round values, each recorded with its basis.

#include <string>

#include "families.hpp"
#include "random.hpp"
#include "tables.hpp"

namespace apograph::synth {

/// A parameter from its text in the trade's notation.
Parameter MakeParameter(const std::string& role, const std::string& text, const std::string& basis);

/// The family's function: its variant and parameters.
Function DrawFunction(Family family, Rng& rng, const TableOptions& options);

/// A mean motion's daily rate, one of the recalled ones (six places).
Parameter DrawDailyRate(Rng& rng, const TableOptions& options);

}  // namespace apograph::synth
