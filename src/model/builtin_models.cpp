// The registry of built-in models and the shared BuiltinModel code.
#include "model/builtin.hpp"

namespace apograph::model {
namespace internal {

double BuiltinModel::Evaluate(const std::vector<double>& p, const RowContext& row) const {
  if (p.size() < params_.size()) {
    throw std::invalid_argument("model " + name_ + ": expected " + std::to_string(params_.size()) +
                                " parameters, got " + std::to_string(p.size()));
  }
  return f_(p.data(), row.arg, row.arg2.value_or(0.0));
}

long double BuiltinModel::EvaluateLong(const std::vector<long double>& p, long double arg,
                                       long double arg2) const {
  return fl_(p.data(), arg, arg2);
}

std::vector<const BuiltinModel*> AllBuiltinModels() {
  std::vector<const BuiltinModel*> out;
  for (const auto* family : {&TrigModels(), &SolarModels(), &PlanetModels(),
                             &SphericalModels(), &MeanMotionModels()}) {
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
