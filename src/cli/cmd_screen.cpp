// apograph screen: suspect entries found from the table alone, before any
// model is known.
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <ostream>

#include <nlohmann/json.hpp>

#include "cli/command.hpp"
#include "deviation/numeral_script.hpp"
#include "deviation/screen.hpp"
#include "estimate/observations.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kScreenUsage[] =
    "usage: apograph screen --table ID --witness SIGLUM [--column NAME] [--window N] [--threshold "
    "Z]\n"
    "                       [--revision N] [--scripts DIR] [--format text|csv|json] [--db FILE]\n"
    "\n"
    "Finds suspect entries without a model: each entry is compared with a robust\n"
    "local quadratic through the entries within --window rows on either side\n"
    "(default 4) and is suspect when it stands further off than --threshold times\n"
    "the column's own scatter (default 4, and never below 1.5 units); second\n"
    "differences are quoted as evidence. Blank and illegible cells are listed.\n"
    "Where a slip in the witness's numeral script explains the departure from the\n"
    "curve, the likely reading is shown. Exit 1 when there are suspects.\n"
    "\n"
    "example: apograph screen --table sun-eq --witness A --column equation";

namespace {

std::string Fixed(double v, const char* fmt) {
  if (!std::isfinite(v)) return "";
  char buf[32];
  std::snprintf(buf, sizeof buf, fmt, v);
  return buf;
}

nlohmann::json SuspectJson(const deviation::Suspect& s, const Transcription& t) {
  const auto arg = s.row < t.rows.size() ? t.ArgumentInUse(s.row) : std::nullopt;
  nlohmann::json j = {
      {"row", s.row + 1},
      {"arg", arg ? arg->ToString() : s.arg},
      {"written_arg", s.arg},
      {"column", s.column_name},
      {"tabulated", s.tabulated},
      {"expected", s.expected ? nlohmann::json(s.expected->ToString()) : nlohmann::json(nullptr)},
      {"diff_units", std::isfinite(s.diff_units)
                         ? nlohmann::json(std::round(s.diff_units * 10) / 10)
                         : nlohmann::json(nullptr)},
      {"score", std::round(s.score * 100) / 100},
      {"evidence", s.evidence},
      {"class", nullptr},
      {"emendation", nullptr},
      {"explanation", nullptr}};
  if (!s.explanations.empty()) {
    const auto& e = s.explanations.front();
    j["class"] = deviation::ToString(e.cls);
    if (e.emendation) j["emendation"] = e.emendation->ToString();
    j["explanation"] = e.evidence;
  }
  return j;
}

}  // namespace

int RunScreen(const std::vector<std::string>& args, Io& io) {
  std::string db_path, table, witness, column, format, scripts;
  int revision = 0;
  deviation::ScreenOptions so;
  po::options_description options("options");
  options.add_options()("table", po::value(&table)->required(), "table id")(
      "witness", po::value(&witness)->required(), "siglum of the witness")(
      "column", po::value(&column), "only this column")(
      "window", po::value(&so.half_window)->default_value(4),
      "rows on each side for the local curve")("threshold",
                                               po::value(&so.threshold)->default_value(4.0),
                                               "robust z-score above which an entry is suspect")(
      "revision", po::value(&revision),
      "an earlier revision of the transcription (default: current)")(
      "scripts", po::value(&scripts)->default_value(deviation::DefaultScriptDir()),
      "folder of numeral scripts");
  AddFormatOption(options, format, {"text", "csv", "json"});
  AddDbOption(options, db_path);
  po::variables_map vm;
  if (ParseOptions(FindCommand("screen"), args, options, vm, io)) return kOk;
  if (so.half_window < 2 || so.half_window > 20) {
    throw InputError::ForOption(
        "--window", ExpectedFound("a number of rows from 2 to 20", std::to_string(so.half_window)));
  }
  if (!(so.threshold > 0))
    throw InputError::ForOption("--threshold",
                                ExpectedFound("a positive number", std::to_string(so.threshold)));

  store::Database db = OpenEdition(db_path);
  const Transcription t =
      store::Load(db, table, witness, revision > 0 ? std::optional<int>(revision) : std::nullopt);
  const auto columns = estimate::ResolveColumns(
      t, column.empty() ? std::vector<std::string>{} : std::vector<std::string>{column});
  const deviation::NumeralScript script = deviation::FindWitnessScript(t.witness, scripts);
  std::vector<deviation::Suspect> suspects;
  for (int c : columns) {
    auto found = deviation::ScreenColumn(t, c, &script, so);
    suspects.insert(suspects.end(), found.begin(), found.end());
  }
  const Format f = ParseFormat(format);
  if (f == Format::kJson) {
    nlohmann::json j = {{"table", t.table_id},
                        {"witness", t.witness.siglum},
                        {"suspects", nlohmann::json::array()}};
    for (const auto& s : suspects) j["suspects"].push_back(SuspectJson(s, t));
    io.out << j.dump(2) << "\n";
  } else {
    Tabular tab;
    tab.headers = {"arg",   "column", "tabulated", "expected", "diff_units",
                   "score", "likely", "reading",   "evidence"};
    tab.right_aligned = {true, false, true, true, true, true, false, true, false};
    for (const auto& s : suspects) {
      const deviation::Explanation* e = s.explanations.empty() ? nullptr : &s.explanations.front();
      tab.Add({s.arg, s.column_name, s.tabulated, s.expected ? s.expected->ToString() : "",
               Fixed(s.diff_units, "%+.1f"), Fixed(s.score, "%.2f"),
               e ? deviation::ToString(e->cls) : "",
               e && e->emendation ? e->emendation->ToString() : "", s.evidence});
    }
    if (f == Format::kCsv) {
      io.out << tab.RenderCsv();
    } else {
      io.out << "table " << t.table_id << ", witness " << t.witness.siglum << ": "
             << suspects.size() << (suspects.size() == 1 ? " suspect entry" : " suspect entries")
             << " (no model used)\n";
      if (!suspects.empty()) io.out << tab.RenderText();
    }
  }
  return suspects.empty() ? kOk : kFindings;
}

}  // namespace apograph::cli
