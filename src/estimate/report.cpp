#include "estimate/report.hpp"

#include <cmath>
#include <sstream>

#include "estimate/notation.hpp"
#include "support/tabular.hpp"

namespace apograph::estimate {

namespace {

std::string Num(double v, int precision = 6) {
  std::ostringstream o;
  o.precision(precision);
  o << v;
  return o.str();
}

std::string ColumnName(const Transcription& t, int c) {
  return c >= 0 && static_cast<std::size_t>(c) < t.columns.size()
             ? t.columns[static_cast<std::size_t>(c)].name
             : "";
}

nlohmann::json AttestedJson(const FitResult& fit, const std::vector<CatalogEntry>& catalog) {
  nlohmann::json out = nlohmann::json::object();
  for (const auto& p : fit.params) {
    if (p.fixed) continue;
    nlohmann::json list = nlohmann::json::array();
    for (const auto& m : NearestAttested(catalog, fit.model, p.name, p.value, p.stderr_)) {
      list.push_back({{"value", m.entry.value.ToString()},
                      {"kind", m.entry.kind},
                      {"tradition", m.entry.tradition},
                      {"source", m.entry.source},
                      {"from_memory", m.entry.from_memory},
                      {"origin", m.entry.origin},
                      {"distance", m.distance},
                      {"distance_se", std::isfinite(m.distance_se) ? nlohmann::json(m.distance_se)
                                                                   : nlohmann::json(nullptr)}});
    }
    out[p.name] = list;
  }
  return out;
}

nlohmann::json Number(double v) { return std::isfinite(v) ? nlohmann::json(v) : nlohmann::json(); }

/// The values used, name -> value (the JSON `params` of every command).
nlohmann::json ParamsJson(const FitResult& fit) {
  nlohmann::json out = nlohmann::json::object();
  for (const auto& p : fit.params) out[p.name] = p.value;
  return out;
}

/// The estimates with their standard errors (the JSON `estimates`).
nlohmann::json EstimatesJson(const FitResult& fit) {
  nlohmann::json out = nlohmann::json::object();
  for (const auto& p : fit.params) {
    out[p.name] = {{"value", p.value},
                   {"stderr", Number(p.stderr_)},
                   {"fixed", p.fixed},
                   {"separable", p.separable},
                   {"trade", TradeValue(p.value, p.stderr_)}};
  }
  return out;
}

nlohmann::json PracticeJson(const model::Practice& p) {
  return {{"rounding", p.rounding == Rounding::kTruncate ? "truncate" : "nearest"},
          {"places", p.places ? nlohmann::json(*p.places) : nlohmann::json(nullptr)},
          {"grid", p.grid},
          {"grid_origin", p.grid_origin},
          {"round_nodes", p.round_nodes},
          {"displacement", p.displacement},
          {"sign", model::ToString(p.sign)}};
}

/// A row's argument in trade notation: the one the row stands for.
std::string ArgText(const Transcription& t, std::size_t row, double arg) {
  if (row < t.rows.size()) {
    if (auto a = t.ArgumentInUse(row)) return a->ToString();
  }
  return Sexagesimal::FromDouble(arg, t.argument.places).ToString();
}

nlohmann::json CombinationsJson(const FitResult& fit) {
  nlohmann::json out = nlohmann::json::array();
  for (const auto& c : fit.combinations) {
    out.push_back({{"params", c.params},
                   {"text", c.text},
                   {"value", Number(c.value)},
                   {"stderr", Number(c.stderr_)}});
  }
  return out;
}

nlohmann::json AdoptedJson(const Candidate& c) {
  nlohmann::json out = nlohmann::json::array();
  if (!c.adoption) return out;
  for (const auto& a : c.adoption->values) {
    out.push_back({{"param", a.param},
                   {"value", a.value},
                   {"value_text", NumberText(a.value, 6)},
                   {"fitted", a.fitted},
                   {"stderr", Number(a.stderr_)},
                   {"source", a.source}});
  }
  return out;
}

nlohmann::json EquivalentsJson(const Candidate& c) {
  nlohmann::json out = nlohmann::json::array();
  for (const auto& e : c.equivalents) {
    nlohmann::json params = nlohmann::json::object();
    for (const auto& p : e.params) params[p.name] = p.value;
    out.push_back({{"model", e.model->name()}, {"params", params}});
  }
  return out;
}

/// The standard error in the trade's notation: two significant places.
std::string ErrorText(double se) {
  if (!std::isfinite(se)) return "-";
  if (se >= 1e9) return NumberText(se);  // undetermined: a decimal, not a sexagesimal overflow
  int places = 0;
  while (places < 10 && se * std::pow(60.0, places) < 1) ++places;
  return Sexagesimal::FromDouble(se, std::min(places + 1, 12)).ToString();
}

/// "e 2;4,48 ± 0;0,0,2" or "r 3;9,2 (not separable)".
std::string ParamText(const FittedParam& p, const char* between) {
  if (!p.separable) return p.name + between + NumberText(p.value) + " (not separable)";
  return p.name + between + TradeValue(p.value, p.stderr_) + " \u00b1 " + ErrorText(p.stderr_);
}

/// What the entries fix when parameters are not separable, one line each.
std::string CombinationsText(const FitResult& fit) {
  std::string s;
  for (const auto& c : fit.combinations) {
    std::string names;
    for (const auto& n : c.params) names += (names.empty() ? "" : " and ") + n;
    s += "  " + names + " cannot be separated by the entries";
    if (!c.text.empty())
      s += "; they fix " + c.text + " = " + NumberWithDecimal(c.value, 4) + " \u00b1 " +
           ErrorText(c.stderr_);
    s += "\n";
  }
  return s;
}

}  // namespace

std::string AttestedText(const FitResult& fit, const std::vector<CatalogEntry>& catalog) {
  std::string s;
  for (const auto& p : fit.params) {
    if (p.fixed) continue;
    for (const auto& m : NearestAttested(catalog, fit.model, p.name, p.value, p.stderr_)) {
      s += "    attested " + p.name + " = " + m.entry.value.ToString() + " (" + m.entry.tradition +
           "; " + m.entry.source + (m.entry.from_memory ? "; from memory" : "") + ") lies " +
           (std::isfinite(m.distance_se) ? Num(m.distance_se, 3) + " standard errors"
                                         : Num(std::fabs(m.distance), 4)) +
           " away\n";
    }
  }
  return s;
}

std::string ParamWithError(const FittedParam& p) {
  if (!p.held.empty()) return p.name + " = " + NumberText(p.value) + " (held: " + p.held + ")";
  if (!p.separable)
    return p.name + " = " + NumberText(p.value) + " (not separable from the other parameters)";
  return ParamText(p, " = ") + " (" + Num(p.value, 6) + " \u00b1 " + Num(p.stderr_, 2) + ")";
}

std::string TradeValue(double value, double se) {
  // Places down to about a quarter of the standard error (2 at least).
  int places = 2;
  while (places < 8 && se > 0 && std::pow(60.0, -places) > se / 4) ++places;
  if (!std::isfinite(value) || std::fabs(value) > 1e11) return "-";
  return Sexagesimal::FromDouble(value, places).ToString();
}

nlohmann::json FitJson(const FitResult& fit, const Transcription& t,
                       const std::vector<CatalogEntry>& catalog) {
  nlohmann::json j;
  j["table"] = t.table_id;
  j["witness"] = t.witness.siglum;
  j["model"] = fit.model;
  const auto& p = fit.practice;
  j["practice"] = PracticeJson(p);
  j["practice"]["displacement_stderr"] = fit.displacement_stderr;
  j["params"] = ParamsJson(fit);
  j["estimates"] = EstimatesJson(fit);
  j["combinations"] = CombinationsJson(fit);
  j["inliers"] = fit.inliers;
  j["exact"] = fit.exact;
  j["within_one"] = fit.within1;
  j["within1"] = fit.within1;  // deprecated alias of within_one (README 0.1)
  j["flagged"] = fit.flagged;
  j["n"] = fit.n;
  j["robust_scale"] = fit.robust_scale;
  j["converged"] = fit.converged;
  j["iterations"] = fit.iterations;
  nlohmann::json entries = nlohmann::json::array();
  for (const auto& e : fit.entries) {
    entries.push_back({{"row", e.row + 1},
                       {"arg", ArgText(t, e.row, e.arg)},
                       {"column", ColumnName(t, e.column)},
                       {"tabulated", e.tabulated.ToString()},
                       {"computed", e.computed ? nlohmann::json(e.computed->ToString())
                                               : nlohmann::json(nullptr)},
                       {"diff_units", std::isfinite(e.diff_units) ? nlohmann::json(e.diff_units)
                                                                  : nlohmann::json(nullptr)},
                       {"flag", e.flag}});
  }
  j["entries"] = entries;
  j["attested"] = AttestedJson(fit, catalog);
  return j;
}

namespace {

std::vector<std::size_t> FromRows(std::vector<std::size_t> rows) {
  for (auto& r : rows) ++r;  // 1-based, as every `row` in JSON
  return rows;
}

}  // namespace

nlohmann::json MeanMotionJson(const MeanMotionAnalysis& a) {
  nlohmann::json j;
  j["rounding"] = a.rounding == Rounding::kTruncate ? "truncate" : "nearest";
  j["rate"] = a.rate;
  j["rate_stderr"] = a.rate_stderr;
  j["rate_low"] = a.rate_low;
  j["rate_high"] = a.rate_high;
  j["rate_trade"] = a.rate_sexagesimal.ToString();
  j["rounded_rate"] =
      a.rounded_rate ? nlohmann::json(a.rounded_rate->ToString()) : nlohmann::json(nullptr);
  j["radix"] = a.radix_present ? nlohmann::json(a.radix.ToString()) : nlohmann::json(nullptr);
  j["successive_addition"] = a.successive_addition;
  j["unit_value"] =
      a.unit_value ? nlohmann::json(a.unit_value->ToString()) : nlohmann::json(nullptr);
  j["unexplained"] = a.unexplained;
  j["verdict"] = a.verdict;
  nlohmann::json entries = nlohmann::json::array();
  for (const auto& e : a.entries) {
    entries.push_back(
        {{"row", e.row + 1},
         {"arg", Sexagesimal::FromDouble(e.arg, 0).ToString()},  // whole arguments only
         {"tabulated", e.value.ToString()},
         {"turns", e.turns},
         {"origin", ToString(e.origin)},
         {"direct", e.direct ? nlohmann::json(e.direct->ToString()) : nlohmann::json(nullptr)},
         {"direct_diff_units", e.direct_diff_units},
         {"from_rows", FromRows(e.from)},
         {"evidence", e.evidence}});
  }
  j["entries"] = entries;
  return j;
}

nlohmann::json IdentificationJson(const Identification& id, const Transcription& t,
                                  const std::vector<CatalogEntry>& catalog) {
  nlohmann::json j;
  j["table"] = t.table_id;
  j["witness"] = t.witness.siglum;
  j["column"] = ColumnName(t, id.column);
  j["candidates_tried"] = id.candidates_tried;
  nlohmann::json list = nlohmann::json::array();
  int rank = 0;
  for (const auto& c : id.ranked) {
    list.push_back({{"rank", ++rank},
                    {"model", c.model->name()},
                    {"practice", PracticeJson(c.fit.practice)},
                    {"practice_text", c.PracticeText()},
                    {"score", c.score},
                    {"log_likelihood", c.log_likelihood},
                    {"penalised_parameters", c.penalised_parameters},
                    {"params", ParamsJson(c.fit)},
                    {"estimates", EstimatesJson(c.fit)},
                    {"exact", c.fit.exact},
                    {"within_one", c.fit.within1},
                    {"within1", c.fit.within1},  // deprecated alias of within_one
                    {"flagged", c.fit.flagged},
                    {"n", c.fit.n},
                    {"robust_scale", c.fit.robust_scale},
                    {"attested", AttestedJson(c.fit, catalog)},
                    {"sign", model::ToString(c.model->ResolvedSign(c.fit.practice.sign))},
                    {"equivalents", EquivalentsJson(c)},
                    {"naming", c.naming},
                    {"adopted", AdoptedJson(c)},
                    {"adoption", c.adoption ? c.adoption->text : ""},
                    {"combinations", CombinationsJson(c.fit)}});
  }
  j["candidates"] = list;
  j["explained"] = id.explained;
  j["within_one_share"] = id.within_one_share;
  j["verdict"] = id.verdict;
  j["notes"] = id.notes;
  j["mean_motion"] = id.mean_motion ? MeanMotionJson(*id.mean_motion) : nlohmann::json(nullptr);
  return j;
}

std::string FitText(const FitResult& fit, const Transcription& t,
                    const std::vector<CatalogEntry>& catalog, bool all_entries) {
  std::ostringstream o;
  o << "table " << t.table_id << ", witness " << t.witness.siglum << ": model " << fit.model
    << "\n";
  for (const auto& p : fit.params) {
    o << "  " << p.name << " = " << TradeValue(p.value, p.stderr_) << " (" << Num(p.value, 10)
      << ")";
    if (p.fixed)
      o << " (fixed)\n";
    else if (!p.separable)
      o << ": not separable from the other parameters\n";
    else
      o << "  standard error " << ErrorText(p.stderr_) << " (" << Num(p.stderr_, 3) << ") "
        << p.unit << "\n";
  }
  o << CombinationsText(fit);
  if (fit.practice.displacement != 0) {
    o << "  displacement = " << TradeValue(fit.practice.displacement, fit.displacement_stderr)
      << " (" << Num(fit.practice.displacement, 10) << ")  standard error "
      << ErrorText(fit.displacement_stderr) << "\n";
  }
  o << AttestedText(fit, catalog);
  o << "  " << fit.exact << " of " << fit.n << " entries reproduced exactly, " << fit.within1
    << " within one unit; robust scale of residuals " << Num(fit.robust_scale, 3)
    << " units of the last place; " << fit.flagged << " flagged (more than the tolerance away)\n";
  Tabular tab;
  tab.headers = {"arg", "column", "tabulated", "computed", "diff", "flag"};
  tab.right_aligned = {true, false, true, true, true, false};
  for (const auto& e : fit.entries) {
    if (!all_entries && !e.flag) continue;
    tab.Add({ArgumentText(t, e.row), ColumnName(t, e.column), e.tabulated.ToString(),
             e.computed ? e.computed->ToString() : "-",
             std::isfinite(e.diff_units) ? Num(e.diff_units, 4) : "-", e.flag ? "*" : ""});
  }
  if (!tab.rows.empty()) o << "\n" << tab.RenderText();
  return o.str();
}

std::string MeanMotionText(const MeanMotionAnalysis& a) {
  std::ostringstream o;
  o << "mean motion: " << a.verdict << "\n";
  Tabular tab;
  tab.headers = {"arg", "tabulated", "origin", "evidence"};
  tab.right_aligned = {true, true, false, false};
  for (const auto& e : a.entries)
    tab.Add({NumberText(e.arg, 6), e.value.ToString(), ToString(e.origin), e.evidence});
  o << tab.RenderText();
  return o.str();
}

std::string IdentificationText(const Identification& id, const Transcription& t,
                               const std::vector<CatalogEntry>& catalog) {
  std::ostringstream o;
  o << "table " << t.table_id << ", witness " << t.witness.siglum << ", column "
    << ColumnName(t, id.column) << ": " << id.candidates_tried << " candidates tried\n";
  if (!id.explained && !id.verdict.empty()) o << id.verdict << ".\n";
  Tabular tab;
  tab.headers = {"rank", "model", "practice", "parameters", "exact", "within1", "flagged", "score"};
  tab.right_aligned = {true, false, false, false, true, true, true, true};
  int rank = 0;
  for (const auto& c : id.ranked) {
    std::string params;
    for (const auto& p : c.fit.params) {
      if (!p.fixed) params += (params.empty() ? "" : ", ") + ParamText(p, " ");
    }
    tab.Add({std::to_string(++rank), c.model->name(), c.PracticeText(), params,
             std::to_string(c.fit.exact) + "/" + std::to_string(c.fit.n),
             std::to_string(c.fit.within1), std::to_string(c.fit.flagged), Num(c.score, 5)});
  }
  o << tab.RenderText();
  if (!id.ranked.empty()) {
    const Candidate& best = id.ranked[0];
    o << CombinationsText(best.fit);
    if (best.adoption) o << "adopted: " << best.adoption->text << "\n";
    for (const auto& e : best.equivalents) {
      std::string params;
      for (const auto& p : e.params) {
        if (!p.fixed) params += " " + p.name + " = " + NumberText(p.value);
      }
      o << "same values: " << e.model->name() << params << "\n";
    }
    o << AttestedText(best.fit, catalog);
  }
  for (const auto& n : id.notes) o << "note: " << n << "\n";
  if (id.mean_motion) o << MeanMotionText(*id.mean_motion);
  return o.str();
}

}  // namespace apograph::estimate
