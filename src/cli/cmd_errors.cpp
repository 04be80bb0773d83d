// apograph errors: explain a witness's deviations from a model, propose
// emendations and record them in the database for the editor to decide.
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <ostream>

#include <nlohmann/json.hpp>

#include "cli/command.hpp"
#include "deviation/explain.hpp"
#include "deviation/numeral_script.hpp"
#include "estimate/fit.hpp"
#include "estimate/observations.hpp"
#include "model/check.hpp"
#include "model/model.hpp"
#include "store/deviation_store.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kErrorsUsage[] =
    "usage: apograph errors --table ID --witness SIGLUM (--model NAME [--param N=V]... | --auto)\n"
    "                       [--column NAME] [--tolerance U] [--rounding nearest|truncate]\n"
    "                       [--revision N] [--scripts DIR] [--no-record] [--format text|csv|json] [--db FILE]\n"
    "\n"
    "Recomputes the witness's entries from the model and, for every entry further\n"
    "from it than the tolerance (units of the last place, default 0.5), ranks the\n"
    "explanations: a confusion of symbols in the witness's numeral script,\n"
    "transposed digits, a place omitted/added/moved, a run of entries displaced by\n"
    "rows (reported once), a repeated neighbour, a blank or illegible cell, the\n"
    "author's own computation, or 'unexplained'. Each finding is one line that\n"
    "reads like a critical note; the proposed readings are recorded in the\n"
    "database as emendations for the editor to accept or reject (apograph\n"
    "emendation). --auto fits the parameters of --model (or of every built-in\n"
    "model, keeping the best) to the witness first. Exit 1 when there are findings.\n"
    "\n"
    "example: apograph errors --table sun --witness A --model solar-eccentric --param e=2.5";

namespace {

struct ErrorsOptions {
  std::string db, table, witness, model, column, format, rounding, scripts;
  std::vector<std::string> params;
  double tolerance = 0.5;
  int revision = 0;
  bool automatic = false, no_record = false;
};

std::vector<std::pair<std::string, double>> ParseParams(const std::vector<std::string>& texts) {
  std::vector<std::pair<std::string, double>> out;
  for (const auto& t : texts) {
    const auto eq = t.find('=');
    std::optional<double> value;
    if (eq != std::string::npos && eq > 0) {
      const std::string v = t.substr(eq + 1);
      if (auto s = Sexagesimal::Parse(v)) {
        value = s->ToDouble();
      } else {
        char* end = nullptr;
        const double d = std::strtod(v.c_str(), &end);
        if (!v.empty() && *end == '\0') value = d;
      }
    }
    if (!value) throw InputError::ForOption("--param", ExpectedFound("NAME=VALUE (e.g. e=2;30 or e=2.5)", "'" + t + "'"));
    out.emplace_back(t.substr(0, eq), *value);
  }
  return out;
}

const model::Model& FindModel(const std::string& name) {
  if (const model::Model* m = model::FindBuiltinModel(name)) return *m;
  std::string known;
  for (const auto* m : model::BuiltinModels()) known += (known.empty() ? "" : ", ") + m->name();
  throw InputError::ForOption("--model", ExpectedFound("a built-in model (" + known + ")", "'" + name + "'"));
}

struct Chosen {
  const model::Model* model = nullptr;
  std::vector<double> params;
  std::string how;  // "given" or "fitted"
};

int ExactEntries(const Chosen& c, const Transcription& t, const std::vector<int>& columns,
                 const model::Practice& practice) {
  int exact = 0;
  for (int col : columns) {
    const auto re = model::Recompute(*c.model, c.params, t, col, practice);
    for (std::size_t r = 0; r < t.rows.size(); ++r) {
      const auto& v = t.rows[r].cells[static_cast<std::size_t>(col)].value;
      exact += v && re.computed[r] && *v == *re.computed[r];
    }
  }
  return exact;
}

/// Authors chose round sexagesimal parameters: the fitted values brought to
/// 1, 2 or 3 sexagesimal places, the coarsest that reproduces at least as
/// many entries exactly as the fit itself.
Chosen RoundParams(const Chosen& fitted, const Transcription& t, const std::vector<int>& columns,
                   const model::Practice& practice) {
  const int target = ExactEntries(fitted, t, columns, practice);
  for (int places = 1; places <= 3; ++places) {
    Chosen c = fitted;
    for (double& v : c.params) v = Sexagesimal::FromDouble(v, places).ToDouble();
    if (ExactEntries(c, t, columns, practice) >= target) {
      c.how = "fitted, rounded to " + std::to_string(places) + (places == 1 ? " place" : " places");
      return c;
    }
  }
  return fitted;
}

/// --auto: the fitted parameters of one model, or of the built-in model that
/// fits best (most entries reproduced exactly, then fewer free parameters,
/// then the smallest scatter).
Chosen AutoModel(const ErrorsOptions& o, const Transcription& t, const std::vector<int>& columns,
                 const model::Practice& practice) {
  estimate::FitOptions fo;
  fo.practice = practice;
  std::vector<const model::Model*> candidates;
  if (!o.model.empty()) candidates.push_back(&FindModel(o.model));
  else candidates = model::BuiltinModels();
  Chosen best;
  int best_good = -1;
  double best_scale = INFINITY;
  for (const auto* m : candidates) {
    estimate::FitResult r;
    try {
      r = estimate::Fit(*m, t, columns, fo);
    } catch (const std::exception&) {
      if (candidates.size() == 1) throw;
      continue;  // a model that cannot describe this table
    }
    // Most entries reproduced exactly; on a tie the fewer free parameters,
    // then the smaller scatter (an equivalent richer model is no better).
    const int good = r.exact * 100 - r.free_parameters;
    if (good > best_good || (good == best_good && r.robust_scale < best_scale)) {
      best = {m, r.Values(), "fitted"};
      best_good = good;
      best_scale = r.robust_scale;
    }
  }
  if (!best.model) throw InputError::ForOption("--auto", "no built-in model could be fitted to this table");
  return RoundParams(best, t, columns, practice);
}

/// "solar-eccentric e=2.5 (2;30)": the trade's notation beside a value that
/// is a short sexagesimal fraction.
std::string ModelText(const Chosen& c) {
  std::string out = c.model->name();
  for (std::size_t i = 0; i < c.params.size() && i < c.model->params().size(); ++i) {
    char buf[64];
    std::snprintf(buf, sizeof buf, " %s=%.6g", c.model->params()[i].name.c_str(), c.params[i]);
    out += buf;
    for (int places = 1; places <= 3; ++places) {
      const auto v = Sexagesimal::FromDouble(c.params[i], places);
      if (std::fabs(v.ToDouble() - c.params[i]) > 1e-12) continue;
      if (std::fabs(c.params[i] - std::round(c.params[i])) > 1e-12) out += " (" + v.ToString() + ")";
      break;
    }
  }
  return out + (c.how == "given" ? "" : " (" + c.how + ")");
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
    j["cells"].push_back({{"row", cell.row + 1}, {"arg", cell.arg}, {"tabulated", cell.tabulated},
                          {"computed", Reading(cell.computed)}, {"diff_units", Units(cell.diff_units)},
                          {"emendation", Reading(cell.emendation)}});
  }
  j["alternatives"] = nlohmann::json::array();
  for (std::size_t i = 1; i < f.explanations.size(); ++i) {
    const auto& e = f.explanations[i];
    j["alternatives"].push_back({{"class", deviation::ToString(e.cls)}, {"score", std::round(e.score * 100) / 100},
                                 {"emendation", Reading(e.emendation)}, {"explanation", e.evidence}});
  }
  return j;
}

void Print(const ErrorsOptions& o, const Transcription& t, const std::string& model,
           const std::vector<deviation::Finding>& findings, Io& io) {
  const Format format = ParseFormat(o.format);
  if (format == Format::kJson) {
    nlohmann::json j = {{"table", t.table_id}, {"witness", t.witness.siglum}, {"script", t.witness.script},
                        {"model", model}, {"tolerance", o.tolerance}};
    j["findings"] = nlohmann::json::array();
    for (const auto& f : findings) j["findings"].push_back(FindingJson(f));
    io.out << j.dump(2) << "\n";
    return;
  }
  if (format == Format::kCsv) {
    Tabular tab;
    tab.headers = {"finding", "arg", "column", "tabulated", "computed", "diff_units", "class", "emendation", "score",
                   "explanation"};
    for (std::size_t i = 0; i < findings.size(); ++i) {
      const auto& f = findings[i];
      for (const auto& c : f.cells) {
        char diff[32] = "", score[16];
        if (std::isfinite(c.diff_units)) std::snprintf(diff, sizeof diff, "%g", std::round(c.diff_units * 100) / 100);
        std::snprintf(score, sizeof score, "%.2f", f.best().score);
        tab.Add({std::to_string(i + 1), c.arg, f.column_name, c.tabulated, c.computed ? c.computed->ToString() : "",
                 diff, deviation::ToString(f.best().cls), c.emendation ? c.emendation->ToString() : "", score,
                 f.best().evidence});
      }
    }
    io.out << tab.RenderCsv();
    return;
  }
  io.out << "table " << t.table_id << ", witness " << t.witness.siglum << " ("
         << (t.witness.script.empty() ? "hindu-arabic" : t.witness.script) << "), compared with " << model << ": "
         << findings.size() << (findings.size() == 1 ? " finding\n" : " findings\n");
  for (const auto& f : findings) io.out << f.Note(t.witness.siglum) << "\n";
}

std::vector<store::EmendationRecord> Proposals(const Transcription& t, int revision, const std::string& model,
                                               const std::vector<deviation::Finding>& findings) {
  std::vector<store::EmendationRecord> out;
  for (std::size_t i = 0; i < findings.size(); ++i) {
    const auto& f = findings[i];
    if (!deviation::IsCopyingSlip(f.best().cls)) continue;
    for (const auto& c : f.cells) {
      if (!c.emendation || (c.value && c.emendation->Identical(c.value->Rounded(f.places)))) continue;
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
  options.add_options()
      ("table", po::value(&o.table)->required(), "table id")
      ("witness", po::value(&o.witness)->required(), "siglum of the witness")
      ("model", po::value(&o.model), "built-in model to compare with")
      ("param", po::value(&o.params)->composing(), "parameter value NAME=VALUE (repeatable)")
      ("auto", po::bool_switch(&o.automatic), "fit the parameters (of --model, or of every built-in model) first")
      ("column", po::value(&o.column), "only this column")
      ("tolerance", po::value(&o.tolerance)->default_value(0.5), "units of the last place an entry may differ")
      ("rounding", po::value(&o.rounding)->default_value("nearest"), "the author's rounding: nearest|truncate")
      ("revision", po::value(&o.revision), "an earlier revision of the transcription (default: current)")
      ("scripts", po::value(&o.scripts)->default_value(deviation::DefaultScriptDir()), "folder of numeral scripts")
      ("no-record", po::bool_switch(&o.no_record), "do not record the proposals in the database");
  AddFormatOption(options, o.format, {"text", "csv", "json"});
  AddDbOption(options, o.db);
  po::variables_map vm;
  if (ParseOptions(FindCommand("errors"), args, options, vm, io)) return kOk;
  CheckChoice("--format", o.format, {"text", "csv", "json"});
  CheckChoice("--rounding", o.rounding, {"nearest", "truncate"});
  if (o.model.empty() && !o.automatic) throw InputError::ForOption("--model", "expected --model NAME or --auto, found neither");
  if (o.automatic && !o.params.empty()) throw InputError::ForOption("--param", "expected no --param with --auto (the parameters are fitted)");
  if (!(o.tolerance >= 0)) throw InputError::ForOption("--tolerance", ExpectedFound("a number of units >= 0", std::to_string(o.tolerance)));
  if (!std::filesystem::exists(o.db)) throw InputError::ForOption("--db", ExpectedFound("an edition database", "no file '" + o.db + "'"));

  store::Database db(o.db);
  const Transcription t = store::Load(db, o.table, o.witness, o.revision > 0 ? std::optional<int>(o.revision) : std::nullopt);
  const auto columns = estimate::ResolveColumns(t, o.column.empty() ? std::vector<std::string>{} : std::vector<std::string>{o.column});
  const deviation::NumeralScript script = deviation::FindNumeralScript(t.witness.script, o.scripts);
  model::Practice practice;
  practice.rounding = *model::RoundingFromString(o.rounding);
  Chosen chosen;
  if (o.automatic) {
    chosen = AutoModel(o, t, columns, practice);
  } else {
    const model::Model& m = FindModel(o.model);
    chosen = {&m, model::ParamsWithOverrides(m, ParseParams(o.params)), "given"};
  }
  deviation::ExplainOptions eo;
  eo.tolerance = o.tolerance;
  std::vector<deviation::Finding> findings;
  for (int col : columns) {
    const auto re = model::Recompute(*chosen.model, chosen.params, t, col, practice);
    deviation::ColumnValues values{col, re.computed, re.exact};
    auto found = deviation::ExplainColumn(t, values, script, eo);
    findings.insert(findings.end(), found.begin(), found.end());
  }
  const std::string model_text = ModelText(chosen);
  Print(o, t, model_text, findings, io);
  if (!o.no_record) {
    auto proposals = Proposals(t, CurrentRevision(db, o), model_text, findings);
    if (!proposals.empty()) {
      const auto r = store::RecordEmendations(db, proposals);
      io.err << "recorded " << r.added << " new proposed emendation" << (r.added == 1 ? "" : "s") << " in " << o.db
             << (r.kept ? " (" + std::to_string(r.kept) + " already recorded)" : "") << "\n";
    }
  }
  return findings.empty() ? kOk : kFindings;
}

}  // namespace apograph::cli
