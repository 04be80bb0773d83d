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

/// Three planets on a circular deferent (e = 0) with the epicycle's radius
/// of the catalog, as planet-position's parameters (radii and daily rates
/// from memory: an outer planet with a large epicycle, an inner one, a slow
/// outer one).
inline const std::vector<std::vector<double>>& CircularPlanets() {
  static const std::vector<std::vector<double>> kPlanets = {
      {D("197;2"), D("0;31,26,36,54"), D("97;49"), D("0;27,41,40,19"), 0, 0, D("39;30"), 360},
      {D("111;6"), D("0;59,8,17,13"), D("56;50"), D("0;36,59,25,53"), 0, 0, D("43;10"), 360},
      {D("318;43"), D("0;4,59,14,27"), D("218;8"), D("0;54,9,2,46"), 0, 0, D("11;30"), 360}};
  return kPlanets;
}

/// Planet `p` by day over 110 days, two places, a fifth of the entries
/// corrupted (`seed`): a short arc.
inline Transcription ShortArc(const std::vector<double>& p, unsigned seed) {
  return CorruptAFifth(MakeTable("p", 1, 1, 110, {FromModel("planet-position", p, 2)}), seed);
}

}  // namespace apograph::estimate::testing
