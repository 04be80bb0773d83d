// apograph fit: robust estimate of a model's parameters from a witness's entries.
#include "cli/command.hpp"

#include <ostream>

#include "cli/estimate_options.hpp"
#include "cli/reference_options.hpp"
#include "estimate/fit.hpp"
#include "estimate/mean_motion_analysis.hpp"
#include "estimate/report.hpp"
#include "store/edition_store.hpp"
#include "store/estimate_store.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {

extern const char kFitUsage[] =
    "usage: apograph fit --table ID --witness SIGLUM --model NAME [--column NAME]...\n"
    "                    [--fix NAME=VALUE]... [--rounding nearest|truncate] [--places N]\n"
    "                    [--grid G [--grid-origin X] [--round-nodes]] [--displacement VALUE|fit]\n"
    "                    [--sign signed|negated|magnitude|conventional]\n"
    "                    [--tolerance UNITS] [--all-entries]\n"
    "                    [--format text|json] [--db FILE]\n\n"
    "Estimates the model's free parameters by robust least squares (Cauchy loss, scale one\n"
    "unit of the last place), so that a few miscopied entries do not pull the estimate;\n"
    "standard errors from the covariance at the optimum. Several --column options fit the\n"
    "columns jointly with the same parameters. A mean-motion model also gets the analysis\n"
    "of how the table was built. Exit code 1 when entries are flagged.\n\n"
    "example:\n"
    "  apograph fit --table sun-eq --witness A --model solar-eccentric\n"
    "  apograph fit --table decl --witness B --model declination --rounding truncate --format json";

namespace {

struct FitArgs {
  std::string table, witness, model, rounding, displacement, format, db;
  std::string sign = "conventional";
  std::vector<std::string> columns, fixes;
  int places = -1;
  double grid = 0, grid_origin = 0, tolerance = 1.0;
  bool round_nodes = false, all_entries = false;
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

}  // namespace

int RunFit(const std::vector<std::string>& args, Io& io) {
  const Command& cmd = FindCommand("fit");
  FitArgs a;
  po::options_description opts("options");
  opts.add_options()("table", po::value(&a.table)->required(), "table id")(
      "witness", po::value(&a.witness)->required(), "siglum of the witness")(
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
      "text: list every entry, not only flagged ones");
  AddDbOption(opts, a.db);
  AddFormatOption(opts, a.format, {"text", "json"});
  po::variables_map vm;
  if (ParseOptions(cmd, args, opts, vm, io)) return kOk;
  CheckChoice("--format", a.format, {"text", "json"});
  store::Database db = OpenEdition(a.db);
  const pipeline::ModelLibrary library = LoadModels(db, io);
  const auto model = library.FindOrThrow(a.model, "--model");
  const model::Model& m = *model;
  const estimate::FitOptions options = Options(a, m);
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
