// ResolveReferences: a column's reference from the editor's request, or
// identified from the witnesses (see reference.hpp for the choice made).
#include <algorithm>
#include <cmath>
#include <cstdio>

#include "estimate/fit.hpp"
#include "estimate/identify.hpp"
#include "estimate/notation.hpp"
#include "estimate/observations.hpp"
#include "model/check.hpp"
#include "model/formula.hpp"
#include "pipeline/derived_references.hpp"
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

/// The best explanation of one witness's column, or nothing.
struct WitnessBest {
  const Transcription* witness = nullptr;
  std::shared_ptr<const model::Model> model;
  estimate::Candidate best;
  std::vector<std::string> notes;
  std::optional<estimate::MeanMotionAnalysis> mean_motion;  ///< identify's, for a mean motion
  bool explains = true;
  std::string verdict;
};

/// The editor fixed the practice: the model's parameters are only fitted
/// (then brought to round or attested values).
std::optional<WitnessBest> FitOnly(const Transcription& t, int column,
                                   const std::shared_ptr<const model::Model>& requested,
                                   const ReferenceRequest& request, const ModelLibrary& library) {
  estimate::FitOptions fo;
  fo.practice = request.practice;
  const auto obs = estimate::CollectObservations(t, {column});
  if (obs.size() < 3) return std::nullopt;
  WitnessBest b;
  b.witness = &t;
  b.model = requested;
  b.best.model = requested.get();
  b.best.fit = estimate::Fit(*requested, t, obs, fo);
  const auto& entries = b.best.fit.entries;
  if (std::none_of(entries.begin(), entries.end(),
                   [](const estimate::FitEntry& e) { return e.computed.has_value(); })) {
    throw InputError::ForOption(
        "--model", ExpectedFound("a model that gives a value on some row of column " +
                                     t.columns.at(static_cast<std::size_t>(column)).name,
                                 "'" + requested->name() + "', undefined on every row"));
  }
  b.best.penalised_parameters = b.best.fit.free_parameters;
  b.best.score = estimate::Score(b.best.fit, b.best.penalised_parameters);
  b.best.adoption = estimate::AdoptRoundValues(*requested, b.best.fit, t, column, &library.catalog);
  const auto& f = b.best.Final();
  b.explains = f.n > 0 && f.within1 >= estimate::kExplainedShare * f.n;
  return b;
}

/// The object identify used, shared: a saved formula is owned by the library.
std::shared_ptr<const model::Model> Shared(const model::Model* m, const ModelLibrary& library) {
  for (const auto& f : library.formulas) {
    if (f.get() == m) return f;
  }
  return std::shared_ptr<const model::Model>(std::shared_ptr<const model::Model>(), m);
}

std::optional<WitnessBest> BestOf(const Transcription& t, int column,
                                  const std::shared_ptr<const model::Model>& requested,
                                  const ReferenceRequest& request, const ModelLibrary& library) {
  if (requested && request.practice_given) return FitOnly(t, column, requested, request, library);
  estimate::IdentifyOptions o;
  o.top = 5;
  o.catalog = &library.catalog;
  if (requested)
    o.models = {requested.get()};
  else
    o.extra_models = library.FormulaPointers();
  const estimate::Identification id = estimate::Identify(t, column, o);
  if (id.ranked.empty()) {
    if (!requested || estimate::CollectObservations(t, {column}).size() < 3) return std::nullopt;
    // identify found the model undefined on most rows: fit it anyway (the
    // fit says where it has no value)
    ReferenceRequest plain = request;
    plain.practice_given = true;
    return FitOnly(t, column, requested, plain, library);
  }
  WitnessBest b;
  b.witness = &t;
  b.best = id.ranked.front();
  b.model = requested ? requested : Shared(b.best.model, library);
  b.notes = id.notes;
  b.mean_motion = id.mean_motion;
  b.explains = id.explained;
  b.verdict = id.verdict;
  return b;
}

/// A mean motion's radix is fitted modulo the modulus: 360 is written 0.
void ReduceRadix(const model::Model& m, std::vector<double>& params) {
  const int radix = m.ParamIndex(model::ParamRole::kRadix),
            modulus = m.ParamIndex(model::ParamRole::kModulus);
  if (radix < 0 || modulus < 0) return;
  const double mod = params[static_cast<std::size_t>(modulus)];
  double& r = params[static_cast<std::size_t>(radix)];
  if (!(mod > 0)) return;
  r = std::fmod(r, mod);
  if (r < 0) r += mod;
  if (std::fabs(r - mod) < 1e-9 || std::fabs(r) < 1e-9) r = 0;
}

std::string HowText(const ColumnReference& r, bool fitted_only) {
  char buf[200];
  std::snprintf(buf, sizeof buf,
                "%s witness %s (%d of %d entries exact, %d within one unit, score %.1f)",
                fitted_only ? "fitted to" : "identified from", r.witness.c_str(), r.exact,
                r.entries, r.within_one, r.score);
  std::string s = buf;
  for (const auto& a : r.adopted) {
    s += "; " + a.param + " = " + estimate::NumberText(a.value, 6) + " adopted (" + a.source +
         "), fitted " + estimate::NumberWithDecimal(a.fitted, 4);
  }
  if (!r.explains) s += "; " + r.verdict;
  return s;
}

/// Better evidence of the author's computation: more entries within one
/// unit, then more exact, then the higher score.
bool Better(const WitnessBest& a, const WitnessBest& b) {
  const auto& fa = a.best.Final();
  const auto& fb = b.best.Final();
  if (fa.within1 != fb.within1) return fa.within1 > fb.within1;
  if (fa.exact != fb.exact) return fa.exact > fb.exact;
  return a.best.score > b.best.score;
}

void FillIdentified(ColumnReference& r, const WitnessBest& chosen) {
  const estimate::Candidate& c = chosen.best;
  const estimate::FitResult& f = c.Final();
  r.practice = f.practice;
  r.source = ReferenceSource::kIdentified;
  r.witness = chosen.witness->witness.siglum;
  r.score = c.score;
  r.penalised_parameters = c.penalised_parameters;
  // identify's notes without the naming note, which has a field of its own
  // (shown once by every report).
  for (const auto& note : chosen.notes) {
    if (note != c.naming) r.ties.push_back(note);
  }
  r.entries = f.n;
  r.exact = f.exact;
  r.within_one = f.within1;
  r.estimates = c.adoption && !c.adoption->estimates.empty() ? c.adoption->estimates : c.fit.params;
  r.mean_motion = chosen.mean_motion;
  r.params = f.Values();
  ReduceRadix(*r.model, r.params);
  if (c.adoption) {
    r.adopted = c.adoption->values;
    r.adoption = c.adoption->text;
  }
  for (const auto& e : c.equivalents) {
    std::string s = e.model->name();
    for (const auto& p : e.params) {
      if (!p.fixed) s += " " + p.name + " = " + estimate::NumberText(p.value);
    }
    r.equivalents.push_back(s);
  }
  r.naming = c.naming;
  r.explains = chosen.explains;
  r.verdict = chosen.verdict;
}

/// The witness whose best explanation of `column` is the best evidence.
WitnessBest Chosen(const std::vector<const Transcription*>& from, int column,
                   const std::shared_ptr<const model::Model>& requested,
                   const ReferenceRequest& request, const ModelLibrary& library) {
  std::optional<WitnessBest> chosen;
  for (const Transcription* t : from) {
    auto b = BestOf(*t, column, requested, request, library);
    if (b && (!chosen || Better(*b, *chosen))) chosen = std::move(b);
  }
  if (!chosen) {
    const Transcription& layout = *from.front();
    throw InputError::ForOption(
        "--auto", "no model could be identified for column " +
                      layout.columns.at(static_cast<std::size_t>(column)).name + " of table " +
                      layout.table_id + " (too few readable entries)");
  }
  return std::move(*chosen);
}

ColumnReference Identified(const Transcription& layout, int column, const WitnessBest& chosen,
                           const std::shared_ptr<const model::Model>& requested,
                           const ReferenceRequest& request) {
  ColumnReference r = Base(layout, column, chosen.model);
  FillIdentified(r, chosen);
  r.how = HowText(r, requested && request.practice_given);
  Finish(r, layout);
  return r;
}

/// Every column's best explanation, then one value for the table where
/// most columns adopted it (estimate::ShareAdoptedValues), when identify
/// chose the models.
std::vector<ColumnReference> IdentifiedAll(const std::vector<const Transcription*>& from,
                                           const std::vector<int>& columns,
                                           const std::shared_ptr<const model::Model>& requested,
                                           const ReferenceRequest& request,
                                           const ModelLibrary& library) {
  std::vector<WitnessBest> chosen;
  for (int c : columns) chosen.push_back(Chosen(from, c, requested, request, library));
  if (!requested) {
    std::vector<estimate::ColumnBest> bests;
    for (std::size_t i = 0; i < columns.size(); ++i)
      bests.push_back({chosen[i].witness, columns[i], &chosen[i].best});
    estimate::ShareAdoptedValues(bests, &library.catalog);
  }
  std::vector<ColumnReference> out;
  for (std::size_t i = 0; i < columns.size(); ++i)
    out.push_back(Identified(*from.front(), columns[i], chosen[i], requested, request));
  return out;
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
  if (request.automatic) {
    out = IdentifiedAll(from, columns, requested, request, library);
  } else {
    for (int c : columns) out.push_back(Given(layout, c, requested, request));
  }
  // Columns computed from other columns, when the model is identified.
  if (request.automatic && !requested) internal::AddDerivedReferences(from, out);
  return out;
}

}  // namespace apograph::pipeline
