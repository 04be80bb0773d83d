#pragma once
// The model and practice options shared by check, errors, collate, stemma
// and apparatus (internal to the CLI): --model NAME | --formula TEXT,
// --param NAME=VALUE..., --rounding, --places, --grid, --grid-origin,
// --round-nodes, --displacement, --sign, and --auto.

#include <string>
#include <utility>
#include <vector>

#include "cli/command.hpp"
#include "pipeline/reference.hpp"

namespace apograph::cli {

struct ReferenceArgs {
  std::string model, formula;
  std::vector<std::string> params;
  std::string rounding = "nearest";
  int places = -1;
  std::string grid = "0", grid_origin = "0", displacement = "0";
  std::string sign = "conventional";
  bool round_nodes = false;
  bool automatic = false;
};

/// Adds the options; --auto only when `auto_help` is not empty (its help text).
void AddReferenceOptions(po::options_description& options, ReferenceArgs& args,
                         const std::string& auto_help = "");

/// "signed", "negated", "magnitude" or "conventional"; InputError naming --sign.
model::SignForm ParseSign(const std::string& text);

/// NAME=VALUE items; values in the trade's notation or decimal. InputError
/// naming `--param` (or `--param NAME` for a bad value).
std::vector<std::pair<std::string, double>> ParseParams(const std::vector<std::string>& items);

/// Checks the options and turns them into a request (nothing is resolved
/// yet). `vm` tells which practice options the editor gave.
pipeline::ReferenceRequest ToReferenceRequest(const ReferenceArgs& args,
                                              const po::variables_map& vm);

}  // namespace apograph::cli
