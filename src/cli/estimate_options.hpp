#pragma once
// Options shared by `fit` and `identify` (internal to the CLI).

#include <memory>
#include <string>
#include <vector>

#include "cli/command.hpp"
#include "edition/transcription.hpp"
#include "estimate/catalog.hpp"
#include "model/model.hpp"
#include "store/database.hpp"

namespace apograph::cli {

/// A number in trade notation (2;4,48) or decimal (2.08); InputError naming `option`.
double ParseNumber(const std::string& option, const std::string& text);

/// A built-in model, or a formula saved in the database (compiled into
/// `holder`), by name; InputError listing the known ones.
const model::Model& FindModelOrThrow(const std::string& name, store::Database& db,
                                     std::unique_ptr<model::Model>& holder);

/// Every formula saved in the database, compiled (for identify).
std::vector<std::unique_ptr<model::Model>> SavedFormulaModels(store::Database& db);

}  // namespace apograph::cli
