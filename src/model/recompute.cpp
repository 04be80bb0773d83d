// Recomputation of a column under a computing practice (see Practice in
// model.hpp for the exact order of operations).
#include <algorithm>
#include <cmath>
#include <limits>

#include "model/model.hpp"

namespace apograph::model {
namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

/// Distance below which an argument counts as standing on a node (arguments
/// are exact sexagesimal values with at most 12 places, far coarser).
constexpr double kNodeSlack = 1e-9;

/// The model's value at a node, brought to the places first if asked.
double NodeValue(const Model& model, const std::vector<double>& params, RowContext ctx, double node,
                 const Practice& practice, int places) {
  ctx.arg = node;
  const double v = model.Evaluate(params, ctx);
  if (!practice.round_nodes || !std::isfinite(v)) return v;
  return RoundUnits(v, places, practice.rounding) / std::pow(60.0, places);
}

std::optional<double> ColumnArgument(const Transcription& table, int column) {
  const auto& spec = table.columns.at(static_cast<std::size_t>(column));
  if (spec.arg2) return spec.arg2->ToDouble();
  return std::nullopt;
}

}  // namespace

std::vector<double> Model::Defaults() const {
  std::vector<double> out;
  for (const auto& p : params()) out.push_back(p.default_value);
  return out;
}

double Model::EvaluateWithGradient(const std::vector<double>& params, const RowContext& row,
                                   const std::vector<int>& wrt, double* gradient) const {
  const double v = Evaluate(params, row);
  std::vector<double> moved = params;
  for (std::size_t j = 0; j < wrt.size(); ++j) {
    const auto i = static_cast<std::size_t>(wrt[j]);
    const double h = 1e-7 * std::max(std::fabs(params[i]), 1e-2);
    moved[i] = params[i] + h;
    gradient[j] = (Evaluate(moved, row) - v) / h;
    moved[i] = params[i];
  }
  return v;
}

const std::string& Model::convention() const {
  static const std::string kNone;
  return kNone;
}

int Model::ParamIndex(ParamRole role) const {
  const auto& ps = params();
  for (std::size_t i = 0; i < ps.size(); ++i) {
    if (ps[i].role == role) return static_cast<int>(i);
  }
  return -1;
}

const ModelTraits& Model::traits() const {
  static const ModelTraits kPlain;
  return kPlain;
}

SignForm Model::ResolvedSign(SignForm form) const {
  return form == SignForm::kConventional ? traits().conventional : form;
}

const char* ToString(ModelKind kind) {
  switch (kind) {
    case ModelKind::kFunction:
      return "function";
    case ModelKind::kMeanMotion:
      return "mean motion";
    case ModelKind::kPosition:
      return "position";
  }
  return "function";
}

const char* ToString(SignForm form) {
  switch (form) {
    case SignForm::kConventional:
      return "conventional";
    case SignForm::kSigned:
      return "signed";
    case SignForm::kNegated:
      return "negated";
    case SignForm::kMagnitude:
      return "magnitude";
  }
  return "conventional";
}

std::optional<SignForm> SignFormFromString(std::string_view text) {
  for (SignForm f :
       {SignForm::kConventional, SignForm::kSigned, SignForm::kNegated, SignForm::kMagnitude}) {
    if (text == ToString(f)) return f;
  }
  return std::nullopt;
}

double ApplySign(double v, SignForm form) {
  switch (form) {
    case SignForm::kNegated:
      return -v;
    case SignForm::kMagnitude:
      return std::fabs(v);
    default:
      return v;
  }
}

int Model::ParamIndex(std::string_view param_name) const {
  const auto& ps = params();
  for (std::size_t i = 0; i < ps.size(); ++i) {
    if (ps[i].name == param_name) return static_cast<int>(i);
  }
  return -1;
}

const char* ToString(Rounding rounding) {
  return rounding == Rounding::kTruncate ? "truncate" : "nearest";
}

std::optional<Rounding> RoundingFromString(std::string_view text) {
  if (text == "nearest") return Rounding::kNearest;
  if (text == "truncate") return Rounding::kTruncate;
  return std::nullopt;
}

std::optional<double> RowArgument(const Transcription& table, std::size_t row) {
  if (auto a = table.ArgumentInUse(row)) return a->ToDouble();
  return std::nullopt;
}

double PracticeValue(const Model& model, const std::vector<double>& params, const RowContext& given,
                     const Practice& practice, int places) {
  RowContext row = given;
  row.sign = practice.sign;
  double v = 0;
  const double g = practice.grid;
  const double lo =
      g > 0 ? practice.grid_origin + std::floor((row.arg - practice.grid_origin) / g) * g : row.arg;
  if (g > 0 && std::fabs(row.arg - lo) > kNodeSlack && std::fabs(row.arg - lo - g) > kNodeSlack) {
    const double va = NodeValue(model, params, row, lo, practice, places);
    const double vb = NodeValue(model, params, row, lo + g, practice, places);
    v = va + (vb - va) * (row.arg - lo) / g;
  } else if (g > 0) {
    const double node = std::fabs(row.arg - lo) <= kNodeSlack ? lo : lo + g;
    v = NodeValue(model, params, row, node, practice, places);
  } else {
    v = model.Evaluate(params, row);
  }
  return v + practice.displacement;
}

double PracticeValueWithGradient(const Model& model, const std::vector<double>& params,
                                 const RowContext& given, const Practice& practice, int places,
                                 const std::vector<int>& wrt, double* gradient) {
  RowContext row = given;
  row.sign = practice.sign;
  const double g = practice.grid;
  const double lo =
      g > 0 ? practice.grid_origin + std::floor((row.arg - practice.grid_origin) / g) * g : row.arg;
  const bool between =
      g > 0 && std::fabs(row.arg - lo) > kNodeSlack && std::fabs(row.arg - lo - g) > kNodeSlack;
  if (!between) {
    RowContext at = row;
    if (g > 0) at.arg = std::fabs(row.arg - lo) <= kNodeSlack ? lo : lo + g;
    double v = model.EvaluateWithGradient(params, at, wrt, gradient);
    if (g > 0 && practice.round_nodes && std::isfinite(v)) {
      v = RoundUnits(v, places, practice.rounding) / std::pow(60.0, places);
    }
    return v + practice.displacement;
  }
  // The straight line between the nodes, and the same line between their
  // derivatives.
  constexpr std::size_t kStack = 8;
  double stack[kStack];
  std::vector<double> heap;
  double* gb = stack;
  if (wrt.size() > kStack) {
    heap.resize(wrt.size());
    gb = heap.data();
  }
  RowContext at = row;
  at.arg = lo;
  double va = model.EvaluateWithGradient(params, at, wrt, gradient);
  at.arg = lo + g;
  double vb = model.EvaluateWithGradient(params, at, wrt, gb);
  if (practice.round_nodes) {
    const double unit = std::pow(60.0, places);
    if (std::isfinite(va)) va = RoundUnits(va, places, practice.rounding) / unit;
    if (std::isfinite(vb)) vb = RoundUnits(vb, places, practice.rounding) / unit;
  }
  const double t = (row.arg - lo) / g;
  for (std::size_t j = 0; j < wrt.size(); ++j) gradient[j] += (gb[j] - gradient[j]) * t;
  return va + (vb - va) * t + practice.displacement;
}

ColumnRecomputation Recompute(const Model& model, const std::vector<double>& params,
                              const Transcription& table, int column, const Practice& practice) {
  const std::size_t n = table.rows.size();
  const int places =
      practice.places.value_or(table.columns.at(static_cast<std::size_t>(column)).places);
  const std::optional<double> arg2 = ColumnArgument(table, column);
  ColumnRecomputation out;
  out.exact.assign(n, kNaN);
  out.computed.assign(n, std::nullopt);
  for (std::size_t i = 0; i < n; ++i) {
    auto arg = RowArgument(table, i);
    if (!arg) continue;
    const RowContext ctx{*arg, arg2, &table, i, column};
    const double v = PracticeValue(model, params, ctx, practice, places);
    out.exact[i] = v;
    if (std::isfinite(v) && std::fabs(v) < 1e12) {
      out.computed[i] = Sexagesimal::FromDouble(v, places, practice.rounding);
    }
  }
  return out;
}

}  // namespace apograph::model
