#pragma once
// What the two contamination criteria share (relations.cpp: two lines;
// one_line.cpp: one relative in one stretch). Not for other files.

#include <cstddef>
#include <string>
#include <vector>

#include "lineage/relations.hpp"

namespace apograph::lineage::contamination {

// Errors siding with the same relative within this many rows of each
// other count as one slip (a run of a column shifted by a unit, an eye
// skipping down a few rows): judgement from the generator's runs of slips,
// checked on the uncontaminated draws of the lineage benchmark (seeds 1-40:
// four false alarms of the kind before, see DEVELOPERS.md).
inline constexpr int kSameSlipRows = 3;
// Slips (as counted above) on each side. Measured on the lineage benchmark
// (seeds 1-40 with and without contamination): two gave false alarms on 3
// of 40 uncontaminated draws and 6 of 10 flagged witnesses right; three
// give 1 of 40 and 5 of 6.
inline constexpr int kMinSideSlips = 3;

/// Only characters whose direction comes from the model or the majority,
/// of a weight class of 1 or more, not one-unit differences or tie-breaks.
bool Evidence(const Character& ch);
/// C's errors in usable characters (indices); errors in neighbouring rows
/// carried by the same witnesses count once.
std::vector<std::size_t> ErrorsOf(const CharacterMatrix& m, int c);
/// Witnesses holding every one of C's errors where they can be read (two
/// or more): its descendants.
std::vector<bool> Descendants(const CharacterMatrix& m, int c, const std::vector<std::size_t>& e);
/// Whether d's evidence errors are also c's (c descends from d); a copy may
/// lack one in kErrorsPerLackedError.
bool Holds(const CharacterMatrix& m, int c, int d);
/// Adds to `kept` the witnesses the one-line criterion flags beyond `found`
/// (one_line.cpp).
void AddOneLine(const CharacterMatrix& m, const std::vector<Contamination>& found,
                std::vector<Contamination>& kept);
/// Adds to `kept` the witnesses the line-join criterion flags, none of
/// them in `named` (flagged already, or inheriting a mixture) and none
/// with a relative there (its mixture explains the stretch) (line_join.cpp).
void AddLineJoin(const CharacterMatrix& m, const std::vector<std::string>& named,
                 std::vector<Contamination>& kept);

}  // namespace apograph::lineage::contamination
