#pragma once
/// Where the shipped data (numeral scripts, parameter catalog, demo corpus)
/// is found.

#include <string>

namespace apograph {

/// The data folder: `APOGRAPH_DATA` when set, else the folder compiled in.
/// Defined in one translation unit only, so that the rest of the library
/// compiles identically wherever the source tree sits.
std::string DataDir();

}  // namespace apograph
