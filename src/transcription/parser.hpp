#pragma once
/// Reading transcription files (the format of grammar/transcription.ebnf).
///
/// The parser checks syntax and everything the format promises beyond it
/// (places 0..59, places per column, cells per row, order of directives) and
/// fills plain `Transcription` values, one per `@table` section. The first
/// error stops the parse and is thrown as an `InputError` positioned at the
/// offending character; warnings (duplicate arguments, arguments that break
/// the declared start/step) are returned beside the tables because arguments
/// are evidence and the rows stay as written.
///
/// Example:
///
///     auto file = apograph::ReadTranscriptionFile("k.apo");
///     for (const auto& t : file.tables) { ... t.rows ... }
///     for (const auto& w : file.warnings) std::cerr << w.Render() << '\n';

#include <string>
#include <string_view>

#include "edition/transcription.hpp"
#include "support/input_error.hpp"

namespace apograph {

/// Parses the text of a transcription file. `file_name` is used in messages
/// and copied into every Transcription::source_file. The text must be UTF-8
/// (a leading byte order mark is skipped); NUL and control characters other
/// than TAB are rejected with their position.
/// Throws InputError on the first error.
TranscriptionFile ParseTranscription(std::string_view text, const std::string& file_name);

/// Reads and parses a file. Unreadable files, directories, empty files,
/// non-UTF-8 text and binary content are reported as InputError, never as a
/// crash.
TranscriptionFile ReadTranscriptionFile(const std::string& path);

}  // namespace apograph
