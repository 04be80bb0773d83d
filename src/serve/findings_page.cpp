#include "serve/findings_page.hpp"

#include <optional>
#include <sstream>
#include <tuple>
#include <vector>

#include "pipeline/decisions.hpp"
#include "publish/html_report.hpp"
#include "serve/guard.hpp"
#include "store/edition_store.hpp"

namespace apograph::serve {
namespace {

using Form = std::map<std::string, std::string>;
using publish::Html;

constexpr const char* kFilters[] = {"table", "witness", "class", "status"};

std::string Get(const Form& f, const std::string& key) {
  const auto it = f.find(key);
  return it == f.end() ? "" : it->second;
}

std::string Hidden(const std::string& name, const std::string& value) {
  return "<input type=\"hidden\" name=\"" + Html(name) + "\" value=\"" + Html(value) + "\">";
}

std::optional<pipeline::FindingStatus> StatusOf(const std::string& text) {
  for (auto s : {pipeline::FindingStatus::kProposed, pipeline::FindingStatus::kAccepted,
                 pipeline::FindingStatus::kRejected, pipeline::FindingStatus::kReview,
                 pipeline::FindingStatus::kSuperseded}) {
    if (text == pipeline::ToString(s)) return s;
  }
  return std::nullopt;
}

/// The findings (a run is one) that pass the filters, as the CLI lists them.
std::vector<pipeline::FindingState> Findings(store::Database& db, const Form& q) {
  pipeline::FindingFilter filter;
  if (!Get(q, "table").empty()) filter.table_id = Get(q, "table");
  if (!Get(q, "witness").empty()) filter.witness = Get(q, "witness");
  if (!Get(q, "status").empty()) {
    filter.status = StatusOf(Get(q, "status"));
    if (!filter.status) return {};  // no finding has an unknown status
  }
  auto all = pipeline::ListFindings(db, filter);
  if (Get(q, "class").empty()) return all;
  std::vector<pipeline::FindingState> out;
  for (auto& f : all)
    if (f.cls == Get(q, "class")) out.push_back(std::move(f));
  return out;
}

/// The overrides and conjectures in force, by table, argument and column.
using EditedCells =
    std::map<std::tuple<std::string, std::string, std::string>, pipeline::EditedCellDecision>;

EditedCells Edited(store::Database& db, const Form& q) {
  EditedCells out;
  for (const auto& t : store::ListTables(db)) {
    if (!Get(q, "table").empty() && t.id != Get(q, "table")) continue;
    for (auto& e : pipeline::ListEditedCells(db, t.id))
      out.emplace(std::make_tuple(e.table_id, e.arg, e.column), std::move(e));
  }
  return out;
}

/// "accepted by A. Editor on 2026-12-02: why", or the status alone.
std::string DecisionText(const pipeline::FindingState& f) {
  std::string out = pipeline::ToString(f.status);
  if (f.decision) {
    out += " by " + f.decision->editor + " at " + f.decision->decided_at;
    if (f.carried && f.decision->revision)
      out += " (on revision " + std::to_string(*f.decision->revision) + ")";
    if (!f.decision->note.empty()) out += ": " + f.decision->note;
  }
  if (!f.review.empty()) out += "; " + f.review;
  return out;
}

std::string EditedText(const pipeline::EditedCellDecision& e) {
  return std::string(pipeline::ToString(e.decision.action)) + " " + e.reading + " by " +
         e.decision.editor + " at " + e.decision.decided_at +
         (e.decision.note.empty() ? "" : ": " + e.decision.note);
}

void FilterForm(Site& site, const Form& q, std::ostream& out) {
  out << "<form class=\"filters\" method=\"get\" action=\"/\">" << Hidden("token", site.token);
  for (const char* key : kFilters) {
    out << "<label>" << key << " <input name=\"" << key << "\" value=\"" << Html(Get(q, key))
        << "\" size=\"10\"></label> ";
  }
  out << "<button>filter</button></form><p>Tables: ";
  for (const auto& t : store::ListTables(site.db)) {
    out << "<a href=\"/report?token=" << site.token << "&amp;table=" << Html(UrlEncode(t.id))
        << "\">" << Html(t.id) << "</a> ";
  }
  out << "(the report of each, with its plots)</p>";
}

std::string CarriedFilters(const Form& q) {
  std::string out;
  for (const char* key : kFilters) out += Hidden(std::string("f_") + key, Get(q, key));
  return out;
}

void FindingForm(Site& site, const Form& q, const pipeline::FindingState& f, std::ostream& out) {
  out << "<form method=\"post\" action=\"/decide\">" << Hidden("token", site.token)
      << Hidden("id", std::to_string(f.id)) << Hidden("state", f.state) << CarriedFilters(q)
      << "<input name=\"note\" placeholder=\"why\" size=\"14\">";
  for (const char* a : {"accept", "reject"})
    out << "<button name=\"action\" value=\"" << a << "\" data-id=\"" << f.id << "\">" << a
        << "</button>";
  if (f.decision)
    out << "<button name=\"action\" value=\"undo\" data-id=\"" << f.id << "\">undo</button>";
  out << "</form>";
}

/// The edited table's cell at `arg`: override or conjecture a reading, or
/// undo the one in force.
void CellForm(Site& site, const Form& q, const std::string& table, const std::string& arg,
              const std::string& column, const std::string& reading, const EditedCells& edited,
              std::ostream& out) {
  const auto it = edited.find({table, arg, column});
  out << "<form method=\"post\" action=\"/decide\">" << Hidden("token", site.token)
      << Hidden("table", table) << Hidden("arg", arg) << Hidden("column", column)
      << Hidden("state", it == edited.end() ? "none" : it->second.state) << CarriedFilters(q)
      << "<input name=\"reading\" value=\"" << Html(reading) << "\" size=\"9\">"
      << "<input name=\"note\" placeholder=\"why\" size=\"10\">";
  for (const char* a : {"override", "conjecture"})
    out << "<button name=\"action\" value=\"" << a << "\">" << a << "</button>";
  if (it != edited.end()) out << "<button name=\"action\" value=\"undo\">undo cell</button>";
  out << "</form>";
}

void Row(Site& site, const Form& q, const pipeline::FindingState& f, const EditedCells& edited,
         std::ostream& out) {
  std::string args, readings;
  for (const auto& c : f.cells) {
    args += (args.empty() ? "" : ", ") + c.arg;
    readings += (readings.empty() ? "" : ", ") + Html(c.tabulated) + " &rarr; " + Html(c.proposed);
  }
  const std::string status = pipeline::ToString(f.status);
  out << "<tr class=\"" << status << "\" id=\"finding-" << f.id << "\"><td>" << f.id << "</td><td>"
      << Html(f.table_id) << "</td><td>" << Html(f.witness) << "</td><td>" << Html(args)
      << "</td><td>" << Html(f.column) << "</td><td>" << readings << "</td><td>" << Html(f.cls)
      << "</td><td class=\"evidence\">" << Html(f.evidence) << "</td><td class=\"status\">"
      << Html(DecisionText(f));
  const auto cell = edited.find({f.table_id, f.cells.front().arg, f.column});
  if (cell != edited.end())
    out << "<br><small>edited text: " << Html(EditedText(cell->second)) << "</small>";
  out << "</td><td>";
  FindingForm(site, q, f, out);
  CellForm(site, q, f.table_id, f.cells.front().arg, f.column, f.cells.front().proposed, edited,
           out);
  out << "</td></tr>";
}

/// Every override and conjecture in force, each with its undo.
void EditedList(Site& site, const Form& q, const EditedCells& edited, std::ostream& out) {
  if (edited.empty()) return;
  out << "<h3>The edited table's readings decided by the editor</h3><ul class=\"edited-cells\">";
  for (const auto& [key, e] : edited) {
    out << "<li>" << Html(e.table_id) << " " << Html(e.arg) << " " << Html(e.column) << ": "
        << Html(EditedText(e)) << " <form method=\"post\" action=\"/decide\">"
        << Hidden("token", site.token) << Hidden("table", e.table_id) << Hidden("arg", e.arg)
        << Hidden("column", e.column) << Hidden("state", e.state) << CarriedFilters(q)
        << "<button name=\"action\" value=\"undo\">undo</button></form></li>";
  }
  out << "</ul>";
}

}  // namespace

HttpResponse FindingsPage(Site& site, const Form& q) {
  std::ostringstream out;
  out << "<h2>Findings to review</h2>";
  if (!Get(q, "done").empty()) out << "<p class=\"done\">" << Html(Get(q, "done")) << "</p>";
  FilterForm(site, q, out);
  const auto findings = Findings(site.db, q);
  const EditedCells edited = Edited(site.db, q);
  if (findings.empty())
    out << "<p>No recorded findings match. Findings are recorded by <code>apograph errors --table "
           "ID --witness SIGLUM --auto</code>.</p>";
  out << "<table class=\"review\"><tr><th>id</th><th>table</th><th>witness</th><th>argument</th>"
         "<th>column</th><th>reading &rarr; proposed</th><th>class</th><th>evidence</th>"
         "<th>status</th><th>decide</th></tr>";
  for (const auto& f : findings) Row(site, q, f, edited, out);
  out << "</table>";
  EditedList(site, q, edited, out);
  out << "<p>Deciding as <b>" << Html(site.editor) << "</b>.</p>";
  return {200, "text/html; charset=utf-8",
          publish::HtmlDocument("apograph review", "<article>" + out.str() + "</article>"), ""};
}

std::string ListQuery(const Form& form, const std::string& token) {
  std::string out = "token=" + UrlEncode(token);
  for (const char* key : kFilters) {
    const std::string v = Get(form, std::string("f_") + key);
    if (!v.empty()) out += std::string("&") + key + "=" + UrlEncode(v);
  }
  return out;
}

}  // namespace apograph::serve
