#pragma once

#include <algorithm>
#include <cmath>
/// Internal to the estimate stage: what identify.cpp, naming.cpp,
/// round_values.cpp and round_pairs.cpp share.

#include <map>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "estimate/identify.hpp"
#include "estimate/observations.hpp"

namespace apograph::estimate::internal {

/// What a column's entries show before any model is tried.
struct ColumnFacts {
  std::vector<Observation> obs;  ///< every readable entry
  std::vector<Observation> sub;  ///< at most 60 of them, spread over the column
  bool has_negative = false;     ///< some entry is negative
  std::optional<int> reduced;    ///< computed to one place fewer (see identify.hpp)
  double unit = 0;               ///< one unit of the last place computed
};

/// The entries of a column, a subsample of at most 60 spread over it, its
/// signs and places (screen_forms.cpp).
ColumnFacts Examine(const std::vector<Observation>& obs);

/// The model gives a finite value for most rows at its defaults, and a
/// quantity by date is not tried on an argument declared an angle.
bool Applicable(const model::Model& m, const Transcription& table,
                const std::vector<Observation>& obs);

/// The (sign form, displacement) pairs worth screening for a model on this
/// column (identify.hpp, step 1).
std::vector<std::pair<model::SignForm, bool>> Forms(const model::Model& m, const Transcription& t,
                                                    const ColumnFacts& f,
                                                    const IdentifyOptions& options);

/// A candidate with its score (a grid counts as one more parameter).
Candidate MakeCandidate(const model::Model& m, FitResult fit, bool grid);

/// Candidates with a rate fitted negative (below a range that starts at 0)
/// whose mirror, every angle negated and the sign form kept or turned,
/// computes the same entries: shown with the mirror, rates non-negative
/// (mirrored_rate.cpp). `obs` are the entries the candidates were fitted on.
void PreferNonNegativeRates(std::vector<Candidate>& all, const Transcription& table,
                            const std::vector<Observation>& obs);

/// Why a candidate's estimate is no historical value (a free parameter
/// more than its range's width outside ParamSpec low..high); empty when
/// plausible.
std::string Implausible(const Candidate& c);

/// Moves implausible candidates after the others, with a note for each that
/// would otherwise have come first.
void SetAsideImplausible(std::vector<Candidate>& all, std::vector<std::string>& notes);

/// Folds candidates that compute the same value at every entry into one
/// (ranked order kept: each group stands where its best member stood) and
/// names each group by the evidence (see naming.cpp); `catalog` may be null.
void FoldEquivalents(std::vector<Candidate>& ranked, const Transcription& table,
                     const std::vector<CatalogEntry>* catalog);

/// A simple value of a parameter (round_equivalents.cpp).
struct SimpleValue {
  double value = 0;
  std::string source;  ///< "attested: ...", "round, 0 places", or how it was computed
  std::string text;    ///< the value as written ("43;10")
};

/// Two simple values of a model's parameters (by index) and the value of
/// their combination.
struct SimplePair {
  std::size_t first_index = 0, second_index = 0;
  SimpleValue first, second;
  double combined = 0;
};

/// Values of `param` of model `m` that another model's combination
/// (model::ParamCombination::same_as) computes from simple values of its
/// own two parameters, within `many` standard errors `se` of `estimate`,
/// nearest first, at most `most`.
std::vector<SimpleValue> EquivalentValues(const model::Model& m, const std::string& param,
                                          double estimate, double se, double many, int most,
                                          const std::vector<CatalogEntry>* catalog);

/// For a fit whose two parameters the entries fix only in a combination the
/// model names: pairs of simple values whose combination lies within `many`
/// standard errors of the fitted one, nearest first, at most `most`.
std::vector<SimplePair> CombinationPairs(const Candidate& best, double many, int most,
                                         const std::vector<CatalogEntry>* catalog);

// Round values (round_values.cpp, round_pairs.cpp).

/// Entries reproduced exactly that an adopted value may lose against the
/// fit, as a share of the entries (at least one). Judgement: the author's
/// departures touch a few percent of the entries (realism.md), and a fitted
/// value can only absorb some of them.
inline constexpr double kExactAllowance = 0.03;
/// kExactAllowance of `entries`, at least one.
inline int ExactAllowance(int entries) {
  return std::max(1, static_cast<int>(std::ceil(kExactAllowance * static_cast<double>(entries))));
}

/// A fit with adopted values keeps the fit's entries: no more entries
/// beyond one unit, and at most `allowance` fewer reproduced exactly; or,
/// reproducing at least as many exactly, at most `allowance` more beyond
/// one unit (entries where the free fit bent towards a copyist's slip: a
/// latitude of 41;50 truncated reproduced 85 of 90 entries, the fit 84,
/// and missed one slip by two units that the fit missed by one).
bool Keeps(const FitResult& f, const FitResult& fit, int allowance);

/// The group of whole values (roundings to 0 places and the combinations
/// as simple, see Trials): attested values have groups below it (their
/// places), finer roundings above.
inline constexpr int kWholeGroup = 100;

/// One value to try for a parameter.
struct Trial {
  double value = 0;
  int places = 0;
  std::string source;
  int group = 0;  ///< trials of one group are equally simple (see FirstAcceptable)
};

/// Round values are looked for this many standard errors from the
/// estimate, at most kRidgeValues of them, nearest first. Judgement: the
/// usual 3-sigma rule; an estimate on a ridge of two parameters may lie
/// that far from the author's value.
inline constexpr double kRidgeSigmas = 3;
inline constexpr int kRidgeValues = 12;

/// A rounding of two places or more (not an attested or equivalent value)
/// of a parameter other than a rate whose unit is smaller than 2 standard
/// errors `se` of its estimate: the entries cannot tell it from the
/// roundings beside it (round_values.cpp).
bool UndeterminedPlace(const Trial& t, double se, const model::ParamSpec* spec);

/// Adds `p` to `out` unless a practice of the same rounding, places, grid
/// and nodes is there already (the columns of a table tried under each
/// other's practices: shared_values.cpp, shared_joint.cpp).
void AddPracticeOnce(std::vector<model::Practice>& out, const model::Practice& p);

/// The values to try, simplest first: attested values (fewest places
/// first), then roundings of the estimate (coarsest first), then a rounded
/// rate the mean-motion analysis found.
std::vector<Trial> Trials(const Candidate& best, const std::string& param, double estimate,
                          double se, const model::ParamSpec* spec, int column_places,
                          const std::vector<CatalogEntry>* catalog,
                          const MeanMotionAnalysis* mean_motion);

/// The fit with `fixed` held and the other free parameters refitted from
/// `from`'s values.
FitResult FitHolding(const Candidate& best, const Transcription& table,
                     const std::vector<Observation>& obs, const FitResult& from,
                     const std::map<std::string, double>& fixed,
                     const std::optional<double>& displacement);

/// The first trial that keeps the fit's entries (see round_values.cpp);
/// among acceptable trials of the same group (equally simple: attested
/// values of as many places, or the two roundings beside the estimate) the
/// one that reproduces most entries exactly, then the earlier. For a `rate`
/// a rounding that reproduces fewer than kRoundingMargin (round_values.cpp)
/// entries exactly more than the other acceptable value of its group is not
/// adopted (none is returned).
std::optional<std::pair<Trial, FitResult>> FirstAcceptable(
    const std::vector<Trial>& trials, const Candidate& best, const Transcription& table,
    const std::vector<Observation>& obs, const FitResult& current,
    std::map<std::string, double> fixed, std::optional<double> displacement,
    const std::string& param, bool rate = false);

/// Two parameters adopted together (see AdoptJointly).
struct Pair {
  Trial first, second;
  FitResult fit;
  std::size_t first_index = 0, second_index = 0;  ///< in the model's parameters
  /// The less simple of the two first, then both (attested before round,
  /// fewer places first).
  std::pair<int, int> Simplicity() const {
    return {std::max(first.group, second.group), first.group + second.group};
  }
};

/// For a model of two free parameters of its own (an obliquity and a
/// latitude): the two adopted together (round_pairs.cpp); nullopt when the
/// model has not two such parameters or no pair keeps the fit's entries.
std::optional<Pair> AdoptJointly(const Candidate& best, const Transcription& table,
                                 const std::vector<Observation>& obs, int places,
                                 const std::vector<CatalogEntry>* catalog);

/// For a model whose two parameters the entries fix only in a combination:
/// a pair of simple values held together (round_pairs.cpp).
std::optional<Pair> AdoptCombination(const Candidate& best, const Transcription& table,
                                     const std::vector<Observation>& obs,
                                     const std::vector<CatalogEntry>* catalog);

/// For a table of positions whose parameters the entries leave on a ridge
/// (some not separable): the attested values one tradition gives for two of
/// the model's own parameters (a planet's epicycle and eccentricity; also
/// with the eccentricity at 0), held together with the motions searched
/// afresh; of the sets that keep the fit's entries, those with a value
/// held at 0 first (the simpler geometry), then the one that reproduces
/// most entries exactly (round_sets.cpp).
std::optional<Pair> AdoptAttestedSet(const Candidate& best, const Transcription& table,
                                     const std::vector<Observation>& obs,
                                     const std::vector<CatalogEntry>* catalog);

/// The free fit of a table of positions left on a ridge started again from
/// the fit under the attested set AdoptAttestedSet chooses: where it ends at
/// a lower cost than `best.fit` it replaces it (score refreshed) and true is
/// returned. The fast solver stops along the ridge's long curved valley; the
/// set's fit lies near the author's basin (identify_accuracy_bench seed 113:
/// a free cost of 20.5 and 59 of 105 entries exact, 5.1 and 96 from the
/// set's values).
bool RestartFromAttestedSet(Candidate& best, const Transcription& table,
                            const std::vector<Observation>& obs,
                            const std::vector<CatalogEntry>* catalog);

/// The value written in the column's heading for the parameter the
/// table's second argument names (a latitude above a column of ascensional
/// differences), as a trial; nullopt when none is written (round_pairs.cpp).
std::optional<Trial> AsWritten(const Transcription& table, const std::vector<Observation>& obs,
                               const std::string& param);

/// One estimate for a table of several latitudes whose columns adopted
/// no common value of the parameter they share (an obliquity) by a
/// majority: the columns' estimates with their latitudes held, combined;
/// a round or attested value near it that every column keeps adopted for
/// the table, else the joint estimate held with its error
/// (shared_joint.cpp).
void ShareJointEstimate(const std::vector<ColumnBest>& columns,
                        const std::vector<CatalogEntry>* catalog);

/// Which values were adopted and why, in words (round_values.cpp).
std::string AdoptionText(const std::vector<AdoptedValue>& values, const FitResult& fit,
                         const FitResult& adopted);

/// Round and attested values for `best` (see round_values.cpp); nullopt when
/// nothing was adopted.
std::optional<Adoption> AdoptRoundValues(const Candidate& best, const Transcription& table,
                                         const std::vector<Observation>& obs,
                                         const std::vector<CatalogEntry>* catalog,
                                         const MeanMotionAnalysis* mean_motion);

/// Step 5b (identify.hpp): when the best explanation, with its round
/// values adopted, computes what a candidate with fewer free parameters
/// computes with its own (a latitude adopted at 0 is a right ascension; a
/// versed sine of radius -60 displaced by 60 is a cosine), the simpler
/// candidate takes its place, adopted, with the other named as its
/// equivalent; so too when, refitted under the best's grid rounded either
/// way, it reproduces as many entries exactly (a cosine displaced by 60
/// less half a unit is a truncated versed sine).
void PreferSimpler(std::vector<Candidate>& ranked, const Transcription& table,
                   const std::vector<Observation>& obs, const std::vector<CatalogEntry>* catalog,
                   const MeanMotionAnalysis* mean_motion);

/// Near-ties with the best: candidates within kNearTie that compute other
/// values, with what tells them apart.
void NearTieNotes(const std::vector<Candidate>& ranked, const Transcription& table, int top,
                  std::vector<std::string>& notes);

}  // namespace apograph::estimate::internal
