#pragma once
/// Values the editor gives on the command line (an override's reading) read
/// exactly like a transcription's cell, so that nothing is stored that a
/// transcription could not hold.

#include <string>

namespace apograph {

/// Parses `text` as the reading of a cell in a column of `places` places
/// (trade, degree or blank-separated form; places 0 to 59) and requires a
/// value read in full with exactly `places` places. Returns the value in
/// trade notation (`16;41,57`). Throws InputError naming `option`, with the
/// character where the reading fails.
std::string ParseEditorReading(const std::string& option, const std::string& text, int places);

}  // namespace apograph
