#pragma once
// Cells of hand-made transcriptions for tests: a value read in full.
#include <string>

#include "edition/transcription.hpp"
#include "number/sexagesimal.hpp"

namespace apograph::testing {

inline Sexagesimal S(const std::string& text) { return Sexagesimal::ParseOrThrow(text); }

/// A cell that reads `text` in full (its places those written).
inline Cell ValueCell(const std::string& text) {
  Cell c;
  c.raw = text;
  c.value = S(text);
  c.places = c.value->places();
  return c;
}

}  // namespace apograph::testing
