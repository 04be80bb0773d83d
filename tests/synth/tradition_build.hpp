#pragma once
// Internal to tests/synth: the steps of a tradition draw (tradition.cpp:
// the tree; tradition_text.cpp: the texts along it; dates.cpp).

#include "tradition.hpp"

namespace apograph::synth::internal {

/// A catalogue's way of writing `year` for a witness of that kind.
CatalogueDate DrawDate(int year, WitnessKind kind, Rng& rng);

/// Copies the texts down the tree (nodes in order: exemplars first):
/// exemplars merged where contaminated, corrections, own slips,
/// recognition slips for digitised witnesses.
void CopyTexts(Tradition& tradition, const TraditionOptions& options, Rng& rng);

}  // namespace apograph::synth::internal
