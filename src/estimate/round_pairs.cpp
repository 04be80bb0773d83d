// Two parameters adopted together (see round_values.cpp): an obliquity and
// a latitude the entries determine together more than apart, the latitude
// first held as written in the column's heading (WithWritten), else both
// tried along their ridge (AdoptJointly); and two parameters the entries
// fix only in a combination (AdoptCombination).
#include <algorithm>
#include <cmath>
#include <map>

#include "estimate/identify_internal.hpp"

namespace apograph::estimate::internal {

namespace {

/// Round values along the ridge of two correlated parameters: at 0 and 1
/// places, every value within kRidgeSigmas standard errors of the estimate
/// (at most kRidgeValues of each, nearest first), beyond the two beside it.
/// Judgement: an obliquity fitted at 23;57,52 together with a latitude a
/// little off may come from an author's 23;30, which the roundings beside
/// the estimate never reach.

void AddRidge(std::vector<Trial>& out, double estimate, double se) {
  if (!(se > 0) || !std::isfinite(se)) return;
  for (int p = 0; p <= 1; ++p) {
    const double unit = std::pow(60.0, -p);
    const double lo = std::ceil((estimate - kRidgeSigmas * se) / unit);
    const double hi = std::floor((estimate + kRidgeSigmas * se) / unit);
    std::vector<double> values;
    for (double k = lo; k <= hi && hi - lo < 1e5; ++k) values.push_back(k * unit);
    std::sort(values.begin(), values.end(), [&](double a, double b) {
      return std::fabs(a - estimate) < std::fabs(b - estimate);
    });
    const std::string source = "round, " + std::to_string(p) + (p == 1 ? " place" : " places");
    int added = 0;
    for (double x : values) {
      if (added >= kRidgeValues) break;
      bool seen = false;
      for (const auto& t : out) seen = seen || std::fabs(t.value - x) <= 1e-12 * std::fabs(x);
      if (!seen) out.push_back({x, p, source, kWholeGroup + p}), ++added;
    }
  }
}

/// The second of two parameters held at the value written in the column's
/// heading (AsWritten) and the first then adopted at its own round or
/// attested value near its refitted estimate, when both keep the fit's
/// entries. Measured (adoption_order_test.cpp): with the ridge's values
/// around the free estimate only, an author's 23;50 at a latitude of 30;22
/// was never tried (the free fit lay at 23;35 with a latitude of 30;40).
std::optional<Pair> WithWritten(const Candidate& best, const Transcription& table,
                                const std::vector<Observation>& obs, int places,
                                const std::vector<CatalogEntry>* catalog,
                                const std::vector<std::size_t>& free) {
  const std::string& b = best.fit.params[free[1]].name;
  const std::optional<Trial> written = AsWritten(table, obs, b);
  if (!written) return std::nullopt;
  const int allowance = ExactAllowance(best.fit.n);
  const std::map<std::string, double> fixed = {{b, written->value}};
  // Searched afresh over the first's range, not from the free estimate: on
  // the ridge that lies far from where the written value puts it.
  FitOptions fo;
  fo.practice = best.fit.practice;
  fo.fixed = fixed;
  for (const auto& p : best.fit.params) {
    if (p.fixed) fo.fixed[p.name] = p.value;
  }
  const FitResult held = Fit(*best.model, table, obs, fo);
  if (!Keeps(held, best.fit, allowance)) return std::nullopt;
  const auto& a = held.params[free[0]];
  auto found = FirstAcceptable(Trials(best, a.name, a.value, a.stderr_,
                                      &best.model->params()[free[0]], places, catalog, nullptr),
                               best, table, obs, held, fixed, std::nullopt, a.name);
  if (!found) return std::nullopt;
  return Pair{found->first, *written, std::move(found->second), free[0], free[1]};
}

}  // namespace

/// The value written in the column's heading for the parameter the table's
/// second argument names (a latitude of 23;51 above a column of
/// ascensional differences): what the author computed the column for, the
/// simplest value there is. Measured: identify_accuracy_bench seed 348, six
/// columns of 36 rows computed with an obliquity of 23;33; with the
/// latitude free each column adopted the obliquity nearest along its ridge
/// (23;35, 23;33,30 or 23;33), with the latitude as written the fitted
/// obliquity lies within 2 standard errors of 23;33 in every column.
std::optional<Trial> AsWritten(const Transcription& table, const std::vector<Observation>& obs,
                               const std::string& param) {
  if (obs.empty() || !table.argument2 || table.argument2->name != param) return std::nullopt;
  const auto& spec = table.columns.at(static_cast<std::size_t>(obs.front().column));
  if (!spec.arg2) return std::nullopt;
  return Trial{spec.arg2->ToDouble(), 0, "as written in the column's heading", 0};
}

/// For a model of two free parameters of its own (an obliquity and a
/// latitude), which the entries determine together more than apart: each
/// value of the first (attested, roundings, round values along the ridge)
/// with the second refitted, then each value of the second beside that;
/// of the pairs that keep the fit's entries (as FirstAcceptable), the
/// simplest (attested before round, fewer places), then the one that
/// reproduces most entries exactly. One at a time, the first adopted fixes
/// the second off its round value.
std::optional<Pair> AdoptJointly(const Candidate& best, const Transcription& table,
                                 const std::vector<Observation>& obs, int places,
                                 const std::vector<CatalogEntry>* catalog) {
  std::vector<std::size_t> free;
  const auto& specs = best.model->params();
  for (std::size_t j = 0; j < specs.size() && j < best.fit.params.size(); ++j) {
    const auto& p = best.fit.params[j];
    if (p.fixed) continue;
    if (specs[j].role != model::ParamRole::kOther || !p.separable) return std::nullopt;
    free.push_back(j);
  }
  if (free.size() != 2) return std::nullopt;
  if (auto written = WithWritten(best, table, obs, places, catalog, free)) return written;
  const auto& a = best.fit.params[free[0]];
  const auto& b = best.fit.params[free[1]];
  std::vector<Trial> firsts =
      Trials(best, a.name, a.value, a.stderr_, &specs[free[0]], places, catalog, nullptr);
  AddRidge(firsts, a.value, a.stderr_);
  const int allowance = ExactAllowance(best.fit.n);
  std::optional<Pair> chosen;
  for (const Trial& ta : firsts) {
    std::map<std::string, double> fixed = {{a.name, ta.value}};
    const FitResult refit = FitHolding(best, table, obs, best.fit, fixed, std::nullopt);
    const double bv = refit.Value(b.name);
    for (const Trial& tb :
         Trials(best, b.name, bv, b.stderr_, &specs[free[1]], places, catalog, nullptr)) {
      Pair pair{ta, tb, {}, free[0], free[1]};
      if (chosen && pair.Simplicity() > chosen->Simplicity()) continue;
      fixed[b.name] = tb.value;
      pair.fit = FitHolding(best, table, obs, refit, fixed, std::nullopt);
      if (!Keeps(pair.fit, best.fit, allowance)) continue;
      if (!chosen || pair.Simplicity() < chosen->Simplicity() || pair.fit.exact > chosen->fit.exact)
        chosen = std::move(pair);
    }
  }
  return chosen;
}

/// For a model whose two parameters the entries fix only in a combination
/// (r and e at the greatest distance fix 60 r/(60 + e)): the pairs of
/// simple values (attested, whole numbers) whose combination lies within
/// kRidgeSigmas standard errors of the fitted one (CombinationPairs), each
/// tried with both held; of those that keep the fit's entries (as
/// FirstAcceptable), the one that reproduces most entries exactly, then the
/// nearer. One at a time, an attested r was adopted first and e then
/// fitted to no round value.
std::optional<Pair> AdoptCombination(const Candidate& best, const Transcription& table,
                                     const std::vector<Observation>& obs,
                                     const std::vector<CatalogEntry>* catalog) {
  const int allowance = ExactAllowance(best.fit.n);
  std::optional<Pair> chosen;
  for (const SimplePair& p : CombinationPairs(best, kRidgeSigmas, kRidgeValues, catalog)) {
    const std::string& a = best.fit.params[p.first_index].name;
    const std::string& b = best.fit.params[p.second_index].name;
    Pair pair{{p.first.value, 0, p.first.source, 0},
              {p.second.value, 0, p.second.source, 0},
              {},
              p.first_index,
              p.second_index};
    pair.fit = FitHolding(best, table, obs, best.fit, {{a, p.first.value}, {b, p.second.value}},
                          std::nullopt);
    if (!Keeps(pair.fit, best.fit, allowance)) continue;
    if (!chosen || pair.fit.exact > chosen->fit.exact) chosen = std::move(pair);
  }
  return chosen;
}

}  // namespace apograph::estimate::internal
