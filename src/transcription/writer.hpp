#pragma once
/// Writing transcriptions back as text in the canonical layout of
/// grammar/transcription.ebnf (used by `apograph export`).
///
/// Guarantee: ParseTranscription(WriteTranscription(tables)) yields tables
/// with SameContent() as the input, provided the tables came from the
/// parser or the CSV reader (ids are words without blanks, raw readings are
/// readings). Cell readings are written as typed (Cell::raw), so nothing the
/// editor wrote is normalised away. Control characters in free text (notes,
/// titles) are written as blanks, since a line cannot hold them.

#include <string>
#include <vector>

#include "edition/transcription.hpp"

namespace apograph {

/// All tables, one `@table` section each; `@work` and `@witness` lines are
/// written whenever they change from the previous table. Throws InputError
/// when an id cannot be written as a bare word.
std::string WriteTranscription(const std::vector<Transcription>& tables);

/// One table with its `@work` and `@witness` lines.
std::string WriteTranscription(const Transcription& table);

/// A quoted attribute value: `"a \"b\" \\ c"`.
std::string QuoteValue(const std::string& text);

}  // namespace apograph
