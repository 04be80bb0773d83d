#pragma once
/// Where the shipped data (numeral scripts, parameter catalog, demo corpus)
/// is found.

#include <string>
#include <vector>

namespace apograph {

/// The data folder: `APOGRAPH_DATA` when set, else the folder compiled in.
/// Defined in one translation unit only, so that the rest of the library
/// compiles identically wherever the source tree sits.
std::string DataDir();

/// The folder of the numeral scripts: `APOGRAPH_SCRIPTS` when set, else
/// `DataDir()/scripts`.
std::string ScriptDir();

/// The names of the numeral scripts in `dir` (files NAME.script), sorted;
/// what a witness may declare as `script=`.
std::vector<std::string> ScriptNames(const std::string& dir = ScriptDir());

}  // namespace apograph
