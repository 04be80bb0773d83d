#pragma once
/// The alphabet of the names that later become parts of file names: work,
/// table and witness ids, and numeral script names (a script is read from
/// `<scripts>/<name>.script`, a report is written as `<table>.md`).
///
/// A safe id is 1 to 64 characters: ASCII letters and digits, '-', '_' and
/// '.', or any non-ASCII character (so Greek or Hebrew sigla stay possible);
/// it starts with a letter, a digit or a non-ASCII character and holds no
/// "..". So no id can carry '/', '\', '..' or an absolute path into a file
/// name, nor start like an option ('-') or a hidden file ('.').

#include <cstddef>
#include <string_view>

namespace apograph {

/// The rule above in words, for messages ("expected an id of ..., found ...").
inline constexpr const char* kSafeIdRule =
    "letters, digits, '-', '_' or '.' (starting with a letter or digit, no '..', at most 64 "
    "characters)";

/// Longest safe id in characters (judgement: far above any siglum or table
/// name in use, far below a file system's 255 bytes).
inline constexpr std::size_t kMaxIdCharacters = 64;

/// True when `id` follows the rule above. `id` is assumed to be UTF-8.
bool IsSafeId(std::string_view id);

}  // namespace apograph
