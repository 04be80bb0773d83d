// What `apograph errors` prints: a witness's findings as text, JSON (with
// the references and the guard's verdicts) and CSV rows (errors_output.hpp).
#include "cli/errors_output.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <ostream>

#include "deviation/numeral_script.hpp"
#include "estimate/notation.hpp"
#include "model/model.hpp"

namespace apograph::cli {
namespace {

/// The practice differs from plain rounding to the column's places.
bool SpecialPractice(const pipeline::ColumnReference& r, const Transcription& t) {
  const auto& p = r.practice;
  return p.rounding != Rounding::kNearest || p.grid > 0 || p.displacement != 0 ||
         p.places.value_or(0) != t.columns.at(static_cast<std::size_t>(r.column)).places;
}

/// "solar-eccentric e=2.5 (2;30)", with "(fitted, rounded to 1 place)" when
/// identified and the practice when it is not plain rounding.
std::string ModelText(const pipeline::ColumnReference& r, const Transcription& t) {
  std::string out = r.ModelText();
  const std::string practice =
      SpecialPractice(r, t) ? pipeline::DescribePractice(r.practice, *r.practice.places) : "";
  if (r.source == pipeline::ReferenceSource::kGiven)
    return practice.empty() ? out : out + " (" + practice + ")";
  std::string how = r.derived.empty() ? "fitted" : "identified";
  for (const auto& a : r.adopted) {
    how +=
        ", " + a.param + " = " + estimate::NumberText(a.value, 6) + " adopted (" + a.source + ")";
  }
  if (!practice.empty()) how += "; entries " + practice;
  return out + " (" + how + ")";
}

}  // namespace

std::string ModelText(const std::vector<pipeline::ColumnReference>& refs, const Transcription& t) {
  std::string out;
  for (const auto& r : refs)
    out +=
        (out.empty() ? "" : "; ") + (refs.size() > 1 ? r.column_name + ": " : "") + ModelText(r, t);
  return out;
}

namespace {

nlohmann::json ReferenceJson(const pipeline::ColumnReference& r) {
  nlohmann::json params = nlohmann::json::object();
  for (std::size_t i = 0; i < r.params.size() && i < r.model->params().size(); ++i)
    params[r.model->params()[i].name] = r.params[i];
  const auto& p = r.practice;
  nlohmann::json adopted = nlohmann::json::array();
  for (const auto& a : r.adopted) {
    adopted.push_back({{"param", a.param},
                       {"value", a.value},
                       {"fitted", a.fitted},
                       {"stderr", std::isfinite(a.stderr_) ? nlohmann::json(a.stderr_) : nullptr},
                       {"source", a.source}});
  }
  nlohmann::json variants = nlohmann::json::array();
  for (const auto& v : r.variants)
    variants.push_back({{"followers", v.followers}, {"description", v.description}});
  return {{"column", r.column_name},
          {"model", r.model->name()},
          {"params", params},
          {"practice",
           {{"rounding", model::ToString(p.rounding)},
            {"places", p.places.value_or(0)},
            {"grid", p.grid},
            {"grid_origin", p.grid_origin},
            {"round_nodes", p.round_nodes},
            {"displacement", p.displacement},
            {"sign", model::ToString(r.model->ResolvedSign(p.sign))}}},
          {"description", r.description},
          {"source", pipeline::ToString(r.source)},
          {"witness", r.witness.empty() ? nlohmann::json(nullptr) : nlohmann::json(r.witness)},
          {"how", r.how},
          {"explains", r.explains},
          {"verdict", r.verdict},
          {"derived", r.derived},
          {"adopted", adopted},
          {"variants", variants}};
}

nlohmann::json Units(double d) {
  if (!std::isfinite(d)) return nullptr;
  return std::round(d * 100) / 100;
}

nlohmann::json Reading(const std::optional<Sexagesimal>& v) {
  if (!v) return nullptr;
  return v->ToString();
}

/// The argument a row stands for (the JSON `arg`), in trade notation.
std::string ArgInUse(const Transcription& t, std::size_t row, const std::string& written) {
  const auto arg = row < t.rows.size() ? t.ArgumentInUse(row) : std::nullopt;
  return arg ? arg->ToString() : written;
}

nlohmann::json FindingJson(const deviation::Finding& f, const Transcription& t) {
  const auto& c = f.cells.front();
  nlohmann::json j = {{"row", c.row + 1},
                      {"arg", ArgInUse(t, c.row, c.arg)},
                      {"written_arg", c.arg},
                      {"column", f.column_name},
                      {"tabulated", c.tabulated},
                      {"computed", Reading(c.computed)},
                      {"diff_units", Units(c.diff_units)},
                      {"class", deviation::ToString(f.best().cls)},
                      {"explanation", f.best().evidence},
                      {"emendation", Reading(c.emendation)},
                      {"score", std::round(f.best().score * 100) / 100}};
  j["arg_end"] = ArgInUse(t, f.cells.back().row, f.cells.back().arg);
  j["cells"] = nlohmann::json::array();
  for (const auto& cell : f.cells) {
    j["cells"].push_back({{"row", cell.row + 1},
                          {"arg", ArgInUse(t, cell.row, cell.arg)},
                          {"written_arg", cell.arg},
                          {"tabulated", cell.tabulated},
                          {"computed", Reading(cell.computed)},
                          {"diff_units", Units(cell.diff_units)},
                          {"emendation", Reading(cell.emendation)}});
  }
  j["alternatives"] = nlohmann::json::array();
  for (std::size_t i = 1; i < f.explanations.size(); ++i) {
    const auto& e = f.explanations[i];
    j["alternatives"].push_back({{"class", deviation::ToString(e.cls)},
                                 {"score", std::round(e.score * 100) / 100},
                                 {"emendation", Reading(e.emendation)},
                                 {"explanation", e.evidence}});
  }
  return j;
}

nlohmann::json SuspectJson(const deviation::Suspect& s) {
  nlohmann::json j = {{"row", s.row + 1},
                      {"arg", s.arg},
                      {"tabulated", s.tabulated},
                      {"expected", Reading(s.expected)},
                      {"diff_units", Units(s.diff_units)},
                      {"score", std::round(s.score * 100) / 100},
                      {"evidence", s.evidence},
                      {"class", nullptr},
                      {"emendation", nullptr}};
  if (!s.explanations.empty()) {
    j["class"] = deviation::ToString(s.explanations.front().cls);
    j["emendation"] = Reading(s.explanations.front().emendation);
  }
  return j;
}

nlohmann::json VerdictJson(const pipeline::ColumnVerdict& v) {
  nlohmann::json j = {{"column", v.column_name},
                      {"explains", v.verdict.explains},
                      {"on", v.verdict.consensus ? "tradition" : "witness"},
                      {"compared", v.verdict.compared},
                      {"flagged", v.verdict.flagged},
                      {"limit", v.verdict.limit},
                      {"why", v.verdict.why}};
  j["screen"] = nlohmann::json::array();
  for (const auto& s : v.screen) j["screen"].push_back(SuspectJson(s));
  return j;
}

/// A refused reference: why, and the model-free screen instead of findings.
void PrintRefused(const pipeline::ColumnVerdict& v, Io& io) {
  if (v.verdict.explains) return;
  io.out << v.column_name << ": " << v.verdict.why << "\n";
  io.out << v.column_name << ": model-free screen, " << v.screen.size()
         << (v.screen.size() == 1 ? " suspect entry\n" : " suspect entries\n");
  for (const auto& s : v.screen) {
    io.out << "  " << s.arg << " " << s.tabulated << ": " << s.evidence;
    if (!s.explanations.empty() && s.explanations.front().emendation) {
      io.out << "; likely " << deviation::ToString(s.explanations.front().cls) << ", reading "
             << s.explanations.front().emendation->ToString();
    }
    io.out << "\n";
  }
}

}  // namespace

nlohmann::json ErrorsJson(double tolerance, const Transcription& t,
                          const std::vector<pipeline::ColumnReference>& refs,
                          const pipeline::WitnessFindings& explained) {
  nlohmann::json j = {{"table", t.table_id},
                      {"witness", t.witness.siglum},
                      {"script", t.witness.script},
                      {"numeral_script", explained.script},
                      {"witness_kind", ToString(t.witness.Kind())},
                      {"model", ModelText(refs, t)},
                      {"tolerance", tolerance}};
  j["references"] = nlohmann::json::array();
  for (const auto& r : refs) j["references"].push_back(ReferenceJson(r));
  j["findings"] = nlohmann::json::array();
  for (const auto& f : explained.findings) j["findings"].push_back(FindingJson(f, t));
  j["verdicts"] = nlohmann::json::array();
  for (const auto& v : explained.verdicts) j["verdicts"].push_back(VerdictJson(v));
  return j;
}

extern const std::vector<std::string> kCsvHeaders = {
    "finding",    "arg",   "column",     "tabulated", "computed",
    "diff_units", "class", "emendation", "score",     "explanation"};

/// One CSV row per cell of each finding.
std::vector<std::vector<std::string>> CsvRows(const std::vector<deviation::Finding>& findings) {
  std::vector<std::vector<std::string>> rows;
  for (std::size_t i = 0; i < findings.size(); ++i) {
    const auto& f = findings[i];
    for (const auto& c : f.cells) {
      char diff[32] = "", score[16];
      if (std::isfinite(c.diff_units))
        std::snprintf(diff, sizeof diff, "%g", std::round(c.diff_units * 100) / 100);
      std::snprintf(score, sizeof score, "%.2f", f.best().score);
      rows.push_back({std::to_string(i + 1), c.arg, f.column_name, c.tabulated,
                      c.computed ? c.computed->ToString() : "", diff,
                      deviation::ToString(f.best().cls),
                      c.emendation ? c.emendation->ToString() : "", score, f.best().evidence});
    }
  }
  return rows;
}

void PrintText(const Transcription& t, const std::vector<pipeline::ColumnReference>& refs,
               const pipeline::WitnessFindings& explained, bool with_references, Io& io) {
  const auto& findings = explained.findings;
  for (const auto& r : refs) {
    if (with_references && r.source == pipeline::ReferenceSource::kIdentified)
      io.out << r.column_name << ": " << r.description << "; " << r.how << "\n";
  }
  io.out << "table " << t.table_id << ", witness " << t.witness.siglum << " (" << explained.script
         << "), compared with " << ModelText(refs, t) << ": " << findings.size()
         << (findings.size() == 1 ? " finding\n" : " findings\n");
  for (const auto& f : findings) io.out << f.Note(t.witness.siglum) << "\n";
  for (const auto& v : explained.verdicts) PrintRefused(v, io);
}

}  // namespace apograph::cli
