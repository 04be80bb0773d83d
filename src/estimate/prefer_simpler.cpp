// The simpler model named where it explains as much: a candidate with fewer
// free parameters, refitted under the best's rounding and grid with its
// round values adopted, that computes the same values (or reproduces as
// many entries), is shown, the richer one reported as its equivalent.
#include <algorithm>
#include <cmath>
#include <string>

#include "estimate/identify_internal.hpp"

namespace apograph::estimate::internal {

namespace {

/// Entries within one unit (or reproduced exactly), as a share of the
/// entries (at least one), that the simpler of two explanations may lose
/// (judgement: the share round_values.cpp lets an adopted value lose).
constexpr double kSimplerAllowance = 0.03;

/// As SameValues, but for at most `allowance` entries whose computed values
/// differ by one unit (two formulas of one function rounding a value that
/// lies on the boundary differently).
bool NearlySameValues(const Candidate& a, const Candidate& b, int allowance) {
  if (a.fit.entries.size() != b.fit.entries.size()) return false;
  int differ = 0;
  for (std::size_t i = 0; i < a.fit.entries.size(); ++i) {
    const auto& ea = a.fit.entries[i];
    const auto& eb = b.fit.entries[i];
    if (std::fabs(ea.diff_units) > 1 && std::fabs(eb.diff_units) > 1) continue;
    if (ea.computed.has_value() != eb.computed.has_value()) return false;
    if (!ea.computed || *ea.computed == *eb.computed) continue;
    if (std::fabs(ea.diff_units - eb.diff_units) > 1.5 || ++differ > allowance) return false;
  }
  return true;
}

/// `c` refitted with `practice`'s rounding and grid (its own sign form and
/// displacement kept), from its own estimate; `c` itself when they agree.
Candidate UnderPractice(const Candidate& c, const model::Practice& practice,
                        const Transcription& table, const std::vector<Observation>& obs) {
  const model::Practice& own = c.fit.practice;
  if (own.rounding == practice.rounding && own.grid == practice.grid &&
      own.grid_origin == practice.grid_origin && own.round_nodes == practice.round_nodes)
    return c;
  FitOptions fo;
  fo.practice = own;
  fo.practice.rounding = practice.rounding;
  fo.practice.grid = practice.grid;
  fo.practice.grid_origin = practice.grid_origin;
  fo.practice.round_nodes = practice.round_nodes;
  fo.fit_displacement = own.displacement != 0;
  for (const auto& p : c.fit.params) {
    if (!p.fixed) fo.start[p.name] = p.value;
  }
  return MakeCandidate(*c.model, Fit(*c.model, table, obs, fo), practice.grid > 0);
}

Rounding Other(Rounding r) {
  return r == Rounding::kNearest ? Rounding::kTruncate : Rounding::kNearest;
}

/// `c` under `practice`'s grid, rounded as it and the other way (a
/// displacement of half a unit is truncation read as rounding), its round
/// values adopted: the one reproducing more entries exactly, and that one
/// with its adopted fit as its fit.
std::pair<Candidate, Candidate> SimplerUnder(const Candidate& c, const model::Practice& practice,
                                             const Transcription& table,
                                             const std::vector<Observation>& obs,
                                             const std::vector<CatalogEntry>* catalog,
                                             const MeanMotionAnalysis* mean_motion) {
  Candidate simpler, adopted;
  for (Rounding rounding : {practice.rounding, Other(practice.rounding)}) {
    model::Practice p = practice;
    p.rounding = rounding;
    Candidate one = UnderPractice(c, p, table, obs);
    one.adoption = AdoptRoundValues(one, table, obs, catalog, mean_motion);
    Candidate final_one = one;
    final_one.fit = one.Final();
    if (simpler.model && final_one.fit.exact <= adopted.fit.exact) continue;
    simpler = std::move(one);
    adopted = std::move(final_one);
  }
  return {std::move(simpler), std::move(adopted)};
}

}  // namespace

void PreferSimpler(std::vector<Candidate>& ranked, const Transcription& table,
                   const std::vector<Observation>& obs, const std::vector<CatalogEntry>* catalog,
                   const MeanMotionAnalysis* mean_motion) {
  if (ranked.empty()) return;
  const Candidate& front = ranked.front();
  Candidate shown = front;
  shown.fit = front.Final();
  for (std::size_t j = 1; j < ranked.size(); ++j) {
    const Candidate& c = ranked[j];
    if (c.model == front.model || c.fit.free_parameters >= front.fit.free_parameters ||
        !Implausible(c).empty())
      continue;
    auto [simpler, adopted] = SimplerUnder(c, front.fit.practice, table, obs, catalog, mean_motion);
    // As many entries within one unit, but for an entry or two that only
    // the richer model's freedom reaches (kSimplerAllowance).
    const int allowance = std::max(
        1, static_cast<int>(std::ceil(kSimplerAllowance * static_cast<double>(shown.fit.n))));
    // Or, computing other values by a hair (a displacement fitted a little
    // off the radius moves the rounding of some entries), it reproduces as
    // many entries exactly, but for the same allowance.
    if (adopted.fit.within1 < shown.fit.within1 - allowance) continue;
    const bool same = NearlySameValues(shown, adopted, allowance);
    if (!same && adopted.fit.exact < shown.fit.exact - allowance) continue;
    simpler.naming =
        "named " + c.model->name() + " rather than " + front.model->name() +
        (same ? " (with their round values adopted they compute the same value at every entry "
                "they explain)"
              : " (with their round values adopted: " + std::to_string(adopted.fit.exact) +
                    " entries exact against " + std::to_string(shown.fit.exact) + ")") +
        ": the simpler model (" + std::to_string(c.fit.free_parameters) +
        " free parameters against " + std::to_string(front.fit.free_parameters) +
        ") explains as much.";
    simpler.equivalents.push_back({front.model, shown.fit.params});
    for (const auto& e : front.equivalents) simpler.equivalents.push_back(e);
    ranked.erase(ranked.begin() + static_cast<std::ptrdiff_t>(j));
    ranked.front() = std::move(simpler);
    return;
  }
}

}  // namespace apograph::estimate::internal
