// Provisional registry with one model; the model library replaces it.
#include <cmath>
#include <numbers>

#include "model/model.hpp"

namespace apograph::model {
namespace {

class SolarEccentric final : public Model {
 public:
  const std::string& name() const override { return name_; }
  const std::string& description() const override { return description_; }
  const std::vector<ParamSpec>& params() const override { return params_; }
  double Evaluate(const std::vector<double>& p, const RowContext& row) const override {
    const double a = row.arg * std::numbers::pi / 180.0;
    return std::atan2(p[0] * std::sin(a), 60.0 + p[0] * std::cos(a)) * 180.0 / std::numbers::pi;
  }

 private:
  std::string name_ = "solar-eccentric";
  std::string description_ = "q(a) = atan2(e sin a, 60 + e cos a)";
  std::vector<ParamSpec> params_ = {{"e", "parts of 60", "eccentricity", 2.5, 1.0, 4.0}};
};

const SolarEccentric kSolarEccentric;

}  // namespace

const Model* FindBuiltinModel(std::string_view name) {
  for (const Model* m : BuiltinModels()) {
    if (m->name() == name) return m;
  }
  return nullptr;
}

std::vector<const Model*> BuiltinModels() { return {&kSolarEccentric}; }

}  // namespace apograph::model
