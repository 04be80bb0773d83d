// Whole files read as text, with a size limit (ReadTextFile, parser.hpp):
// for transcriptions, sheets and manifests alike.
#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <algorithm>
#include <array>
#include <cerrno>

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
  // One open and one fstat per file (an import reads thousands of small
  // sheets: three path look-ups and an ifstream were 8% of it, measured).
  const int fd = ::open(path.c_str(), O_RDONLY | O_CLOEXEC);
  if (fd < 0)
    throw InputError::ForFile(path,
                              "expected a readable file, found none (missing or not permitted)");
  struct Closer {
    int fd;
    ~Closer() { ::close(fd); }
  } closer{fd};
  struct stat st {};
  if (::fstat(fd, &st) == 0 && S_ISDIR(st.st_mode))
    throw InputError::ForFile(path, "expected " + what + ", found a directory");
  // Read in chunks up to the limit: a device (/dev/zero) has no size to ask.
  // A regular file's size reserves the string once; each chunk is appended
  // as read (resizing by a whole chunk first zero-filled a mebibyte for
  // every small sheet: a fifth of importing 1,000 sheets, measured).
  std::string text;
  if (S_ISREG(st.st_mode) && st.st_size >= 0)
    text.reserve(std::min(static_cast<std::size_t>(st.st_size), max_bytes) + 1);
  constexpr std::size_t kChunk = std::size_t{1} << 16;
  std::array<char, kChunk> chunk;
  for (;;) {
    const ssize_t n = ::read(fd, chunk.data(), kChunk);
    if (n < 0 && errno == EINTR) continue;
    if (n < 0) throw InputError::ForFile(path, "expected a readable file, found a read error");
    if (n == 0) break;
    text.append(chunk.data(), static_cast<std::size_t>(n));
    if (text.size() > max_bytes) {
      throw InputError::ForFile(path, "expected " + what + " of at most " + SizeWords(max_bytes) +
                                          ", found more (raise the limit with --max-file-mb)");
    }
  }
  return text;
}

}  // namespace apograph
