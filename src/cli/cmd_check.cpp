// apograph check: recompute every entry of a witness's column from a model
// (built-in or formula) under a computing practice, list the differences in
// units of the last place, flag those beyond tolerance and store the run.
#include "cli/command.hpp"

#include <cmath>
#include <filesystem>
#include <iomanip>
#include <memory>
#include <ostream>
#include <sstream>

#include <nlohmann/json.hpp>

#include "cli/batch_output.hpp"
#include "cli/estimate_options.hpp"
#include "cli/reference_options.hpp"
#include "model/check.hpp"
#include "pipeline/reference.hpp"
#include "store/edition_store.hpp"
#include "store/model_store.hpp"
#include "support/input_error.hpp"
#include "support/ordered_batch.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kCheckUsage[] =
    "usage: apograph check --table ID --witness SIGLUM (--model NAME | --formula TEXT | --auto)\n"
    "                      [--param NAME=VALUE]... [--column NAME] [--rounding nearest|truncate]\n"
    "                      [--places N] [--grid G [--grid-origin O] [--round-nodes]]\n"
    "                      [--displacement D] [--sign signed|negated|magnitude]\n"
    "                      [--tolerance U] [--revision N] [--flagged-only]\n"
    "                      [--format text|csv|json] [--db FILE]\n"
    "       apograph check (--all | --work WORK) (--model NAME | --formula TEXT | --auto)\n"
    "                      [the options above] [--threads N]\n\n"
    "Recomputes every entry of the column and lists: the argument and reading as written,\n"
    "the value after the practice, the exact value, the difference in units of the last\n"
    "place, and a flag where |difference| > tolerance (default 1 unit). --model takes a\n"
    "built-in model (see apograph formula list --builtin) or a saved formula. Numbers may\n"
    "be written in the trade's notation (2;4,48) or as decimals (2.08). The run is stored\n"
    "in the database. --auto identifies the model, parameters and practice from the witness's\n"
    "own entries first (apograph identify; parameters brought to round sexagesimal values).\n"
    "Exit code 1 when anything is flagged.\n\n"
    "--all (or --work) checks every transcription (or every one of the work's tables) in\n"
    "one process on every core, each run stored: text prints one summary line per\n"
    "transcription as it is done, CSV every entry (or, with --flagged-only, the flagged\n"
    "ones) with its table, witness and column, JSON one object per line (JSON lines, the\n"
    "fields of the single form). A transcription without the column is listed as such.\n\n"
    "example: apograph check --table sun-eq --witness A --model solar-eccentric \\\n"
    "           --param 'e=2;16' --grid 6";

namespace {

struct CheckOptions {
  std::string table, witness, column, format, db;
  ReferenceArgs reference;
  int revision = 0;
  std::string tolerance = "1";
  bool flagged_only = false;
};

std::string FormatDiff(const std::optional<double>& d) {
  if (!d) return "";
  std::ostringstream s;
  if (*d == std::round(*d)) {
    s << (*d > 0 ? "+" : "") << static_cast<long long>(*d);
  } else {
    s << std::showpos << std::fixed << std::setprecision(2) << *d;
  }
  return s.str();
}

/// The exact value with one place more than the column, as an editor reads it.
std::string FormatExact(double v, int places) {
  if (!std::isfinite(v) || std::fabs(v) >= 1e12) return "";
  return Sexagesimal::FromDouble(v, std::min(places + 1, Sexagesimal::kMaxPlaces)).ToString();
}

std::string FormatParam(double v) {
  std::ostringstream s;
  s << std::setprecision(12) << v;
  if (std::fabs(v) < 1e9 && v != std::round(v)) {
    Sexagesimal x = Sexagesimal::FromDouble(v, 4);
    while (x.places() > 1 && x.units() % 60 == 0) x = x.Rounded(x.places() - 1);
    s << " (" << x.ToString() << ")";
  }
  return s.str();
}

Tabular EntryTable(const model::CheckReport& r, bool flagged_only) {
  Tabular t;
  t.headers = {"row", "arg", "tabulated", "computed", "exact", "diff", "flag"};
  t.right_aligned = {true, true, true, true, true, true, false};
  for (const auto& e : r.entries) {
    if (flagged_only && !e.flag) continue;
    std::string flag = e.flag ? "FLAG" : (e.skipped.empty() ? "" : "(" + e.skipped + ")");
    t.Add({std::to_string(e.row + 1), e.arg,
           e.tabulated ? e.tabulated->ToString() : e.tabulated_raw,
           e.computed ? e.computed->ToString() : "", FormatExact(e.exact, r.places),
           FormatDiff(e.diff_units), flag});
  }
  return t;
}

std::string SummaryLine(const model::CheckReport& r) {
  const auto& s = r.summary;
  std::ostringstream out;
  out << s.entries << " entries: " << s.exact << " exact, " << s.within_one << " within one unit, "
      << s.flagged << " flagged (|diff| > " << r.tolerance << "), " << s.blank << " blank, "
      << s.illegible << " illegible or partial, " << s.undefined << " without a model value";
  if (s.worst_row)
    out << "; worst " << FormatDiff(r.entries[*s.worst_row].diff_units) << " at argument "
        << r.entries[*s.worst_row].arg;
  return out.str();
}

void PrintText(const model::CheckReport& r, const CheckOptions& o, Io& io) {
  io.out << "table " << r.table << ", witness " << r.witness << ", column "
         << (r.entries.empty() ? o.column : r.entries.front().column) << ": model " << r.model;
  if (!r.params.empty()) {
    io.out << " with";
    for (const auto& [name, value] : r.params) io.out << " " << name << " = " << FormatParam(value);
  }
  const auto& p = r.practice;
  io.out << "\npractice: " << model::ToString(p.rounding) << " to " << r.places << " places";
  if (p.grid > 0)
    io.out << ", exact every " << p.grid << " (from " << p.grid_origin << ")"
           << (p.round_nodes ? ", nodes rounded" : "") << ", linear between";
  if (p.displacement != 0) io.out << ", displaced by " << p.displacement;
  io.out << "\n\n" << EntryTable(r, o.flagged_only).RenderText() << "\n" << SummaryLine(r) << "\n";
}

/// The argument a row stands for, in trade notation (the JSON `arg`).
nlohmann::json ArgInUse(const Transcription& t, std::size_t row) {
  if (row >= t.rows.size()) return nullptr;
  const auto arg = t.ArgumentInUse(row);
  return arg ? nlohmann::json(arg->ToString()) : nlohmann::json(nullptr);
}

nlohmann::json ToJson(const model::CheckReport& r, const Transcription& t,
                      std::optional<int> revision, const std::optional<std::string>& formula,
                      std::int64_t run) {
  using nlohmann::json;
  json params = json::object();
  for (const auto& [name, value] : r.params) params[name] = value;
  json entries = json::array();
  for (const auto& e : r.entries) {
    entries.push_back(
        {{"row", e.row + 1},
         {"arg", ArgInUse(t, e.row)},
         {"written_arg", e.arg},
         {"column", e.column},
         {"tabulated", e.tabulated ? e.tabulated->ToString() : e.tabulated_raw},
         {"computed", e.computed ? json(e.computed->ToString()) : json(nullptr)},
         {"exact_value", std::isfinite(e.exact) ? json(e.exact) : json(nullptr)},
         {"diff_units", e.diff_units ? json(*e.diff_units) : json(nullptr)},
         {"exact_diff_units", e.exact_diff_units ? json(*e.exact_diff_units) : json(nullptr)},
         {"flag", e.flag},
         {"skipped", e.skipped}});
  }
  const auto& s = r.summary;
  json summary = {
      {"entries", s.entries},
      {"compared", s.compared},
      {"exact", s.exact},
      {"within_one", s.within_one},
      {"flagged", s.flagged},
      {"blank", s.blank},
      {"illegible", s.illegible},
      {"undefined", s.undefined},
      {"worst", s.worst},
      {"worst_arg", s.worst_row ? ArgInUse(t, r.entries[*s.worst_row].row) : json(nullptr)}};
  const auto& p = r.practice;
  return {{"table", r.table},
          {"witness", r.witness},
          {"revision", revision ? json(*revision) : json(nullptr)},
          {"column", r.entries.empty() ? "" : r.entries.front().column},
          {"model", r.model},
          {"formula", formula ? json(*formula) : json(nullptr)},
          {"params", params},
          {"practice",
           {{"rounding", model::ToString(p.rounding)},
            {"places", r.places},
            {"grid", p.grid},
            {"grid_origin", p.grid_origin},
            {"round_nodes", p.round_nodes},
            {"displacement", p.displacement}}},
          {"tolerance", r.tolerance},
          {"entries", entries},
          {"summary", summary},
          {"run_id", run}};
}

void AddOptions(po::options_description& d, CheckOptions& o) {
  d.add_options()("table", po::value(&o.table), "table id")("witness", po::value(&o.witness),
                                                            "siglum of the witness")(
      "column", po::value(&o.column), "column to check (default: the first)")(
      "tolerance", po::value(&o.tolerance)->default_value("1"),
      "flag when |diff| > this many units")("revision", po::value(&o.revision),
                                            "revision to check (default: the current)")(
      "flagged-only", po::bool_switch(&o.flagged_only),
      "text and CSV: list only the flagged entries");
  AddReferenceOptions(d, o.reference,
                      "identify the model, parameters and practice from this witness's entries");
}

/// check --all / --work: every transcription in scope, each run stored,
/// results streamed.
int RunBatch(store::Database& db, const CheckOptions& o, const BatchArgs& batch,
             const pipeline::ReferenceRequest& request, double tolerance, Io& io) {
  const auto scope = BatchScope(db, batch);
  const pipeline::ModelLibrary library = LoadModels(db, io);
  const Format format = ParseFormat(o.format);
  const bool per_entry = format == Format::kCsv;
  StreamingTable out(
      io, format,
      per_entry ? std::vector<std::string>{"table", "witness", "column", "row", "arg", "tabulated",
                                           "computed", "exact", "diff", "flag"}
                : std::vector<std::string>{"table", "witness", "column", "model", "entries",
                                           "exact", "within_one", "flagged", "worst"},
      per_entry ? std::vector<bool>{}
                : std::vector<bool>{false, false, false, false, true, true, true, true, true});
  struct Done {
    std::optional<pipeline::ColumnReference> ref;
    std::optional<model::CheckReport> report;
    std::string why_not;
  };
  bool findings = false;
  ProgressBar bar(io, "check");
  support::RunInOrder<Transcription, Done>(
      scope.size(), {static_cast<unsigned>(batch.threads)},
      [&](std::size_t i) { return store::Load(db, scope[i].table_id, scope[i].siglum); },
      [&](const Transcription& t) -> Done {
        if (t.columns.empty()) return {std::nullopt, std::nullopt, "no value columns"};
        const std::string column = o.column.empty() ? t.columns.front().name : o.column;
        if (t.ColumnIndex(column) < 0) return {std::nullopt, std::nullopt, "no column " + column};
        pipeline::ReferenceRequest one = request;
        one.columns = {column};
        auto ref = pipeline::ResolveReferences({t}, one, library).front();
        auto r = model::Check(t, *ref.model, ref.params, ref.practice, tolerance, ref.column);
        return {std::move(ref), std::move(r), ""};
      },
      [&](std::size_t i, Transcription&& t, Done&& d) {
        if (!d.report) {
          findings = true;
          if (!per_entry)
            out.Add({t.table_id, t.witness.siglum, "", "-", "", "", "", "", d.why_not});
          out.AddJson(
              {{"table", t.table_id}, {"witness", t.witness.siglum}, {"skipped", d.why_not}});
          return;
        }
        const auto& r = *d.report;
        const std::optional<std::string> formula =
            d.ref->formula.empty() ? std::nullopt : std::optional(d.ref->formula);
        const std::int64_t run = store::SaveCheckRun(db, r, scope[i].number, formula);
        findings = findings || r.summary.flagged > 0 || r.summary.compared == 0;
        const std::string column = r.entries.empty() ? "" : r.entries.front().column;
        if (per_entry) {
          for (const auto& row : EntryTable(r, o.flagged_only).rows) {
            std::vector<std::string> line = {t.table_id, t.witness.siglum, column};
            line.insert(line.end(), row.begin(), row.end());
            out.Add(line);
          }
        } else {
          const auto& s = r.summary;
          out.Add({t.table_id, t.witness.siglum, column, r.model, std::to_string(s.entries),
                   std::to_string(s.exact), std::to_string(s.within_one), std::to_string(s.flagged),
                   s.worst_row ? FormatDiff(r.entries[*s.worst_row].diff_units) : ""});
        }
        if (format == Format::kJson) out.AddJson(ToJson(r, t, scope[i].number, formula, run));
      },
      [&](std::size_t done, std::size_t total) { bar.Show(done, total); });
  out.Finish();
  return findings ? kFindings : kOk;
}

}  // namespace

int RunCheck(const std::vector<std::string>& args, Io& io) {
  CheckOptions o;
  po::options_description d("options");
  AddOptions(d, o);
  BatchArgs batch;
  AddBatchOptions(d, batch);
  AddFormatOption(d, o.format, {"text", "csv", "json"});
  AddDbOption(d, o.db);
  po::variables_map vm;
  if (ParseOptions(FindCommand("check"), args, d, vm, io)) return kOk;
  CheckBatchOptions(batch, !o.table.empty() || !o.witness.empty(), "check");
  if (!batch.Batch() && (o.table.empty() || o.witness.empty()))
    throw InputError::ForOption(o.table.empty() ? "--table" : "--witness",
                                ExpectedFound("--table and --witness together", "only one"));
  if (batch.Batch() && vm.count("revision"))
    throw InputError::ForOption(
        "--revision", ExpectedFound("one table (--all checks current revisions)", "--all"));
  pipeline::ReferenceRequest request = ToReferenceRequest(o.reference, vm);
  const double tolerance = ParseNumber("--tolerance", o.tolerance);
  if (tolerance < 0)
    throw InputError::ForOption("--tolerance", ExpectedFound("0 or more", "'" + o.tolerance + "'"));
  store::Database db = OpenEdition(o.db);
  if (batch.Batch()) return RunBatch(db, o, batch, request, tolerance, io);
  const std::optional<int> revision =
      vm.count("revision") ? std::optional<int>(o.revision) : std::nullopt;
  const Transcription t = store::Load(db, o.table, o.witness, revision);
  if (t.columns.empty())
    throw InputError::ForOption("--table", ExpectedFound("a table with value columns", "none"));
  request.columns = {o.column.empty() ? t.columns.front().name : o.column};
  const auto ref = pipeline::ResolveReferences({t}, request, LoadModels(db, io)).front();
  const model::CheckReport r =
      model::Check(t, *ref.model, ref.params, ref.practice, tolerance, ref.column);
  const std::optional<std::string> formula_text =
      ref.formula.empty() ? std::nullopt : std::optional(ref.formula);
  const std::optional<int> stored_revision =
      revision ? revision : std::optional<int>(store::CurrentRevision(db, o.table, o.witness));
  const std::int64_t run = store::SaveCheckRun(db, r, stored_revision, formula_text);
  switch (ParseFormat(o.format)) {
    case Format::kJson:
      io.out << ToJson(r, t, stored_revision, formula_text, run).dump(2) << "\n";
      break;
    case Format::kCsv:
      io.out << EntryTable(r, o.flagged_only).RenderCsv();
      break;
    case Format::kText:
      if (ref.source == pipeline::ReferenceSource::kIdentified)
        io.out << "reference: " << ref.how << "\n";
      PrintText(r, o, io);
      break;
  }
  if (r.summary.compared == 0 && r.summary.entries > 0) {  // not "nothing to look at"
    io.err << "apograph check: nothing was compared: none of the " << r.summary.entries
           << " entries has both a reading and a model value (" << r.summary.undefined
           << " without a model value, " << r.summary.blank << " blank, " << r.summary.illegible
           << " illegible); check the model, its parameters and the witness\n";
    return kFindings;
  }
  return r.summary.flagged > 0 ? kFindings : kOk;
}

}  // namespace apograph::cli
