// Reading a CSV sheet in one pass: records are cut into fields that point
// into the text (only a quoted field with a doubled quote is copied), and
// each field is read into its cell at once, so a sheet reads at the speed of
// the transcription parser. The sheet's layout (which fields make which
// column: joins) is planned from the header before the first row.
#include "transcription/csv.hpp"

#include <algorithm>
#include <filesystem>

#include "edition/names.hpp"
#include "support/tabular.hpp"
#include "transcription/csv_internal.hpp"
#include "transcription/parser.hpp"

namespace apograph {
namespace transcription::csv {
namespace {

/// The delimiter found most often outside quotes in the first line.
char DetectDelimiter(std::string_view text) {
  std::size_t counts[3] = {0, 0, 0};
  const char kCandidates[3] = {',', ';', '\t'};
  bool quoted = false;
  for (char c : text) {
    if (c == '"') quoted = !quoted;
    if (!quoted && c == '\n') break;
    for (int i = 0; i < 3; ++i) counts[i] += !quoted && c == kCandidates[i];
  }
  const auto best = std::max_element(counts, counts + 3) - counts;
  return counts[best] > 0 ? kCandidates[best] : ',';
}

}  // namespace

void CsvReader::CheckFieldCount(const std::vector<Field>& record) const {
  const std::size_t n = plan_.fields;
  if (record.size() == n) return;
  const std::string message = "expected " + std::to_string(n) +
                              " fields (the argument and one per column), found " +
                              std::to_string(record.size());
  if (record.size() < n) Fail(record.back(), record.back().text.size(), message);
  Fail(record[n], 0, message);
}

/// Arguments written with fewer places than the most any has (`1` beside
/// `1;30`) take those places; the raw text stays as written.
void CsvReader::FinishArgument(Transcription& t) {
  if (plan_.columns[0].places) return;
  t.argument.places = argument_places_;
  for (auto& row : t.rows) {
    Cell& a = row.argument;
    a.places = argument_places_;
    if (a.value) a.value = a.value->Extended(argument_places_);
  }
}

/// A sheet whose columns say degrees, minutes (and seconds) of one value is
/// refused unless the editor joined them or chose to keep them apart: three
/// value columns imported without a word would be wrong everywhere after.
void CsvReader::CheckPartColumns(const std::vector<Field>& header, const Transcription& t) const {
  if (options_.keep_columns || !options_.joins.empty()) return;
  for (const auto& g : transcription::csv::FindPartGroups(header)) {
    if (!LooksLikeParts(g, t)) continue;
    std::string parts, list;
    for (std::size_t k = 0; k < g.count; ++k) {
      const std::string name = plan_.header_names[g.first + k];
      parts += (k ? "+" : "") + name;
      list += (k ? ", '" : "'") + name + "'";
    }
    Fail(header[g.first], 0,
         "expected one column per value, found columns " + list +
             " that read as the degrees, minutes" + (g.count == 3 ? " and seconds" : "") +
             " of one value; join them with --join '" + g.name + "=" + parts +
             "' or keep them apart with --keep-columns");
  }
}

/// True when the later parts hold whole numbers 0..59 and the first whole
/// numbers, on every row where they are read.
bool CsvReader::LooksLikeParts(const transcription::csv::PartGroup& g,
                               const Transcription& t) const {
  std::size_t read = 0;
  for (const auto& row : t.rows) {
    for (std::size_t k = 0; k < g.count; ++k) {
      const std::size_t field = g.first + k;
      const Cell& c = field == 0 ? row.argument : row.cells[field - 1];
      if (!c.value) continue;
      if (c.value->places() != 0) return false;
      if (k > 0 && (c.value->negative() || c.value->units() > 59)) return false;
      ++read;
    }
  }
  return read > 0;
}

Transcription CsvReader::MakeHead(const std::vector<Field>& header) const {
  const Transcription& head = options_.head;
  auto id = [](const std::string& value, const char* option, const char* what) {
    if (value.empty()) {
      throw InputError::ForOption(option,
                                  std::string("expected ") + what + " of the sheet, found none");
    }
    if (!IsSafeId(value)) {
      throw InputError::ForOption(option, std::string("expected ") + what + " of " + kSafeIdRule +
                                              ", found " + QuotedText(value));
    }
  };
  id(head.table_id, "--table", "a table id");
  id(head.witness.siglum, "--witness", "a siglum");
  if (!head.work.id.empty()) id(head.work.id, "--work", "a work id");
  if (!head.witness.script.empty()) {
    const std::string problem = CheckScriptName(head.witness.script, options_.read);
    if (!problem.empty()) throw InputError::ForOption("--script", problem);
  }
  if (!head.witness.kind.empty() && !WitnessKindFromString(head.witness.kind)) {
    throw InputError::ForOption("--kind", "expected manuscript, print or modern-edition, found " +
                                              QuotedText(head.witness.kind));
  }
  Transcription t;
  t.work = head.work;
  if (t.work.id.empty()) t.work.id = head.table_id;
  t.table_id = head.table_id;
  t.table_title = head.table_title;
  t.kind = head.kind;
  t.witness = head.witness;
  t.folios = head.folios;
  t.hand = head.hand;
  t.source_file = file_;
  t.argument = head.argument;
  t.argument.name = plan_.columns[0].name;
  if (!head.argument.name.empty() && head.argument.name != t.argument.name) {
    Fail(header[0], 0,
         "expected the argument '" + head.argument.name + "' as declared for this sheet, found " +
             QuotedText(t.argument.name));
  }
  t.argument.places = plan_.columns[0].places.value_or(0);
  for (std::size_t c = 1; c < plan_.columns.size(); ++c) {
    ColumnSpec column;
    column.name = plan_.columns[c].name;
    for (const auto& declared : head.columns) {
      if (declared.name == column.name) column.unit = declared.unit, column.title = declared.title;
    }
    t.columns.push_back(std::move(column));
  }
  for (const auto& declared : head.columns) {
    if (t.ColumnIndex(declared.name) < 0) {
      Fail(header[0], 0,
           "expected a column '" + declared.name + "' as declared for this sheet, found none");
    }
  }
  return t;
}

TranscriptionFile CsvReader::Run() {
  if (text_.empty()) FailEmpty("expected a CSV sheet, found an empty file");
  const std::size_t line_ends =
      transcription::CheckText(text_, file_, options_.read.max_line_bytes);
  if (text_.substr(0, 3) == "\xEF\xBB\xBF") pos_ = line_start_ = 3;
  delimiter_ = options_.delimiter ? options_.delimiter : DetectDelimiter(text_.substr(pos_));
  std::vector<Field> header, record;
  if (!NextRecord(header)) FailEmpty("expected a header row, found only empty lines");
  for (const auto& f : header) plan_.header_names.push_back(std::string(Trimmed(f.text)));
  unquoted_header_ = std::move(unquoted_);  // header fields stay valid
  try {
    static_cast<Plan&>(plan_) = transcription::csv::PlanColumns(header, options_);
  } catch (const transcription::csv::HeaderError& e) {
    Fail(header[e.field], e.offset, e.message);
  }
  first_line_.assign(plan_.columns.size(), 0);
  Transcription t = MakeHead(header);
  // The rows of the sheet before, reused where they stand: a spare row keeps
  // its cells' memory (a fresh vector per row was a malloc and a free per
  // row, 7% of importing 1,000 sheets), and reused in place it is not moved
  // (moving each spare row into a fresh vector was 8% of that import).
  t.rows = std::move(spare_);
  std::size_t used = 0;
  // One allocation for the rows (a line is at most one row): growing the
  // vector by doubling left the heap so that each run faulted in its cells
  // afresh (csv_bench alone: 1.0 M cells/s CPU, 8 M with the reservation).
  t.rows.reserve(line_ends + 1);
  while (NextRecord(record)) {
    CheckFieldCount(record);
    Row& row = used < t.rows.size() ? t.rows[used] : t.rows.emplace_back();
    ++used;
    row.argument = Cell();
    row.cells.clear();
    row.line = record[0].line;
    ReadCell(record, 0, row.argument);
    row.cells.resize(plan_.columns.size() - 1);  // each read in its place
    for (std::size_t c = 1; c < plan_.columns.size(); ++c) ReadCell(record, c, row.cells[c - 1]);
  }
  t.rows.resize(used);  // the spare rows this sheet did not need
  if (t.rows.empty()) {
    Fail(header[0], 0, "expected at least one row after the header, found none");
  }
  FinishArgument(t);
  for (std::size_t c = 1; c < plan_.columns.size(); ++c) {
    t.columns[c - 1].places = plan_.columns[c].places.value_or(0);
  }
  for (auto& row : t.rows) {  // columns whose places were fixed after some blanks
    for (std::size_t c = 0; c < row.cells.size(); ++c) row.cells[c].places = t.columns[c].places;
  }
  if (plan_.columns.size() == plan_.fields) CheckPartColumns(header, t);
  // The file's text itself when the reader holds it (a copy of every sheet
  // otherwise); text_ is not used after this.
  t.source_text = owns_ ? std::move(owned_) : std::string(text_);
  TranscriptionFile out;
  out.tables.push_back(std::move(t));
  return out;
}

std::string CsvReading(const Cell& cell) {
  if (cell.state == CellState::kBlank) return "";
  if (cell.state == CellState::kIllegible) return "?";
  if (!cell.raw.empty()) return cell.raw;
  return cell.value ? cell.value->ToString() : "?";
}

}  // namespace transcription::csv

TranscriptionFile ReadCsv(std::string_view text, const std::string& file,
                          const CsvOptions& options) {
  return transcription::csv::CsvReader(text, file, options).Run();
}

TranscriptionFile ReadCsvFile(const std::string& path, const CsvOptions& options) {
  std::string text = ReadTextFile(path, options.read.max_file_bytes, "a CSV sheet");
  return transcription::csv::CsvReader(std::move(text), path, options).Run();
}

TranscriptionFile ReadCsvFile(const std::string& path, const CsvOptions& options,
                              Transcription& spare) {
  std::string text = ReadTextFile(path, options.read.max_file_bytes, "a CSV sheet");
  transcription::csv::CsvReader reader(std::move(text), path, options);
  reader.ReuseRows(std::move(spare.rows));
  spare.rows.clear();
  return reader.Run();
}

std::string WriteCsv(const Transcription& table) {
  std::string out = CsvField(table.argument.name);
  for (const auto& c : table.columns) out += "," + CsvField(c.name);
  out += '\n';
  for (const auto& row : table.rows) {
    out += CsvField(transcription::csv::CsvReading(row.argument));
    for (const auto& cell : row.cells) out += "," + CsvField(transcription::csv::CsvReading(cell));
    out += '\n';
  }
  return out;
}

}  // namespace apograph
