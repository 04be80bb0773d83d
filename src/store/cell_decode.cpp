// Reading `revision_cells.rows` back (DecodeRevisionRows in cell_json.hpp): a small
// strict JSON reader for the encoding documented in schema/014_revision_cells.sql
// and 001_edition.sql.
// Bytes inside strings are copied as they are (only escapes are decoded),
// so a reading comes back byte for byte as it was imported.
#include "store/cell_json.hpp"

#include <charconv>
#include <limits>

#include "store/database.hpp"

namespace apograph::store {
namespace {

class Reader {
 public:
  explicit Reader(std::string_view text) : text_(text) {}

  [[noreturn]] void Fail(const char* expected) const {
    // A revision's text runs to many kilobytes: quote what surrounds the fault.
    const std::size_t from = pos_ > 80 ? pos_ - 80 : 0;
    throw StoreError("the database holds rows of cells it cannot read (expected " +
                     std::string(expected) + " at byte " + std::to_string(pos_) + ", near '" +
                     std::string(text_.substr(from, 160)) + "')");
  }
  void SkipSpace() {
    while (pos_ < text_.size() && (text_[pos_] == ' ' || text_[pos_] == '\n' ||
                                   text_[pos_] == '\t' || text_[pos_] == '\r')) {
      ++pos_;
    }
  }
  /// Consumes `c` (after blanks) when it is next.
  bool Take(char c) {
    SkipSpace();
    if (pos_ < text_.size() && text_[pos_] == c) {
      ++pos_;
      return true;
    }
    return false;
  }
  void Expect(char c, const char* what) {
    if (!Take(c)) Fail(what);
  }
  bool AtEnd() {
    SkipSpace();
    return pos_ == text_.size();
  }
  bool NextIsString() {
    SkipSpace();
    return pos_ < text_.size() && text_[pos_] == '"';
  }

  std::int64_t Integer() {
    SkipSpace();
    std::int64_t v = 0;
    const char* begin = text_.data() + pos_;
    const auto [end, ec] = std::from_chars(begin, text_.data() + text_.size(), v);
    if (ec != std::errc() || end == begin) Fail("an integer");
    pos_ += static_cast<std::size_t>(end - begin);
    return v;
  }

  std::string String() {
    std::string out;
    StringInto(out);
    return out;
  }
  /// Reads a string into `out` (replacing what it held): a cell's reading
  /// goes straight into its place, no string built in between.
  void StringInto(std::string& out) {
    out.clear();
    Expect('"', "a string");
    for (;;) {
      const std::size_t start = pos_;
      while (pos_ < text_.size() && text_[pos_] != '"' && text_[pos_] != '\\') ++pos_;
      out.append(text_.data() + start, pos_ - start);
      if (pos_ >= text_.size()) Fail("the end of a string");
      if (text_[pos_++] == '"') return;
      Escape(out);
    }
  }

 private:
  void Escape(std::string& out) {
    if (pos_ >= text_.size()) Fail("an escape");
    const char c = text_[pos_++];
    switch (c) {
      case '"':
      case '\\':
      case '/':
        out += c;
        return;
      case 'b':
        out += '\b';
        return;
      case 'f':
        out += '\f';
        return;
      case 'n':
        out += '\n';
        return;
      case 'r':
        out += '\r';
        return;
      case 't':
        out += '\t';
        return;
      case 'u':
        break;
      default:
        Fail("an escape");
    }
    std::uint32_t code = Hex4();
    if (code >= 0xD800 && code < 0xDC00 && text_.substr(pos_, 2) == "\\u") {
      pos_ += 2;
      const std::uint32_t low = Hex4();
      if (low < 0xDC00 || low > 0xDFFF) Fail("a low surrogate");
      code = 0x10000 + ((code - 0xD800) << 10) + (low - 0xDC00);
    }
    AppendUtf8(out, code);
  }
  std::uint32_t Hex4() {
    if (pos_ + 4 > text_.size()) Fail("four hex digits");
    std::uint32_t v = 0;
    const auto [end, ec] = std::from_chars(text_.data() + pos_, text_.data() + pos_ + 4, v, 16);
    if (ec != std::errc() || end != text_.data() + pos_ + 4) Fail("four hex digits");
    pos_ += 4;
    return v;
  }
  static void AppendUtf8(std::string& out, std::uint32_t c) {
    if (c < 0x80) {
      out += static_cast<char>(c);
    } else if (c < 0x800) {
      out += static_cast<char>(0xC0 | (c >> 6));
      out += static_cast<char>(0x80 | (c & 0x3F));
    } else if (c < 0x10000) {
      out += static_cast<char>(0xE0 | (c >> 12));
      out += static_cast<char>(0x80 | ((c >> 6) & 0x3F));
      out += static_cast<char>(0x80 | (c & 0x3F));
    } else {
      out += static_cast<char>(0xF0 | (c >> 18));
      out += static_cast<char>(0x80 | ((c >> 12) & 0x3F));
      out += static_cast<char>(0x80 | ((c >> 6) & 0x3F));
      out += static_cast<char>(0x80 | (c & 0x3F));
    }
  }

  std::string_view text_;
  std::size_t pos_ = 0;
};

/// One entry of the details object, read into `c`; `value` collects "value".
void ReadDetail(Reader& in, const std::string& key, Cell& c, std::optional<std::string>& value) {
  if (key == "state") {
    const auto state = CellStateFromString(in.String());
    if (!state) in.Fail("a cell state");
    c.state = *state;
  } else if (key == "value") {
    value = in.String();
  } else if (key == "places") {
    c.places = static_cast<int>(in.Integer());
  } else if (key == "line") {
    c.line = static_cast<int>(in.Integer());
  } else if (key == "damaged") {
    c.damaged = in.Integer() != 0;
  } else if (key == "doubtful") {
    c.doubtful = in.Integer() != 0;
  } else if (key == "addition") {
    const auto addition = AdditionFromString(in.String());
    if (!addition) in.Fail("margin or interlinear");
    c.addition = *addition;
  } else if (key == "corrected_from") {
    c.corrected_from = in.String();
  } else if (key == "note") {
    c.note = in.String();
  } else {
    in.Fail("a known key");
  }
}

/// One cell into `c`, a fresh Cell in its place in the row.
void ReadCell(Reader& in, int column_places, int row_line, Cell& c) {
  c.places = column_places;
  c.line = row_line;
  in.Expect('[', "a cell");
  in.StringInto(c.raw);
  in.Expect(',', "a comma");
  c.column = static_cast<int>(in.Integer());
  std::optional<std::string> value;
  if (in.Take(',')) {
    in.Expect('{', "an object");
    if (!in.Take('}')) {
      do {
        const std::string key = in.String();
        in.Expect(':', "a colon");
        ReadDetail(in, key, c, value);
      } while (in.Take(','));
      in.Expect('}', "the end of an object");
    }
  }
  in.Expect(']', "the end of a cell");
  if (c.places < 0 || c.places > Sexagesimal::kMaxPlaces) in.Fail("0 to 12 places");
  if (c.line < 0 || c.column < 0) in.Fail("a line and column of 0 or more");
  if (c.state == CellState::kRead) {
    c.value = Sexagesimal::Parse(value ? *value : c.raw);
    if (!c.value) in.Fail("a read cell's exact value");
  } else if (value) {
    in.Fail("no value for a cell not read");
  }
}

/// One row, `[line,argument,cell,...]`, appended to `t.rows`.
void ReadRow(Reader& in, Transcription& t) {
  in.Expect('[', "a row");
  const auto line = in.Integer();
  if (line < 0 || line > std::numeric_limits<int>::max()) in.Fail("a line of 0 or more");
  Row& row = t.rows.emplace_back();
  row.line = static_cast<int>(line);
  in.Expect(',', "a comma");
  ReadCell(in, t.argument.places, row.line, row.argument);
  row.cells.reserve(t.columns.size());
  while (in.Take(',')) {
    if (row.cells.size() == t.columns.size()) in.Fail("one cell per column");
    const int places = t.columns[row.cells.size()].places;
    ReadCell(in, places, row.line, row.cells.emplace_back());
  }
  in.Expect(']', "the end of the row");
  if (row.cells.size() != t.columns.size()) in.Fail("one cell per column");
}

}  // namespace

void DecodeRevisionRows(std::string_view json, Transcription& t) {
  Reader in(json);
  in.Expect('[', "an array of rows");
  if (!in.Take(']')) {
    do {
      ReadRow(in, t);
    } while (in.Take(','));
    in.Expect(']', "the end of the rows");
  }
  if (!in.AtEnd()) in.Fail("the end of the text");
}

}  // namespace apograph::store
