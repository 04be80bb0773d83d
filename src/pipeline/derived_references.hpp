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

/// A derived relation counts as this many free parameters when its score is
/// set against the model identified for the column. Judgement, by analogy
/// with identify, which counts the choice of an interpolation grid (one of a
/// few spans and origins) as one parameter: the relation is one choice
/// among a few dozen (span, fraction, rounding); the source's own
/// parameters are paid for by the source column.
inline constexpr int kDerivedPenalised = 1;

/// Replaces the identified reference of every column computed from other
/// columns (estimate::DetectDerivedColumns on each witness, with the
/// source references' rounded and exact values) by a derived reference
/// when, on the witness the model was identified from, it scores at least
/// as high as the model by identify's score (estimate::Score: entries
/// reproduced, a copyist's slip at its probability, each free parameter
/// paid for) on the rows both compute; a model fitted to the column itself
/// with several parameters keeps most entries of a column of small
/// differences within one unit, so within-one counts alone prefer it to a
/// relation that reproduces far more entries exactly. Adds per-witness
/// variants where witnesses follow different computations (rounded
/// entries, their own entries, exact values).
void AddDerivedReferences(const std::vector<const Transcription*>& witnesses,
                          std::vector<ColumnReference>& references);

}  // namespace apograph::pipeline::internal
