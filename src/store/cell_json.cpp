#include "store/cell_json.hpp"

#include <algorithm>
#include <charconv>

#include "store/value_text.hpp"

namespace apograph::store {
namespace {

void AppendInt(std::string& out, long long v) {
  char buffer[24];
  const auto end = std::to_chars(buffer, buffer + sizeof buffer, v).ptr;
  out.append(buffer, static_cast<std::size_t>(end - buffer));
}

bool NeedsEscape(unsigned char c) { return c < 0x20 || c == '"' || c == '\\'; }

/// Opens the details object or continues it: `,{"key":` or `,"key":`.
void Key(std::string& out, bool& open, const char* key) {
  out += open ? ",\"" : ",{\"";
  open = true;
  out += key;
  out += "\":";
}

bool HasMarks(const Cell& c) {
  return c.damaged || c.doubtful || c.addition != Addition::kNone || c.corrected_from ||
         !c.note.empty();
}

/// `["<value>",<column>]` in one append: canonical value text holds only
/// digits, `-`, `;` and `,`, nothing to escape.
void AppendPlainCell(std::string& out, std::string_view value, int column) {
  char buffer[kValueTextSize + 32];
  char* p = buffer;
  *p++ = '[';
  *p++ = '"';
  p = std::copy(value.begin(), value.end(), p);
  *p++ = '"';
  *p++ = ',';
  p = std::to_chars(p, buffer + sizeof buffer - 1, column).ptr;
  *p++ = ']';
  out.append(buffer, static_cast<std::size_t>(p - buffer));
}

/// The editor's marks, only those present.
void AppendMarks(std::string& out, bool& open, const Cell& c) {
  if (c.damaged) {
    Key(out, open, "damaged");
    out += '1';
  }
  if (c.doubtful) {
    Key(out, open, "doubtful");
    out += '1';
  }
  if (c.addition != Addition::kNone) {
    Key(out, open, "addition");
    AppendJsonString(out, ToString(c.addition));
  }
  if (c.corrected_from) {
    Key(out, open, "corrected_from");
    AppendJsonString(out, *c.corrected_from);
  }
  if (!c.note.empty()) {
    Key(out, open, "note");
    AppendJsonString(out, c.note);
  }
}

}  // namespace

void AppendJsonString(std::string& out, std::string_view text) {
  out += '"';
  std::size_t plain = 0;  // start of the run of bytes not yet copied
  for (std::size_t i = 0; i < text.size(); ++i) {
    const auto c = static_cast<unsigned char>(text[i]);
    if (!NeedsEscape(c)) continue;
    out.append(text.data() + plain, i - plain);
    plain = i + 1;
    if (c == '"' || c == '\\') {
      out += '\\';
      out += static_cast<char>(c);
    } else {
      static constexpr char kHex[] = "0123456789abcdef";
      out += "\\u00";
      out += kHex[c >> 4];
      out += kHex[c & 15];
    }
  }
  out.append(text.data() + plain, text.size() - plain);
  out += '"';
}

void AppendCellJson(std::string& out, const Cell& c, int column_places, int row_line) {
  char value_text[kValueTextSize];
  const std::string_view value = c.state == CellState::kRead && c.value
                                     ? FormatValue(*c.value, value_text)
                                     : std::string_view();
  const bool canonical = !value.empty() && value == c.raw;
  if (canonical && c.places == column_places && c.line == row_line && !HasMarks(c)) {
    AppendPlainCell(out, value, c.column);  // most cells: no escaping needed
    return;
  }
  out += '[';
  AppendJsonString(out, c.raw);
  out += ',';
  AppendInt(out, c.column);
  bool open = false;
  if (c.state != CellState::kRead) {
    Key(out, open, "state");
    AppendJsonString(out, ToString(c.state));
  } else if (!value.empty() && !canonical) {
    Key(out, open, "value");
    AppendJsonString(out, value);
  }
  if (c.places != column_places) {
    Key(out, open, "places");
    AppendInt(out, c.places);
  }
  if (c.line != row_line) {
    Key(out, open, "line");
    AppendInt(out, c.line);
  }
  AppendMarks(out, open, c);
  if (open) out += '}';
  out += ']';
}

void AppendRowJson(std::string& out, const Transcription& t, const Row& row) {
  const int line = row.argument.line;
  out += '[';
  AppendInt(out, line);
  out += ',';
  AppendCellJson(out, row.argument, t.argument.places, line);
  for (std::size_t k = 0; k < row.cells.size(); ++k) {
    out += ',';
    AppendCellJson(out, row.cells[k], t.columns[k].places, line);
  }
  out += ']';
}

void EncodeRowArguments(std::string& out, const Transcription& t) {
  out.clear();
  out += '[';
  char text[kValueTextSize];
  for (std::size_t r = 0; r < t.rows.size(); ++r) {
    if (r) out += ',';
    if (const auto argument = t.ArgumentInUse(r)) {
      out += '"';
      out += FormatValue(*argument, text);  // canonical notation: nothing to escape
      out += '"';
    } else {
      out += "null";
    }
  }
  out += ']';
}

void EncodeRevisionRows(std::string& out, const Transcription& t) {
  out.clear();
  out += '[';
  for (std::size_t r = 0; r < t.rows.size(); ++r) {
    if (r) out += ',';
    AppendRowJson(out, t, t.rows[r]);
  }
  out += ']';
}

}  // namespace apograph::store
