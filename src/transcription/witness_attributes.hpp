#pragma once
/// A `@witness` directive's attributes, as the transcription parser and the
/// sheet manifest both read them.

#include <string>

#include "edition/transcription.hpp"
#include "transcription/parser.hpp"
#include "transcription/syntax.hpp"

namespace apograph::transcription {

/// Applies one attribute to `w`; returns what is wrong with its value (a
/// script that is not among `read`'s, a kind that is none of manuscript,
/// print or modern-edition), or an empty string. A date is kept as written
/// (the caller warns when it cannot be read).
std::string ApplyWitnessAttribute(WitnessInfo& w, const AttributeAst& a, const ReadOptions& read);

}  // namespace apograph::transcription
