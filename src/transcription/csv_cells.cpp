// CSV fields read into cells: readings in trade notation, degree/minute/
// second parts joined into one value, the places of each column fixed by
// its readings.
#include "transcription/csv_internal.hpp"

namespace apograph::transcription::csv {

/// Remembers the places of a value column from its first reading, or checks
/// a later reading against them.
void CsvReader::FixPlaces(std::size_t column, const Field& f, const std::string& raw,
                          const ReadingInfo& info) {
  PlannedColumn& c = plan_.columns[column];
  if (!c.places) {
    c.places = info.fraction_places;
    first_line_[column] = f.line;
  } else if (*c.places != info.fraction_places) {
    std::size_t lead = 0;
    Trimmed(f.text, &lead);
    const std::string expected =
        first_line_[column] > 0
            ? PlacesWords(*c.places) + " like the first reading of column '" + c.name + "' (line " +
                  std::to_string(first_line_[column]) + ")"
            : "a reading with " + PlacesWords(*c.places) + " in column '" + c.name + "'";
    Fail(f, lead,
         "expected " + expected + ", found " + QuotedText(raw) + " (" +
             PlacesWords(info.fraction_places) + ")");
  }
}

void CsvReader::ReadCell(const std::vector<Field>& record, std::size_t column, Cell& cell) {
  const PlannedColumn& c = plan_.columns[column];
  if (c.sources.size() > 1) {
    cell = JoinedCell(record, column);
    return;
  }
  const Field& f = record[c.sources[0]];
  std::size_t lead = 0;
  const std::string_view text = Trimmed(f.text, &lead);
  if (text.empty())
    cell.raw = "_";
  else
    cell.raw.assign(text.data(), text.size());
  cell.line = f.line;
  cell.column = ColumnOf(f, lead);
  const bool argument = column == 0;
  const int places = c.places.value_or(-1);
  // Sheets often drop a whole 0 before the semicolon (`;4,10`, `-;9`): the
  // reading is parsed with the 0 restored; the cell keeps what the sheet shows.
  const std::size_t sign = !text.empty() && (text[0] == '-' || text[0] == '+') ? 1 : 0;
  const bool dropped = text.size() > sign && text[sign] == ';';
  std::string restored;
  std::string_view reading = cell.raw;
  if (dropped) {
    restored = cell.raw;
    restored.insert(sign, "0");
    reading = restored;
  }
  ReadingInfo info;
  try {
    info = argument ? transcription::ParseArgumentReading(reading, places, 0)
                    : transcription::ParseReading(reading, places, 0);
  } catch (const LineError& e) {
    Fail(f, lead + (dropped && e.offset > sign ? e.offset - 1 : e.offset), e.message);
  }
  const bool has_places = info.state == CellState::kRead || info.state == CellState::kPartial;
  // An argument written with more places than declared is the same argument
  // when the extra places are zero (`3;0` in a column of whole degrees);
  // the cell keeps what the sheet shows.
  const bool same_value = argument && info.state == CellState::kRead && info.value && c.places &&
                          info.fraction_places > *c.places && info.value->places() > *c.places &&
                          info.value->Rounded(*c.places, Rounding::kTruncate) == *info.value;
  if (same_value) {
    info.value = info.value->Rounded(*c.places, Rounding::kTruncate);
    info.fraction_places = *c.places;
  }
  if (has_places && argument && c.places && info.fraction_places != *c.places) {
    Fail(f, lead,
         "expected a reading with " + PlacesWords(*c.places) + " in the argument '" + c.name +
             "', found " + QuotedText(cell.raw) + " (" + PlacesWords(info.fraction_places) + ")");
  }
  if (has_places && argument) argument_places_ = std::max(argument_places_, info.fraction_places);
  if (has_places && !argument) FixPlaces(column, f, cell.raw, info);
  cell.places = c.places.value_or(info.fraction_places);
  cell.state = info.state;
  cell.value = info.value;
}

/// The parts of a joined column as one reading in the blank-separated form
/// (`12 4 10`), which keeps what the sheet shows.
Cell CsvReader::JoinedCell(const std::vector<Field>& record, std::size_t column) {
  const PlannedColumn& c = plan_.columns[column];
  const Field& first = record[c.sources[0]];
  std::size_t lead = 0;
  Trimmed(first.text, &lead);
  Cell cell;
  cell.line = first.line;
  cell.column = ColumnOf(first, lead);
  cell.places = *c.places;
  // A sheet that drops a whole 0 leaves the degree field empty (or a lone
  // sign) beside filled places: that field reads 0.
  bool later_filled = false;
  for (std::size_t k = 1; k < c.sources.size(); ++k) {
    std::size_t at = 0;
    later_filled = later_filled || !Trimmed(record[c.sources[k]].text, &at).empty();
  }
  std::size_t empty = 0, unknown = 0;
  for (std::size_t k = 0; k < c.sources.size(); ++k) {
    const Field& f = record[c.sources[k]];
    std::size_t at = 0;
    std::string restored;
    std::string_view part = Trimmed(f.text, &at);
    if (k == 0 && later_filled && (part.empty() || part == "-" || part == "+")) {
      restored = std::string(part) + "0";
      part = restored;
    }
    empty += part.empty();
    unknown += part == "?";
    const bool sign = k == 0 && !part.empty() && (part[0] == '-' || part[0] == '+');
    const std::string_view digits = part.substr(sign ? 1 : 0);
    const bool place =
        digits == "?" ||
        (!digits.empty() && digits.find_first_not_of("0123456789") == std::string_view::npos);
    if (!part.empty() && !place) {
      Fail(f, at,
           "expected a whole number or '?' in '" + plan_.header_names[c.sources[k]] +
               "', one place of the joined column '" + c.name + "', found " + QuotedText(part));
    }
    if (!cell.raw.empty()) cell.raw += ' ';
    cell.raw += part.empty() ? std::string_view("?") : part;
  }
  if (empty == c.sources.size()) cell.raw = "_";
  if (unknown == c.sources.size()) cell.raw = "?";
  if (empty > 0 && empty < c.sources.size()) {
    for (std::size_t k = 0; k < c.sources.size(); ++k) {
      const Field& f = record[c.sources[k]];
      std::size_t at = 0;
      if (k > 0 && Trimmed(f.text, &at).empty()) {
        Fail(f, at,
             "expected a whole number or '?' in every part of the joined column '" + c.name +
                 "' (or all parts empty for a blank), found an empty part");
      }
    }
  }
  ReadingInfo info;
  try {
    info = transcription::ParseReading(cell.raw, *c.places, 0);
  } catch (const LineError& e) {
    Fail(first, lead, e.message + " (the joined column '" + c.name + "' reads '" + cell.raw + "')");
  }
  if (column == 0 && info.value) argument_places_ = std::max(argument_places_, *c.places);
  cell.state = info.state;
  cell.value = info.value;
  return cell;
}

int CsvReader::ColumnOf(const Field& f, std::size_t lead) {
  if (f.line_start != counter_start_) {
    // The text from the line's start, not the line cut at its end: a
    // field's reading starts on its first line (blanks are not line
    // breaks), and the counter reads no further than the offset asked for.
    counter_start_ = f.line_start;
    counter_ = ColumnCounter(text_.substr(f.line_start));
  }
  return counter_.At(f.offset + lead);
}

}  // namespace apograph::transcription::csv
