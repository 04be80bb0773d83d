#pragma once
/// Which parts of a tree the errors actually support. Both methods return
/// fully resolved trees; a group is kept only when some error supports it,
/// judged the same way for every method: contracting the group's branch
/// would make the tree longer under parsimony (Fitch's count, extended to
/// nodes with more than two children) by at least `kMinGroupEvidence`: two
/// common slips or one distinctive error. A group resting on a single slip
/// that copyists make independently is not kept. A witness that adds no
/// change of its own to the tree is drawn at the place of its lost parent:
/// it may be the exemplar of its group, unless its kind or date forbid it
/// (a modern edition above manuscripts, a witness later than another in
/// the group) or it cannot be read at most of the readings that arose below.

#include <vector>

#include "lineage/characters.hpp"
#include "lineage/stemma.hpp"

namespace apograph::lineage {

/// Weighted parsimony length of any rooted tree (root = archetype, no errors).
/// `weights` replaces the characters' weights when not empty.
double FitchLength(const Stemma& stemma, const CharacterMatrix& matrix,
                   const std::vector<double>& weights = {});

/// Judgement: two common slips, or one distinctive error, but not one
/// common slip alone nor two one-unit differences.
inline constexpr double kMinGroupEvidence = 1.5;

/// Contracts every lost inner node whose branch is not supported by
/// `min_evidence` (weight units), then places witnesses without changes of
/// their own; compacts the stemma.
void KeepSupported(Stemma& stemma, const CharacterMatrix& matrix,
                   const std::vector<double>& weights = {},
                   double min_evidence = kMinGroupEvidence);

}  // namespace apograph::lineage
