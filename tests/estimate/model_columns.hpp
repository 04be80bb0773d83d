#pragma once
// Columns made by a built-in model with given parameters, and the shipped
// parameter catalog: what the identification tests build their tables from.

#include <doctest/doctest.h>

#include <string>
#include <vector>

#include "estimate/catalog.hpp"
#include "model/model.hpp"
#include "synthetic.hpp"

namespace apograph::estimate::testing {

/// A column made by a built-in model (in its sign form) with given parameters.
inline SyntheticColumn FromModel(const std::string& name, std::vector<double> params, int places,
                                 model::SignForm sign = model::SignForm::kConventional) {
  const model::Model* m = model::FindBuiltinModel(name);
  REQUIRE(m != nullptr);
  SyntheticColumn c;
  c.places = places;
  c.f = [m, params, sign](double a) {
    model::RowContext ctx;
    ctx.arg = a;
    ctx.sign = sign;
    return m->Evaluate(params, ctx);
  };
  return c;
}

/// The shipped catalog of attested parameter values, read once.
inline const std::vector<CatalogEntry>& Catalog() {
  static const auto kCatalog = ReadCatalogFile(DefaultCatalogPath());
  return kCatalog;
}

}  // namespace apograph::estimate::testing
