#include "estimate/fit_problem.hpp"

#include <algorithm>
#include <array>
#include <cmath>

namespace apograph::estimate::internal {

FitProblem::FitProblem(const model::Model& model, const Transcription& table,
                       const std::vector<Observation>& obs, const FitOptions& options)
    : model_(model),
      practice_(options.practice),
      full_(model.Defaults()),
      fit_displacement_(options.fit_displacement),
      modulo_(options.modulo_360),
      displacement_(options.practice.displacement) {
  const auto& specs = model.params();
  for (std::size_t j = 0; j < specs.size(); ++j) {
    auto f = options.fixed.find(specs[j].name);
    if (f != options.fixed.end()) {
      full_[j] = f->second;
      continue;
    }
    if (IsStructural(specs[j]) && !options.start.count(specs[j].name)) continue;
    free_index_.push_back(static_cast<int>(j));
    double lo = specs[j].low, hi = specs[j].high;
    if (!(hi > lo)) {
      const double d = std::max(std::fabs(specs[j].default_value) * 0.5, 1.0);
      lo = specs[j].default_value - d;
      hi = specs[j].default_value + d;
    }
    lows_.push_back(lo);
    highs_.push_back(hi);
  }
  practice_.displacement = 0;
  gradient_.assign(free_index_.size(), 0.0);
  entries_.reserve(obs.size());
  // Per column and per number of places, computed once.
  int last_column = -1;
  std::optional<double> arg2;
  std::vector<double> powers;
  auto power = [&](int places) {
    while (static_cast<int>(powers.size()) <= places)
      powers.push_back(std::pow(60.0, static_cast<double>(powers.size())));
    return powers[static_cast<std::size_t>(places)];
  };
  for (const auto& o : obs) {
    Entry e;
    if (o.column != last_column) {
      const auto& col = table.columns.at(static_cast<std::size_t>(o.column));
      arg2 = col.arg2 ? std::optional<double>(col.arg2->ToDouble()) : std::nullopt;
      last_column = o.column;
    }
    e.ctx = {o.arg, arg2, &table, o.row, o.column};
    e.places = options.practice.places ? std::min(*options.practice.places, o.places) : o.places;
    e.scale = power(e.places);
    e.tab = o.units / power(o.places);
    e.target = e.tab * e.scale;
    if (options.practice.rounding == Rounding::kTruncate) {
      e.target += e.tab > 0 ? 0.5 : (e.tab < 0 ? -0.5 : 0.0);
    }
    entries_.push_back(e);
  }
}

std::vector<double> FitProblem::Start(const FitOptions& options) const {
  std::vector<double> x;
  const auto& specs = model_.params();
  for (int j : free_index_) {
    auto s = options.start.find(specs[static_cast<std::size_t>(j)].name);
    x.push_back(s != options.start.end() ? s->second : full_[static_cast<std::size_t>(j)]);
  }
  if (fit_displacement_) x.push_back(displacement_);
  return x;
}

const std::vector<double>& FitProblem::Expand(const double* x) {
  for (std::size_t j = 0; j < free_index_.size(); ++j)
    full_[static_cast<std::size_t>(free_index_[j])] = x[j];
  return full_;
}

double FitProblem::Displacement(const double* x) const {
  return fit_displacement_ ? x[free_index_.size()] : displacement_;
}

int FitProblem::ModelIndex(int j) const {
  return j < static_cast<int>(free_index_.size()) ? free_index_[static_cast<std::size_t>(j)] : -1;
}

double FitProblem::ModelValue(const Entry& e) {
  return model::PracticeValue(model_, full_, e.ctx, practice_, e.places);
}

double FitProblem::Value(std::size_t i, const double* x) {
  Expand(x);
  return ModelValue(entries_[i]) + Displacement(x);
}

double FitProblem::Residual(std::size_t i, const double* x) {
  Expand(x);
  return ResidualOf(i, ModelValue(entries_[i]) + Displacement(x));
}

double FitProblem::ResidualOf(std::size_t i, double v) const {
  const Entry& e = entries_[i];
  if (!std::isfinite(v)) return 1e6;
  if (modulo_) {
    double d = e.tab - v;
    d -= 360.0 * std::round(d / 360.0);
    const double off = e.target - e.tab * e.scale;
    return d * e.scale + off;
  }
  return e.target - v * e.scale;
}

void FitProblem::Residuals(const double* x, double* r, const std::vector<std::size_t>* subset) {
  if (subset) {
    for (std::size_t k = 0; k < subset->size(); ++k) r[k] = Residual((*subset)[k], x);
  } else {
    for (std::size_t i = 0; i < entries_.size(); ++i) r[i] = Residual(i, x);
  }
}

void FitProblem::Linearise(const double* x, double* r, double* J, double* v,
                           const std::vector<std::size_t>* subset) {
  if (modulo_ && !model_.ExactGradient()) {
    LineariseByDifferences(x, r, J, v, subset);
    return;
  }
  Expand(x);
  const double shift = Displacement(x);
  const std::size_t m = subset ? subset->size() : entries_.size();
  const std::size_t k = static_cast<std::size_t>(num_free());
  const std::size_t km = free_index_.size();
  for (std::size_t row = 0; row < m; ++row) {
    const Entry& e = entries_[subset ? (*subset)[row] : row];
    const double value = model::PracticeValueWithGradient(model_, full_, e.ctx, practice_, e.places,
                                                          free_index_, gradient_.data()) +
                         shift;
    v[row] = value;
    r[row] = ResidualOf(subset ? (*subset)[row] : row, value);
    double* Jr = J + row * k;
    const bool finite = std::isfinite(value);
    for (std::size_t j = 0; j < km; ++j) {
      const double d = -e.scale * gradient_[j];
      Jr[j] = finite && std::isfinite(d) ? d : 0.0;
    }
    if (fit_displacement_) Jr[km] = finite ? -e.scale : 0.0;
  }
}

/// 60^places in long double (exact up to 12 places: 60^12 = 2^24 15^12).
namespace {

long double LongPowerOf60(int places) {
  static const auto kPowers = [] {
    std::array<long double, Sexagesimal::kMaxPlaces + 1> p{};
    p[0] = 1;
    for (std::size_t i = 1; i < p.size(); ++i) p[i] = p[i - 1] * 60;
    return p;
  }();
  return kPowers[static_cast<std::size_t>(places)];
}

}  // namespace

std::optional<std::int64_t> BroughtUnits(double value, int places, Rounding rounding) {
  const long double scaled = static_cast<long double>(value) * LongPowerOf60(places);
  if (!(fabsl(scaled) < 0x1p52L)) return std::nullopt;
  if (rounding == Rounding::kTruncate)
    return static_cast<std::int64_t>(scaled);  // toward zero, as truncl
  // roundl (ties away from zero) by the hardware's nearest-even conversion,
  // the ties then moved away from zero: scaled - n is exact here.
  std::int64_t n = llrintl(scaled);
  const long double d = scaled - static_cast<long double>(n);
  if (scaled > 0 && d == 0.5L) ++n;
  if (scaled < 0 && d == -0.5L) --n;
  return n;
}

void FitProblem::LineariseByDifferences(const double* x, double* r, double* J, double* v,
                                        const std::vector<std::size_t>* subset) {
  const std::size_t m = subset ? subset->size() : entries_.size();
  const std::size_t k = static_cast<std::size_t>(num_free());
  std::vector<double> xt(x, x + k);
  for (std::size_t row = 0; row < m; ++row) {
    const std::size_t i = subset ? (*subset)[row] : row;
    v[row] = Value(i, x);
    r[row] = ResidualOf(i, v[row]);
  }
  for (std::size_t j = 0; j < k; ++j) {
    const double h = 1e-7 * std::max(std::fabs(x[j]), 1e-2);
    xt[j] = x[j] + h;
    for (std::size_t row = 0; row < m; ++row) {
      const std::size_t i = subset ? (*subset)[row] : row;
      J[row * k + j] = (Residual(i, xt.data()) - r[row]) / h;
    }
    xt[j] = x[j];
  }
  Expand(x);
}

double CauchyCost(const double* r, std::size_t n, double s) {
  const double s2 = s * s;
  double c = 0;
  for (std::size_t i = 0; i < n; ++i) c += s2 * std::log1p(r[i] * r[i] / s2);
  return 0.5 * c;
}

double RobustScale(std::vector<double> residuals) {
  if (residuals.empty()) return 0;
  for (double& r : residuals) r = std::fabs(r);
  auto mid = residuals.begin() + static_cast<std::ptrdiff_t>(residuals.size() / 2);
  std::nth_element(residuals.begin(), mid, residuals.end());
  return std::max(1.4826 * *mid, 1.0 / std::sqrt(12.0));
}

}  // namespace apograph::estimate::internal
