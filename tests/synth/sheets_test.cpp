// CSV sheets in messy styles: every row means what the key says; the plain
// style is read by the project's CSV reader as the transcription.
#include "synth/sheets.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <set>

#include "synth/tradition.hpp"
#include "test_support.hpp"
#include "transcription/csv.hpp"

namespace synth = apograph::synth;
using apograph::Sexagesimal;

namespace {

// Fields of one CSV line (quotes as RFC 4180).
std::vector<std::string> Split(const std::string& line, char delimiter) {
  std::vector<std::string> out(1);
  bool quoted = false;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const char c = line[i];
    if (c == '"' && quoted && i + 1 < line.size() && line[i + 1] == '"') {
      out.back() += '"';
      ++i;
    } else if (c == '"') {
      quoted = !quoted;
    } else if (c == delimiter && !quoted) {
      out.emplace_back();
    } else {
      out.back() += c;
    }
  }
  return out;
}

std::vector<std::string> Lines(const std::string& text) {
  std::vector<std::string> out;
  std::size_t start = 0;
  for (std::size_t i = text.find('\n'); i != std::string::npos; i = text.find('\n', start)) {
    out.push_back(text.substr(start, i - start));
    start = i + 1;
  }
  return out;
}

// A written value read back by the key's conventions, in trade notation
// ("" blank, "?" illegible, partly legible readings kept with their ?).
std::string Normalised(std::vector<std::string> fields) {
  if (std::all_of(fields.begin(), fields.end(), [](const std::string& f) { return f.empty(); }))
    return "_";
  if (std::all_of(fields.begin(), fields.end(), [](const std::string& f) { return f == "?"; }))
    return "?";
  if (fields.size() == 1) {  // trade notation in one field
    std::string f = fields[0];
    const bool negative = !f.empty() && f[0] == '-';
    if (negative) f = f.substr(1);
    if (f.empty() || f[0] == ';') f = "0" + f;
    fields.clear();
    std::string part;
    for (char c : f + ",") {
      if (c == ';' || c == ',') {
        fields.push_back(part);
        part.clear();
      } else {
        part += c;
      }
    }
    if (negative) fields[0] = "-" + fields[0];
  }
  std::string out;
  for (std::size_t j = 0; j < fields.size(); ++j) {
    std::string f = fields[j];
    if (j == 0 && (f.empty() || f == "-")) f += "0";
    if (j > 0 && f.size() == 2 && f[0] == '0') f = f.substr(1);
    out += (j == 0 ? "" : j == 1 ? ";" : ",") + f;
  }
  return out;
}

double ArgumentValue(const std::string& written) {
  if (written.find('.') != std::string::npos) return std::stod(written);
  return Sexagesimal::ParseOrThrow(written).ToDouble();
}

}  // namespace

TEST_CASE("synth sheets: every written row means what the key says") {
  std::set<std::string> styles;
  for (std::uint64_t seed = 1; seed <= 200; ++seed) {
    synth::Rng rng(seed);
    synth::TraditionOptions o;
    o.witnesses = 4;
    const synth::Tradition t = synth::DrawTradition(rng, o);
    for (const auto& table : t.WitnessTables(t.Surviving().front())) {
      const synth::SheetStyle style = synth::DrawSheetStyle(table, rng);
      const synth::Sheet sheet = synth::WriteSheet(table, style, rng);
      styles.insert(style.arguments);
      styles.insert(std::string("delimiter ") + style.delimiter);
      styles.insert(style.zeros);
      if (style.dms) styles.insert("dms");
      const auto lines = Lines(sheet.text);
      REQUIRE(lines.size() == table.rows.size() + 1);
      for (std::size_t r = 0; r < table.rows.size(); ++r) {
        const auto fields = Split(lines[r + 1], style.delimiter);
        const auto& key_row = sheet.key["rows"][r];
        CHECK(key_row["argument"] == table.rows[r].argument.raw);
        CHECK(ArgumentValue(fields[0]) ==
              doctest::Approx(table.rows[r].argument.value->ToDouble()));
        std::size_t at = 1;
        for (std::size_t c = 0; c < table.columns.size(); ++c) {
          const std::size_t width =
              style.dms ? static_cast<std::size_t>(table.columns[c].places) + 1 : 1;
          const std::vector<std::string> value(fields.begin() + static_cast<long>(at),
                                               fields.begin() + static_cast<long>(at + width));
          at += width;
          CAPTURE(lines[r + 1]);
          CHECK(Normalised(value) == table.rows[r].cells[c].raw);
          CHECK(key_row["cells"][c] == table.rows[r].cells[c].raw);
        }
        CHECK(at == fields.size());
      }
    }
  }
  CHECK(styles == std::set<std::string>{"trade", "decimal", "mixed", "inconsistent-places",
                                        "delimiter ,", "delimiter ;", "plain", "padded", "dropped",
                                        "dms"});
}

TEST_CASE(
    "synth sheets: the plain style is read by the project's CSV reader as the transcription") {
  for (std::uint64_t seed = 1; seed <= 40; ++seed) {
    synth::Rng rng(seed);
    const synth::Tradition t = synth::DrawTradition(rng, {});
    const int w = t.Surviving().back();
    for (const auto& table : t.WitnessTables(w)) {
      const synth::Sheet sheet = synth::WriteSheet(table, synth::SheetStyle{}, rng);
      apograph::CsvOptions options;
      options.head.table_id = table.table_id;
      options.head.witness.siglum = "A";
      for (const auto& c : table.columns) options.column_places[c.name] = c.places;
      options.column_places[table.argument.name] = table.argument.places;
      const auto read = apograph::ReadCsv(sheet.text, "sheet.csv", options);
      REQUIRE(read.tables.size() == 1);
      const auto& rows = read.tables[0].rows;
      REQUIRE(rows.size() == table.rows.size());
      for (std::size_t r = 0; r < rows.size(); ++r) {
        CHECK(rows[r].argument.value == table.rows[r].argument.value);
        for (std::size_t c = 0; c < table.columns.size(); ++c) {
          CHECK(rows[r].cells[c].state == table.rows[r].cells[c].state);
          CHECK(rows[r].cells[c].value == table.rows[r].cells[c].value);
        }
      }
    }
  }
}

TEST_CASE("synth sheets: every messy style imports to the readings of its key") {
  // The editor's options for a sheet: its places per column, and for a sheet
  // with one column per place the --join that makes them one value; the
  // delimiter and the argument notation are detected.
  int sheets = 0, dms = 0, semicolon = 0, decimal = 0;
  for (std::uint64_t seed = 1; seed <= 120; ++seed) {
    synth::Rng rng(seed);
    synth::TraditionOptions o;
    o.witnesses = 4;
    const synth::Tradition t = synth::DrawTradition(rng, o);
    for (const auto& table : t.WitnessTables(t.Surviving().front())) {
      const synth::SheetStyle style = synth::DrawSheetStyle(table, rng);
      const synth::Sheet sheet = synth::WriteSheet(table, style, rng);
      apograph::CsvOptions options;
      options.head.table_id = table.table_id;
      options.head.witness.siglum = "A";
      for (const auto& c : table.columns) options.column_places[c.name] = c.places;
      options.column_places[table.argument.name] = table.argument.places;
      for (const auto& c : sheet.key["columns"]) {
        if (c["sheet_columns"].size() > 1)
          options.joins.push_back(
              {c["column"], c["sheet_columns"].get<std::vector<std::string>>()});
      }
      INFO("seed ", seed, " table ", table.table_id, " dms ", style.dms, " delimiter ",
           style.delimiter, " arguments ", style.arguments, " zeros ", style.zeros);
      const auto read = apograph::ReadCsv(sheet.text, "sheet.csv", options);
      REQUIRE(read.tables.size() == 1);
      const auto& rows = read.tables[0].rows;
      REQUIRE(rows.size() == table.rows.size());
      for (std::size_t r = 0; r < rows.size(); ++r) {
        CHECK(rows[r].argument.value == table.rows[r].argument.value);
        for (std::size_t c = 0; c < table.columns.size(); ++c) {
          CHECK(rows[r].cells[c].state == table.rows[r].cells[c].state);
          CHECK(rows[r].cells[c].value == table.rows[r].cells[c].value);
        }
      }
      ++sheets;
      dms += style.dms;
      semicolon += style.delimiter == ';';
      decimal += style.arguments == "decimal";
    }
  }
  // Every habit occurred often enough to be exercised.
  CHECK(dms > 10);
  CHECK(semicolon > 10);
  CHECK(decimal > 5);
  CHECK(sheets > 100);
}
