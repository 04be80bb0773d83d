#pragma once
/// Where commands may write. Every file a command writes goes through here,
/// so that none lands outside the folder the editor named, over the open
/// edition database, or over an existing file without --force; a write goes
/// through a temporary file and a rename, and the temporary (and a Graphviz
/// child) does not outlive an interrupted command.

#include <filesystem>
#include <functional>
#include <string>
#include <vector>

namespace apograph::cli {

/// What a command that writes files knows about where it may write.
struct OutputRules {
  std::string option;    ///< the option that named the file or folder (for messages)
  std::string database;  ///< the open edition database: never written over
  bool force = false;    ///< --force: an existing file may be replaced
  /// Called with each file's path before anything of it is written (demo
  /// keeps its manifest this way, so that a killed run is cleaned up next time).
  std::function<void(const std::filesystem::path&)> before_write;
};

/// Creates the folder `dir` (and its parents) unless it exists; InputError
/// naming `option` when it is a file or cannot be made.
void MakeOutputFolder(const std::filesystem::path& dir, const std::string& option = "--output");

/// Throws InputError (naming rules.option) unless `path` may be written: not
/// the database (by filesystem identity), not a folder, not an existing file
/// unless rules.force, in a folder that exists.
void CheckOutputFile(const std::filesystem::path& path, const OutputRules& rules);

/// `dir / (id + suffix)` once `id` is known to name a plain file inside `dir`
/// (a safe id: no '/', no '..', not absolute; the database may be older than
/// that rule or edited). InputError naming rules.option otherwise.
std::filesystem::path FileInFolder(const std::filesystem::path& dir, const std::string& id,
                                   const std::string& suffix, const OutputRules& rules);

/// Writes `text` to `path` (checked by CheckOutputFile) through a temporary
/// file beside it and a rename: a failure leaves no half-written file.
void WriteOutputFile(const std::filesystem::path& path, const std::string& text,
                     const OutputRules& rules);

/// The temporary files a write of `path` may leave when killed outright.
std::vector<std::filesystem::path> TemporariesOf(const std::filesystem::path& path);

/// Renders DOT into `svg_path` (checked by CheckOutputFile) with Graphviz;
/// false when `dot` is not installed. dot runs as a child that dies with
/// this process. Throws std::runtime_error when dot fails.
bool RenderSvgFile(const std::string& dot, const std::filesystem::path& svg_path,
                   const OutputRules& rules);

}  // namespace apograph::cli
