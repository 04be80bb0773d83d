// The registry of built-in models and the shared BuiltinModel code.
#include "model/builtin.hpp"

namespace apograph::model {
namespace internal {

// The families, one per file (adding a family: its file, a line here and
// its names in tests/model/builtin_models_test.cpp).
const std::vector<const BuiltinModel*>& TrigModels();
const std::vector<const BuiltinModel*>& SolarModels();
const std::vector<const BuiltinModel*>& PlanetModels();
const std::vector<const BuiltinModel*>& SphericalModels();
const std::vector<const BuiltinModel*>& MeanMotionModels();
const std::vector<const BuiltinModel*>& PositionModels();

double BuiltinModel::Evaluate(const std::vector<double>& p, const RowContext& row) const {
  if (p.size() < params_.size()) {
    throw std::invalid_argument("model " + name_ + ": expected " + std::to_string(params_.size()) +
                                " parameters, got " + std::to_string(p.size()));
  }
  return ApplySign(f_(p.data(), row.arg, row.arg2.value_or(0.0)), ResolvedSign(row.sign));
}

double BuiltinModel::EvaluateWithGradient(const std::vector<double>& p, const RowContext& row,
                                          const std::vector<int>& wrt, double* gradient) const {
  if (!f1_ || !f2_) return Model::EvaluateWithGradient(p, row, wrt, gradient);
  if (p.size() < params_.size()) return Evaluate(p, row);  // throws the same message
  constexpr std::size_t kMax = kDualParameterLimit;
  if (params_.size() > kMax) return Model::EvaluateWithGradient(p, row, wrt, gradient);
  const double arg = row.arg, arg2 = row.arg2.value_or(0.0);
  double v = 0;
  // Two derivatives per pass, the last one alone when their number is odd.
  for (std::size_t j = 0; j < wrt.size() || j == 0; j += 2) {
    if (j + 1 < wrt.size()) {
      Dual<2> q[kMax];
      for (std::size_t i = 0; i < params_.size(); ++i) q[i] = p[i];
      q[wrt[j]].d[0] = 1;
      q[wrt[j + 1]].d[1] = 1;
      const Dual<2> r = f2_(q, Dual<2>(arg), Dual<2>(arg2));
      v = r.v;
      gradient[j] = r.d[0];
      gradient[j + 1] = r.d[1];
    } else {
      Dual<1> q[kMax];
      for (std::size_t i = 0; i < params_.size(); ++i) q[i] = p[i];
      if (j < wrt.size()) q[wrt[j]].d[0] = 1;
      const Dual<1> r = f1_(q, Dual<1>(arg), Dual<1>(arg2));
      v = r.v;
      if (j < wrt.size()) gradient[j] = r.d[0];
    }
  }
  // The sign form: -v, |v| (the derivative of |v| is sign(v) v'), or v.
  const SignForm form = ResolvedSign(row.sign);
  const double factor =
      form == SignForm::kNegated ? -1.0 : (form == SignForm::kMagnitude && v < 0 ? -1.0 : 1.0);
  if (factor < 0) {
    for (std::size_t j = 0; j < wrt.size(); ++j) gradient[j] = -gradient[j];
  }
  return factor * v;
}

long double BuiltinModel::EvaluateLong(const std::vector<long double>& p, long double arg,
                                       long double arg2) const {
  const long double v = fl_(p.data(), arg, arg2);
  return traits_.conventional == SignForm::kMagnitude ? fabsl(v) : v;
}

std::vector<const BuiltinModel*> AllBuiltinModels() {
  std::vector<const BuiltinModel*> out;
  for (const auto* family : {&TrigModels(), &SolarModels(), &PlanetModels(), &SphericalModels(),
                             &MeanMotionModels(), &PositionModels()}) {
    out.insert(out.end(), family->begin(), family->end());
  }
  return out;
}

}  // namespace internal

const Model* FindBuiltinModel(std::string_view name) {
  for (const Model* m : BuiltinModels()) {
    if (m->name() == name) return m;
  }
  return nullptr;
}

std::vector<const Model*> BuiltinModels() {
  auto all = internal::AllBuiltinModels();
  return {all.begin(), all.end()};
}

}  // namespace apograph::model
