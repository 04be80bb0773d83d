#include "serve/findings_page.hpp"

#include <sstream>
#include <vector>

#include "publish/html_report.hpp"
#include "serve/guard.hpp"
#include "store/deviation_store.hpp"
#include "store/edition_store.hpp"
#include "store/review_store.hpp"

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

/// The findings (runs together) that pass the filters, by first proposal.
std::vector<std::vector<store::EmendationRecord>> Findings(store::Database& db, const Form& q) {
  store::EmendationFilter filter;
  if (!Get(q, "table").empty()) filter.table_id = Get(q, "table");
  if (!Get(q, "witness").empty()) filter.siglum = Get(q, "witness");
  if (!Get(q, "status").empty()) filter.status = Get(q, "status");
  std::vector<std::vector<store::EmendationRecord>> groups;
  std::map<std::int64_t, std::size_t> at;
  for (auto& r : store::ListEmendations(db, filter)) {
    if (!Get(q, "class").empty() && r.cls != Get(q, "class")) continue;
    const std::int64_t key = r.finding.value_or(r.id);
    if (!at.count(key)) at[key] = groups.size(), groups.emplace_back();
    groups[at[key]].push_back(std::move(r));
  }
  return groups;
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

void FindingForm(Site& site, const Form& q, const store::EmendationRecord& r, std::ostream& out) {
  out << "<form method=\"post\" action=\"/decide\">" << Hidden("token", site.token)
      << Hidden("id", std::to_string(r.id)) << Hidden("state", store::FindingState(site.db, r.id))
      << CarriedFilters(q) << "<input name=\"note\" placeholder=\"why\" size=\"14\">";
  for (const char* a : {"accept", "reject"})
    out << "<button name=\"action\" value=\"" << a << "\" data-id=\"" << r.id << "\">" << a
        << "</button>";
  if (r.status != "proposed")
    out << "<button name=\"action\" value=\"undo\" data-id=\"" << r.id << "\">undo</button>";
  out << "</form>";
}

void CellForm(Site& site, const Form& q, const store::EmendationRecord& r, std::ostream& out) {
  const auto arg = Sexagesimal::Parse(r.arg);
  if (!arg) return;
  const std::string state = store::CellState(site.db, r.table_id, arg->ToString(), r.column_name);
  out << "<form method=\"post\" action=\"/decide\">" << Hidden("token", site.token)
      << Hidden("table", r.table_id) << Hidden("arg", arg->ToString())
      << Hidden("column", r.column_name) << Hidden("state", state) << CarriedFilters(q)
      << "<input name=\"reading\" value=\"" << Html(r.proposed) << "\" size=\"9\">"
      << "<input name=\"note\" placeholder=\"why\" size=\"10\">";
  for (const char* a : {"override", "conjecture"})
    out << "<button name=\"action\" value=\"" << a << "\">" << a << "</button>";
  if (state != "cell:none") out << "<button name=\"action\" value=\"undo\">undo cell</button>";
  out << "</form>";
}

void Row(Site& site, const Form& q, const std::vector<store::EmendationRecord>& g,
         std::ostream& out) {
  const auto& r = g.front();
  std::string args, readings;
  for (const auto& c : g) {
    args += (args.empty() ? "" : ", ") + c.arg;
    readings += (readings.empty() ? "" : ", ") + Html(c.tabulated) + " &rarr; " + Html(c.proposed);
  }
  out << "<tr class=\"" << Html(r.status) << "\" id=\"finding-" << r.id << "\"><td>" << r.id
      << "</td><td>" << Html(r.table_id) << "</td><td>" << Html(r.siglum) << "</td><td>"
      << Html(args) << "</td><td>" << Html(r.column_name) << "</td><td>" << readings << "</td><td>"
      << Html(r.cls) << "</td><td class=\"evidence\">" << Html(r.evidence)
      << "</td><td class=\"status\">" << Html(r.status)
      << (r.editor_note.empty() ? "" : "<br><small>" + Html(r.editor_note) + "</small>")
      << "</td><td>";
  FindingForm(site, q, r, out);
  CellForm(site, q, r, out);
  out << "</td></tr>";
}

}  // namespace

HttpResponse FindingsPage(Site& site, const Form& q) {
  std::ostringstream out;
  out << "<h2>Findings to review</h2>";
  if (!Get(q, "done").empty()) out << "<p class=\"done\">" << Html(Get(q, "done")) << "</p>";
  FilterForm(site, q, out);
  const auto groups = Findings(site.db, q);
  if (groups.empty())
    out << "<p>No recorded findings match. Findings are recorded by <code>apograph errors --table "
           "ID --witness SIGLUM --auto</code>.</p>";
  out << "<table class=\"review\"><tr><th>id</th><th>table</th><th>witness</th><th>argument</th>"
         "<th>column</th><th>reading &rarr; proposed</th><th>class</th><th>evidence</th>"
         "<th>status</th><th>decide</th></tr>";
  for (const auto& g : groups) Row(site, q, g, out);
  out << "</table><p>Deciding as <b>" << Html(site.editor) << "</b>.</p>";
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
