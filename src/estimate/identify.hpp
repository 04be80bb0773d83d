#pragma once
/// Which model, parameters and computing practice explain a column.
///
/// Steps (identify.cpp, one function each):
///  1. Screen, on a subsample of at most 60 entries: every family (mean
///     motions and tables of positions included) on every column, under
///     rounding, in each sign form that fits the column (signed, oriented
///     by the entries, when some entry is negative; otherwise as magnitudes
///     and signed with a displacement constant; models that never go
///     negative as they are and displaced).
///  2. Refit the best six on every entry under rounding and under
///     truncation.
///  3. Grids: the best three families (every family refitted, when none
///     explains the column yet) with the interpolation grids that fit the
///     argument range, nodes at multiples of the grid or counted from the
///     first argument (unless a candidate already reproduces every entry),
///     the best grid also under the other rounding and with its nodes
///     rounded first.
///  4. Rank by the score below; estimates far outside their historical
///     range go last (with a note); candidates that compute the same value
///     at every entry are one explanation, shown under the name the evidence
///     chooses (naming.cpp: the table's kind, the parameters' historical
///     ranges, attested values, then the simpler model), their equivalents
///     named beside it.
///  5. Round and attested values (round_values.cpp): for the best
///     explanation, attested values and coarse sexagesimal roundings of each
///     estimate (the two values beside it at each number of places), the
///     simplest adopted that leaves no more entries beyond one unit than the
///     fit (and loses few exact ones). Then (naming.cpp, PreferSimpler): when
///     the best explanation with its round values computes what a candidate
///     with fewer free parameters computes with its own (a latitude adopted
///     at 0, a versed sine of radius -60 displaced by 60), the simpler one
///     is shown and the other named as its equivalent.
///  6. The verdict: below kExplainedShare of entries within one unit, no
///     model explains the column.
///
/// Score (higher is better):
///
///   score = sum over entries of log P(d) - (k / 2) ln n
///
/// where d is the entry's difference from the candidate in units of its
/// last place and P is a discrete error model: with probability 0.98 the
/// author's value, P(d) proportional to 0.1^|d| (0 for most entries, a
/// unit off now and then), and with probability 0.02 a copyist's slip
/// spread evenly over the column's range of values. k counts the free
/// parameters: the model's, the displacement, and one for a grid. Entries
/// reproduced exactly raise the score most; an extra parameter must buy
/// about ln(n)/2 in fit to pay for itself (a BIC-style penalty), so the
/// simpler model wins when a richer one explains no more.
///
/// Places: when at least 90% of a column's entries end in 0 in the last
/// place, the author computed to one place fewer and the zero was written
/// to fill the layout (common practice); every fit then works at the
/// reduced places, and the best family is also refitted at the places as
/// written, for comparison.
///
/// Candidates within 2 of the best that compute different values are
/// reported as near-ties with what tells them apart.

#include <optional>
#include <string>
#include <vector>

#include "estimate/catalog.hpp"
#include "estimate/fit.hpp"
#include "estimate/mean_motion_analysis.hpp"

namespace apograph::estimate {

/// Share of entries within one unit below which no model explains a column.
/// Measured (tests/bench/identify_accuracy_bench.cpp, see DEVELOPERS.md):
/// the right model keeps at least 0.74 of the entries within one unit with a
/// fifth of them corrupted; the best wrong model on a column no model
/// explains reaches at most 0.2.
inline constexpr double kExplainedShare = 0.5;

/// A model that computes the same value as the shown one at every entry.
struct Equivalent {
  const model::Model* model = nullptr;
  std::vector<FittedParam> params;
};

/// A parameter brought to a round or attested value.
struct AdoptedValue {
  std::string param;  ///< the parameter's name, or "displacement"
  double value = 0;   ///< adopted
  double fitted = 0;  ///< the estimate
  double stderr_ = 0;
  std::string source;  ///< "round, 0 places" or "attested: TRADITION"
};

/// The values adopted for the best explanation and the entries under them.
struct Adoption {
  std::vector<AdoptedValue> values;
  FitResult fit;     ///< the adopted values (other parameters refitted), every entry
  std::string text;  ///< which were adopted and why, in words
  /// The estimate to report with its standard errors when the free fit
  /// leaves parameters not separable and some were held for that (a
  /// planet's epicycle and eccentricity over a short arc): the fit with
  /// those held (FittedParam::held says at what), every other parameter
  /// free. Empty: the candidate's free fit is the estimate.
  std::vector<FittedParam> estimates;
};

struct Candidate {
  const model::Model* model = nullptr;
  FitResult fit;
  double score = 0;
  double log_likelihood = 0;
  int penalised_parameters = 0;
  /// Models computing the same values at every entry (folded into this one).
  std::vector<Equivalent> equivalents;
  /// Why this name was shown rather than an equivalent's (empty without
  /// equivalents).
  std::string naming;
  /// Round or attested values adopted (the best candidate only).
  std::optional<Adoption> adoption;
  /// The fit to use downstream: the adopted values when there are any.
  const FitResult& Final() const { return adoption ? adoption->fit : fit; }
  /// "rounded, 2 places, grid 6, displacement 3;0, signed" etc.
  std::string PracticeText() const;
};

struct IdentifyOptions {
  int top = 5;
  /// Models to try; every built-in model when empty.
  std::vector<const model::Model*> models;
  /// Extra models tried beside the built-ins (user formulas).
  std::vector<const model::Model*> extra_models;
  bool try_grids = true;
  bool try_displacement = true;
  /// Families carried into the second round (grids, other rounding).
  int refine = 3;
  /// Attested values (tried as round values and used to name equivalents);
  /// none when null.
  const std::vector<CatalogEntry>* catalog = nullptr;
  /// Bring the best explanation's parameters to round or attested values.
  bool adopt_round_values = true;
};

struct Identification {
  int column = 0;
  std::vector<Candidate> ranked;                  ///< best first, at most `top`
  std::vector<std::string> notes;                 ///< near-ties, set-asides, naming
  std::optional<MeanMotionAnalysis> mean_motion;  ///< for mean-motion columns
  int candidates_tried = 0;
  /// Whether the best explanation explains the column (kExplainedShare).
  bool explained = false;
  double within_one_share = 0;  ///< of the best explanation's entries
  /// "no model explains column X: ..." or empty when explained.
  std::string verdict;
};

/// Score of a fit as documented above (`extra` adds penalised parameters,
/// e.g. 1 for a grid).
double Score(const FitResult& fit, int penalised_parameters, double* log_likelihood = nullptr);

/// Ranks the explanations of column `column`.
Identification Identify(const Transcription& table, int column,
                        const IdentifyOptions& options = {});

/// Round and attested values for a fit of `model` to column `column` of
/// `table` (step 5 above, on its own: the fit's parameters tried at
/// attested values and coarse roundings); nullopt when none is adopted.
std::optional<Adoption> AdoptRoundValues(const model::Model& model, const FitResult& fit,
                                         const Transcription& table, int column,
                                         const std::vector<CatalogEntry>* catalog);

/// A column of a table and its best explanation (ShareAdoptedValues).
struct ColumnBest {
  const Transcription* table = nullptr;
  int column = 0;
  Candidate* best = nullptr;
};

/// One value for the table (shared_values.cpp): in a table of several
/// latitudes, the obliquity adopted by most columns is tried in each column
/// that adopted another or nothing, the latitude then adopted again; the column's
/// adoption is replaced when its entries keep the fit's. Then ShareMotions.
void ShareAdoptedValues(const std::vector<ColumnBest>& columns,
                        const std::vector<CatalogEntry>* catalog);

/// One motion, one rate (shared_motions.cpp): a rate or radix of a column
/// is held at the value another column of the table adopted for a rate
/// (or radix) when that column determines it better (a smaller standard
/// error) and the value lies near this column's estimate (within
/// kRidgeSigmas standard errors, 2% of a rate, 2 degrees of a radix: the
/// mean sun's rate in the column of the solar equation by date); the
/// column's other parameters are adopted afresh, and its adoption replaced
/// when its entries keep the fit's.
void ShareMotions(const std::vector<ColumnBest>& columns, const std::vector<CatalogEntry>* catalog);

/// Interpolation grids worth trying for a table's argument step and range.
std::vector<double> CandidateGrids(const Transcription& table);

}  // namespace apograph::estimate
