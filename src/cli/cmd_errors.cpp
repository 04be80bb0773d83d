// apograph errors: explain a witness's deviations from a model, propose
// emendations and record them in the database for the editor to decide.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <ostream>

#include <nlohmann/json.hpp>

#include "cli/command.hpp"
#include "cli/reference_options.hpp"
#include "deviation/explain.hpp"
#include "deviation/numeral_script.hpp"
#include "model/model.hpp"
#include "pipeline/reference.hpp"
#include "pipeline/witness_findings.hpp"
#include "store/deviation_store.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kErrorsUsage[] =
    "usage: apograph errors --table ID --witness SIGLUM\n"
    "                       ((--model NAME | --formula TEXT) [--param N=V]... [practice options]\n"
    "                        | --auto [--model NAME | --formula TEXT] [practice options])\n"
    "                       [--column NAME] [--tolerance U]\n"
    "                       [--revision N] [--scripts DIR] [--no-record] [--format text|csv|json] "
    "[--db FILE]\n"
    "\n"
    "Recomputes the witness's entries from the model and, for every entry further\n"
    "from it than the tolerance (units of the last place, default 0.5), ranks the\n"
    "explanations: a confusion of symbols in the witness's numeral script,\n"
    "transposed digits, a place omitted/added/moved, a run of entries displaced by\n"
    "rows (reported once), a repeated neighbour, a blank or illegible cell, the\n"
    "author's own computation, or 'unexplained'. Each finding is one line that\n"
    "reads like a critical note; the proposed readings are recorded in the\n"
    "database as emendations for the editor to accept or reject (apograph\n"
    "emendation). --auto first identifies each column's model, parameters and\n"
    "computing practice (interpolation grid, truncation, displacement) as apograph\n"
    "identify does, from every witness of the table, keeping the witness whose best\n"
    "explanation reproduces most entries exactly, and brings the parameters to the\n"
    "coarsest sexagesimal values that reproduce as many; with --model (or --formula)\n"
    "only that model is tried, and with practice options too only its parameters are\n"
    "fitted. Practice options: --rounding nearest|truncate, --places N, --grid G\n"
    "[--grid-origin O] [--round-nodes], --displacement D. Exit 1 when there are findings.\n"
    "\n"
    "example: apograph errors --table sun-eq --witness D --model solar-eccentric --param 'e=2;16' "
    "--grid 6\n"
    "         apograph errors --table sun-eq --witness D --auto";

namespace {

struct ErrorsOptions {
  std::string db, table, witness, column, format, scripts;
  ReferenceArgs reference;
  double tolerance = 0.5;
  int revision = 0;
  bool no_record = false;
};

/// The practice differs from plain rounding to the column's places.
bool SpecialPractice(const pipeline::ColumnReference& r, const Transcription& t) {
  const auto& p = r.practice;
  return p.rounding != Rounding::kNearest || p.grid > 0 || p.displacement != 0 ||
         p.places.value_or(0) != t.columns.at(static_cast<std::size_t>(r.column)).places;
}

/// "solar-eccentric e=2.5 (2;30)", with "(fitted, rounded to 1 place)" when
/// identified and the practice when it is not plain rounding.
std::string ModelText(const pipeline::ColumnReference& r, const Transcription& t) {
  std::string out = r.ModelText();
  const std::string practice =
      SpecialPractice(r, t) ? pipeline::DescribePractice(r.practice, *r.practice.places) : "";
  if (r.source == pipeline::ReferenceSource::kGiven)
    return practice.empty() ? out : out + " (" + practice + ")";
  std::string how = "fitted";
  if (r.rounded_places > 0) {
    how += ", rounded to " + std::to_string(r.rounded_places) +
           (r.rounded_places == 1 ? " place" : " places");
  }
  if (!practice.empty()) how += "; entries " + practice;
  return out + " (" + how + ")";
}

std::string ModelText(const std::vector<pipeline::ColumnReference>& refs, const Transcription& t) {
  std::string out;
  for (const auto& r : refs)
    out +=
        (out.empty() ? "" : "; ") + (refs.size() > 1 ? r.column_name + ": " : "") + ModelText(r, t);
  return out;
}

nlohmann::json ReferenceJson(const pipeline::ColumnReference& r) {
  nlohmann::json params = nlohmann::json::object();
  for (std::size_t i = 0; i < r.params.size() && i < r.model->params().size(); ++i)
    params[r.model->params()[i].name] = r.params[i];
  const auto& p = r.practice;
  return {{"column", r.column_name},
          {"model", r.model->name()},
          {"params", params},
          {"practice",
           {{"rounding", model::ToString(p.rounding)},
            {"places", p.places.value_or(0)},
            {"grid", p.grid},
            {"grid_origin", p.grid_origin},
            {"round_nodes", p.round_nodes},
            {"displacement", p.displacement}}},
          {"description", r.description},
          {"source", pipeline::ToString(r.source)},
          {"witness", r.witness.empty() ? nlohmann::json(nullptr) : nlohmann::json(r.witness)},
          {"how", r.how}};
}

nlohmann::json Units(double d) {
  if (!std::isfinite(d)) return nullptr;
  return std::round(d * 100) / 100;
}

nlohmann::json Reading(const std::optional<Sexagesimal>& v) {
  if (!v) return nullptr;
  return v->ToString();
}

nlohmann::json FindingJson(const deviation::Finding& f) {
  const auto& c = f.cells.front();
  nlohmann::json j = {{"arg", c.arg},
                      {"column", f.column_name},
                      {"tabulated", c.tabulated},
                      {"computed", Reading(c.computed)},
                      {"diff_units", Units(c.diff_units)},
                      {"class", deviation::ToString(f.best().cls)},
                      {"explanation", f.best().evidence},
                      {"emendation", Reading(c.emendation)},
                      {"score", std::round(f.best().score * 100) / 100}};
  j["arg_end"] = f.cells.back().arg;
  j["cells"] = nlohmann::json::array();
  for (const auto& cell : f.cells) {
    j["cells"].push_back({{"row", cell.row + 1},
                          {"arg", cell.arg},
                          {"tabulated", cell.tabulated},
                          {"computed", Reading(cell.computed)},
                          {"diff_units", Units(cell.diff_units)},
                          {"emendation", Reading(cell.emendation)}});
  }
  j["alternatives"] = nlohmann::json::array();
  for (std::size_t i = 1; i < f.explanations.size(); ++i) {
    const auto& e = f.explanations[i];
    j["alternatives"].push_back({{"class", deviation::ToString(e.cls)},
                                 {"score", std::round(e.score * 100) / 100},
                                 {"emendation", Reading(e.emendation)},
                                 {"explanation", e.evidence}});
  }
  return j;
}

nlohmann::json SuspectJson(const deviation::Suspect& s) {
  nlohmann::json j = {{"row", s.row + 1},
                      {"arg", s.arg},
                      {"tabulated", s.tabulated},
                      {"expected", Reading(s.expected)},
                      {"diff_units", Units(s.diff_units)},
                      {"score", std::round(s.score * 100) / 100},
                      {"evidence", s.evidence},
                      {"class", nullptr},
                      {"emendation", nullptr}};
  if (!s.explanations.empty()) {
    j["class"] = deviation::ToString(s.explanations.front().cls);
    j["emendation"] = Reading(s.explanations.front().emendation);
  }
  return j;
}

nlohmann::json VerdictJson(const pipeline::ColumnVerdict& v) {
  nlohmann::json j = {{"column", v.column_name},
                      {"explains", v.verdict.explains},
                      {"on", v.verdict.consensus ? "tradition" : "witness"},
                      {"compared", v.verdict.compared},
                      {"flagged", v.verdict.flagged},
                      {"limit", v.verdict.limit},
                      {"why", v.verdict.why}};
  j["screen"] = nlohmann::json::array();
  for (const auto& s : v.screen) j["screen"].push_back(SuspectJson(s));
  return j;
}

/// A refused reference: why, and the model-free screen instead of findings.
void PrintRefused(const pipeline::ColumnVerdict& v, Io& io) {
  if (v.verdict.explains) return;
  io.out << v.column_name << ": " << v.verdict.why << "\n";
  io.out << v.column_name << ": model-free screen, " << v.screen.size()
         << (v.screen.size() == 1 ? " suspect entry\n" : " suspect entries\n");
  for (const auto& s : v.screen) {
    io.out << "  " << s.arg << " " << s.tabulated << ": " << s.evidence;
    if (!s.explanations.empty() && s.explanations.front().emendation) {
      io.out << "; likely " << deviation::ToString(s.explanations.front().cls) << ", reading "
             << s.explanations.front().emendation->ToString();
    }
    io.out << "\n";
  }
}

void Print(const ErrorsOptions& o, const Transcription& t,
           const std::vector<pipeline::ColumnReference>& refs,
           const pipeline::WitnessFindings& explained, Io& io) {
  const auto& findings = explained.findings;
  const Format format = ParseFormat(o.format);
  const std::string model = ModelText(refs, t);
  if (format == Format::kJson) {
    nlohmann::json j = {{"table", t.table_id},
                        {"witness", t.witness.siglum},
                        {"script", t.witness.script},
                        {"numeral_script", explained.script},
                        {"kind", ToString(t.witness.Kind())},
                        {"model", model},
                        {"tolerance", o.tolerance}};
    j["references"] = nlohmann::json::array();
    for (const auto& r : refs) j["references"].push_back(ReferenceJson(r));
    j["findings"] = nlohmann::json::array();
    for (const auto& f : findings) j["findings"].push_back(FindingJson(f));
    j["verdicts"] = nlohmann::json::array();
    for (const auto& v : explained.verdicts) j["verdicts"].push_back(VerdictJson(v));
    io.out << j.dump(2) << "\n";
    return;
  }
  if (format == Format::kCsv) {
    Tabular tab;
    tab.headers = {"finding",    "arg",   "column",     "tabulated", "computed",
                   "diff_units", "class", "emendation", "score",     "explanation"};
    for (std::size_t i = 0; i < findings.size(); ++i) {
      const auto& f = findings[i];
      for (const auto& c : f.cells) {
        char diff[32] = "", score[16];
        if (std::isfinite(c.diff_units))
          std::snprintf(diff, sizeof diff, "%g", std::round(c.diff_units * 100) / 100);
        std::snprintf(score, sizeof score, "%.2f", f.best().score);
        tab.Add({std::to_string(i + 1), c.arg, f.column_name, c.tabulated,
                 c.computed ? c.computed->ToString() : "", diff, deviation::ToString(f.best().cls),
                 c.emendation ? c.emendation->ToString() : "", score, f.best().evidence});
      }
    }
    io.out << tab.RenderCsv();
    return;
  }
  for (const auto& r : refs) {
    if (r.source == pipeline::ReferenceSource::kIdentified)
      io.out << r.column_name << ": " << r.description << "; " << r.how << "\n";
  }
  io.out << "table " << t.table_id << ", witness " << t.witness.siglum << " (" << explained.script
         << "), compared with " << model << ": " << findings.size()
         << (findings.size() == 1 ? " finding\n" : " findings\n");
  for (const auto& f : findings) io.out << f.Note(t.witness.siglum) << "\n";
  for (const auto& v : explained.verdicts) PrintRefused(v, io);
}

std::vector<store::EmendationRecord> Proposals(const Transcription& t, int revision,
                                               const std::string& model,
                                               const std::vector<deviation::Finding>& findings) {
  std::vector<store::EmendationRecord> out;
  for (std::size_t i = 0; i < findings.size(); ++i) {
    const auto& f = findings[i];
    if (!deviation::IsCopyingSlip(f.best().cls)) continue;
    for (const auto& c : f.cells) {
      if (!c.emendation || (c.value && c.emendation->Identical(c.value->Rounded(f.places))))
        continue;
      store::EmendationRecord r;
      r.table_id = t.table_id;
      r.siglum = t.witness.siglum;
      r.revision = revision;
      r.row = static_cast<int>(c.row);
      r.column = f.column;
      r.column_name = f.column_name;
      r.arg = c.arg;
      r.tabulated = c.tabulated;
      r.proposed = c.emendation->ToString();
      r.cls = deviation::ToString(f.best().cls);
      r.evidence = f.best().evidence;
      r.score = f.best().score;
      r.model = model;
      r.group = f.cells.size() > 1 ? static_cast<int>(i + 1) : 0;
      out.push_back(std::move(r));
    }
  }
  return out;
}

int CurrentRevision(store::Database& db, const ErrorsOptions& o) {
  if (o.revision > 0) return o.revision;
  auto revisions = store::ListRevisions(db, o.table, o.witness);
  return revisions.empty() ? 1 : revisions.back().number;
}

}  // namespace

int RunErrors(const std::vector<std::string>& args, Io& io) {
  ErrorsOptions o;
  po::options_description options("options");
  options.add_options()("table", po::value(&o.table)->required(), "table id")(
      "witness", po::value(&o.witness)->required(), "siglum of the witness")(
      "column", po::value(&o.column), "only this column")(
      "tolerance", po::value(&o.tolerance)->default_value(0.5),
      "units of the last place an entry may differ")(
      "revision", po::value(&o.revision),
      "an earlier revision of the transcription (default: current)")(
      "scripts", po::value(&o.scripts)->default_value(deviation::DefaultScriptDir()),
      "folder of numeral scripts")("no-record", po::bool_switch(&o.no_record),
                                   "do not record the proposals in the database");
  AddReferenceOptions(
      options, o.reference,
      "identify the model, parameters and practice from the table's witnesses first");
  AddFormatOption(options, o.format, {"text", "csv", "json"});
  AddDbOption(options, o.db);
  po::variables_map vm;
  if (ParseOptions(FindCommand("errors"), args, options, vm, io)) return kOk;
  CheckChoice("--format", o.format, {"text", "csv", "json"});
  CheckChoice("--rounding", o.reference.rounding, {"nearest", "truncate"});
  pipeline::ReferenceRequest request = ToReferenceRequest(o.reference, vm);
  if (request.Empty())
    throw InputError::ForOption(
        "--model", "expected --model NAME, --formula TEXT or --auto, found none of them");
  if (!(o.tolerance >= 0))
    throw InputError::ForOption(
        "--tolerance", ExpectedFound("a number of units >= 0", std::to_string(o.tolerance)));

  store::Database db = OpenEdition(o.db);
  const Transcription t = store::Load(
      db, o.table, o.witness, o.revision > 0 ? std::optional<int>(o.revision) : std::nullopt);
  if (!o.column.empty()) request.columns = {o.column};
  // Every witness of the table (this revision of this one): --auto identifies
  // from them, and each cell is judged with what the others read there.
  std::vector<Transcription> witnesses = store::LoadTable(db, o.table);
  std::erase_if(witnesses,
                [&](const Transcription& w) { return w.witness.siglum == t.witness.siglum; });
  witnesses.insert(witnesses.begin(), t);
  const auto refs =
      pipeline::ResolveReferences(request.automatic ? witnesses : std::vector<Transcription>{t},
                                  request, pipeline::LoadModelLibrary(db));
  deviation::ExplainOptions eo;
  eo.tolerance = o.tolerance;
  const auto explained = pipeline::ExplainTradition(witnesses, refs, o.scripts, eo).front();
  const auto& findings = explained.findings;
  Print(o, t, refs, explained, io);
  if (!o.no_record) {
    auto proposals = Proposals(t, CurrentRevision(db, o), ModelText(refs, t), findings);
    if (!proposals.empty()) {
      const auto r = store::RecordEmendations(db, proposals);
      io.err << "recorded " << r.added << " new proposed emendation" << (r.added == 1 ? "" : "s")
             << " in " << o.db
             << (r.kept ? " (" + std::to_string(r.kept) + " already recorded)" : "") << "\n";
    }
  }
  const bool refused = std::any_of(explained.verdicts.begin(), explained.verdicts.end(),
                                   [](const auto& v) { return !v.verdict.explains; });
  return findings.empty() && !refused ? kOk : kFindings;
}

}  // namespace apograph::cli
