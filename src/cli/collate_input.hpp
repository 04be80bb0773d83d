#pragma once
/// What `collate`, `stemma` and `apparatus` share: loading the witnesses of
/// a table from the database and collating them, optionally against a
/// built-in model.

#include <string>
#include <vector>

#include "cli/command.hpp"
#include "collate/collation.hpp"
#include "store/database.hpp"

namespace apograph::cli {

struct CollateRequest {
  std::string table;
  std::string witnesses;  ///< comma-separated sigla; empty: all
  std::string model;      ///< built-in model name; empty: majority basis
  std::vector<std::string> params;  ///< NAME=VALUE
  std::string column;     ///< the column the model computes; empty: every column
  double tolerance = 1;
};

/// Adds --witnesses, --model, --param, --column, --tolerance.
void AddCollateOptions(po::options_description& options, CollateRequest& request);

/// Loads the table's current transcriptions (those named) and collates them.
collate::Collation CollateFromDb(store::Database& db, const CollateRequest& request);

}  // namespace apograph::cli
