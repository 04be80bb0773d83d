#pragma once
/// Where the shipped data (numeral scripts, parameter catalog, demo corpus)
/// is found.

#include <filesystem>
#include <string>
#include <vector>

namespace apograph {

/// The file a build tree writes beside its programs, naming the source
/// tree's data folder (`corpora/`).
inline constexpr const char* kBuildDataFile = "apograph-data-dir.txt";

/// The folder of the running program (Linux: /proc/self/exe); empty when
/// it cannot be read.
std::filesystem::path ProgramDir();

/// The data folder, found at run time so that a moved or installed program
/// keeps it: `APOGRAPH_DATA` when set; else `../share/apograph` beside the
/// program (an installed program); else the folder a build tree names in
/// kBuildDataFile beside its programs (or one folder up). Nothing is
/// compiled in, so that objects compile identically wherever the tree sits.
std::string DataDir();

/// The folder of the numeral scripts: `APOGRAPH_SCRIPTS` when set, else
/// `DataDir()/scripts`.
std::string ScriptDir();

/// The names of the numeral scripts in `dir` (files NAME.script), sorted;
/// what a witness may declare as `script=`.
std::vector<std::string> ScriptNames(const std::string& dir = ScriptDir());

}  // namespace apograph
