// CSV sheets in the styles of real sheets (see sheets.hpp).
#include "sheets.hpp"

#include <cstdint>

namespace apograph::synth {
namespace {

using nlohmann::json;

const char* kPlaceNames[] = {"deg", "min", "sec", "thirds", "fourths", "fifths", "sixths"};

// The decimal text of a value, if it has one of at most four decimals.
std::optional<std::string> Decimal(const Sexagesimal& v) {
  const auto scale = PowerOf60(v.places());
  const __int128 scaled = v.units() * 10000;
  if (scaled % scale != 0) return std::nullopt;
  const auto x = static_cast<std::int64_t>(scaled / scale);
  const std::int64_t magnitude = x < 0 ? -x : x;
  std::string out = (x < 0 ? "-" : "") + std::to_string(magnitude / 10000);
  std::string frac = std::to_string(10000 + magnitude % 10000).substr(1);
  while (!frac.empty() && frac.back() == '0') frac.pop_back();
  return frac.empty() ? out : out + "." + frac;
}

bool AllDecimal(const Transcription& t) {
  for (const auto& row : t.rows) {
    if (row.argument.value && !Decimal(*row.argument.value)) return false;
  }
  return true;
}

std::string Quoted(const std::string& field, char delimiter) {
  if (field.find_first_of(std::string(1, delimiter) + "\"\n") == std::string::npos) return field;
  std::string out = "\"";
  for (char c : field) out += c == '"' ? std::string("\"\"") : std::string(1, c);
  return out + "\"";
}

std::string Line(const std::vector<std::string>& fields, char delimiter) {
  std::string out;
  for (std::size_t i = 0; i < fields.size(); ++i)
    out += (i ? std::string(1, delimiter) : "") + Quoted(fields[i], delimiter);
  return out + "\n";
}

std::string Argument(const Cell& arg, const SheetStyle& s, Rng& rng) {
  if (!arg.value) return arg.raw;
  const Sexagesimal& v = *arg.value;
  const bool whole = v.units() % PowerOf60(v.places()) == 0;
  if (s.arguments == "decimal") return *Decimal(v);
  if (s.arguments == "mixed" && whole)
    return std::to_string(v.IntegerPart() * (v.negative() ? -1 : 1));
  if (s.arguments == "inconsistent-places") {
    const Sexagesimal base = whole ? v.Rounded(0) : v;
    return base.Extended(base.places() + rng.Int(0, whole ? 2 : 1)).ToString();
  }
  return v.ToString();
}

// A reading's places as text fields: sign on the first, "?" where unreadable.
std::vector<std::string> Fields(const Cell& cell, int places, const SheetStyle& s) {
  std::vector<std::string> out(static_cast<std::size_t>(places + 1), "");
  if (cell.state == CellState::kBlank) return out;
  if (cell.state == CellState::kIllegible) return std::vector<std::string>(out.size(), "?");
  std::string raw = cell.raw;
  const bool negative = !raw.empty() && raw[0] == '-';
  if (negative) raw = raw.substr(1);
  std::size_t k = 0;
  for (char c : raw) {
    if (c == ';' || c == ',') {
      ++k;
      continue;
    }
    out[k] += c;
  }
  for (std::size_t j = 1; j < out.size(); ++j) {
    if (s.zeros == "padded" && out[j].size() == 1 && out[j] != "?") out[j] = "0" + out[j];
  }
  // A whole 0 keeps its digit: an empty field is a blank.
  if (s.zeros == "dropped" && out[0] == "0" && out.size() > 1) out[0] = "";
  if (negative) out[0] = "-" + out[0];
  return out;
}

std::string Trade(const Cell& cell, const SheetStyle& s) {
  if (cell.state == CellState::kBlank) return "";
  if (cell.state == CellState::kIllegible) return "?";
  const auto f = Fields(cell, cell.places, s);
  std::string out = f[0];
  for (std::size_t j = 1; j < f.size(); ++j) out += (j == 1 ? ";" : ",") + f[j];
  return out;
}

json Columns(const Transcription& t, const SheetStyle& s, std::vector<std::string>& header) {
  json out = json::array();
  header.push_back(t.argument.name);
  for (const auto& c : t.columns) {
    std::vector<std::string> names;
    if (s.dms) {
      for (int j = 0; j <= c.places; ++j) names.push_back(c.name + "_" + kPlaceNames[j]);
    } else {
      names.push_back(c.name);
    }
    header.insert(header.end(), names.begin(), names.end());
    out.push_back({{"column", c.name}, {"places", c.places}, {"sheet_columns", names}});
  }
  return out;
}

}  // namespace

SheetStyle DrawSheetStyle(const Transcription& t, Rng& rng) {
  SheetStyle s;
  s.delimiter = rng.Chance(0.3) ? ';' : ',';
  const std::vector<std::string> args = {"trade", "decimal", "mixed", "inconsistent-places"};
  s.arguments = args[rng.Weighted({0.4, AllDecimal(t) ? 0.25 : 0.0, 0.2, 0.15})];
  bool places = !t.columns.empty();
  for (const auto& c : t.columns) places = places && c.places >= 1 && c.places < 7;
  s.dms = places && rng.Chance(0.3);
  s.zeros = std::vector<std::string>{"plain", "padded", "dropped"}[rng.Weighted({0.6, 0.2, 0.2})];
  return s;
}

Sheet WriteSheet(const Transcription& t, const SheetStyle& s, Rng& rng) {
  Sheet out;
  std::vector<std::string> header;
  json columns = Columns(t, s, header);
  out.text = Line(header, s.delimiter);
  json rows = json::array();
  int line = 1;
  for (const auto& row : t.rows) {
    std::vector<std::string> fields = {Argument(row.argument, s, rng)};
    json cells = json::array();
    for (const auto& cell : row.cells) {
      if (s.dms) {
        const auto f = Fields(cell, cell.places, s);
        fields.insert(fields.end(), f.begin(), f.end());
      } else {
        fields.push_back(Trade(cell, s));
      }
      cells.push_back(cell.raw);
    }
    out.text += Line(fields, s.delimiter);
    rows.push_back({{"line", ++line},
                    {"written_argument", fields[0]},
                    {"argument", row.argument.raw},
                    {"cells", cells}});
  }
  out.key = {{"delimiter", std::string(1, s.delimiter)},
             {"arguments", s.arguments},
             {"dms", s.dms},
             {"zeros", s.zeros},
             {"header", header},
             {"argument_column", t.argument.name},
             {"argument_places", t.argument.places},
             {"columns", columns},
             {"rows", rows},
             {"meaning",
              {"an empty field is a blank in the witness, `?` an illegible reading or place",
               "a `-` before the first field makes the whole value negative",
               "decimal arguments are degrees (0.5 = 0;30), whole arguments may lack their places",
               "cells and arguments under `rows` are the readings in the trade's notation"}}};
  return out;
}

}  // namespace apograph::synth
