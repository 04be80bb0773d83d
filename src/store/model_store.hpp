#pragma once
/// The model library's tables (schema/002_models.sql) as plain values: user
/// formulas saved by name, and check runs with their entries.

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "model/check.hpp"
#include "store/database.hpp"

namespace apograph::store {

/// A formula as saved; the text is compiled by model::CompileFormula.
struct SavedFormula {
  std::string name;
  std::string text;
  std::string description;
  std::string updated_at;  ///< set by the database
};

/// Saves (or replaces) a formula under its name, in one transaction. The
/// caller compiles the text first so that only valid formulas are saved.
void SaveFormula(Database& db, const SavedFormula& formula);
/// The formula saved under `name`, if any.
std::optional<SavedFormula> FindFormula(Database& db, const std::string& name);
/// All saved formulas, by name.
std::vector<SavedFormula> ListFormulas(Database& db);

// CurrentRevision: see store/edition_store.hpp (0 when there is none).

/// Stores one check run (its practice, parameters, summary and every entry)
/// in one transaction and returns its id. `formula_text` is the text when the
/// model was a formula.
std::int64_t SaveCheckRun(Database& db, const model::CheckReport& report,
                          std::optional<int> revision,
                          const std::optional<std::string>& formula_text);

/// Number of stored check runs for a table and witness (for tests and
/// summaries).
int CountCheckRuns(Database& db, const std::string& table_id, const std::string& siglum);

}  // namespace apograph::store
