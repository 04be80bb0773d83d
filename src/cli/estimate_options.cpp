#include "cli/estimate_options.hpp"

#include <cmath>
#include <cstdlib>

#include "model/formula.hpp"
#include "store/estimate_store.hpp"
#include "store/model_store.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {

double ParseNumber(const std::string& option, const std::string& text) {
  if (auto v = Sexagesimal::Parse(text)) return v->ToDouble();
  // A plain decimal only: strtod alone would also take hexadecimal, blanks and "infinity".
  const bool decimal = text.find_first_not_of("0123456789+-.eE") == std::string::npos;
  char* end = nullptr;
  const double d = std::strtod(text.c_str(), &end);
  if (decimal && !text.empty() && end && *end == '\0' && std::isfinite(d)) return d;
  throw InputError::ForOption(option,
                              ExpectedFound("a number such as 2;4,48 or 2.08", "'" + text + "'"));
}

const model::Model& FindModelOrThrow(const std::string& name, store::Database& db,
                                     std::unique_ptr<model::Model>& holder) {
  if (const model::Model* m = model::FindBuiltinModel(name)) return *m;
  if (auto saved = store::FindFormula(db, name)) {
    holder = model::CompileFormula(saved->text, saved->name, "formula " + saved->name);
    return *holder;
  }
  std::string known;
  for (const auto* m : model::BuiltinModels()) known += (known.empty() ? "" : ", ") + m->name();
  for (const auto& f : store::ListFormulas(db)) known += ", " + f.name;
  throw InputError::ForOption("--model",
                              ExpectedFound("a model or saved formula (" + known + ")", name));
}

std::vector<std::unique_ptr<model::Model>> SavedFormulaModels(store::Database& db) {
  std::vector<std::unique_ptr<model::Model>> out;
  for (const auto& f : store::ListFormulas(db)) {
    try {
      out.push_back(model::CompileFormula(f.text, f.name, "formula " + f.name));
    } catch (const InputError&) {
      // A saved formula that no longer compiles is skipped (formula show says why).
    }
  }
  return out;
}

}  // namespace apograph::cli
