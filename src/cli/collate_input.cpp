#include "cli/collate_input.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>

#include "model/check.hpp"
#include "model/model.hpp"
#include "store/edition_store.hpp"
#include "support/input_error.hpp"

namespace apograph::cli {
namespace {

std::vector<std::string> Split(const std::string& text, char sep) {
  std::vector<std::string> out;
  std::stringstream in(text);
  for (std::string part; std::getline(in, part, sep);) {
    if (!part.empty()) out.push_back(part);
  }
  return out;
}

std::vector<std::pair<std::string, double>> ParseParams(const std::vector<std::string>& params) {
  std::vector<std::pair<std::string, double>> out;
  for (const auto& p : params) {
    const auto eq = p.find('=');
    std::size_t used = 0;
    double v = 0;
    try {
      if (eq != std::string::npos) v = std::stod(p.substr(eq + 1), &used);
    } catch (const std::exception&) {
      used = 0;
    }
    if (eq == std::string::npos || eq == 0 || used == 0 || eq + 1 + used != p.size()) {
      throw InputError::ForOption("--param", ExpectedFound("NAME=NUMBER", "'" + p + "'"));
    }
    out.emplace_back(p.substr(0, eq), v);
  }
  return out;
}

collate::Reference ModelReference(const CollateRequest& r, const std::vector<ColumnSpec>& columns) {
  const model::Model* m = model::FindBuiltinModel(r.model);
  if (!m) throw InputError::ForOption("--model", ExpectedFound("the name of a built-in model", "'" + r.model + "'"));
  const auto params = model::ParamsWithOverrides(*m, ParseParams(r.params));
  int only = -1;
  if (!r.column.empty()) {
    for (std::size_t c = 0; c < columns.size(); ++c) {
      if (columns[c].name == r.column) only = static_cast<int>(c);
    }
    if (only < 0) throw InputError::ForOption("--column", ExpectedFound("a column of the table", "'" + r.column + "'"));
  }
  std::ostringstream d;
  d << r.model;
  for (std::size_t k = 0; k < params.size(); ++k) d << " " << m->params()[k].name << "=" << params[k];
  d << ", rounded to the column's places";
  return {d.str(), [m, params, columns, only](const Sexagesimal& arg, int col) -> std::optional<Sexagesimal> {
            if (only >= 0 && col != only) return std::nullopt;
            model::RowContext ctx;
            ctx.arg = arg.ToDouble();
            ctx.column = col;
            if (columns[col].arg2) ctx.arg2 = columns[col].arg2->ToDouble();
            const double v = m->Evaluate(params, ctx);
            if (!std::isfinite(v)) return std::nullopt;
            return Sexagesimal::FromDouble(v, columns[col].places);
          }};
}

}  // namespace

void AddCollateOptions(po::options_description& o, CollateRequest& r) {
  o.add_options()("witnesses", po::value(&r.witnesses), "only these witnesses (comma-separated sigla)")(
      "model", po::value(&r.model), "judge readings against this built-in model (default: by majority)")(
      "param", po::value(&r.params)->composing(), "model parameter NAME=VALUE (repeatable)")(
      "column", po::value(&r.column), "the column the model computes (default: every column)")(
      "tolerance", po::value(&r.tolerance)->default_value(1),
      "units of the last place a reading may lie from the recomputed value");
}

collate::Collation CollateFromDb(store::Database& db, const CollateRequest& r) {
  auto all = store::LoadTable(db, r.table);
  if (all.empty()) {
    throw InputError::ForOption("--table", ExpectedFound("a table with transcriptions", "'" + r.table + "'"));
  }
  std::vector<Transcription> chosen;
  if (r.witnesses.empty()) {
    chosen = std::move(all);
  } else {
    for (const auto& s : Split(r.witnesses, ',')) {
      auto it = std::find_if(all.begin(), all.end(), [&](const Transcription& t) { return t.witness.siglum == s; });
      if (it == all.end()) {
        throw InputError::ForOption("--witnesses", ExpectedFound("a witness of table " + r.table, "'" + s + "'"));
      }
      chosen.push_back(*it);
    }
  }
  collate::CollateOptions options;
  options.tolerance_units = r.tolerance;
  if (!r.model.empty()) options.reference = ModelReference(r, chosen.front().columns);
  return collate::Collate(chosen, options);
}

}  // namespace apograph::cli
