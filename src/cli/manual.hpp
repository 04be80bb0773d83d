#pragma once
/// The manual page and the shell completion, written from the same command
/// table and option descriptions as `--help` (so the three cannot drift).

#include <iosfwd>

namespace apograph::cli {

/// The manual page (roff, section 1): every command's summary, usage and
/// options as `apograph COMMAND --help` prints them, the exit codes, the
/// data folder and its overrides.
void WriteManPage(std::ostream& out);

/// A bash completion script: command names, then each command's options.
void WriteBashCompletion(std::ostream& out);

}  // namespace apograph::cli
