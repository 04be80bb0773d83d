#pragma once
/// Which model, parameters and computing practice explain a column.
///
/// Every applicable model is fitted (fit.hpp) on a subsample of at most 60
/// entries, with and without a displacement constant; the best six are
/// refitted on every entry under rounding and under truncation; the best
/// three families are then tried with the interpolation grids that fit the
/// argument range (unless a candidate already reproduces every entry): each
/// grid fitted on the subsample, the best two per family refitted on every
/// entry. Candidates are ranked by a score (higher is better):
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
/// about ln(n)/2 in fit to pay for itself (a BIC-style penalty).
///
/// Places: when at least 90% of a column's entries end in 0 in the last
/// place, the author computed to one place fewer and the zero was written
/// to fill the layout (common practice: a column of minutes and seconds
/// whose seconds are all 0; a few slips in the last place do not hide it).
/// Every fit then works at the reduced places (`places` in the practice);
/// the best family is also refitted at the places as written, for
/// comparison. Entries written with non-zero last places are not tried at
/// fewer places: the author must then have computed them.
///
/// Rounded nodes: the best grid candidate is also refitted with its node
/// values brought to the column's places before interpolating
/// (Practice::round_nodes: the author tabulated the nodes, then filled in
/// between them from the rounded values).
///
/// A candidate whose estimate lies more than its range's width outside a
/// parameter's historical range (ParamSpec low..high; e.g. an obliquity of
/// 0;6) is ranked after every candidate with historical values, with a note
/// when it would have come first: a degenerate limit of a family can mimic
/// another family.
///
/// Candidates within 2 of the best (a likelihood ratio below e^2 after the
/// penalty) are reported as near-ties with what tells them apart.

#include <optional>
#include <string>
#include <vector>

#include "estimate/fit.hpp"
#include "estimate/mean_motion_analysis.hpp"

namespace apograph::estimate {

struct Candidate {
  const model::Model* model = nullptr;
  FitResult fit;
  double score = 0;
  double log_likelihood = 0;
  int penalised_parameters = 0;
  /// "rounded, 2 places, grid 6, displacement 3;0" etc.
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
};

struct Identification {
  int column = 0;
  std::vector<Candidate> ranked;                  ///< best first, at most `top`
  std::vector<std::string> notes;                 ///< near-ties and what tells them apart
  std::optional<MeanMotionAnalysis> mean_motion;  ///< for mean-motion columns
  int candidates_tried = 0;
};

/// Score of a fit as documented above (`extra` adds penalised parameters,
/// e.g. 1 for a grid).
double Score(const FitResult& fit, int penalised_parameters, double* log_likelihood = nullptr);

/// Ranks the explanations of column `column`.
Identification Identify(const Transcription& table, int column,
                        const IdentifyOptions& options = {});

/// Interpolation grids worth trying for a table's argument step and range.
std::vector<double> CandidateGrids(const Transcription& table);

}  // namespace apograph::estimate
