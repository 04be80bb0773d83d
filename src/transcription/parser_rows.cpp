// The transcription parser's row lines: cells read (cell_x3.cpp), the
// argument checked against the table's step, and the sequence of arguments
// checked when the table closes (duplicates and rows out of step warned).
#include "transcription/parser_internal.hpp"

namespace apograph::transcription {

void Parser::RowLine(std::string_view line, std::size_t at) {
  if (phase_ != Phase::kRows) {
    if (phase_ == Phase::kLayout) {
      Fail(line, at, "expected @rows before the first row, found " + FoundToken(line, at));
    }
    Fail(line, at,
         std::string("expected a directive (") + kDirectives + "), found " + FoundToken(line, at));
  }
  Row row;
  row.line = line_no_;
  row.cells.reserve(table_.columns.size());
  std::size_t argument_offset = 0;
  try {
    ParseRowCells(line, at, row, argument_offset);
  } catch (const LineError& e) {
    Fail(line, e.offset, e.message);
  }
  CheckArgument(row, line, argument_offset);
  table_.rows.push_back(std::move(row));
  row_sources_.push_back({line, argument_offset});
  table_end_ = line_start_ + line.size();
}

void Parser::ParseRowCells(std::string_view line, std::size_t pos, Row& row,
                           std::size_t& argument_offset) {
  ColumnCounter columns(line);
  const std::size_t wanted = table_.columns.size();
  for (std::size_t n = 0;; ++n) {
    if (n > wanted) {
      while (pos < line.size() && IsBlank(line[pos])) ++pos;
      throw LineError{pos, "expected " + std::to_string(wanted) + " value cells (" + ColumnList() +
                               "), found an extra cell"};
    }
    const bool is_argument = n == 0;
    const int places = is_argument ? table_.argument.places : table_.columns[n - 1].places;
    Cell& cell = is_argument ? row.argument : row.cells.emplace_back();
    std::size_t offset = 0;
    const ReadingInfo info = ParseCell(line, pos, places, cell, offset, is_argument);
    cell.places = places;
    cell.line = line_no_;
    cell.column = columns.At(offset);
    if (is_argument) argument_offset = offset;
    const bool has_places = info.state == CellState::kRead || info.state == CellState::kPartial;
    if (has_places && info.fraction_places != places) {
      const std::string where = is_argument ? "the argument '" + table_.argument.name + "'"
                                            : "column '" + table_.columns[n - 1].name + "'";
      throw LineError{offset, "expected a reading with " + PlacesWords(places) + " in " + where +
                                  ", found " + Quote(cell.raw) + " (" +
                                  PlacesWords(info.fraction_places) + ")"};
    }
    if (pos >= line.size() || line[pos] == '#') break;
    ++pos;  // the '|'
  }
  if (row.cells.size() < wanted) {
    std::size_t end = pos;
    while (end > 0 && IsBlank(line[end - 1])) --end;
    throw LineError{end, "expected " + std::to_string(wanted) + " value cells (" + ColumnList() +
                             "), found " + std::to_string(row.cells.size())};
  }
}

void Parser::CheckArgument(const Row& row, std::string_view line, std::size_t offset) {
  const Cell& a = row.argument;
  if (a.state != CellState::kRead) return;
  // Every argument has the argument's places, so units compare exactly.
  auto [it, inserted] = seen_arguments_.emplace(a.value->units(), line_no_);
  if (!inserted) {
    out_.warnings.push_back(Make(Severity::kWarning, line_no_, line, offset,
                                 "expected each argument once, found " + ArgumentText(a) +
                                     " again (first in line " + std::to_string(it->second) + ")"));
  }
}

// Arguments are evidence, so a break in their sequence is a warning, said
// once where it happens: a miscopied argument (the row keeps its place), or a
// gap or a step back in the sequence (rows missing or out of order).
void Parser::CheckSequence() {
  if (!table_.argument.step) {
    row_sources_.clear();
    return;
  }
  const Sexagesimal step = *table_.argument.step;
  std::optional<Sexagesimal> previous;
  for (std::size_t i = 0; i < table_.rows.size(); ++i) {
    const Row& row = table_.rows[i];
    const RowSource& src = row_sources_[i];
    std::optional<Sexagesimal> in_use, expected;
    try {
      in_use = table_.ArgumentInUse(i);
      expected = previous ? std::optional(*previous + step) : table_.argument.start;
    } catch (const std::overflow_error&) {
      // Beyond the range of exact values: nothing to compare.
      in_use.reset();
      expected.reset();
    }
    const auto& written = row.argument.value;
    if (written && in_use && *written != *in_use) {
      out_.warnings.push_back(Make(Severity::kWarning, row.line, src.line, src.argument_offset,
                                   "expected argument " + in_use->ToString() +
                                       " (it breaks the sequence of its neighbours), found " +
                                       ArgumentText(row.argument) +
                                       "; the row is taken as argument " + in_use->ToString()));
    } else if (written && in_use && expected && *in_use != *expected) {
      const std::string why =
          *in_use > *expected ? "a row seems to be missing" : "rows out of order";
      out_.warnings.push_back(Make(Severity::kWarning, row.line, src.line, src.argument_offset,
                                   "expected argument " + expected->ToString() + ", found " +
                                       ArgumentText(row.argument) + " (" + why + ")"));
    }
    previous = in_use ? in_use : expected;
  }
  row_sources_.clear();
}

}  // namespace apograph::transcription
