// CSV sheets drawn at random (delimiters, quoting, blanks, line ends, empty
// lines, readings with multi-byte characters): every cell's reading, value,
// line and column as the sheet shows them, and the same table whether the
// reader is given the text or reads the file (which keeps the file's text).
#include <doctest/doctest.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <random>
#include <string>
#include <utility>
#include <vector>

#include "transcription/csv.hpp"

using apograph::CellState;
using apograph::CsvOptions;
using apograph::Sexagesimal;

namespace {

/// What the sheet shows in one cell, written by the draw.
struct Expected {
  std::string raw;  ///< trimmed reading, `_` for an empty field
  CellState state = CellState::kRead;
  Sexagesimal::Units units = 0;  ///< the value in units of its last place, when read
  int places = 1;
  int line = 0;
  int column = 0;  ///< 1-based, in characters
};

int Characters(const std::string& s) {
  int n = 0;
  for (char c : s) n += (static_cast<unsigned char>(c) & 0xC0) != 0x80;
  return n;
}

struct DrawnSheet {
  std::string text;
  std::vector<std::vector<Expected>> rows;  ///< argument first, then e1, e2
};

/// A reading of one fractional place in one of the forms sheets use.
Expected DrawReading(std::mt19937& draw) {
  Expected e;
  const int d = static_cast<int>(draw() % 100), m = static_cast<int>(draw() % 60);
  const std::string dm = std::to_string(d) + ";" + std::to_string(m);
  e.units = d * 60 + m;
  switch (draw() % 9) {
    case 0:
      e.raw = "\xE2\x88\x92" + dm;  // U+2212, the minus sign
      e.units = -e.units;
      break;
    case 1:
      e.raw = std::to_string(d) + "\xC2\xB0" + std::to_string(m) + "'";  // degree form
      break;
    case 2:
      e.raw = "?", e.state = CellState::kIllegible;
      break;
    case 3:
      e.raw = "_", e.state = CellState::kBlank;  // written as an empty field
      break;
    case 4:
      e.raw = std::to_string(d) + ";?", e.state = CellState::kPartial;
      break;
    case 5:
      e.raw = ";" + std::to_string(m), e.units = m;  // the whole 0 dropped
      break;
    case 6:
      e.raw = "-" + dm, e.units = -e.units;
      break;
    default:
      e.raw = dm;
  }
  return e;
}

DrawnSheet DrawSheet(std::mt19937& draw) {
  const char delimiter = ",;\t"[draw() % 3];
  DrawnSheet sheet;
  std::string& text = sheet.text;
  if (draw() % 5 == 0) text += "\xEF\xBB\xBF";  // a byte order mark
  const std::string eol = draw() % 2 ? "\n" : "\r\n";
  text += std::string("a") + delimiter + "e1" + delimiter + "e2" + eol;
  int line = 2;
  const int rows = 1 + static_cast<int>(draw() % 12);
  for (int r = 1; r <= rows; ++r) {
    while (draw() % 6 == 0) {  // empty lines between rows
      text += (draw() % 2 ? " " : "") + eol;
      ++line;
    }
    std::string out;
    std::vector<Expected> cells;
    for (int k = 0; k < 3; ++k) {
      Expected e;
      if (k == 0) {
        e.raw = std::to_string(r), e.units = r, e.places = 0;
      } else {
        e = DrawReading(draw);
      }
      e.line = line;
      if (k > 0) out += delimiter;
      const std::string written = e.raw == "_" ? "" : e.raw;
      const bool quoted = written.find(delimiter) != std::string::npos || draw() % 3 == 0;
      const std::string before(draw() % 3, ' '), inside(draw() % 2, ' '), after(draw() % 3, ' ');
      out += before;
      if (quoted) out += '"';
      out += inside;
      // An empty field's position is after all its blanks (inside its quotes).
      e.column = 1 + Characters(written.empty() ? out + inside + (quoted ? "" : after) : out);
      out += written + inside;
      if (quoted) out += '"';
      out += after;
      cells.push_back(e);
    }
    text += out + eol;
    sheet.rows.push_back(cells);
    ++line;
  }
  return sheet;
}

void CheckCell(const apograph::Cell& cell, const Expected& e) {
  CHECK(cell.raw == e.raw);
  CHECK(cell.line == e.line);
  CHECK(cell.column == e.column);
  CHECK(cell.state == e.state);
  REQUIRE(cell.value.has_value() == (e.state == CellState::kRead));
  if (cell.value) CHECK(cell.value->Identical(Sexagesimal::FromUnits(e.units, e.places)));
}

}  // namespace

TEST_CASE("drawn CSV sheets: readings, values and positions as written, from text or file") {
  std::mt19937 draw(1515);  // fixed seed: the same sheets on every run
  const auto dir =
      std::filesystem::temp_directory_path() / ("apograph_csv_drawn_" + std::to_string(::getpid()));
  std::filesystem::create_directories(dir);
  CsvOptions options;
  options.head.table_id = "sun-eq";
  options.head.witness.siglum = "K";
  // The rows a batch import hands on from sheet to sheet; the first from a
  // transcription with marks, notes and corrections, which must not leak.
  apograph::Transcription spare;
  apograph::Cell marked;
  marked.raw = "1;2", marked.damaged = true, marked.doubtful = true, marked.note = "ink";
  marked.corrected_from = "1;3", marked.addition = apograph::Addition::kMargin;
  for (int r = 0; r < 20; ++r) {
    apograph::Row& row = spare.rows.emplace_back();
    row.argument = marked;
    row.cells.assign(static_cast<std::size_t>(1 + r % 4), marked);
  }
  int cells = 0;
  for (int n = 0; n < 400; ++n) {
    const DrawnSheet sheet = DrawSheet(draw);
    const std::string path = (dir / "sheet.csv").string();
    { std::ofstream(path, std::ios::binary) << sheet.text; }
    INFO("sheet ", n, ":\n", sheet.text);
    const auto from_text = apograph::ReadCsv(sheet.text, path, options);
    const auto from_file = apograph::ReadCsvFile(path, options);
    REQUIRE(from_text.tables.size() == 1);
    REQUIRE(from_file.tables.size() == 1);
    const auto& t = from_text.tables[0];
    const auto& f = from_file.tables[0];
    CHECK(t.source_text == sheet.text);
    CHECK(f.source_text == sheet.text);
    CHECK(t.rows == f.rows);
    auto reused = apograph::ReadCsvFile(path, options, spare);
    REQUIRE(reused.tables.size() == 1);
    CHECK(reused.tables[0].rows == t.rows);
    CHECK(reused.tables[0].source_text == sheet.text);
    CHECK(spare.rows.empty());
    spare.rows = std::move(reused.tables[0].rows);  // as the import hands them on
    REQUIRE(t.rows.size() == sheet.rows.size());
    for (std::size_t r = 0; r < t.rows.size(); ++r) {
      const auto& expected = sheet.rows[r];
      CHECK(t.rows[r].line == expected[0].line);
      CheckCell(t.rows[r].argument, expected[0]);
      REQUIRE(t.rows[r].cells.size() == 2);
      CheckCell(t.rows[r].cells[0], expected[1]);
      CheckCell(t.rows[r].cells[1], expected[2]);
      cells += 3;
    }
  }
  std::filesystem::remove_all(dir);
  CHECK(cells > 3000);
}
