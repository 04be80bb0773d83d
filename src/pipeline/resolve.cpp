// ResolveReferences: a column's reference from the editor's request, or
// identified from the witnesses (see reference.hpp for the choice made).
#include <algorithm>
#include <cmath>
#include <cstdio>

#include "estimate/fit.hpp"
#include "estimate/identify.hpp"
#include "estimate/observations.hpp"
#include "model/check.hpp"
#include "model/formula.hpp"
#include "pipeline/reference.hpp"
#include "support/input_error.hpp"

namespace apograph::pipeline {

namespace internal {
std::shared_ptr<const model::Model> RequestedModel(const ReferenceRequest& r,
                                                   const ModelLibrary& library);
}

namespace {

std::string ColumnList(const Transcription& t) {
  std::string s;
  for (const auto& c : t.columns) s += (s.empty() ? "" : ", ") + c.name;
  return s;
}

/// A formula may only read columns the table has.
void CheckFormulaColumns(const model::Model& m, const Transcription& t) {
  const auto* f = dynamic_cast<const model::FormulaModel*>(&m);
  if (!f) return;
  for (const auto& name : f->columns()) {
    if (t.ColumnIndex(name) < 0) {
      throw InputError::ForOption(
          "--formula", ExpectedFound("a column of table " + t.table_id + " (" + ColumnList(t) + ")",
                                     "col(" + name + ")"));
    }
  }
}

ColumnReference Base(const Transcription& t, int column, std::shared_ptr<const model::Model> m) {
  ColumnReference r;
  r.column = column;
  r.column_name = t.columns.at(static_cast<std::size_t>(column)).name;
  r.model = std::move(m);
  if (dynamic_cast<const model::FormulaModel*>(r.model.get()))
    r.formula = r.model->description();  // its text
  return r;
}

void Finish(ColumnReference& r, const Transcription& t) {
  if (!r.practice.places)
    r.practice.places = t.columns.at(static_cast<std::size_t>(r.column)).places;
  std::string s = r.model->name();
  const auto& specs = r.model->params();
  for (std::size_t i = 0; i < r.params.size() && i < specs.size(); ++i) {
    s += (i ? ", " : " ") + specs[i].name + " = " + ParamValueText(r.params[i]);
  }
  r.description = s + ", " + DescribePractice(r.practice, *r.practice.places);
}

ColumnReference Given(const Transcription& t, int column,
                      const std::shared_ptr<const model::Model>& m,
                      const ReferenceRequest& request) {
  ColumnReference r = Base(t, column, m);
  r.params = model::ParamsWithOverrides(*m, request.params);
  r.practice = request.practice;
  r.source = ReferenceSource::kGiven;
  r.how = "given";
  Finish(r, t);
  return r;
}

/// The best candidate of one witness's column, or nothing.
struct WitnessBest {
  const Transcription* witness = nullptr;
  std::shared_ptr<const model::Model> model;
  estimate::FitResult fit;
  double score = 0;
  std::vector<std::string> ties;
  std::optional<estimate::MeanMotionAnalysis>
      mean_motion;  ///< identify's, for a mean-motion column
};

std::optional<WitnessBest> BestOf(const Transcription& t, int column,
                                  const std::shared_ptr<const model::Model>& requested,
                                  const ReferenceRequest& request, const ModelLibrary& library) {
  if (requested && request.practice_given) {  // the editor fixed the practice: fit only
    estimate::FitOptions fo;
    fo.practice = request.practice;
    const auto obs = estimate::CollectObservations(t, {column});
    if (obs.size() < 3) return std::nullopt;
    WitnessBest b{&t, requested, estimate::Fit(*requested, t, obs, fo), 0, {}, std::nullopt};
    b.score = estimate::Score(b.fit, b.fit.free_parameters);
    return b;
  }
  estimate::IdentifyOptions o;
  o.top = 5;
  if (requested)
    o.models = {requested.get()};
  else {
    for (const auto& f : library.formulas) o.extra_models.push_back(f.get());
  }
  const estimate::Identification id = estimate::Identify(t, column, o);
  if (id.ranked.empty()) {
    if (!requested) return std::nullopt;
    // identify found the model inapplicable to this kind of column: fit it anyway
    ReferenceRequest plain = request;
    plain.practice_given = true;
    return BestOf(t, column, requested, plain, library);
  }
  const auto& best = id.ranked.front();
  std::shared_ptr<const model::Model> m = requested;
  if (!m) {  // keep the very object identify used (a saved formula is owned by the library)
    m = std::shared_ptr<const model::Model>(std::shared_ptr<const model::Model>(), best.model);
    for (const auto& f : library.formulas) {
      if (f.get() == best.model) m = f;
    }
  }
  return WitnessBest{&t, m, best.fit, best.score, id.notes, id.mean_motion};
}

/// A mean motion's radix is fitted modulo the modulus: 360 is written 0.
void ReduceRadix(const model::Model& m, std::vector<double>& params) {
  const int radix = m.ParamIndex("radix"), modulus = m.ParamIndex("modulus");
  if (radix < 0 || modulus < 0) return;
  const double mod = params[static_cast<std::size_t>(modulus)];
  double& r = params[static_cast<std::size_t>(radix)];
  if (!(mod > 0)) return;
  r = std::fmod(r, mod);
  if (r < 0) r += mod;
  if (std::fabs(r - mod) < 1e-9 || std::fabs(r) < 1e-9) r = 0;
}

std::string HowText(const ColumnReference& r, bool fitted_only) {
  char buf[160];
  std::snprintf(buf, sizeof buf, "%s witness %s (%d of %d entries exact, score %.1f)",
                fitted_only ? "fitted to" : "identified from", r.witness.c_str(), r.exact,
                r.entries, r.score);
  std::string s = buf;
  if (r.rounded_places > 0) {
    s += "; parameters brought to " + std::to_string(r.rounded_places) +
         (r.rounded_places == 1 ? " sexagesimal place" : " sexagesimal places");
  }
  return s;
}

ColumnReference Identified(const std::vector<const Transcription*>& from, int column,
                           const std::shared_ptr<const model::Model>& requested,
                           const ReferenceRequest& request, const ModelLibrary& library) {
  std::optional<WitnessBest> chosen;
  for (const Transcription* t : from) {
    auto b = BestOf(*t, column, requested, request, library);
    if (!b) continue;
    const bool better = !chosen || b->fit.exact > chosen->fit.exact ||
                        (b->fit.exact == chosen->fit.exact && b->score > chosen->score);
    if (better) chosen = std::move(b);
  }
  const Transcription& layout = *from.front();
  if (!chosen) {
    throw InputError::ForOption(
        "--auto", "no model could be identified for column " +
                      layout.columns.at(static_cast<std::size_t>(column)).name + " of table " +
                      layout.table_id + " (too few readable entries)");
  }
  ColumnReference r = Base(layout, column, chosen->model);
  r.practice = chosen->fit.practice;
  r.source = ReferenceSource::kIdentified;
  r.witness = chosen->witness->witness.siglum;
  r.score = chosen->score;
  r.ties = chosen->ties;
  r.entries = chosen->fit.n;
  r.estimates = chosen->fit.params;
  r.mean_motion = chosen->mean_motion;
  auto [params, places] =
      RoundParams(*r.model, chosen->fit.Values(), *chosen->witness, {column}, r.practice);
  r.params = std::move(params);
  r.rounded_places = places;
  ReduceRadix(*r.model, r.params);
  r.exact = ExactEntries(*r.model, r.params, *chosen->witness, {column}, r.practice);
  r.how = HowText(r, requested && request.practice_given);
  Finish(r, layout);
  return r;
}

std::vector<const Transcription*> Sources(const std::vector<Transcription>& ws,
                                          const std::string& siglum) {
  std::vector<const Transcription*> out;
  for (const auto& w : ws) {
    if (siglum.empty() || w.witness.siglum == siglum) out.push_back(&w);
  }
  if (out.empty()) {
    std::string known;
    for (const auto& w : ws) known += (known.empty() ? "" : ", ") + w.witness.siglum;
    throw InputError::ForOption(
        "--witness", ExpectedFound("a witness of table " + ws.front().table_id + " (" + known + ")",
                                   "'" + siglum + "'"));
  }
  return out;
}

}  // namespace

std::vector<ColumnReference> ResolveReferences(const std::vector<Transcription>& witnesses,
                                               const ReferenceRequest& request,
                                               const ModelLibrary& library) {
  if (witnesses.empty())
    throw InputError::ForOption("--table", "expected a table with transcriptions, found none");
  const Transcription& layout = witnesses.front();
  const auto requested = internal::RequestedModel(request, library);
  if (!requested && !request.automatic) {
    throw InputError::ForOption(
        "--model", "expected --model NAME, --formula TEXT or --auto, found none of them");
  }
  if (request.automatic && !request.params.empty()) {
    throw InputError::ForOption("--param",
                                "expected no --param with --auto (the parameters are estimated)");
  }
  if (request.automatic && request.practice_given && !requested) {
    throw InputError::ForOption("--auto",
                                "expected --model or --formula with a given practice (--auto alone "
                                "identifies the practice too), found only the practice");
  }
  if (requested) CheckFormulaColumns(*requested, layout);
  const std::vector<int> columns = estimate::ResolveColumns(layout, request.columns);
  const auto from = Sources(witnesses, request.witness);
  std::vector<ColumnReference> out;
  for (int c : columns) {
    out.push_back(request.automatic ? Identified(from, c, requested, request, library)
                                    : Given(layout, c, requested, request));
  }
  return out;
}

}  // namespace apograph::pipeline
