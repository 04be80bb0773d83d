// Whole files read as text, with a size limit (ReadTextFile, parser.hpp):
// for transcriptions, sheets and manifests alike.
#include <algorithm>
#include <array>
#include <filesystem>
#include <fstream>

#include "transcription/parser.hpp"

namespace apograph {
namespace {

std::string SizeWords(std::size_t bytes) {
  if (bytes >= (std::size_t{1} << 20) && bytes % (std::size_t{1} << 20) == 0)
    return std::to_string(bytes >> 20) + " MB";
  return std::to_string(bytes) + " bytes";
}

}  // namespace

std::string ReadTextFile(const std::string& path, std::size_t max_bytes, const std::string& what) {
  std::error_code ec;
  if (std::filesystem::is_directory(path, ec)) {
    throw InputError::ForFile(path, "expected " + what + ", found a directory");
  }
  std::ifstream in(path, std::ios::binary);
  if (!in)
    throw InputError::ForFile(path,
                              "expected a readable file, found none (missing or not permitted)");
  // Read in chunks up to the limit: a device (/dev/zero) has no size to ask.
  // A regular file's size reserves the string once; each chunk is appended
  // as read (resizing by a whole chunk first zero-filled a mebibyte for
  // every small sheet: a fifth of importing 1,000 sheets, measured).
  std::string text;
  if (std::filesystem::is_regular_file(path, ec)) {
    const auto size = std::filesystem::file_size(path, ec);
    if (!ec) text.reserve(static_cast<std::size_t>(std::min<std::uintmax_t>(size, max_bytes) + 1));
  }
  constexpr std::size_t kChunk = std::size_t{1} << 16;
  std::array<char, kChunk> chunk;
  while (in) {
    in.read(chunk.data(), static_cast<std::streamsize>(kChunk));
    text.append(chunk.data(), static_cast<std::size_t>(in.gcount()));
    if (text.size() > max_bytes) {
      throw InputError::ForFile(path, "expected " + what + " of at most " + SizeWords(max_bytes) +
                                          ", found more (raise the limit with --max-file-mb)");
    }
  }
  if (in.bad()) throw InputError::ForFile(path, "expected a readable file, found a read error");
  return text;
}

}  // namespace apograph
