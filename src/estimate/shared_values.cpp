// One value of a parameter for the whole table (issue 9): an author
// computed a table of several latitudes (ascensional differences, oblique
// ascensions, the length of daylight for each climate) with one obliquity,
// but each column fitted alone lies on the ridge of obliquity and latitude,
// and its own entries may accept another round obliquity with the latitude
// a little off (23;59,47 with 35;0,17 beside five columns adopting 24).
// After every column is adopted, the value adopted by most columns (at
// least two, and more than adopted any other value) is tried in each
// column that adopted another or adopted nothing (its estimates left
// fitted on the ridge: identify_accuracy_bench seed 10, a column at 35
// whose roundings finer than their errors are no longer tried, was never
// offered the table's 24): held there, the column's other parameters
// refitted and its latitude adopted (as written in the heading, else at
// its round or attested value), kept when it keeps the column's entries
// as any adoption must (Keeps, round_values.cpp). Where no value is
// adopted by a majority of the columns, the table's one value is
// estimated from all of them (shared_joint.cpp).
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <map>
#include <utility>

#include "estimate/identify_internal.hpp"
#include "estimate/notation.hpp"

namespace apograph::estimate {

void internal::AddPracticeOnce(std::vector<model::Practice>& out, const model::Practice& p) {
  for (const auto& q : out) {
    if (q.rounding == p.rounding && q.places == p.places && q.grid == p.grid &&
        q.round_nodes == p.round_nodes && q.grid_origin == p.grid_origin)
      return;
  }
  out.push_back(p);
}

namespace {

/// The adopted value of a parameter the table's columns share: a
/// parameter of the model's own (not a rate, radix or radius role) other
/// than the one the table's second argument names, of a model that has
/// that second argument as a parameter (the latitude of a table of
/// several latitudes). Null when there is none.
const AdoptedValue* SharedOf(const Candidate& c, const Transcription& t) {
  if (!c.model || !c.adoption || !t.argument2 || c.model->ParamIndex(t.argument2->name) < 0)
    return nullptr;
  for (const auto& v : c.adoption->values) {
    const int j = c.model->ParamIndex(v.param);
    if (j < 0 || v.param == t.argument2->name) continue;
    if (c.model->params()[static_cast<std::size_t>(j)].role == model::ParamRole::kOther) return &v;
  }
  return nullptr;
}

/// Whether a column that adopted no shared value can be offered `param`:
/// its model has that parameter and the table's second argument, and
/// the column adopted nothing of its own (an estimate left fitted on the
/// ridge is what the table's value is for).
bool Unadopted(const Candidate& c, const Transcription& t, const std::string& param) {
  if (!c.model || !t.argument2 || c.model->ParamIndex(t.argument2->name) < 0 ||
      c.model->ParamIndex(param) < 0)
    return false;
  return !c.adoption;
}

/// The (parameter, value) adopted by most columns, with how many; nullopt
/// when fewer than two columns agree or another value is adopted as often
/// (judgement: one column is no majority, and a tie says nothing).
std::optional<std::pair<std::pair<std::string, double>, int>> MostAdopted(
    const std::vector<ColumnBest>& columns) {
  std::map<std::pair<std::string, double>, int> count;
  for (const auto& c : columns) {
    if (const AdoptedValue* v = SharedOf(*c.best, *c.table)) ++count[{v->param, v->value}];
  }
  std::optional<std::pair<std::pair<std::string, double>, int>> most;
  bool tie = false;
  for (const auto& [key, n] : count) {
    if (most && n == most->second) tie = true;
    if (!most || n > most->second) most = std::make_pair(key, n), tie = false;
  }
  if (!most || tie || most->second < 2) return std::nullopt;
  return most;
}

/// The practices to try for a column: its own, then those of the columns
/// that adopted the shared value (one author, one practice: a column fitted
/// alone may take truncation for rounding, or exact nodes for rounded
/// ones, to absorb what its own obliquity got wrong), each with the
/// column's own sign and displacement.
std::vector<model::Practice> Practices(const ColumnBest& c,
                                       const std::vector<ColumnBest>& agreeing) {
  std::vector<model::Practice> out = {c.best->fit.practice};
  for (const auto& o : agreeing) {
    model::Practice p = o.best->Final().practice;
    p.sign = c.best->fit.practice.sign;
    p.displacement = c.best->fit.practice.displacement;
    internal::AddPracticeOnce(out, p);
  }
  return out;
}

/// The column refitted under `practice` with `fixed` held, the other
/// parameters searched afresh (on the ridge they lie far from the free
/// fit's).
FitResult Under(const Candidate& best, const Transcription& table,
                const std::vector<Observation>& obs, const model::Practice& practice,
                std::map<std::string, double> fixed, const std::optional<double>& displacement) {
  FitOptions fo;
  fo.practice = practice;
  fo.fit_displacement = practice.displacement != 0 && !displacement;
  if (displacement) fo.practice.displacement = *displacement;
  fo.fixed = std::move(fixed);
  for (const auto& p : best.fit.params) {
    if (p.fixed) fo.fixed[p.name] = p.value;
  }
  return Fit(*best.model, table, obs, fo);
}

/// Column `c` with `param` held at `value` and its latitude as written in
/// the heading (else at its own round or attested value, the column's
/// practice kept), under its own practice or another column's that
/// adopted the value; nullopt when the column's entries accept none.
std::optional<Adoption> Holding(const ColumnBest& c, const std::vector<ColumnBest>& agreeing,
                                const std::string& param, double value, const std::string& source,
                                const std::vector<CatalogEntry>* catalog) {
  const Candidate& best = *c.best;
  const std::vector<Observation> obs = CollectObservations(*c.table, {c.column});
  if (obs.empty() || best.fit.n == 0) return std::nullopt;
  const int allowance = internal::ExactAllowance(best.fit.n);
  std::optional<double> displacement;
  if (best.adoption) {
    for (const auto& v : best.adoption->values) {
      if (v.param == "displacement") displacement = v.value;
    }
  }
  const std::string& lat = c.table->argument2->name;
  const int j = best.model->ParamIndex(lat);
  std::optional<std::pair<internal::Trial, FitResult>> found;
  std::string how;
  if (auto w = internal::AsWritten(*c.table, obs, lat)) {
    for (const auto& practice : Practices(c, agreeing)) {
      FitResult f =
          Under(best, *c.table, obs, practice, {{param, value}, {lat, w->value}}, displacement);
      if (!internal::Keeps(f, best.fit, allowance)) continue;
      if (!found || f.exact > found->second.exact) {
        how = practice.rounding == best.fit.practice.rounding &&
                      practice.round_nodes == best.fit.practice.round_nodes
                  ? ""
                  : "; computed as those columns were";
        found = std::make_pair(*w, std::move(f));
      }
    }
  } else {
    const FitResult held =
        Under(best, *c.table, obs, best.fit.practice, {{param, value}}, displacement);
    if (!internal::Keeps(held, best.fit, allowance)) return std::nullopt;
    const auto& fitted = held.params.at(static_cast<std::size_t>(j));
    const int places = best.fit.practice.places.value_or(obs.front().places);
    found = internal::FirstAcceptable(
        internal::Trials(best, lat, fitted.value, fitted.stderr_,
                         &best.model->params()[static_cast<std::size_t>(j)], places, catalog,
                         nullptr),
        best, *c.table, obs, held, {{param, value}}, displacement, lat);
  }
  if (!found) return std::nullopt;
  Adoption a;
  const auto& free = best.fit.params;
  const auto& p = free.at(static_cast<std::size_t>(best.model->ParamIndex(param)));
  const auto& l = free.at(static_cast<std::size_t>(j));
  a.values.push_back({param, value, p.value, p.stderr_, source + how});
  a.values.push_back({lat, found->first.value, l.value, l.stderr_, found->first.source});
  if (displacement)
    a.values.push_back({"displacement", *displacement, best.fit.practice.displacement,
                        best.fit.displacement_stderr, "as adopted in the column alone"});
  a.fit = std::move(found->second);
  a.text = internal::AdoptionText(a.values, best.fit, a.fit);
  return a;
}

/// The obliquity (or another parameter of the model's own) adopted by most
/// columns, tried in the others (see the file comment).
void ShareMostAdopted(const std::vector<ColumnBest>& columns,
                      const std::vector<CatalogEntry>* catalog) {
  const auto most = MostAdopted(columns);
  if (!most) return;
  const auto& [param, value] = most->first;
  const std::string source = "adopted by " + std::to_string(most->second) + " of " +
                             std::to_string(columns.size()) +
                             " columns of the table: one author, one value";
  std::vector<ColumnBest> agreeing, others;
  for (const auto& c : columns) {
    const AdoptedValue* v = SharedOf(*c.best, *c.table);
    if (v && v->param == param)
      (v->value == value ? agreeing : others).push_back(c);
    else if (!v && Unadopted(*c.best, *c.table, param))
      others.push_back(c);
  }
  for (const auto& c : others) {
    if (auto a = Holding(c, agreeing, param, value, source, catalog))
      c.best->adoption = std::move(*a);
  }
}

}  // namespace

void ShareAdoptedValues(const std::vector<ColumnBest>& columns,
                        const std::vector<CatalogEntry>* catalog) {
  ShareMostAdopted(columns, catalog);
  internal::ShareJointEstimate(columns, catalog);
  ShareMotions(columns, catalog);
}

}  // namespace apograph::estimate
