// One estimate for the table where its columns disagree (issue 9): an
// author computed a table of several latitudes with one obliquity, but
// when that obliquity is not round (24;15,43) each column alone adopts
// the rounding its own copyists' slips favour (24;15,42, 24;15,44,
// 24;15,41 in three columns of 30 rows), and sharing the value most
// columns adopted (shared_values.cpp) needs a majority that such a table
// does not give. There the columns' entries together decide: each
// column's obliquity is estimated with its latitude held (as written in
// its heading, else as the column adopted it), and the estimates are
// combined (weighted by their errors; the error widened by their scatter
// when they disagree more than their errors allow). The joint estimate's
// roundings the joint error fixes, and attested values, are tried in
// every column at once; the first that every column's entries keep
// (Keeps, round_values.cpp), of equally simple ones the one reproducing
// most entries exactly over the table, is adopted for the table. Else the
// table's obliquity is the joint estimate itself, reported with its
// error, and each column computes with it where its entries keep that.
#include <cmath>
#include <cstddef>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "estimate/identify_internal.hpp"
#include "estimate/notation.hpp"

namespace apograph::estimate::internal {

namespace {

/// A column of the table, its latitude held for the joint estimate.
struct Member {
  const ColumnBest* column = nullptr;
  std::vector<Observation> obs;
  AdoptedValue latitude;  ///< held: as written in the heading, else as adopted
  std::optional<AdoptedValue> displacement;
  FitResult held;  ///< the column's fit with the latitude held
  /// Whether `held` keeps the column's entries, so that its estimate joins
  /// the table's (else the column only follows the table's value where
  /// its entries keep it).
  bool estimates = false;
};

/// The parameter the table's columns share: of the model's own (not a
/// rate, radix or radius role) and not the one the table's second
/// argument names. Empty when there is none.
std::string SharedParam(const model::Model& m, const std::string& lat) {
  for (const auto& spec : m.params()) {
    if (spec.role == model::ParamRole::kOther && spec.name != lat) return spec.name;
  }
  return "";
}

/// The value the column adopted for `param`, if any.
const AdoptedValue* AdoptedOf(const Candidate& c, const std::string& param) {
  if (!c.adoption) return nullptr;
  for (const auto& v : c.adoption->values) {
    if (v.param == param) return &v;
  }
  return nullptr;
}

/// Whether no value of `param` is adopted by more than half the columns:
/// a majority is the table's value (shared_values.cpp offers it).
bool NoMajority(const std::vector<ColumnBest>& columns, const std::string& param) {
  std::map<double, int> count;
  for (const auto& c : columns) {
    if (const AdoptedValue* v = AdoptedOf(*c.best, param)) ++count[v->value];
  }
  for (const auto& [value, n] : count) {
    if (2 * n > static_cast<int>(columns.size())) return false;
  }
  return true;
}

/// The column with its latitude held; nullopt when it has none to hold
/// (neither written nor adopted).
std::optional<Member> MemberOf(const ColumnBest& c, const std::string& lat) {
  const Candidate& best = *c.best;
  Member m{&c, CollectObservations(*c.table, {c.column}), {}, std::nullopt, {}};
  if (m.obs.empty() || best.fit.n == 0) return std::nullopt;
  const int j = best.model->ParamIndex(lat);
  const FittedParam& free = best.fit.params.at(static_cast<std::size_t>(j));
  if (auto w = AsWritten(*c.table, m.obs, lat)) {
    m.latitude = {lat, w->value, free.value, free.stderr_, w->source};
  } else if (const AdoptedValue* v = AdoptedOf(best, lat)) {
    m.latitude = *v;
    m.latitude.source += "; as the column adopted it";
  } else {
    return std::nullopt;
  }
  std::optional<double> displacement;
  if (const AdoptedValue* d = AdoptedOf(best, "displacement")) {
    m.displacement = *d;
    displacement = d->value;
  }
  m.held = FitHolding(best, *c.table, m.obs, best.fit, {{lat, m.latitude.value}}, displacement);
  m.estimates = Keeps(m.held, best.fit, ExactAllowance(best.fit.n));
  return m;
}

/// The column's fit with `param` at `value` and its latitude (and
/// displacement) held, under its own practice or another column's (one
/// author, one practice: a column fitted alone may take truncation for
/// rounding to absorb what its own obliquity got wrong), the one that
/// reproduces most entries exactly; nullopt when its entries keep the
/// fit's under none.
std::optional<FitResult> Holding(const Member& m, const std::vector<model::Practice>& practices,
                                 const std::string& param, double value) {
  const Candidate& best = *m.column->best;
  std::optional<double> displacement;
  if (m.displacement) displacement = m.displacement->value;
  std::optional<FitResult> out;
  for (const auto& practice : practices) {
    Candidate under = best;
    under.fit.practice = practice;
    under.fit.practice.sign = best.fit.practice.sign;
    under.fit.practice.displacement = best.fit.practice.displacement;
    FitResult f = FitHolding(under, *m.column->table, m.obs, m.held,
                             {{param, value}, {m.latitude.param, m.latitude.value}}, displacement);
    if (Keeps(f, best.fit, ExactAllowance(best.fit.n)) && (!out || f.exact > out->exact))
      out = std::move(f);
  }
  return out;
}

/// The members' practices, each once (rounding, places, grid and nodes).
std::vector<model::Practice> PracticesOf(const std::vector<Member>& members) {
  std::vector<model::Practice> out;
  for (const auto& m : members) AddPracticeOnce(out, m.column->best->fit.practice);
  return out;
}

/// The weighted mean of the members' estimates of `param` and its error,
/// widened by their scatter beyond their errors (the square root of the
/// reduced chi-square when above 1). Nullopt when an error is not finite.
std::optional<std::pair<double, double>> Joint(const std::vector<Member>& members,
                                               const std::string& param) {
  double sw = 0, swx = 0;
  for (const auto& m : members) {
    const int j = m.column->best->model->ParamIndex(param);
    const FittedParam& p = m.held.params.at(static_cast<std::size_t>(j));
    if (!std::isfinite(p.stderr_) || p.stderr_ <= 0) return std::nullopt;
    const double w = 1 / (p.stderr_ * p.stderr_);
    sw += w, swx += w * p.value;
  }
  const double mean = swx / sw;
  double chi2 = 0;
  for (const auto& m : members) {
    const int j = m.column->best->model->ParamIndex(param);
    const FittedParam& p = m.held.params.at(static_cast<std::size_t>(j));
    chi2 += (p.value - mean) * (p.value - mean) / (p.stderr_ * p.stderr_);
  }
  const double reduced = chi2 / static_cast<double>(members.size() - 1);
  return std::make_pair(mean, std::sqrt(1 / sw) * std::sqrt(std::max(1.0, reduced)));
}

/// Of the trials, the first group in which some value keeps every
/// member's entries, and of that group the value that reproduces most
/// entries exactly over the table, with each member's fit.
std::optional<std::pair<Trial, std::vector<FitResult>>> TableValue(
    const std::vector<Trial>& trials, const std::vector<Member>& members,
    const std::vector<model::Practice>& practices, const std::string& param) {
  std::optional<std::pair<Trial, std::vector<FitResult>>> chosen;
  int chosen_exact = -1;
  for (const auto& t : trials) {
    if (chosen && t.group != chosen->first.group) break;
    std::vector<FitResult> fits;
    int exact = 0;
    for (const auto& m : members) {
      auto f = Holding(m, practices, param, t.value);
      if (!f) break;
      exact += f->exact;
      fits.push_back(std::move(*f));
    }
    if (fits.size() != members.size() || exact <= chosen_exact) continue;
    chosen = std::make_pair(t, std::move(fits));
    chosen_exact = exact;
  }
  return chosen;
}

/// The member's adoption: `param` at `value` (adopted, or the joint
/// estimate with its error `joint_se`), its latitude and displacement as
/// held, and whether it computes as another column does.
Adoption AdoptionOf(const Member& m, const std::string& param, double value,
                    const std::string& source, FitResult fit, std::optional<double> joint_se) {
  const Candidate& best = *m.column->best;
  const FittedParam& free =
      best.fit.params.at(static_cast<std::size_t>(best.model->ParamIndex(param)));
  Adoption a;
  if (!joint_se) a.values.push_back({param, value, free.value, free.stderr_, source});
  a.values.push_back(m.latitude);
  if (m.displacement) a.values.push_back(*m.displacement);
  a.fit = std::move(fit);
  a.text = AdoptionText(a.values, best.fit, a.fit);
  if (a.fit.practice.rounding != best.fit.practice.rounding ||
      a.fit.practice.round_nodes != best.fit.practice.round_nodes)
    a.text += "; computed as another column of the table is (one author, one practice)";
  if (joint_se) {
    // Estimated, not adopted: the table's one value with its error.
    a.estimates = best.fit.params;
    for (auto& p : a.estimates) {
      if (p.name == param) p.value = value, p.stderr_ = *joint_se;
    }
    a.text += "; " + param + " = " + NumberText(value, 4) + " (" + source + ")";
  }
  return a;
}

}  // namespace

void ShareJointEstimate(const std::vector<ColumnBest>& columns,
                        const std::vector<CatalogEntry>* catalog) {
  // The columns the entries explain: one model in all, with the table's
  // second argument and the shared value free.
  std::vector<ColumnBest> explained;
  for (const auto& c : columns) {
    const FitResult& f = c.best->fit;
    if (!c.best->model || f.n == 0 || f.within1 < kExplainedShare * f.n) continue;
    if (!explained.empty() && c.best->model->name() != explained.front().best->model->name())
      return;
    explained.push_back(c);
  }
  if (explained.size() < 2) return;
  const model::Model& m = *explained.front().best->model;
  const Transcription& table = *explained.front().table;
  if (!table.argument2 || m.ParamIndex(table.argument2->name) < 0) return;
  const std::string& lat = table.argument2->name;
  const std::string param = SharedParam(m, lat);
  if (param.empty()) return;
  for (const auto& c : explained) {
    if (c.best->fit.params.at(static_cast<std::size_t>(m.ParamIndex(param))).fixed) return;
  }
  if (!NoMajority(explained, param)) return;
  std::vector<Member> members, followers;
  for (const auto& c : explained) {
    if (auto m = MemberOf(c, lat)) (m->estimates ? members : followers).push_back(std::move(*m));
  }
  if (members.size() < 2) return;
  const auto joint = Joint(members, param);
  if (!joint) return;
  const double mean = joint->first;
  const double se = joint->second;
  const Candidate& lead = *members.front().column->best;
  const std::size_t j = static_cast<std::size_t>(lead.model->ParamIndex(param));
  const int places = lead.fit.practice.places.value_or(members.front().obs.front().places);
  std::vector<Trial> trials =
      Trials(lead, param, mean, se, &lead.model->params()[j], places, catalog, nullptr);
  const model::ParamSpec* spec = &lead.model->params()[j];
  std::erase_if(trials, [se, spec](const Trial& t) { return UndeterminedPlace(t, se, spec); });
  const std::string joint_text = "the table's joint estimate " + NumberText(mean, 4) + " ± " +
                                 NumberText(se, 4) + " from " + std::to_string(members.size()) +
                                 " columns, their latitudes held";
  const std::vector<model::Practice> practices = PracticesOf(members);
  if (auto found = TableValue(trials, members, practices, param)) {
    const std::string source = found->first.source + " of " + joint_text +
                               "; every column keeps it: one author, one value";
    for (std::size_t k = 0; k < members.size(); ++k) {
      members[k].column->best->adoption = AdoptionOf(members[k], param, found->first.value, source,
                                                     std::move(found->second[k]), std::nullopt);
    }
    for (const auto& m : followers) {
      if (auto f = Holding(m, practices, param, found->first.value))
        m.column->best->adoption =
            AdoptionOf(m, param, found->first.value, source, std::move(*f), std::nullopt);
    }
    return;
  }
  const std::string source = joint_text + "; no round or attested value keeps every column";
  for (const auto* group : {&members, &followers}) {
    for (const auto& m : *group) {
      if (auto f = Holding(m, practices, param, mean))
        m.column->best->adoption = AdoptionOf(m, param, mean, source, std::move(*f), se);
    }
  }
}

}  // namespace apograph::estimate::internal
