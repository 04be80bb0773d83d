// apograph fit: robust estimate of a model's parameters from a witness's entries.
#include "cli/command.hpp"

#include <cmath>
#include <cstdio>
#include <iomanip>
#include <optional>
#include <ostream>
#include <sstream>

#include "cli/batch_output.hpp"
#include "cli/estimate_options.hpp"
#include "cli/reference_options.hpp"
#include "estimate/fit.hpp"
#include "estimate/mean_motion_analysis.hpp"
#include "estimate/report.hpp"
#include "store/edition_store.hpp"
#include "store/estimate_store.hpp"
#include "support/input_error.hpp"
#include "support/ordered_batch.hpp"

namespace apograph::cli {

extern const char kFitUsage[] =
    "usage: apograph fit --table ID --witness SIGLUM --model NAME [--column NAME]...\n"
    "                    [--fix NAME=VALUE]... [--rounding nearest|truncate] [--places N]\n"
    "                    [--grid G [--grid-origin X] [--round-nodes]] [--displacement VALUE|fit]\n"
    "                    [--sign signed|negated|magnitude|conventional]\n"
    "                    [--tolerance UNITS] [--all-entries] [--cauchy-only]\n"
    "                    [--format text|json] [--db FILE]\n"
    "       apograph fit (--all | --work WORK) --model NAME [the options above] [--threads N]\n"
    "                    [--format text|csv|json]\n\n"
    "Estimates the model's free parameters by robust least squares (Cauchy loss, scale one\n"
    "unit of the last place), so that a few miscopied entries do not pull the estimate,\n"
    "then by least squares on the entries within 2.5 units (or three robust scales) of that\n"
    "estimate; standard errors from the covariance at the optimum, scaled by the robust\n"
    "scale of the entries used. --cauchy-only stops at the Cauchy estimate (the loss another\n"
    "program would minimise, for comparisons). Several --column options fit the\n"
    "columns jointly with the same parameters. A mean-motion model also gets the analysis\n"
    "of how the table was built. Exit code 1 when entries are flagged.\n\n"
    "--all (or --work) fits the model to every transcription (or every one of the work's\n"
    "tables) in one process on every core, the columns as for one table: text and CSV\n"
    "print one line per transcription as it is done (estimates with their standard errors),\n"
    "JSON one object per line (JSON lines, the fields of the single form); a transcription\n"
    "without readable entries is listed as such. A progress bar shows on a terminal.\n\n"
    "example:\n"
    "  apograph fit --table sun-eq --witness A --model solar-eccentric\n"
    "  apograph fit --table decl --witness B --model declination --rounding truncate --format "
    "json\n"
    "  apograph fit --work lantern --model declination --format csv > fits.csv";

namespace {

struct FitArgs {
  std::string table, witness, model, rounding, displacement, format, db;
  std::string sign = "conventional";
  std::vector<std::string> columns, fixes;
  int places = -1;
  double grid = 0, grid_origin = 0, tolerance = 1.0;
  bool round_nodes = false, all_entries = false, cauchy_only = false;
};

estimate::FitOptions Options(const FitArgs& a, const model::Model& m) {
  estimate::FitOptions o;
  auto r = model::RoundingFromString(a.rounding);
  if (!r)
    throw InputError::ForOption("--rounding", ExpectedFound("nearest or truncate", a.rounding));
  o.practice.rounding = *r;
  if (a.places >= 0) o.practice.places = a.places;
  if (a.grid < 0)
    throw InputError::ForOption("--grid", ExpectedFound("a positive step", std::to_string(a.grid)));
  o.practice.grid = a.grid;
  o.practice.grid_origin = a.grid_origin;
  o.practice.round_nodes = a.round_nodes;
  o.practice.sign = ParseSign(a.sign);
  if (a.displacement == "fit")
    o.fit_displacement = true;
  else if (!a.displacement.empty())
    o.practice.displacement = ParseNumber("--displacement", a.displacement);
  o.tolerance = a.tolerance;
  o.refit_inliers = !a.cauchy_only;
  for (const auto& f : a.fixes) {
    const auto eq = f.find('=');
    if (eq == std::string::npos || eq == 0)
      throw InputError::ForOption("--fix", ExpectedFound("NAME=VALUE", f));
    const std::string name = f.substr(0, eq);
    if (m.ParamIndex(name) < 0)
      throw InputError::ForOption("--fix", ExpectedFound("a parameter of " + m.name(), name));
    o.fixed[name] = ParseNumber("--fix", f.substr(eq + 1));
  }
  return o;
}

std::string Estimates(const estimate::FitResult& fit) {
  std::ostringstream s;
  s << std::setprecision(10);
  for (const auto& p : fit.params) {
    s << (s.tellp() > 0 ? " " : "") << p.name << "=" << p.value;
    if (p.fixed)
      s << "(fixed)";
    else if (std::isfinite(p.stderr_))
      s << "+-" << std::setprecision(2) << p.stderr_ << std::setprecision(10);
    else
      s << "(not separable)";
  }
  return s.str();
}

/// fit --all / --work: every transcription in scope, streamed.
int RunBatch(store::Database& db, const FitArgs& a, const BatchArgs& batch, const model::Model& m,
             const estimate::FitOptions& options,
             const std::vector<estimate::CatalogEntry>& catalog, Io& io) {
  const auto scope = BatchScope(db, batch);
  const Format format = ParseFormat(a.format);
  StreamingTable out(io, format,
                     {"table", "witness", "revision", "model", "entries", "exact", "within_one",
                      "flagged", "scale", "estimates"},
                     {false, false, true, false, true, true, true, true, true, false});
  struct Done {
    std::optional<estimate::FitResult> fit;
    std::string why_not;
  };
  bool findings = false;
  ProgressBar bar(io, "fit");
  support::RunInOrder<Transcription, Done>(
      scope.size(), {static_cast<unsigned>(batch.threads)},
      [&](std::size_t i) { return store::Load(db, scope[i].table_id, scope[i].siglum); },
      [&](const Transcription& t) -> Done {
        for (const auto& name : a.columns) {
          if (t.ColumnIndex(name) < 0) return {std::nullopt, "no column " + name};
        }
        const std::vector<int> columns = estimate::ResolveColumns(t, a.columns);
        const auto obs = estimate::CollectObservations(t, columns);
        if (obs.empty()) return {std::nullopt, "no readable entries"};
        return {estimate::Fit(m, t, obs, options), ""};
      },
      [&](std::size_t i, Transcription&& t, Done&& d) {
        const std::string revision = std::to_string(scope[i].number);
        if (!d.fit) {
          findings = true;
          out.Add(
              {t.table_id, t.witness.siglum, revision, m.name(), "0", "", "", "", "", d.why_not});
          out.AddJson({{"table", t.table_id},
                       {"witness", t.witness.siglum},
                       {"revision", scope[i].number},
                       {"model", m.name()},
                       {"skipped", d.why_not}});
          return;
        }
        const auto& f = *d.fit;
        findings = findings || f.flagged > 0;
        char scale[32];
        std::snprintf(scale, sizeof scale, "%.2f", f.robust_scale);
        out.Add({t.table_id, t.witness.siglum, revision, f.model, std::to_string(f.n),
                 std::to_string(f.exact), std::to_string(f.within1), std::to_string(f.flagged),
                 scale, Estimates(f)});
        if (format == Format::kJson) {
          auto j = estimate::FitJson(f, t, catalog);
          j["revision"] = scope[i].number;
          out.AddJson(j);
        }
      },
      [&](std::size_t done, std::size_t total) { bar.Show(done, total); });
  out.Finish();
  return findings ? kFindings : kOk;
}

}  // namespace

int RunFit(const std::vector<std::string>& args, Io& io) {
  const Command& cmd = FindCommand("fit");
  FitArgs a;
  po::options_description opts("options");
  BatchArgs batch;
  opts.add_options()("table", po::value(&a.table), "table id")("witness", po::value(&a.witness),
                                                               "siglum of the witness")(
      "model", po::value(&a.model)->required(),
      "built-in model or saved formula (see apograph check --help)")(
      "column", po::value(&a.columns),
      "value column (repeat to fit jointly; default: every column)")(
      "fix", po::value(&a.fixes), "hold a parameter: NAME=VALUE (repeatable)")(
      "rounding", po::value(&a.rounding)->default_value("nearest"), "nearest or truncate")(
      "places", po::value(&a.places), "places the author computed to (default: the column's)")(
      "grid", po::value(&a.grid), "interpolation grid in argument units")(
      "grid-origin", po::value(&a.grid_origin), "first node of the grid (default 0)")(
      "round-nodes", po::bool_switch(&a.round_nodes),
      "grid nodes were rounded before interpolating")(
      "displacement", po::value(&a.displacement),
      "constant added to every entry, or 'fit' to estimate it")(
      "sign", po::value(&a.sign)->default_value("conventional"),
      "signed, negated, magnitude or conventional (the model's convention)")(
      "tolerance", po::value(&a.tolerance)->default_value(1.0),
      "flag entries more than this many units away")(
      "all-entries", po::bool_switch(&a.all_entries),
      "text: list every entry, not only flagged ones")(
      "cauchy-only", po::bool_switch(&a.cauchy_only),
      "the Cauchy estimate alone, without the least-squares refit on the inliers (the loss "
      "another program would fit: for comparisons)");
  AddBatchOptions(opts, batch);
  AddDbOption(opts, a.db);
  AddFormatOption(opts, a.format, {"text", "csv", "json"});
  po::variables_map vm;
  if (ParseOptions(cmd, args, opts, vm, io)) return kOk;
  CheckBatchOptions(batch, !a.table.empty() || !a.witness.empty(), "fit");
  if (!batch.Batch() && (a.table.empty() || a.witness.empty()))
    throw InputError::ForOption(a.table.empty() ? "--table" : "--witness",
                                ExpectedFound("--table and --witness together", "only one"));
  if (!batch.Batch() && a.format == "csv")
    throw InputError::ForOption("--format", ExpectedFound("text or json for one table", "csv"));
  store::Database db = OpenEdition(a.db);
  const pipeline::ModelLibrary library = LoadModels(db, io);
  const auto model = library.FindOrThrow(a.model, "--model");
  const model::Model& m = *model;
  const estimate::FitOptions options = Options(a, m);
  if (batch.Batch()) return RunBatch(db, a, batch, m, options, library.catalog, io);
  const Transcription t = store::Load(db, a.table, a.witness);
  const std::vector<int> columns = estimate::ResolveColumns(t, a.columns);
  const auto& catalog = library.catalog;
  const auto obs = estimate::CollectObservations(t, columns);
  if (obs.empty()) {
    throw InputError::ForOption(
        "--witness", ExpectedFound("a witness with readable entries in the columns fitted",
                                   "'" + a.witness +
                                       "', whose cells there are all blank, "
                                       "illegible or partly read"));
  }
  const estimate::FitResult fit = estimate::Fit(m, t, obs, options);
  const bool mm = m.traits().kind == model::ModelKind::kMeanMotion && columns.size() == 1;
  if (a.format == "json") {
    auto j = estimate::FitJson(fit, t, catalog);
    if (mm) j["mean_motion"] = estimate::MeanMotionJson(estimate::AnalyseMeanMotion(t, columns[0]));
    io.out << j.dump(2) << "\n";
  } else {
    io.out << estimate::FitText(fit, t, catalog, a.all_entries);
    if (mm) io.out << "\n" << estimate::MeanMotionText(estimate::AnalyseMeanMotion(t, columns[0]));
  }
  return fit.flagged > 0 ? kFindings : kOk;
}

}  // namespace apograph::cli
