// A rate fitted negative, shown positive (issue 9). The equation of a
// quantity by date is odd in its anomaly, q(-a) = -q(a), so that the
// parameters (a, r) and their mirror (360 - a, -r) compute the same
// magnitudes, and the same entries when the sign form is turned too (a
// column printed negated is computed by the mirror printed signed). The
// solver may end on either, and identification tries both signs of a
// quantity by date, first signed: the mirror won by listing order
// (identify_accuracy_bench seed 55, an equation of the sun by date printed
// negated, anomaly-radix 10;49,10 and rate 0;36,59,25,52, 50 of 53 entries
// exact: named signed with 349;11 and -0;36,59, each thousands of standard
// errors from the author's; the same at the held-out seed 507). A rate
// below a model's range that starts at 0 is no value an author used (a
// motion tabulated forward: judgement, and the model's range): of two
// explanations that compute the same entries, the one with its rates
// non-negative is shown, as an eccentricity fitted negative is shown
// positive with the apogee turned (fit_finish.cpp, PositiveEccentricity).
//
// The mirror is never assumed from the model: every angle of the model
// (radices, rates, apogee) is negated (a radix or an apogee then brought
// into [0, 360)), the sign form kept or, for a model whose values a table
// may print signed, turned (signed and negated exchanged; magnitudes
// stay), and the mirror replaces the candidate only when it computes every
// entry as the candidate does (the same computed value, the residual
// within a thousandth of a unit: floating noise at five places is well
// under that; judgement). Measured: identify_accuracy_bench seeds 1-300,
// 301-600 and 601-900 (DEVELOPERS.md, issue 9, seventh round).
#include <cmath>
#include <cstddef>
#include <optional>
#include <vector>

#include "estimate/identify_internal.hpp"

namespace apograph::estimate::internal {

namespace {

bool IsRate(model::ParamRole r) {
  return r == model::ParamRole::kRate || r == model::ParamRole::kAnomalyRate;
}

bool IsAngle(model::ParamRole r) {
  return IsRate(r) || r == model::ParamRole::kRadix || r == model::ParamRole::kAnomalyRadix ||
         r == model::ParamRole::kApogee;
}

/// Residuals closer than this (units of the last place) are the same.
constexpr double kSameResidual = 1e-3;

/// `a` and `b` compute every entry alike.
bool SameEntries(const FitResult& a, const FitResult& b) {
  if (a.entries.size() != b.entries.size() || a.exact != b.exact || a.within1 != b.within1)
    return false;
  for (std::size_t i = 0; i < a.entries.size(); ++i) {
    const FitEntry& x = a.entries[i];
    const FitEntry& y = b.entries[i];
    if (x.computed.has_value() != y.computed.has_value()) return false;
    if (x.computed && !(*x.computed == *y.computed)) return false;
    if (std::isfinite(x.residual) != std::isfinite(y.residual)) return false;
    if (std::isfinite(x.residual) && !(std::fabs(x.residual - y.residual) <= kSameResidual))
      return false;
  }
  return true;
}

/// The mirror of `c`'s parameters that computes its entries with every
/// rate non-negative, or nothing.
std::optional<FitResult> Mirror(const Candidate& c, const Transcription& table,
                                const std::vector<Observation>& obs) {
  const auto& specs = c.model->params();
  if (specs.size() != c.fit.params.size()) return std::nullopt;
  bool negative = false;
  for (std::size_t j = 0; j < specs.size(); ++j) {
    const FittedParam& p = c.fit.params[j];
    if (!IsAngle(specs[j].role)) continue;
    if (p.fixed) return std::nullopt;  // a held angle cannot be mirrored
    if (IsRate(specs[j].role) && p.value < 0 && specs[j].low >= 0) negative = true;
  }
  if (!negative) return std::nullopt;
  FitResult m = c.fit;
  for (std::size_t j = 0; j < specs.size(); ++j) {
    if (!IsAngle(specs[j].role)) continue;
    double& v = m.params[j].value;
    v = -v;
    if (IsRate(specs[j].role)) {
      if (v < 0) return std::nullopt;  // another rate turned negative
      continue;
    }
    v = std::fmod(v, 360.0);
    if (v < 0) v += 360;
  }
  const model::SignForm form = c.model->ResolvedSign(c.fit.practice.sign);
  std::vector<model::SignForm> forms = {c.fit.practice.sign};  // as the candidate says it
  // Only a model whose values a table may print signed or negated has its
  // sign form turned (a planet's longitude is printed as it is: with the
  // form turned, its mirror, the longitude negated, would be negated back).
  if (c.model->traits().signed_values) {
    if (form == model::SignForm::kSigned) forms.push_back(model::SignForm::kNegated);
    if (form == model::SignForm::kNegated) forms.push_back(model::SignForm::kSigned);
  }
  FitOptions o;  // as Fit prepares them: values compared modulo 360 under a modulus
  for (std::size_t j = 0; j < specs.size(); ++j)
    if (specs[j].role == model::ParamRole::kModulus && c.fit.params[j].value > 0)
      o.modulo_360 = true;
  for (const model::SignForm f : forms) {
    FitResult trial = m;
    trial.practice.sign = f;
    Evaluate(*c.model, table, obs, o, trial);
    if (SameEntries(c.fit, trial)) return trial;
  }
  return std::nullopt;
}

}  // namespace

void PreferNonNegativeRates(std::vector<Candidate>& all, const Transcription& table,
                            const std::vector<Observation>& obs) {
  for (Candidate& c : all) {
    std::optional<FitResult> m = Mirror(c, table, obs);
    if (!m) continue;
    // The same entries, the same score; the parameters' standard errors
    // stay (a variance does not change with the sign of its parameter).
    c.fit.params = std::move(m->params);
    c.fit.practice.sign = m->practice.sign;
    c.fit.entries = std::move(m->entries);
  }
}

}  // namespace apograph::estimate::internal
