#pragma once
/// The demo's output folder. `demo` writes a marker file in the folder it
/// uses and lists there every file it writes (before writing it); a later
/// demo removes only the files listed (and the temporaries a killed run may
/// have left beside them), never a file the editor put there, and refuses a
/// folder without the marker unless it is empty.

#include <filesystem>
#include <string>

namespace apograph::cli {

/// The marker and manifest file's name inside the folder.
inline constexpr const char* kDemoMarker = ".apograph-demo";

/// Makes `dir` ready for a demo (created, or cleared of an earlier demo's
/// files); InputError naming --output when it is a file or a folder the
/// demo did not make.
void PrepareDemoFolder(const std::filesystem::path& dir);

/// Lists `file` (inside the folder) in the manifest, before it is written.
void RecordDemoFile(const std::filesystem::path& dir, const std::filesystem::path& file);

}  // namespace apograph::cli
