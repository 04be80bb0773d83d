// apograph collate: the witnesses of one table aligned, every cell's
// readings with their witnesses, errors marked with their basis.
#include "cli/command.hpp"

#include <filesystem>
#include <ostream>
#include <sstream>

#include <nlohmann/json.hpp>

#include "cli/collate_input.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kCollateUsage[] =
    "usage: apograph collate --table ID [--witnesses A,B,...] [--format text|csv|json] [--db "
    "FILE]\n"
    "                        [(--model NAME | --formula TEXT) [--param N=V]... [practice options] "
    "| --auto]\n"
    "                        [--column C] [--tolerance U] [--scripts DIR]\n\n"
    "Aligns the current transcriptions of a table by argument (missing, extra and\n"
    "miscopied rows and columns slid by a row are reported) and lists every cell's\n"
    "readings with their sigla. With a model (--model or --formula, the practice\n"
    "options as in apograph check; or --auto, which identifies them as apograph\n"
    "errors --auto does) every witness's deviations are explained and the\n"
    "explanations judge the readings: copyists' slips are errors (look-alike\n"
    "confusions and one-unit slips marked common), the author's own departures are\n"
    "not. Without a model, errors are minority readings against a clear majority;\n"
    "each cell says which basis was used (judgement, recomputation, majority).\n"
    "Exit code 1 when errors or alignment notes were found.\n\n"
    "example: apograph collate --table sun-eq --model solar-eccentric --param 'e=2;16' --grid 6\n"
    "         apograph collate --table sun-eq --auto";

namespace {

std::string Units(const std::optional<double>& u) {
  if (!u) return "";
  std::ostringstream o;
  o << *u;
  return o.str();
}

std::string Readings(const collate::CollatedCell& cell) {
  std::string out;
  for (const auto& r : cell.readings) {
    std::string sigla;
    for (const auto& s : r.sigla) sigla += (sigla.empty() ? "" : " ") + s;
    out += (out.empty() ? "" : " | ") + r.text + (r.error ? "*" : "") + " " + sigla;
  }
  return out;
}

void PrintText(const collate::Collation& c, std::ostream& out) {
  out << "table " << c.table_id << ": " << c.witnesses.size() << " witnesses, " << c.rows.size()
      << " rows\n";
  const bool judged = c.BasisCounts().count(collate::Basis::kCaller) > 0;
  out << "errors judged by "
      << (c.reference_description.empty() ? std::string("majority (no model)")
          : judged ? "the explained deviations from " + c.reference_description
                   : "recomputation: " + c.reference_description)
      << "\n";
  for (const auto& n : c.notes) out << "  " << n.siglum << ": " << n.kind << ": " << n.text << "\n";
  for (const auto& s : c.slides) out << "  " << s.siglum << ": slid column: " << s.text << "\n";
  Tabular t;
  t.headers = {"arg", "column", "computed", "basis", "readings (* error)"};
  for (const auto& row : c.rows) {
    for (const auto& cell : row.cells) {
      t.Add({row.argument.ToString(), c.columns[cell.column].name,
             cell.computed ? cell.computed->ToString() : "",
             cell.Varies() ? collate::ToString(cell.basis) : "", Readings(cell)});
    }
  }
  out << "\n" << t.RenderText();
}

void PrintCsv(const collate::Collation& c, std::ostream& out) {
  Tabular t;
  t.headers = {"arg",   "column",     "reading", "witnesses", "kind",
               "error", "diff_units", "basis",   "why"};
  for (const auto& row : c.rows) {
    for (const auto& cell : row.cells) {
      for (const auto& r : cell.readings) {
        std::string sigla;
        for (const auto& s : r.sigla) sigla += (sigla.empty() ? "" : " ") + s;
        t.Add({row.argument.ToString(), c.columns[cell.column].name, r.text, sigla,
               collate::ToString(r.kind), r.error ? "1" : "0", Units(r.units_off),
               collate::ToString(cell.basis), r.why});
      }
    }
  }
  out << t.RenderCsv();
}

nlohmann::json ReadingJson(const collate::Reading& r) {
  using nlohmann::json;
  const json diff = r.units_off ? json(*r.units_off) : json(nullptr);
  return {{"text", r.text},
          {"kind", collate::ToString(r.kind)},
          {"witnesses", r.sigla},
          {"sigla", r.sigla},  // deprecated alias of witnesses (README 0.1)
          {"error", r.error},
          {"diff_units", diff},
          {"units_off", diff},  // deprecated alias of diff_units (README 0.1)
          {"cause", r.cause.empty() ? json(nullptr) : json(r.cause)},
          {"editor", r.editor.empty() ? json(nullptr) : json(r.editor)},
          {"why", r.why}};
}

nlohmann::json ToJson(const collate::Collation& c) {
  using nlohmann::json;
  json j = {{"table", c.table_id},
            {"reference", c.reference_description},
            {"tolerance", c.tolerance_units}};
  j["witnesses"] = json::array();
  for (const auto& w : c.witnesses) j["witnesses"].push_back(w.siglum);
  j["notes"] = json::array();
  for (const auto& n : c.notes) {
    j["notes"].push_back(
        {{"witness", n.siglum},
         {"kind", n.kind},
         {"row", n.source_row >= 0 ? json(n.source_row + 1) : json(nullptr)},
         {"line", n.line},
         {"arg", n.row >= 0 ? json(c.rows[n.row].argument.ToString()) : json(nullptr)},
         {"text", n.text}});
  }
  j["slides"] = json::array();
  for (const auto& s : c.slides) {
    j["slides"].push_back({{"witness", s.siglum},
                           {"column", c.columns[s.column].name},
                           {"arg", c.rows[s.first_row].argument.ToString()},
                           {"arg_end", c.rows[s.last_row].argument.ToString()},
                           {"offset", s.offset},
                           {"text", s.text}});
  }
  j["rows"] = json::array();
  for (const auto& row : c.rows) {
    json cells = json::array();
    for (const auto& cell : row.cells) {
      json readings = json::array();
      for (const auto& r : cell.readings) readings.push_back(ReadingJson(r));
      cells.push_back(
          {{"column", c.columns[cell.column].name},
           {"computed", cell.computed ? json(cell.computed->ToString()) : json(nullptr)},
           {"basis", collate::ToString(cell.basis)},
           {"readings", readings}});
    }
    j["rows"].push_back({{"arg", row.argument.ToString()}, {"cells", cells}});
  }
  return j;
}

bool HasFindings(const collate::Collation& c) {
  if (!c.notes.empty() || !c.slides.empty()) return true;
  for (const auto& row : c.rows) {
    for (const auto& cell : row.cells) {
      for (const auto& r : cell.readings) {
        if (r.error) return true;
      }
    }
  }
  return false;
}

}  // namespace

int RunCollate(const std::vector<std::string>& args, Io& io) {
  po::options_description options("options");
  CollateRequest request;
  std::string db_path, format;
  options.add_options()("table", po::value(&request.table)->required(), "table id");
  AddCollateOptions(options, request);
  AddFormatOption(options, format, {"text", "csv", "json"});
  AddDbOption(options, db_path);
  po::variables_map vm;
  if (ParseOptions(FindCommand("collate"), args, options, vm, io)) return kOk;
  FinishCollateRequest(request, vm);
  store::Database db = OpenEdition(db_path);
  const auto c = CollateFromDb(db, request);
  if (format == "json")
    io.out << ToJson(c).dump(2) << "\n";
  else if (format == "csv")
    PrintCsv(c, io.out);
  else
    PrintText(c, io.out);
  return HasFindings(c) ? kFindings : kOk;
}

}  // namespace apograph::cli
