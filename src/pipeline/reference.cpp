#include "pipeline/reference.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>

#include "estimate/identify.hpp"
#include "estimate/observations.hpp"
#include "model/formula.hpp"
#include "store/estimate_store.hpp"
#include "store/model_store.hpp"
#include "support/input_error.hpp"

namespace apograph::pipeline {

namespace {

std::shared_ptr<const model::Model> Unowned(const model::Model* m) {
  return std::shared_ptr<const model::Model>(std::shared_ptr<const model::Model>(), m);
}

std::string Decimal(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", v);
  return buf;
}

/// The trade's notation when `v` is a sexagesimal fraction of at most 3
/// places that is not a whole number; empty otherwise.
std::string TradeNotation(double v) {
  if (std::fabs(v - std::round(v)) < 1e-12 || std::fabs(v) >= 1e9) return "";
  for (int places = 1; places <= 3; ++places) {
    const auto s = Sexagesimal::FromDouble(v, places);
    if (std::fabs(s.ToDouble() - v) <= 1e-12 * std::max(1.0, std::fabs(v))) return s.ToString();
  }
  return "";
}

}  // namespace

std::string ParamValueText(double v) {
  const std::string t = TradeNotation(v);
  return t.empty() ? Decimal(v) : t;
}

const char* ToString(ReferenceSource source) {
  return source == ReferenceSource::kGiven ? "given" : "identified";
}

std::shared_ptr<const model::Model> ModelLibrary::Find(const std::string& name) const {
  if (const model::Model* m = model::FindBuiltinModel(name)) return Unowned(m);
  for (const auto& f : formulas) {
    if (f->name() == name) return f;
  }
  return nullptr;
}

std::shared_ptr<const model::Model> ModelLibrary::FindOrThrow(const std::string& name,
                                                              const std::string& option) const {
  if (auto m = Find(name)) return m;
  throw InputError::ForOption(
      option, ExpectedFound("a built-in model or a saved formula (" + KnownNames() + ")",
                            "'" + name + "'"));
}

std::vector<const model::Model*> ModelLibrary::FormulaPointers() const {
  std::vector<const model::Model*> out;
  for (const auto& f : formulas) out.push_back(f.get());
  return out;
}

std::string ModelLibrary::KnownNames() const {
  std::string known;
  for (const auto* m : model::BuiltinModels()) known += (known.empty() ? "" : ", ") + m->name();
  for (const auto& f : formulas) known += ", " + f->name();
  return known;
}

ModelLibrary LoadModelLibrary(store::Database& db) {
  ModelLibrary lib;
  for (const auto& f : store::ListFormulas(db)) {
    try {
      lib.formulas.push_back(model::CompileFormula(f.text, f.name, "formula " + f.name));
    } catch (const InputError& e) {  // left out, with the reason for a warning
      lib.skipped.push_back("saved formula " + f.name + " no longer compiles and is left out: " +
                            e.diagnostics().front().message);
    }
  }
  lib.catalog = store::LoadCatalog(db);
  return lib;
}

std::string DescribePractice(const model::Practice& p, int places) {
  std::string s = std::string(p.rounding == Rounding::kTruncate ? "truncated" : "rounded") +
                  " to " + std::to_string(places) + (places == 1 ? " place" : " places");
  if (p.grid > 0) {
    s += ", exact every " + Decimal(p.grid);
    if (p.grid_origin != 0) s += " from " + Decimal(p.grid_origin);
    s += p.round_nodes ? " (nodes rounded) and linear between" : " and linear between";
  }
  if (p.displacement != 0) s += ", displaced by " + ParamValueText(p.displacement);
  return s;
}

std::string ColumnReference::ModelText() const {
  if (!derived.empty()) return "derived: " + derived;
  std::string out = model->name();
  const auto& specs = model->params();
  for (std::size_t i = 0; i < params.size() && i < specs.size(); ++i) {
    out += " " + specs[i].name + "=" + Decimal(params[i]);
    const std::string t = TradeNotation(params[i]);
    if (!t.empty()) out += " (" + t + ")";
  }
  return out;
}

const ColumnReference& ColumnReference::ForWitness(const std::string& siglum) const {
  for (const auto& v : variants) {
    if (std::find(v.followers.begin(), v.followers.end(), siglum) != v.followers.end()) return v;
  }
  return *this;
}

model::ColumnRecomputation ColumnReference::Recompute(const Transcription& witness) const {
  const ColumnReference& r = ForWitness(witness.witness.siglum);
  return model::Recompute(*r.model, r.params, witness, column, r.practice);
}

std::optional<Sexagesimal> ColumnReference::ValueAt(double argument,
                                                    std::optional<double> arg2) const {
  model::RowContext ctx;
  ctx.arg = argument;
  ctx.arg2 = arg2;
  ctx.column = column;
  const int places = practice.places.value_or(0);
  // A formula that reads the table's other cells has no value here (NaN).
  const double v = model::PracticeValue(*model, params, ctx, practice, places);
  if (!std::isfinite(v) || std::fabs(v) >= 1e12) return std::nullopt;
  return Sexagesimal::FromDouble(v, places, practice.rounding);
}

int ExactEntries(const model::Model& m, const std::vector<double>& params, const Transcription& t,
                 const std::vector<int>& columns, const model::Practice& practice) {
  int exact = 0;
  for (int col : columns) {
    const auto re = model::Recompute(m, params, t, col, practice);
    for (std::size_t r = 0; r < t.rows.size(); ++r) {
      const Cell& cell = t.rows[r].cells[static_cast<std::size_t>(col)];
      exact += cell.state == CellState::kRead && cell.value && re.computed[r] &&
               *cell.value == *re.computed[r];
    }
  }
  return exact;
}

namespace internal {

/// The explicitly requested model (owned when it is a formula).
std::shared_ptr<const model::Model> RequestedModel(const ReferenceRequest& r,
                                                   const ModelLibrary& library) {
  if (!r.formula.empty()) {
    if (!r.model.empty())
      throw InputError::ForOption("--formula", "expected either --model or --formula, found both");
    return std::shared_ptr<const model::Model>(model::CompileFormula(r.formula));
  }
  if (r.model.empty()) return nullptr;
  return library.FindOrThrow(r.model, "--model");
}

}  // namespace internal

}  // namespace apograph::pipeline
