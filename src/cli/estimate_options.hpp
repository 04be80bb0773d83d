#pragma once
// Options shared by `fit` and `identify` (internal to the CLI).

#include <memory>
#include <string>
#include <vector>

#include "cli/command.hpp"
#include "edition/transcription.hpp"
#include "estimate/catalog.hpp"
#include "model/model.hpp"
#include "pipeline/reference.hpp"
#include "store/database.hpp"

namespace apograph::cli {

/// A number in trade notation (2;4,48) or decimal (2.08); InputError naming `option`.
double ParseNumber(const std::string& option, const std::string& text);

/// The model registry of the database (pipeline::LoadModelLibrary), with a
/// warning on io.err for each saved formula that no longer compiles.
pipeline::ModelLibrary LoadModels(store::Database& db, Io& io);

}  // namespace apograph::cli
