// Simple values through a combination of two parameters: an equation of
// anomaly computed at the epicycle's greatest distance 60 + e computes what
// an epicycle at mean distance of radius 60 r/(60 + e) computes, and the
// entries fix only that radius. The author's r and e were round or
// attested; their combination is not, and no sexagesimal rounding of the
// estimate reaches it. Used by round_values.cpp: values of the simpler
// model's parameter, and pairs for the model with both.
#include <algorithm>
#include <cmath>

#include "estimate/identify_internal.hpp"
#include "estimate/notation.hpp"

namespace apograph::estimate::internal {

namespace {

/// A parameter's simple values: the attested ones, then the whole numbers
/// of its historical range.
std::vector<SimpleValue> SimpleValues(const model::Model& m, const model::ParamSpec& spec,
                                      const std::vector<CatalogEntry>* catalog) {
  std::vector<SimpleValue> out;
  if (catalog) {
    for (const auto& e : *catalog) {
      if (e.AppliesTo(m.name(), spec.name))
        out.push_back({e.value.ToDouble(), "attested: " + e.tradition, e.value.ToString()});
    }
  }
  for (double k = std::ceil(spec.low); k <= spec.high && k - spec.low < 1000; ++k)
    out.push_back({k, "round, 0 places", NumberText(k, 0)});
  return out;
}

/// The values of `scored` (distance, value) nearest first, at most `most`;
/// equal distances keep their order.
template <typename T>
std::vector<T> NearestFirst(std::vector<std::pair<double, T>> scored, int most) {
  std::stable_sort(scored.begin(), scored.end(),
                   [](const auto& x, const auto& y) { return x.first < y.first; });
  std::vector<T> out;
  for (auto& [d, v] : scored) {
    if (static_cast<int>(out.size()) >= most) break;
    out.push_back(std::move(v));
  }
  return out;
}

/// Every pair of simple values of the combination's two parameters whose
/// combination lies within `many` standard errors of `value`, nearest first
/// (at most `most`). `full` holds the model's other parameters.
std::vector<SimplePair> PairsNear(const model::Model& m, const model::ParamCombination& c,
                                  std::vector<double> full, double value, double se, double many,
                                  int most, const std::vector<CatalogEntry>* catalog) {
  std::vector<std::pair<double, SimplePair>> near;
  const int i = m.ParamIndex(c.params[0]), j = m.ParamIndex(c.params[1]);
  if (i < 0 || j < 0 || !c.value || !(se > 0) || !std::isfinite(se)) return {};
  const auto ui = static_cast<std::size_t>(i), uj = static_cast<std::size_t>(j);
  for (const auto& a : SimpleValues(m, m.params()[ui], catalog)) {
    for (const auto& b : SimpleValues(m, m.params()[uj], catalog)) {
      full[ui] = a.value;
      full[uj] = b.value;
      const double v = c.value(full.data());
      const double d = std::fabs(v - value);
      if (d <= many * se) near.push_back({d, {ui, uj, a, b, v}});
    }
  }
  return NearestFirst(std::move(near), most);
}

}  // namespace

std::vector<SimpleValue> EquivalentValues(const model::Model& m, const std::string& param,
                                          double estimate, double se, double many, int most,
                                          const std::vector<CatalogEntry>* catalog) {
  const std::string target = m.name() + ":" + param;
  std::vector<std::pair<double, SimpleValue>> found;
  for (const model::Model* other : model::BuiltinModels()) {
    for (const auto& c : other->traits().combinations) {
      if (c.same_as != target || c.params.size() != 2) continue;
      std::vector<double> full;
      for (const auto& spec : other->params()) full.push_back(spec.default_value);
      const std::string how = c.text.substr(0, c.text.find(','));
      for (const auto& p : PairsNear(*other, c, full, estimate, se, many, most, catalog)) {
        const std::string text = how + " of " + other->name() + " with " + c.params[0] + " = " +
                                 p.first.text + " (" + p.first.source + "), " + c.params[1] +
                                 " = " + p.second.text + " (" + p.second.source + ")";
        found.push_back({std::fabs(p.combined - estimate), {p.combined, text, text}});
      }
    }
  }
  return NearestFirst(std::move(found), most);
}

std::vector<SimplePair> CombinationPairs(const Candidate& best, double many, int most,
                                         const std::vector<CatalogEntry>* catalog) {
  const model::Model& m = *best.model;
  for (const auto& d : best.fit.combinations) {
    for (const auto& c : m.traits().combinations) {
      if (c.text != d.text || c.params.size() != 2) continue;
      const int i = m.ParamIndex(c.params[0]), j = m.ParamIndex(c.params[1]);
      if (i < 0 || j < 0 || best.fit.params[static_cast<std::size_t>(i)].fixed ||
          best.fit.params[static_cast<std::size_t>(j)].fixed)
        continue;
      std::vector<double> full;
      for (const auto& p : best.fit.params) full.push_back(p.value);
      auto pairs = PairsNear(m, c, full, d.value, d.stderr_, many, most, catalog);
      if (!pairs.empty()) return pairs;
    }
  }
  return {};
}

}  // namespace apograph::estimate::internal
