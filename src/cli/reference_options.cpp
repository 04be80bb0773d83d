#include "cli/reference_options.hpp"

#include "cli/estimate_options.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {

void AddReferenceOptions(po::options_description& d, ReferenceArgs& a,
                         const std::string& auto_help) {
  d.add_options()("model", po::value(&a.model), "built-in model or saved formula")(
      "formula", po::value(&a.formula), "an ad-hoc formula (grammar/formula.ebnf)")(
      "param", po::value(&a.params)->composing(),
      "parameter NAME=VALUE (repeatable; 2;16 or 2.2667)")(
      "rounding", po::value(&a.rounding)->default_value("nearest"),
      "the author's rounding: nearest|truncate")(
      "places", po::value(&a.places), "places the author computed to (default: the column's)")(
      "grid", po::value(&a.grid)->default_value("0"),
      "interpolation grid in argument units (0: none)")(
      "grid-origin", po::value(&a.grid_origin)->default_value("0"), "argument of the first node")(
      "round-nodes", po::bool_switch(&a.round_nodes), "round the node values before interpolating")(
      "displacement", po::value(&a.displacement)->default_value("0"),
      "constant added before rounding")(
      "sign", po::value(&a.sign)->default_value("conventional"),
      "how negative values are printed: signed, negated, magnitude or conventional (the "
      "model's convention)");
  if (!auto_help.empty()) d.add_options()("auto", po::bool_switch(&a.automatic), auto_help.c_str());
}

std::vector<std::pair<std::string, double>> ParseParams(const std::vector<std::string>& items) {
  std::vector<std::pair<std::string, double>> out;
  for (const auto& item : items) {
    const auto eq = item.find('=');
    if (eq == std::string::npos || eq == 0) {
      throw InputError::ForOption(
          "--param", ExpectedFound("NAME=VALUE (e.g. e=2;30 or e=2.5)", "'" + item + "'"));
    }
    out.emplace_back(item.substr(0, eq),
                     ParseNumber("--param " + item.substr(0, eq), item.substr(eq + 1)));
  }
  return out;
}

model::SignForm ParseSign(const std::string& text) {
  const auto form = model::SignFormFromString(text);
  if (!form) {
    throw InputError::ForOption(
        "--sign", ExpectedFound("signed, negated, magnitude or conventional", "'" + text + "'"));
  }
  return *form;
}

namespace {

bool Given(const po::variables_map& vm, const char* name) {
  return vm.count(name) && !vm[name].defaulted();
}

model::Practice ParsePractice(const ReferenceArgs& a) {
  model::Practice p;
  auto rounding = model::RoundingFromString(a.rounding);
  if (!rounding)
    throw InputError::ForOption("--rounding",
                                ExpectedFound("nearest or truncate", "'" + a.rounding + "'"));
  p.rounding = *rounding;
  if (a.places >= 0) {
    if (a.places > Sexagesimal::kMaxPlaces) {
      throw InputError::ForOption("--places", ExpectedFound("0 to 12", std::to_string(a.places)));
    }
    p.places = a.places;
  }
  p.grid = ParseNumber("--grid", a.grid);
  if (p.grid < 0)
    throw InputError::ForOption("--grid", ExpectedFound("a grid of 0 or more", "'" + a.grid + "'"));
  p.grid_origin = ParseNumber("--grid-origin", a.grid_origin);
  p.round_nodes = a.round_nodes;
  p.displacement = ParseNumber("--displacement", a.displacement);
  p.sign = ParseSign(a.sign);
  return p;
}

}  // namespace

pipeline::ReferenceRequest ToReferenceRequest(const ReferenceArgs& a, const po::variables_map& vm) {
  pipeline::ReferenceRequest r;
  r.model = a.model;
  r.formula = a.formula;
  if (!r.model.empty() && !r.formula.empty()) {
    throw InputError::ForOption("--formula", "expected either --model or --formula, found both");
  }
  if (vm.count("places") && (a.places < 0 || a.places > Sexagesimal::kMaxPlaces))
    throw InputError::ForOption("--places", ExpectedFound("0 to 12", std::to_string(a.places)));
  r.params = ParseParams(a.params);
  r.practice = ParsePractice(a);
  r.automatic = a.automatic;
  for (const char* o :
       {"rounding", "places", "grid", "grid-origin", "round-nodes", "displacement", "sign"}) {
    if (Given(vm, o) && !(std::string(o) == "round-nodes" && !a.round_nodes))
      r.practice_given = true;
  }
  if (r.automatic && !r.params.empty()) {
    throw InputError::ForOption("--param",
                                "expected no --param with --auto (the parameters are estimated)");
  }
  return r;
}

}  // namespace apograph::cli
