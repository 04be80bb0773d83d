// What identification learns of a column before any model is tried (the
// entries, a subsample, signs, places: Examine), and which models and sign
// forms are worth screening on it (Applicable, Forms; identify.hpp, step 1).
#include <algorithm>
#include <cctype>
#include <cmath>
#include <string>
#include <utility>
#include <vector>

#include "estimate/identify_internal.hpp"

namespace apograph::estimate::internal {
namespace {

constexpr double kZeroShare = 0.9;       // share of entries ending in 0 that reduces the places
                                         // (judgement; see ReducedPlaces)
constexpr std::size_t kScreenSize = 60;  // entries of the screening subsample (judgement)

/// The argument is declared an angle ("deg", "degrees", "°").
bool AngleArgument(const ArgumentSpec& a) {
  std::string u;
  for (char c : a.unit) u += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return u == "deg" || u == "degree" || u == "degrees" || u == "\u00b0";
}

}  // namespace

/// The model gives a finite value for most rows at its defaults. A
/// quantity by date (a position, an equation by day) is not tried on a
/// table whose argument is declared an angle: a model of seven parameters
/// then fits curves no model explains (measured on the shared generator,
/// seeds 1..300: 4 of 38 such columns said explained by planet-position).
bool Applicable(const model::Model& m, const Transcription& table,
                const std::vector<Observation>& obs) {
  if (m.traits().kind == model::ModelKind::kPosition && AngleArgument(table.argument)) return false;
  const std::vector<double> p = m.Defaults();
  int bad = 0, tried = 0;
  const std::size_t step = std::max<std::size_t>(1, obs.size() / 20);
  for (std::size_t i = 0; i < obs.size(); i += step) {
    const auto& col = table.columns[static_cast<std::size_t>(obs[i].column)];
    model::RowContext ctx{obs[i].arg,
                          col.arg2 ? std::optional<double>(col.arg2->ToDouble()) : std::nullopt,
                          &table, obs[i].row, obs[i].column};
    ++tried;
    bad += !std::isfinite(m.Evaluate(p, ctx));
  }
  return tried > 0 && bad * 5 <= tried;
}

namespace {

/// One place fewer than the column shows when at least kZeroShare of its
/// entries end in 0 (see identify.hpp); nullopt otherwise.
std::optional<int> ReducedPlaces(const std::vector<Observation>& obs) {
  const int places = obs.front().places;
  if (places < 1) return std::nullopt;
  std::size_t zeros = 0;
  for (const auto& o : obs) zeros += o.places == places && std::fmod(std::fabs(o.units), 60.0) == 0;
  if (static_cast<double>(zeros) < kZeroShare * static_cast<double>(obs.size()))
    return std::nullopt;
  return places - 1;
}

}  // namespace

ColumnFacts Examine(const std::vector<Observation>& obs) {
  ColumnFacts f;
  f.obs = obs;
  const std::size_t stride = std::max<std::size_t>(1, (obs.size() + kScreenSize - 1) / kScreenSize);
  for (std::size_t i = 0; i < obs.size(); i += stride) f.sub.push_back(obs[i]);
  for (const auto& o : obs) f.has_negative = f.has_negative || o.value.negative();
  f.reduced = ReducedPlaces(obs);
  f.unit = std::pow(60.0, -(f.reduced ? *f.reduced : obs.front().places));
  return f;
}

namespace {

/// kSigned or kNegated, whichever the entries follow: the sign of the
/// covariance between the model's signed values at its defaults and the
/// entries (a displaced table keeps its covariance).
model::SignForm Orientation(const model::Model& m, const Transcription& table,
                            const std::vector<Observation>& sub) {
  const std::vector<double> p = m.Defaults();
  std::vector<double> v, y;
  for (const auto& o : sub) {
    model::RowContext ctx{o.arg, std::nullopt, &table, o.row, o.column, model::SignForm::kSigned};
    const double x = m.Evaluate(p, ctx);
    if (!std::isfinite(x)) continue;
    v.push_back(x);
    y.push_back(o.value.ToDouble());
  }
  double mv = 0, my = 0, cov = 0;
  for (std::size_t i = 0; i < v.size(); ++i) mv += v[i], my += y[i];
  if (v.empty()) return model::SignForm::kSigned;
  mv /= static_cast<double>(v.size());
  my /= static_cast<double>(v.size());
  for (std::size_t i = 0; i < v.size(); ++i) cov += (v[i] - mv) * (y[i] - my);
  return cov < 0 ? model::SignForm::kNegated : model::SignForm::kSigned;
}

/// The model's signed values at its defaults go negative somewhere on these
/// entries' arguments.
bool Negative(const model::Model& m, const Transcription& table,
              const std::vector<Observation>& sub) {
  const std::vector<double> p = m.Defaults();
  for (const auto& o : sub) {
    model::RowContext ctx{o.arg, std::nullopt, &table, o.row, o.column, model::SignForm::kSigned};
    if (m.Evaluate(p, ctx) < 0) return true;
  }
  return false;
}

}  // namespace

/// The (sign form, displacement) pairs worth screening for a model on this
/// column (see identify.hpp, step 1).
std::vector<std::pair<model::SignForm, bool>> Forms(const model::Model& m, const Transcription& t,
                                                    const ColumnFacts& f,
                                                    const IdentifyOptions& options) {
  using model::SignForm;
  const bool function = m.traits().kind == model::ModelKind::kFunction;
  const bool disp = options.try_displacement && function;
  if (!m.traits().signed_values) {
    if (disp) return {{SignForm::kConventional, false}, {SignForm::kConventional, true}};
    return {{SignForm::kConventional, false}};
  }
  // A quantity by date has no orientation at the defaults (its phase is
  // estimated): both signs are tried.
  if (!function && f.has_negative) return {{SignForm::kSigned, false}, {SignForm::kNegated, false}};
  if (!function) return {{SignForm::kMagnitude, false}};
  const SignForm oriented = Orientation(m, t, f.sub);
  if (f.has_negative) return {{oriented, false}};
  // Where the model never goes negative over these arguments its signed
  // and magnitude forms agree: the conventional one is shown.
  const SignForm plain = Negative(m, t, f.sub) ? SignForm::kMagnitude : SignForm::kConventional;
  if (disp) return {{plain, false}, {oriented, true}};
  return {{plain, false}};
}

}  // namespace apograph::estimate::internal
