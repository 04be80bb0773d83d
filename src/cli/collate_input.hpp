#pragma once
/// What `collate`, `stemma` and `apparatus` share: loading the witnesses of
/// a table from the database and collating them, either by majority or,
/// when a model is given (--model/--formula with the practice options, or
/// --auto), judged by each witness's explained deviations from it.

#include <string>
#include <vector>

#include "cli/command.hpp"
#include "cli/reference_options.hpp"
#include "collate/collation.hpp"
#include "pipeline/decisions.hpp"
#include "pipeline/reference.hpp"
#include "store/database.hpp"

namespace apograph::cli {

struct CollateRequest {
  std::string table;
  std::string witnesses;  ///< comma-separated sigla; empty: all
  std::string column;     ///< the column the model computes; empty: every column
  double tolerance = 1;
  std::string scripts;  ///< numeral scripts folder
  ReferenceArgs reference_args;
  /// Filled by FinishCollateRequest; Empty(): majority basis.
  pipeline::ReferenceRequest reference;
};

/// Adds --witnesses, --column, --tolerance, --scripts and the model options
/// (reference_options.hpp, with --auto).
void AddCollateOptions(po::options_description& options, CollateRequest& request);

/// Checks the model options once parsed.
void FinishCollateRequest(CollateRequest& request, const po::variables_map& vm);

/// A table's transcriptions collated, with the editor's decisions applied.
struct CollatedTable {
  std::vector<Transcription> transcriptions;
  pipeline::TableDecisions decisions;
  collate::Collation collation;
};

/// Loads the table's current transcriptions (those named) and the editor's
/// decisions, and collates them.
CollatedTable CollateTableFromDb(store::Database& db, const CollateRequest& request);
collate::Collation CollateFromDb(store::Database& db, const CollateRequest& request);

}  // namespace apograph::cli
