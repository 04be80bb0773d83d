#pragma once
// Internal to the pipeline: a reference moved to one witness's columns.

#include <optional>

#include "edition/transcription.hpp"
#include "pipeline/reference.hpp"

namespace apograph::pipeline::internal {

/// The reference with its column index moved to `witness`'s own column of
/// that name; nullopt when the witness lacks the column.
inline std::optional<ColumnReference> ForWitness(const ColumnReference& ref,
                                                 const Transcription& witness) {
  const int c = witness.ColumnIndex(ref.column_name);
  if (c < 0) return std::nullopt;
  ColumnReference r = ref;
  r.column = c;
  return r;
}

}  // namespace apograph::pipeline::internal
