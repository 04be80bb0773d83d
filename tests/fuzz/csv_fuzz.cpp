// libFuzzer target for CSV sheets. Build (clang only):
//   CXX=clang++ cmake -S . -B build-fuzz -DAPOGRAPH_FUZZ=ON -DAPOGRAPH_TESTS=OFF
//   cmake --build build-fuzz --target csv_fuzz
//   ./build-fuzz/csv_fuzz -max_total_time=600 -max_len=4096 corpus-copy/
// (seed corpus: tests/fuzz/corpus/csv/). The first byte chooses the reading
// options (delimiter, a join of the second and third columns, places given,
// degree/minute/second columns kept); the rest is the sheet. Any input must
// read or throw InputError; a sheet that reads must hold one cell per column
// in every row and write out as a transcription that parses to the same
// content.
#include <cstdint>
#include <cstdlib>
#include <string_view>

#include "transcription/csv.hpp"
#include "transcription/parser.hpp"
#include "transcription/writer.hpp"

namespace {

apograph::CsvOptions OptionsFrom(std::uint8_t choice, std::string_view sheet) {
  apograph::CsvOptions o;
  o.head.table_id = "t";
  o.head.witness.siglum = "K";
  o.read.scripts = std::vector<std::string>{"hindu-arabic"};
  const char delimiters[4] = {'\0', ',', ';', '\t'};
  o.delimiter = delimiters[choice & 3];
  o.keep_columns = (choice & 4) != 0;
  if (choice & 8) o.places = 2;
  if (choice & 16) {
    // Join the header's 2nd and 3rd names when it has them.
    const std::size_t eol = sheet.find('\n');
    const std::string_view header = sheet.substr(0, eol);
    const char d = o.delimiter ? o.delimiter : ',';
    const std::size_t a = header.find(d);
    const std::size_t b = a == std::string_view::npos ? a : header.find(d, a + 1);
    if (b != std::string_view::npos) {
      const std::size_t c = header.find(d, b + 1);
      const std::string second(header.substr(a + 1, b - a - 1));
      const std::string third(header.substr(b + 1, c == std::string_view::npos ? c : c - b - 1));
      try {
        o.joins.push_back(apograph::ParseColumnJoin("joined=" + second + "+" + third, "--join"));
      } catch (const apograph::InputError&) {
      }
    }
  }
  return o;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  if (size == 0) return 0;
  const std::string_view sheet(reinterpret_cast<const char*>(data) + 1, size - 1);
  const apograph::CsvOptions options = OptionsFrom(data[0], sheet);
  try {
    const auto file = apograph::ReadCsv(sheet, "fuzz.csv", options);
    const auto& t = file.tables.at(0);
    for (const auto& row : t.rows) {
      if (row.cells.size() != t.columns.size()) std::abort();
    }
    const auto again = apograph::ParseTranscription(apograph::WriteTranscription(file.tables),
                                                    "written.apo", options.read);
    if (again.tables.size() != 1 || !again.tables[0].SameContent(t)) std::abort();
  } catch (const apograph::InputError& e) {
    (void)e.Render();
  }
  return 0;
}
