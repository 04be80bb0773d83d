#pragma once
/// Internal to the pipeline: derived columns as references (see
/// reference.hpp), and the witnesses that follow each computation.

#include <vector>

#include "edition/transcription.hpp"
#include "pipeline/reference.hpp"

namespace apograph::pipeline::internal {

/// A witness must reproduce this many more entries exactly under another
/// computation of a derived column than under the table's to get a
/// variant of its own (at least kVariantEntries, and kVariantShare of its
/// entries). Judgement: one or two entries differ between computations by
/// chance (a copyist's slip that lands on the other basis's value).
inline constexpr int kVariantEntries = 3;
inline constexpr double kVariantShare = 0.05;

/// Replaces the identified reference of every column computed from other
/// columns (estimate::DetectDerivedColumns on each witness, with the
/// source references' rounded and exact values) by a derived reference
/// when it explains at least as many entries within one unit as the model
/// identified; adds per-witness variants where witnesses follow different
/// computations (rounded entries, their own entries, exact values).
void AddDerivedReferences(const std::vector<const Transcription*>& witnesses,
                          std::vector<ColumnReference>& references);

}  // namespace apograph::pipeline::internal
