#pragma once
/// Which witness took the second exemplar. A copyist who changed exemplar
/// part-way leaves a pattern of shared errors that looks the same from
/// three places: the mixed witness C follows X in one stretch and Y in
/// another; but the relative whose line C changed to (or its exemplar,
/// whose copies changed away from it) shares errors with C in one stretch
/// and with its own relatives in the other too. The criteria of
/// relations.hpp read one witness at a time and may name the wrong one.
///
/// The test: divide a witness in two at the stretches (two taxa, each
/// unknown outside its part) and find the most parsimonious stemma again.
/// Dividing the witness that changed exemplar lets each part join its own
/// exemplar's line and removes the conflicts the change made; dividing a
/// witness that copied along one line removes little. Of the flagged
/// witness and its two relatives, the one whose division shortens the
/// stemma most is taken to have changed exemplar. A witness's copies, which
/// inherit a change it made, are divided with it. Measured on the lineage
/// benchmark (seeds 1-300, characters built anew at ef3664e; DEVELOPERS.md,
/// "Lineage accuracy", seventeenth round): contamination precision 0.711 ->
/// 0.800, witnesses rightly called 81 -> 80, false alarms on uncontaminated
/// draws 6 of 300 unchanged; groups and copies unchanged.
#include <string>
#include <vector>

#include "lineage/characters.hpp"
#include "lineage/parsimony.hpp"
#include "lineage/relations.hpp"

namespace apograph::lineage {

/// The weighted length the stemma loses when `siglum` is divided at the
/// stretches of `c` that follow its second relative (characters nearest to
/// such a stretch go to the second part).
double DivisionGain(const CharacterMatrix& matrix, const Contamination& c,
                    const std::string& siglum, const ParsimonyOptions& options);

/// Called mixtures whose division gains less than dividing one of their two
/// relatives at the same stretches (by more than kDivisionMargin): not
/// called; each is returned in `refused`, its text saying why. One whose
/// relative's division gains more, but within the margin, stays called and
/// its text names that relative as the other possible reading.
std::vector<Contamination> KeepDividingWitnesses(const CharacterMatrix& matrix,
                                                 std::vector<Contamination> called,
                                                 std::vector<Contamination>* refused);

/// Weight by which a relative's division must beat the witness's own
/// (the heuristic search is not exact, and a relative's division carries
/// its copies along). Measured on seeds 1-100 and 201-300 of the lineage
/// benchmark: 0 and 1 refuse three witnesses rightly called whose
/// relative gained 4 more (two copies of one exemplar that both changed
/// exemplar at one row make dividing the exemplar explain both); 4 keeps
/// them; 8 refuses too few (precision 0.784 and 0.706 against 0.800 and
/// 0.750).
inline constexpr double kDivisionMargin = 4;

}  // namespace apograph::lineage
