#pragma once
/// The argument of a drawn table: regular steps (1, 0;30, 3;45, 6, 10 ...)
/// or, for mean motions, irregular lists (single days, then tens, hundreds,
/// thousands; months; expanded and collected years).

#include "families.hpp"
#include "random.hpp"
#include "tables.hpp"

namespace apograph::synth {

/// A regular argument `start, start + step, ...` of `count` rows.
ArgumentKey RegularArgument(const std::string& name, const std::string& unit,
                            const Sexagesimal& start, const Sexagesimal& step, int count);

/// The argument for a function. `full_range`: a sign-changing family over
/// its whole range (0..360, or 0..180 for a cosine) rather than a quadrant
/// or half. Irregular lists are drawn for mean motions at
/// `options.share_irregular_mean_motion`.
ArgumentKey DrawArgument(const Function& function, bool full_range, Rng& rng,
                         const TableOptions& options);

}  // namespace apograph::synth
