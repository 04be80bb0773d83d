#pragma once
/// Fit, identification and mean-motion results as JSON and as text an
/// editor can read. Field names are stable (documented in DEVELOPERS.md):
///
/// fit JSON: {table, witness, model, practice{rounding, places, grid,
///   grid_origin, round_nodes, displacement, displacement_stderr},
///   params{NAME: {value, stderr, fixed, trade}}, exact, within1, flagged,
///   n, robust_scale, converged, iterations,
///   entries[{arg, column, tabulated, computed, diff_units, flag}],
///   attested{NAME: [{value, kind, tradition, source, from_memory, origin,
///   distance, distance_se}]}, mean_motion (when analysed)}
///
/// identify JSON: {table, witness, column, candidates_tried,
///   candidates[{rank, model, practice, score, log_likelihood,
///   penalised_parameters, params, exact, within1, flagged, n,
///   robust_scale, attested}], notes[...], mean_motion}
///
/// mean_motion JSON: {rounding, rate, rate_stderr, rate_low, rate_high,
///   rate_trade, rounded_rate, radix, successive_addition, unit_value,
///   unexplained, verdict, entries[{arg, tabulated, turns, origin, direct,
///   direct_diff_units, from_rows, evidence}]}

#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "estimate/catalog.hpp"
#include "estimate/fit.hpp"
#include "estimate/identify.hpp"
#include "estimate/mean_motion_analysis.hpp"

namespace apograph::estimate {

/// A parameter value in trade notation with enough places for its error.
std::string TradeValue(double value, double stderr_);

/// "e = 2;4,48 ± 0;0,0,2 (2.08 ± 1.1e-05)", or "r = 3;9,2 (not separable
/// from the other parameters)", or for a parameter held because the entries
/// do not determine it "r = 39;30 (held: attested: ...; the entries do not
/// determine it)".
std::string ParamWithError(const FittedParam& p);

/// The attested values nearest to each free parameter of a fit, one line
/// each ("    attested e = 2;4,45 (...) lies 3.1 standard errors away").
std::string AttestedText(const FitResult& fit, const std::vector<CatalogEntry>& catalog);

nlohmann::json FitJson(const FitResult& fit, const Transcription& table,
                       const std::vector<CatalogEntry>& catalog);
nlohmann::json MeanMotionJson(const MeanMotionAnalysis& a);
nlohmann::json IdentificationJson(const Identification& id, const Transcription& table,
                                  const std::vector<CatalogEntry>& catalog);

/// Text: summary, parameters with nearest attested values, flagged entries
/// (every entry when `all_entries`).
std::string FitText(const FitResult& fit, const Transcription& table,
                    const std::vector<CatalogEntry>& catalog, bool all_entries);
std::string MeanMotionText(const MeanMotionAnalysis& a);
std::string IdentificationText(const Identification& id, const Transcription& table,
                               const std::vector<CatalogEntry>& catalog);

}  // namespace apograph::estimate
