#pragma once
/// The pages of `apograph serve`, as a function from a request to a
/// response, independent of the HTTP library (server.cpp only carries
/// requests to Handle), so that every check is tested without a socket.
///
/// Routes (every one needs the token, in the query for GET and in the form
/// for POST):
///  - GET /          the findings, filterable by table, witness, class
///                   and status, each with forms to accept, reject or undo
///                   it, and to override or conjecture its cell's reading
///  - GET /report    ?table=ID: the table's HTML report (as `report
///                   --format html` writes it)
///  - POST /decide   one decision (serve/review.hpp); 303 back to the list,
///                   409 when the page was stale

#include <cstddef>
#include <mutex>
#include <string>

#include "store/database.hpp"

namespace apograph::serve {

struct HttpRequest {
  std::string method;  ///< "GET", "POST", ...
  std::string target;  ///< raw path and query, still percent-encoded
  std::string content_type;
  std::size_t content_length = 0;  ///< as declared
  std::string body;
};

struct HttpResponse {
  int status = 200;
  std::string content_type = "text/html; charset=utf-8";
  std::string body;
  std::string location;  ///< for a redirect
};

/// What the pages work on. One database connection for every request:
/// `lock` serialises them (a decision's stale check and write are one
/// transaction in any case).
struct Site {
  store::Database& db;
  std::string token;
  std::string editor;
  std::mutex lock;
};

/// Answers one request: 413 for a body over kMaxBody, 400 for an unsafe
/// target, 403 without the right token, 404 for an unknown page, 405 for
/// another method.
HttpResponse Handle(Site& site, const HttpRequest& request);

}  // namespace apograph::serve
