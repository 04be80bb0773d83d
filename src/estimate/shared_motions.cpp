// One motion, one rate (issue 9): the columns of a table of positions by
// date are computed from the same mean motions. The mean sun's column and
// the solar equation's column advance with one rate (the apogee fixed);
// a planet's true longitude has the rates and radices of its columns of
// mean longitude and anomaly. Each column identified alone adopts what
// its own entries allow, and an equation of two places over forty days
// fixes its rate only to a few seconds, where the mean column fixes it to
// a few fifths: the equation then adopted a coarse rounding the mean
// column's entries exclude (identify_accuracy_bench seed 36: the mean
// column adopted 13;10,34,58,33,30,30, the equation 13;10,35), and its
// anomaly radix moved with it.
//
// After each column's adoption, every rate or radix of a column that
// another column of the table determines better (a smaller standard
// error) and adopted at a value near this column's estimate (within
// kRidgeSigmas, or Near below) is held at that value; the column's other parameters are
// refitted and brought to their own round or attested values again
// (round_values.cpp), and the result replaces the column's adoption when
// it keeps the fit's entries as any adoption must (Keeps).
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "estimate/identify_internal.hpp"

namespace apograph::estimate {

namespace {

bool IsRate(model::ParamRole r) {
  return r == model::ParamRole::kRate || r == model::ParamRole::kAnomalyRate;
}

bool IsRadix(model::ParamRole r) {
  return r == model::ParamRole::kRadix || r == model::ParamRole::kAnomalyRadix;
}

/// The distance between two values of a parameter of role `r` (radices on
/// the circle).
double Distance(model::ParamRole r, double a, double b) {
  double d = std::fabs(a - b);
  if (IsRadix(r)) {
    d = std::fmod(d, 360.0);
    d = std::min(d, 360 - d);
  }
  return d;
}

/// How far from a column's estimate another column's value is still tried,
/// beside kRidgeSigmas of its standard error: 2% of a rate, 2 degrees of a
/// radix. Judgement: a planet's longitude over a short arc can settle a few
/// standard errors from its author's motions (identify_accuracy_bench seed
/// 170, all seven parameters 6 s.e. off, the rates 3% and 0.1% off those of
/// its columns of mean longitude and anomaly), while the motions of one
/// table that are not the same motion differ by more (a planet's longitude
/// and anomaly by 12% or more, the moon's by 0.85%: the nearest is taken,
/// and the column's entries decide).
double Near(model::ParamRole role, double value) {
  return IsRadix(role) ? 2.0 : 0.02 * std::fabs(value);
}

/// A value another column adopted for one of its rates or radices.
struct Offer {
  double value = 0;
  double stderr_ = 0;  ///< of that column's own estimate
  std::string column_name;
};

/// The value `c`'s free parameter `p` (of role `role`) may take from
/// another column: of the adoptions of a parameter of the same kind (a rate
/// for a rate, a radix for a radix) in other columns that determine it
/// better than this one (a smaller standard error) and lie within
/// kRidgeSigmas of this estimate or Near it, the nearest.
std::optional<Offer> BestOffer(const ColumnBest& c, const FittedParam& p, model::ParamRole role,
                               const std::vector<ColumnBest>& columns) {
  if (p.fixed || !std::isfinite(p.stderr_) || p.stderr_ <= 0) return std::nullopt;
  std::optional<Offer> out;
  for (const auto& o : columns) {
    if (o.best == c.best || !o.best->model || !o.best->adoption) continue;
    for (const auto& v : o.best->adoption->values) {
      const int j = o.best->model->ParamIndex(v.param);
      if (j < 0) continue;
      const model::ParamRole r = o.best->model->params()[static_cast<std::size_t>(j)].role;
      if (IsRate(r) != IsRate(role) || IsRadix(r) != IsRadix(role)) continue;
      if (!std::isfinite(v.stderr_) || v.stderr_ <= 0 || v.stderr_ >= p.stderr_) continue;
      const double d = Distance(role, v.value, p.value);
      if (d > std::max(internal::kRidgeSigmas * p.stderr_, Near(role, p.value))) continue;
      if (!out || d < Distance(role, out->value, p.value)) {
        const auto& name = c.table->columns.at(static_cast<std::size_t>(o.column)).name;
        out = Offer{v.value, v.stderr_, name};
      }
    }
  }
  return out;
}

/// Whether column `c`'s final fit already has `p` at `value`.
bool AlreadyAt(const ColumnBest& c, const std::string& param, double value) {
  for (const auto& q : c.best->Final().params) {
    if (q.name == param)
      return std::fabs(q.value - value) <= 1e-12 * std::max(1.0, std::fabs(value));
  }
  return false;
}

/// Column `c` with `held` (name -> value, from `offers`) held, its other
/// parameters refitted and adopted afresh; nullopt when its entries do not
/// keep the fit's.
std::optional<Adoption> Holding(const ColumnBest& c, const std::map<std::string, double>& held,
                                const std::map<std::string, Offer>& offers,
                                const std::vector<CatalogEntry>* catalog) {
  const Candidate& best = *c.best;
  const std::vector<Observation> obs = CollectObservations(*c.table, {c.column});
  if (obs.empty() || best.fit.n == 0) return std::nullopt;
  const int allowance = internal::ExactAllowance(best.fit.n);
  FitResult fit = internal::FitHolding(best, *c.table, obs, best.fit, held, std::nullopt);
  if (!internal::Keeps(fit, best.fit, allowance)) return std::nullopt;
  // The column's free fit with the held values marked fixed: its other
  // parameters are then adopted as round_values.cpp adopts them, each
  // compared with the free fit's entries.
  Candidate holding = best;
  holding.adoption.reset();
  for (auto& q : holding.fit.params) {
    if (held.count(q.name)) q.value = held.at(q.name), q.fixed = true;
  }
  Adoption a;
  for (const auto& [name, value] : held) {
    const FittedParam* free = nullptr;
    for (const auto& q : best.fit.params) {
      if (q.name == name) free = &q;
    }
    a.values.push_back({name, value, free ? free->value : value, free ? free->stderr_ : NAN,
                        "adopted for column " + offers.at(name).column_name +
                            ", which fixes it better: one motion, one value"});
  }
  if (auto rest = internal::AdoptRoundValues(holding, *c.table, obs, catalog, nullptr)) {
    a.values.insert(a.values.end(), rest->values.begin(), rest->values.end());
    a.estimates = std::move(rest->estimates);
    fit = std::move(rest->fit);
  }
  if (!internal::Keeps(fit, best.fit, allowance)) return std::nullopt;
  a.fit = std::move(fit);
  a.text = internal::AdoptionText(a.values, best.fit, a.fit);
  return a;
}

}  // namespace

void ShareMotions(const std::vector<ColumnBest>& columns,
                  const std::vector<CatalogEntry>* catalog) {
  std::vector<std::optional<Adoption>> replaced(columns.size());
  for (std::size_t k = 0; k < columns.size(); ++k) {
    const ColumnBest& c = columns[k];
    if (!c.best->model || c.best->fit.n == 0 ||
        c.best->fit.within1 < kExplainedShare * c.best->fit.n)
      continue;
    const auto& specs = c.best->model->params();
    std::map<std::string, double> held;
    std::map<std::string, Offer> offers;
    for (std::size_t j = 0; j < specs.size() && j < c.best->fit.params.size(); ++j) {
      if (!IsRate(specs[j].role) && !IsRadix(specs[j].role)) continue;
      const FittedParam& p = c.best->fit.params[j];
      auto offer = BestOffer(c, p, specs[j].role, columns);
      if (!offer) continue;
      held[p.name] = offer->value;
      offers[p.name] = *offer;
    }
    bool changes = false;
    for (const auto& [name, value] : held) changes = changes || !AlreadyAt(c, name, value);
    if (changes) replaced[k] = Holding(c, held, offers, catalog);
  }
  // Replaced only once every column has been read: a column's new adoption
  // is no evidence for another's.
  for (std::size_t k = 0; k < columns.size(); ++k) {
    if (replaced[k]) columns[k].best->adoption = std::move(replaced[k]);
  }
}

}  // namespace apograph::estimate
