#pragma once
/// Internal to the estimate stage: what identify.cpp, naming.cpp and
/// round_values.cpp share.

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
