// libFuzzer target for the transcription parser, the writer and the CSV
// reader. Build (clang only):
//   CXX=clang++ cmake -S . -B build-fuzz -DAPOGRAPH_FUZZ=ON -DAPOGRAPH_TESTS=OFF
//   cmake --build build-fuzz --target transcription_fuzz
//   ./build-fuzz/transcription_fuzz -max_total_time=600 corpus-copy/
// (seed corpus: tests/fuzz/corpus/transcription/).
// Any input must either parse or throw InputError; a parsed input must write
// back to text that parses to the same content.
#include <cstdint>
#include <cstdlib>
#include <string_view>

#include "transcription/csv.hpp"
#include "transcription/parser.hpp"
#include "transcription/writer.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view text(reinterpret_cast<const char*>(data), size);
  apograph::ReadOptions read;  // a fixed list: no directory listing per input
  read.scripts = std::vector<std::string>{"greek-alphabetic", "hindu-arabic"};
  try {
    const auto file = apograph::ParseTranscription(text, "fuzz.apo", read);
    const std::string written = apograph::WriteTranscription(file.tables);
    const auto again = apograph::ParseTranscription(written, "written.apo", read);
    if (again.tables.size() != file.tables.size()) std::abort();
    for (std::size_t i = 0; i < file.tables.size(); ++i) {
      if (!again.tables[i].SameContent(file.tables[i])) std::abort();
    }
  } catch (const apograph::InputError& e) {
    (void)e.Render();
  }
  try {
    apograph::CsvOptions options;
    options.head.table_id = "t";
    options.head.witness.siglum = "K";
    options.read = read;
    (void)apograph::ReadCsv(text, "fuzz.csv", options);
  } catch (const apograph::InputError& e) {
    (void)e.Render();
  }
  return 0;
}
