#include "serve/pages.hpp"

#include <map>
#include <sstream>

#include "pipeline/analysis.hpp"
#include "publish/html_report.hpp"
#include "serve/findings_page.hpp"
#include "serve/guard.hpp"
#include "serve/review.hpp"
#include "store/review_store.hpp"

namespace apograph::serve {
namespace {

using Form = std::map<std::string, std::string>;

HttpResponse Page(int status, const std::string& title, const std::string& body) {
  return {status, "text/html; charset=utf-8",
          publish::HtmlDocument(title, "<article>" + body + "</article>"), ""};
}

HttpResponse Refuse(int status, const std::string& why) {
  return {status, "text/plain; charset=utf-8", why + "\n", ""};
}

std::string Get(const Form& f, const std::string& key) {
  const auto it = f.find(key);
  return it == f.end() ? "" : it->second;
}

HttpResponse Report(Site& site, const Form& query) {
  const std::string table = Get(query, "table");
  try {
    const auto a = pipeline::AnalyseTable(site.db, table);
    return {200, "text/html; charset=utf-8",
            publish::HtmlDocument("apograph report: " + table, publish::HtmlTableSection(a)), ""};
  } catch (const InputError& e) {
    return Page(404, "no such table", "<p>" + publish::Html(e.what()) + "</p>");
  }
}

ReviewRequest RequestOf(const Site& site, const Form& form) {
  const auto action = ActionFromString(Get(form, "action"));
  if (!action)
    throw InputError::ForOption("action", "expected accept, reject, override, conjecture or undo");
  ReviewRequest r;
  r.action = *action;
  if (const std::string id = Get(form, "id"); !id.empty()) {
    if (id.find_first_not_of("0123456789") != std::string::npos || id.size() > 18)
      throw InputError::ForOption("id", "expected a number, found '" + id + "'");
    r.emendation = std::stoll(id);
  }
  r.table_id = Get(form, "table");
  r.arg = Get(form, "arg");
  r.column = Get(form, "column");
  r.reading = Get(form, "reading");
  r.note = Get(form, "note");
  r.editor = site.editor;
  if (form.count("state")) r.expected_state = Get(form, "state");
  return r;
}

HttpResponse Decide(Site& site, const Form& form) {
  const std::string back = "/?" + ListQuery(form, site.token);
  try {
    const std::string done = serve::Decide(site.db, RequestOf(site, form));
    return {303, "text/plain; charset=utf-8", done + "\n", back + "&done=" + UrlEncode(done)};
  } catch (const store::StaleState& e) {
    return Page(409, "decided meanwhile",
                "<p class=\"stale\">" + publish::Html(e.what()) + "</p><p><a href=\"" +
                    publish::Html(back) + "\">back to the findings</a></p>");
  } catch (const InputError& e) {
    return Page(400, "not decided", "<p>" + publish::Html(e.what()) + "</p>");
  }
}

HttpResponse Route(Site& site, const HttpRequest& request, const std::string& path,
                   const Form& query, const Form& form) {
  if (path == "/" || path == "/report") {
    if (request.method != "GET") return Refuse(405, "method not allowed");
    return path == "/" ? FindingsPage(site, query) : Report(site, query);
  }
  if (path == "/decide") {
    if (request.method != "POST") return Refuse(405, "method not allowed");
    return Decide(site, form);
  }
  return Refuse(404, "no such page");
}

}  // namespace

HttpResponse Handle(Site& site, const HttpRequest& request) {
  if (request.content_length > kMaxBody || request.body.size() > kMaxBody)
    return Refuse(413, "request body too large");
  if (!SafeTarget(request.target)) return Refuse(400, "bad request target");
  const std::size_t q = request.target.find('?');
  const std::string path = request.target.substr(0, q);
  const Form query = q == std::string::npos ? Form{} : ParseForm(request.target.substr(q + 1));
  const bool form_post = request.method == "POST" &&
                         request.content_type.rfind("application/x-www-form-urlencoded", 0) == 0;
  const Form form = form_post ? ParseForm(request.body) : Form{};
  const std::string token = Get(request.method == "POST" ? form : query, "token");
  if (!TokenMatches(site.token, token))
    return Refuse(403, "forbidden: the page's token is missing");
  std::lock_guard<std::mutex> hold(site.lock);
  return Route(site, request, path, query, form);
}

}  // namespace apograph::serve
