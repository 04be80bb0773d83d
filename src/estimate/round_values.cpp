// Round and attested values first: authors computed with round parameters
// (a radius of 60, an eccentricity of 2;30) or values of their tradition, and
// a fitted value that reproduces a few more entries exactly (60;0,0,17)
// usually does so by absorbing the author's own departures, which the
// edition must keep. For the best explanation, each free parameter in turn
// is first tried at its whole values alone, then each parameter not yet
// adopted (then the displacement) at attested values and at coarse
// sexagesimal roundings of its estimate (the two values beside it at each
// number of places), simplest first; the first that leaves no more entries
// beyond one unit than the fit, and loses at most a few entries reproduced
// exactly (kExactAllowance), or reproduces as many exactly and leaves at
// most a few more beyond one unit (Keeps), is adopted (of equally simple
// ones, the one reproducing most entries exactly), the other parameters
// refitted under it. Two parameters of a model's own that the entries
// determine together (an obliquity and a latitude) are tried together
// (AdoptJointly, round_pairs.cpp), and so
// are two the entries fix only in a combination (AdoptCombination: r and e
// at the epicycle's greatest distance); a combination of an equivalent
// model's simple values is as simple as a whole number (an epicycle at mean
// distance of radius 60 r/(60 + e), round_equivalents.cpp). A table of
// positions left on a ridge takes one tradition's attested geometry as a
// set (a planet's epicycle and eccentricity, AdoptAttestedSet,
// round_sets.cpp), its motions searched afresh under it, before the others
// are adopted one at a time from there.
#include <algorithm>
#include <cmath>
#include <map>

#include "estimate/identify_internal.hpp"
#include "estimate/notation.hpp"

namespace apograph::estimate::internal {

namespace {

/// Roundings are tried to this many places for most parameters (coarse:
/// judgement, the places in which authors chose their parameters), more for
/// the rates and radices of motions.
int MaxPlaces(const model::ParamSpec* spec, int column_places) {
  if (!spec) return 2;  // the displacement
  switch (spec->role) {
    case model::ParamRole::kRate:
    case model::ParamRole::kAnomalyRate:
      return 6;
    case model::ParamRole::kRadix:
    case model::ParamRole::kAnomalyRadix:
    case model::ParamRole::kApogee:
      return std::max(2, column_places);
    default:
      return 2;
  }
}

/// A rate's rounding to some places is adopted only when it reproduces at
/// least this many entries more exactly than the other acceptable value of
/// its group (the rounding beside the estimate at as many places): at one
/// or two more the choice between them is the copyists' slips, not the
/// author's value (rates of four places left half a unit of the fourth
/// place off). Measured on identify_accuracy_bench seeds 1-300: with a
/// margin of 1 (no tie adopted), 2 and 3, parameters equal or within 2 s.e.
/// 470, 472, 472 of 565 (467 before), round values adopted 368, 368, 366
/// of 431 (368 before).
constexpr int kRoundingMargin = 2;

/// Under a set held because the entries do not determine it
/// (AdoptAttestedSet), a rounding whose unit is smaller than this many
/// standard errors of the estimate under the set is not tried: the entries
/// cannot tell it from its neighbours, and adopting it would claim a place
/// they do not fix (the parameter stays fitted, with its error). Judgement
/// (two standard errors: the neighbour then lies within the estimate's
/// usual range); measured on identify_accuracy_bench seeds 1-300, see
/// DEVELOPERS.md, issue 9, thirteenth round.
constexpr double kUndeterminedPlace = 2;

/// A rounding (not an attested or equivalent value) finer than the
/// estimate's error allows (kUndeterminedPlace).
bool FinerThanError(const Trial& t, double se) {
  return std::isfinite(se) && t.source.rfind("round, ", 0) == 0 &&
         std::pow(60.0, -t.places) < kUndeterminedPlace * se;
}

bool IsRate(const model::ParamSpec* spec) {
  return spec &&
         (spec->role == model::ParamRole::kRate || spec->role == model::ParamRole::kAnomalyRate);
}

int PlacesOf(const Sexagesimal& v) {
  int p = v.places();
  while (p > 0 && v.Rounded(p - 1).Extended(p) == v) --p;
  return p;
}

}  // namespace

/// A rounding (not an attested or equivalent value) finer than one place
/// of a parameter other than a rate, whose unit is smaller than
/// kUndeterminedPlace standard errors of the free estimate: the entries
/// cannot tell it from the roundings beside it, and adopting it would
/// claim a place they do not fix (a solar eccentricity fitted at
/// 2;14,57,56 +- 0;0,1,50 adopted at 2;14,58 for an author's 2;15). Whole and
/// one-place values are still tried (what authors chose); rates have
/// their own test (kRoundingMargin); the two parameters of a spherical
/// table adopted together (AdoptJointly) are judged by their pair.
/// Measured on identify_accuracy_bench, see DEVELOPERS.md, issue 9,
/// fourteenth round.
bool UndeterminedPlace(const Trial& t, double se, const model::ParamSpec* spec) {
  return t.places >= 2 && !IsRate(spec) && FinerThanError(t, se);
}

std::string AdoptionText(const std::vector<AdoptedValue>& values, const FitResult& fit,
                         const FitResult& adopted) {
  std::string s;
  for (const auto& v : values) {
    s += (s.empty() ? "" : "; ") + v.param + " = " + NumberText(v.value, 6) + " adopted (" +
         v.source + "); fitted " + NumberWithDecimal(v.fitted, 4);
    if (std::isfinite(v.stderr_)) s += " ± " + NumberText(v.stderr_, 6);
  }
  return s + ": it leaves " + std::to_string(adopted.flagged) +
         " entries beyond one unit (the fit " + std::to_string(fit.flagged) + ") and reproduces " +
         std::to_string(adopted.exact) + " of " + std::to_string(adopted.n) + " exactly (the fit " +
         std::to_string(fit.exact) +
         "); a round or attested value is what an author computed with, and the entries it "
         "misses by a unit are his own departures";
}

/// A fit with adopted values keeps the fit's entries: no more entries
/// beyond one unit, and at most `allowance` fewer reproduced exactly; or,
/// reproducing at least as many exactly, at most `allowance` more beyond
/// one unit (entries where the free fit bent towards a copyist's slip: a
/// latitude of 41;50 truncated reproduced 85 of 90 entries, the fit 84,
/// and missed one slip by two units that the fit missed by one).
bool Keeps(const FitResult& f, const FitResult& fit, int allowance) {
  if (f.exact < fit.exact - allowance) return false;
  return f.flagged <= fit.flagged || (f.exact >= fit.exact && f.flagged <= fit.flagged + allowance);
}

/// The values to try, simplest first: attested values (fewest places
/// first), then roundings of the estimate (coarsest first), then a rounded
/// rate the mean-motion analysis found.
std::vector<Trial> Trials(const Candidate& best, const std::string& param, double estimate,
                          double se, const model::ParamSpec* spec, int column_places,
                          const std::vector<CatalogEntry>* catalog,
                          const MeanMotionAnalysis* mean_motion) {
  std::vector<Trial> out;
  auto seen = [&](double v) {
    for (const auto& t : out) {
      if (std::fabs(t.value - v) <= 1e-12 * std::max(1.0, std::fabs(v))) return true;
    }
    return false;
  };
  if (catalog) {
    std::vector<Trial> attested;
    for (const auto& e : *catalog) {
      if (e.AppliesTo(best.model->name(), param))
        attested.push_back({e.value.ToDouble(), PlacesOf(e.value), "attested: " + e.tradition});
    }
    std::stable_sort(attested.begin(), attested.end(),
                     [](const Trial& a, const Trial& b) { return a.places < b.places; });
    for (auto t : attested) {
      t.group = t.places;
      if (!seen(t.value)) out.push_back(t);
    }
  }
  // At each number of places the two values beside the estimate, nearest
  // first: an estimate of 23;50,30 may come from an author's 23;50 as well
  // as from 23;51.
  const bool roundable = std::fabs(estimate) < 1e9;  // no sexagesimal rounding of an absurd value
  for (int p = 0; roundable && p <= MaxPlaces(spec, column_places); ++p) {
    const double v = Sexagesimal::FromDouble(estimate, p).ToDouble();
    const double unit = std::pow(60.0, -p);
    const std::string source = "round, " + std::to_string(p) + (p == 1 ? " place" : " places");
    for (double x : {v, estimate > v ? v + unit : v - unit}) {
      if (!seen(x)) out.push_back({x, p, source, kWholeGroup + p});
    }
    // As simple as a whole number: a combination of two of an equivalent
    // model's simple values (round_equivalents.cpp).
    if (p == 0 && spec && std::isfinite(se)) {
      for (const auto& v :
           EquivalentValues(*best.model, param, estimate, se, kRidgeSigmas, kRidgeValues, catalog))
        if (!seen(v.value)) out.push_back({v.value, 0, v.source, kWholeGroup});
    }
  }
  if (mean_motion && mean_motion->rounded_rate && spec && spec->role == model::ParamRole::kRate &&
      !seen(mean_motion->rounded_rate->ToDouble())) {
    out.push_back({mean_motion->rounded_rate->ToDouble(), mean_motion->rounded_rate->places(),
                   "the rounded rate of the mean-motion analysis", 200});
  }
  return out;
}

/// The fit with `fixed` held and the other free parameters refitted from
/// `from`'s values.
FitResult FitHolding(const Candidate& best, const Transcription& table,
                     const std::vector<Observation>& obs, const FitResult& from,
                     const std::map<std::string, double>& fixed,
                     const std::optional<double>& displacement) {
  FitOptions fo;
  fo.practice = best.fit.practice;
  fo.fit_displacement = best.fit.practice.displacement != 0 && !displacement;
  if (displacement) fo.practice.displacement = *displacement;
  fo.fixed = fixed;
  for (const auto& p : best.fit.params) {
    if (p.fixed && !fo.fixed.count(p.name)) fo.fixed[p.name] = p.value;
  }
  for (const auto& p : from.params) {
    if (!fo.fixed.count(p.name)) fo.start[p.name] = p.value;
  }
  fo.max_iterations = 20;
  return Fit(*best.model, table, obs, fo);
}

/// The first trial that keeps the fit's entries (see the file comment);
/// among acceptable trials of the same group (equally simple: attested
/// values of as many places, or the two roundings beside the estimate) the
/// one that reproduces most entries exactly, then the earlier; for a rate,
/// none where that one is barely told from the other (kRoundingMargin).
std::optional<std::pair<Trial, FitResult>> FirstAcceptable(
    const std::vector<Trial>& trials, const Candidate& best, const Transcription& table,
    const std::vector<Observation>& obs, const FitResult& current,
    std::map<std::string, double> fixed, std::optional<double> displacement,
    const std::string& param, bool rate) {
  const FitResult& fit = best.fit;
  const int allowance = ExactAllowance(fit.n);
  std::optional<std::pair<Trial, FitResult>> chosen;
  int runner_up = -1;  // most entries exact of the other acceptable trials of the group
  for (const auto& t : trials) {
    if (chosen && t.group != chosen->first.group) break;
    if (param == "displacement")
      displacement = t.value;
    else
      fixed[param] = t.value;
    FitResult f = FitHolding(best, table, obs, current, fixed, displacement);
    if (!Keeps(f, fit, allowance)) continue;
    if (!chosen || f.exact > chosen->second.exact) {
      if (chosen) runner_up = chosen->second.exact;
      chosen = std::make_pair(t, std::move(f));
    } else {
      runner_up = std::max(runner_up, f.exact);
    }
  }
  // A rate's rounding (not a whole or attested value) that the entries
  // barely tell from the value beside it is no evidence of the author's:
  // the parameter stays fitted, with its standard error.
  if (rate && chosen && chosen->first.group > kWholeGroup && runner_up >= 0 &&
      chosen->second.exact - runner_up < kRoundingMargin)
    return std::nullopt;
  return chosen;
}

std::optional<Adoption> AdoptRoundValues(const Candidate& best, const Transcription& table,
                                         const std::vector<Observation>& obs,
                                         const std::vector<CatalogEntry>* catalog,
                                         const MeanMotionAnalysis* mean_motion) {
  if (best.fit.n == 0 || obs.empty()) return std::nullopt;
  const int places = best.fit.practice.places.value_or(obs.front().places);
  std::map<std::string, double> fixed;
  std::optional<double> displacement;
  FitResult current = best.fit;
  Adoption a;
  const auto& specs = best.model->params();
  Candidate under = best;  // its rounding may turn for a whole radix (below)
  bool set = false;
  auto consider = [&](const std::string& name, double estimate, double se,
                      const model::ParamSpec* spec, bool whole_only) {
    auto trials = Trials(best, name, estimate, se, spec, places, catalog, mean_motion);
    if (whole_only) std::erase_if(trials, [](const Trial& t) { return t.group != kWholeGroup; });
    std::erase_if(trials, [set, se, spec](const Trial& t) {
      return set ? FinerThanError(t, se) : UndeterminedPlace(t, se, spec);
    });
    auto found = FirstAcceptable(trials, under, table, obs, current, fixed, displacement, name,
                                 IsRate(spec));
    // A radix half a unit below a whole value under rounding computes
    // what the whole value computes under truncation (and the reverse):
    // the entries cannot tell the two practices apart, the whole radix
    // can (identify_accuracy_bench seeds 187 and 263: mean motions by
    // months from 0, named rounded with a radix of 359;59,59,59,59).
    if (!found && whole_only && fixed.empty() && spec && spec->role == model::ParamRole::kRadix) {
      Candidate turned = under;
      turned.fit.practice.rounding = under.fit.practice.rounding == Rounding::kTruncate
                                         ? Rounding::kNearest
                                         : Rounding::kTruncate;
      found = FirstAcceptable(trials, turned, table, obs, current, fixed, displacement, name,
                              IsRate(spec));
      if (found) {
        found->first.source += turned.fit.practice.rounding == Rounding::kTruncate
                                   ? "; the entries truncated, as it computes them"
                                   : "; the entries rounded, as it computes them";
        under = std::move(turned);
      }
    }
    if (!found) return;
    if (name == "displacement")
      displacement = found->first.value;
    else
      fixed[name] = found->first.value;
    current = std::move(found->second);
    a.values.push_back({name, found->first.value, estimate, se, found->first.source});
  };
  std::optional<Pair> pair = AdoptJointly(best, table, obs, places, catalog);
  if (!pair) pair = AdoptCombination(best, table, obs, catalog);
  if (!pair) set = (pair = AdoptAttestedSet(best, table, obs, catalog)).has_value();
  if (pair) {
    for (const auto& [t, j] :
         {std::pair{pair->first, pair->first_index}, std::pair{pair->second, pair->second_index}}) {
      const auto& p = best.fit.params[j];
      fixed[p.name] = t.value;
      a.values.push_back({p.name, t.value, p.value, p.stderr_, t.source});
      // The entries do not determine these (the free fit's ridge): the
      // estimate an editor reads is the others' under them, with errors.
      if (set) pair->fit.params[j].held = t.source + "; the entries do not determine it";
    }
    if (set) a.estimates = pair->fit.params;
    current = std::move(pair->fit);
  }
  if (!pair || set) {
    // Whole values of every parameter first, then each parameter's trials
    // in turn: a rate held at a rounding of three places the entries cannot
    // tell from the author's four made the others make up the difference,
    // and an eccentricity of 0 then lost entries against the fit
    // (identify_accuracy_bench seed 56: 51 of 79 exact, 58 with the rates
    // free). Attested values stay in the second pass: an attested rate
    // tried before the radix's roundings was adopted with the radix left
    // free to make up for it (the sun's 0;59,8,19,48 for an author's
    // 0;59,8,17).
    for (const bool whole_only : {true, false}) {
      for (std::size_t j = 0; j < specs.size() && j < best.fit.params.size(); ++j) {
        // Under a set of values held together (AdoptAttestedSet) the
        // others are rounded from where they were refitted under it: the
        // free estimate lies elsewhere along the ridge.
        const FittedParam p =
            set ? current.params[j] : best.fit.params[j];  // a copy: consider moves current
        if (!best.fit.params[j].fixed && !fixed.count(p.name))
          consider(p.name, p.value, p.stderr_, &specs[j], whole_only);
      }
    }
  }
  if (best.fit.practice.displacement != 0)
    consider("displacement", best.fit.practice.displacement, best.fit.displacement_stderr, nullptr,
             false);
  if (a.values.empty()) return std::nullopt;
  a.fit = std::move(current);
  a.text = AdoptionText(a.values, best.fit, a.fit);
  return a;
}

}  // namespace apograph::estimate::internal

namespace apograph::estimate {

std::optional<Adoption> AdoptRoundValues(const model::Model& model, const FitResult& fit,
                                         const Transcription& table, int column,
                                         const std::vector<CatalogEntry>* catalog) {
  const Candidate c = internal::MakeCandidate(model, fit, fit.practice.grid > 0);
  return internal::AdoptRoundValues(c, table, CollectObservations(table, {column}), catalog,
                                    nullptr);
}

}  // namespace apograph::estimate
