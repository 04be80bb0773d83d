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

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "edition/transcription.hpp"
#include "support/input_error.hpp"

namespace apograph {

/// Limits and name lists a reader checks its input against. The defaults
/// suit any real transcription (a million cells is about 10 MB, the widest
/// real table a few kilobytes a line) and keep junk from exhausting memory
/// (judgement); `import --max-file-mb/--max-line-kb` raise them.
struct ReadOptions {
  std::size_t max_file_bytes = std::size_t{512} << 20;  ///< 512 MiB
  std::size_t max_line_bytes = std::size_t{1} << 20;    ///< 1 MiB
  /// The numeral scripts a witness may declare; nullopt: ScriptNames() (the
  /// files in the scripts folder), read when the first script= is met.
  std::optional<std::vector<std::string>> scripts;
};

/// Checks a numeral script name against `options.scripts` (or the scripts
/// folder); returns the message "expected a numeral script (...), found
/// 'x'" when it is not one, or an empty string.
std::string CheckScriptName(const std::string& name, const ReadOptions& options);

/// Reads a whole file as text, refusing more than `max_bytes` (a device such
/// as /dev/zero included). `what` names the kind of file in messages ("a
/// transcription file"). Throws InputError.
std::string ReadTextFile(const std::string& path, std::size_t max_bytes, const std::string& what);

/// Parses the text of a transcription file. `file_name` is used in messages
/// and copied into every Transcription::source_file. The text must be UTF-8
/// (a leading byte order mark is skipped); NUL and control characters other
/// than TAB are rejected with their position.
/// Throws InputError on the first error.
TranscriptionFile ParseTranscription(std::string_view text, const std::string& file_name,
                                     const ReadOptions& options = {});

/// Reads and parses a file. Unreadable files, directories, empty files,
/// non-UTF-8 text and binary content are reported as InputError, never as a
/// crash.
TranscriptionFile ReadTranscriptionFile(const std::string& path, const ReadOptions& options = {});

}  // namespace apograph
