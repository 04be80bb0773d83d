#include "serve/pages.hpp"

#include <map>
#include <sstream>

#include "pipeline/analysis.hpp"
#include "publish/html_report.hpp"
#include "serve/findings_page.hpp"
#include "serve/guard.hpp"
#include "serve/review.hpp"

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

HttpResponse Decide(Site& site, const Form& form) {
  const std::string back = "/?" + ListQuery(form, site.token);
  try {
    const std::string done = Describe(pipeline::Decide(site.db, RequestOf(form, site.editor)));
    return {303, "text/plain; charset=utf-8", done + "\n", back + "&done=" + UrlEncode(done)};
  } catch (const pipeline::StaleDecision& e) {
    return Page(409, "decided meanwhile",
                "<p class=\"stale\">This was decided since the page was loaded; nothing was "
                "written. " +
                    publish::Html(e.what()) + "</p><p><a href=\"" + publish::Html(back) +
                    "\">back to the findings</a> (reload, then decide again)</p>");
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
