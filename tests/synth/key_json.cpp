#include "key_json.hpp"

#include <cmath>

namespace apograph::synth {
namespace {

using nlohmann::json;

const char* RoleName(ColumnKey::Role role) {
  switch (role) {
    case ColumnKey::Role::kModel:
      return "model";
    case ColumnKey::Role::kDerived:
      return "derived";
    case ColumnKey::Role::kUnexplained:
      return "unexplained";
  }
  return "";
}

json Texts(const std::vector<Sexagesimal>& values) {
  json out = json::array();
  for (const auto& v : values) out.push_back(v.ToString());
  return out;
}

json PracticeJson(const ColumnKey& c) {
  return {{"rounding", c.practice.rounding == Rounding::kTruncate ? "truncate" : "nearest"},
          {"grid", c.practice.grid},
          {"grid_origin", c.practice.grid_origin},
          {"round_nodes", c.practice.round_nodes},
          {"order", "function, sign form and displacement, grid interpolation, rounding, modulo"}};
}

json Form(const ColumnKey& c) {
  json rubric = json::array();
  for (const auto& r : c.rubric) {
    rubric.push_back({{"from", r.from.ToString()}, {"to", r.to.ToString()}, {"sign", r.sign}});
  }
  return {{"sign_form", ToString(c.sign_form)},
          {"negated", c.negated},
          {"displacement", c.displacement ? json(c.displacement->ToString()) : json(nullptr)},
          {"rubric", rubric}};
}

json Derived(const DerivedSpec& d) {
  return {{"kind", d.kind == DerivedSpec::Kind::kSum ? "sum" : "difference"},
          {"from", d.from},
          {"from_exact", d.from_exact},
          {"span_rows", d.span_rows},
          {"forward", d.forward},
          {"divisor", d.divisor},
          {"wrap_360", d.wrap_360}};
}

json MeanMotion(const MeanMotionBuild& b) {
  return {
      {"construction", b.construction},
      {"unit_value", b.unit_value ? json(b.unit_value->ToString()) : json(nullptr)},
      {"multiplied_up_to", b.multiplied_up_to},
      {"period", b.period},
      {"days_per_period", b.days_per_period ? json(b.days_per_period->ToString()) : json(nullptr)},
      {"how", b.how}};
}

json Departures(const ColumnKey& c, const ArgumentKey& a) {
  json out = json::array();
  for (const auto& d : c.departures) {
    const auto i = static_cast<std::size_t>(d.row);
    out.push_back({{"row", d.row},
                   {"arg", a.values[i].ToString()},
                   {"computed", c.computed[i].ToString()},
                   {"tabulated", c.tabulated[i].ToString()},
                   {"units", d.units}});
  }
  return out;
}

// Whether a run of positions goes backwards somewhere (a planet's
// retrogradation), from the exact values.
bool Regresses(const ColumnKey& c) {
  for (std::size_t i = 1; i < c.exact.size(); ++i) {
    if (std::remainder(c.exact[i] - c.exact[i - 1], 360.0) < 0) return true;
  }
  return false;
}

json Equivalents(const ColumnKey& c) {
  json out = json::array();
  for (const auto& e : EquivalentModels(c)) {
    json params = json::object();
    for (const auto& [name, value] : e.params) params[name] = value;
    out.push_back({{"model", e.model}, {"params", params}, {"note", e.note}});
  }
  return out;
}

}  // namespace

json ToJson(const Parameter& p) {
  return {{"role", p.role},
          {"text", p.text},
          {"value", p.value},
          {"basis", p.basis},
          {"nonround", p.basis.rfind("non-round", 0) == 0}};
}

json ToJson(const Function& f) {
  json params = json::array();
  for (const auto& p : f.params) params.push_back(ToJson(p));
  return {{"family", FamilyName(f.family)},
          {"variant", f.variant},
          {"formula", FormulaText(f)},
          {"params", params}};
}

json ToJson(const ArgumentKey& a) {
  return {{"name", a.name},
          {"unit", a.unit},
          {"places", a.places},
          {"regular", a.regular},
          {"start", a.start ? json(a.start->ToString()) : json(nullptr)},
          {"step", a.step ? json(a.step->ToString()) : json(nullptr)},
          {"values", Texts(a.values)}};
}

json ToJson(const ColumnKey& c, const ArgumentKey& a) {
  json out = {{"name", c.name},
              {"unit", c.unit},
              {"title", c.title},
              {"places", c.places},
              {"role", RoleName(c.role)},
              {"explained", c.role != ColumnKey::Role::kUnexplained},
              {"arg2", c.arg2 ? json(c.arg2->ToString()) : json(nullptr)},
              {"modulo_360", c.modulo_360},
              {"practice", PracticeJson(c)},
              {"form", Form(c)},
              {"departures", Departures(c, a)},
              {"exact", c.exact},
              {"computed", Texts(c.computed)},
              {"tabulated", Texts(c.tabulated)}};
  if (c.role != ColumnKey::Role::kDerived) {
    out["function"] = ToJson(c.function);
    out["equivalent_models"] = Equivalents(c);
  }
  if (c.derived) out["derived"] = Derived(*c.derived);
  if (c.mean_motion) out["mean_motion"] = MeanMotion(*c.mean_motion);
  if (c.function.family == Family::kPlanetPosition && c.function.variant == "longitude") {
    out["regresses"] = Regresses(c);
  }
  return out;
}

json ToJson(const TableKey& t) {
  json columns = json::array();
  for (const auto& c : t.columns) columns.push_back(ToJson(c, t.argument));
  return {{"id", t.id},
          {"title", t.title},
          {"kind", t.kind},
          {"family", FamilyName(t.family)},
          {"argument", ToJson(t.argument)},
          {"argument2", t.argument2 ? ToJson(*t.argument2) : json(nullptr)},
          {"columns", columns}};
}

}  // namespace apograph::synth
