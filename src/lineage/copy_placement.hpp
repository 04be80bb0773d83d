#pragma once
/// Copies read against a stemma: which candidate copies stand beside their
/// exemplar (a direct copy), and the surviving exemplar drawn above its copy.

#include <string>
#include <vector>

#include "lineage/relations.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

/// One exemplar per copy (ChooseCopies) among the candidates of `oriented`
/// that stand beside the copy in `s`; ties go to `undecided`.
std::vector<CopyCandidate> AdjacentCopies(const Stemma& s, const CharacterMatrix& oriented,
                                          const std::vector<std::string>& correctors,
                                          std::vector<std::string>& undecided);

/// Each surviving exemplar found beside its copy is drawn above it.
void PlaceExemplars(Stemma& s, const std::vector<CopyCandidate>& copies);

}  // namespace apograph::lineage
