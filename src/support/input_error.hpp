#pragma once
/// The one exception type for recoverable input errors, and warnings.
///
/// Every message about a user's file has the same shape, tested word for word:
///
///     FILE:LINE:COL: error: expected ..., found ...
///     <the offending line>
///     <caret under the column>
///
/// Lines and columns are 1-based; columns count characters (UTF-8 code
/// points), so the caret stands under the right symbol.

#include <cstddef>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace apograph {

/// A position in a source file with the text of its line.
struct SourcePosition {
  std::string file;
  int line = 0;    ///< 1-based; 0 when the message concerns the whole file
  int column = 0;  ///< 1-based; 0 when there is no useful column
  std::string line_text;
};

enum class Severity { kError, kWarning };

/// One positioned message.
struct Diagnostic {
  Severity severity = Severity::kError;
  SourcePosition where;
  std::string message;  ///< e.g. "expected a place from 0 to 59, found '60'"

  /// The three-line rendering described above (one line when there is no
  /// line text).
  std::string Render() const;
};

/// Thrown for bad input; carries one or more diagnostics (the first is the
/// headline). main() maps it to exit code 2.
class InputError : public std::runtime_error {
 public:
  explicit InputError(Diagnostic diagnostic);
  explicit InputError(std::vector<Diagnostic> diagnostics);
  /// An error about a file as a whole (unreadable, empty, not UTF-8).
  static InputError ForFile(const std::string& file, const std::string& message);
  /// An error about a command-line value: "--param: expected NAME=VALUE, found 'x'".
  static InputError ForOption(const std::string& option, const std::string& message);

  const std::vector<Diagnostic>& diagnostics() const { return diagnostics_; }
  /// All diagnostics rendered, one after another.
  std::string Render() const;

 private:
  std::vector<Diagnostic> diagnostics_;
};

/// "expected X, found Y" with Y quoted unless it is a description such as
/// "end of line".
std::string ExpectedFound(const std::string& expected, const std::string& found);

/// Longest line echoed under a message, in bytes: a longer one is shown as
/// a window around the column with "..." for what is left out (judgement:
/// a terminal line or two; the position is in the headline anyway).
inline constexpr std::size_t kEchoedLineBytes = 160;
/// Longest text quoted whole in a message ("found '...'"), in bytes.
inline constexpr std::size_t kQuotedTextBytes = 60;

/// `'text'`, or its first kQuotedTextBytes bytes (whole UTF-8 sequences)
/// followed by `...' (N bytes)` when longer.
std::string QuotedText(std::string_view text);

}  // namespace apograph
