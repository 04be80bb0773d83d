#include "cli/estimate_options.hpp"

#include <cstdlib>

#include "store/estimate_store.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {

double ParseNumber(const std::string& option, const std::string& text) {
  if (auto v = Sexagesimal::Parse(text)) return v->ToDouble();
  char* end = nullptr;
  const double d = std::strtod(text.c_str(), &end);
  if (!text.empty() && end && *end == '\0') return d;
  throw InputError::ForOption(option, ExpectedFound("a number such as 2;4,48 or 2.08", text));
}

std::vector<estimate::CatalogEntry> LoadCatalog(store::Database& db) {
  auto all = estimate::ReadCatalogFile(estimate::DefaultCatalogPath());
  auto more = store::CatalogEntries(db);
  all.insert(all.end(), more.begin(), more.end());
  return all;
}

const model::Model& FindModelOrThrow(const std::string& name) {
  if (const model::Model* m = model::FindBuiltinModel(name)) return *m;
  std::string known;
  for (const auto* m : model::BuiltinModels()) known += (known.empty() ? "" : ", ") + m->name();
  throw InputError::ForOption("--model", ExpectedFound("a model (" + known + ")", name));
}

}  // namespace apograph::cli
