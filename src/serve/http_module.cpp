// The HTTP module (apograph-http.so): cpp-httplib behind the plain C
// boundary of http_module.hpp. Built as its own shared object and loaded
// only by `apograph serve`; it includes nothing of the program but that
// header.
#include "serve/http_module.hpp"

#include <httplib.h>

#include <string>

namespace {

ApographHttpText Text(const std::string& s) { return {s.data(), s.size()}; }

std::string String(const ApographHttpText& t) { return std::string(t.data, t.size); }

/// Copies the program's answer into httplib's response.
void Respond(void* sink, const ApographHttpResponse* a) {
  auto& res = *static_cast<httplib::Response*>(sink);
  res.status = a->status;
  res.set_content(String(a->body), String(a->content_type).c_str());
  if (a->location.size > 0) res.set_header("Location", String(a->location));
  // The pages never need another origin, a frame or a script.
  res.set_header("Content-Security-Policy",
                 "default-src 'none'; style-src 'unsafe-inline'; form-action 'self'");
  res.set_header("X-Frame-Options", "DENY");
  res.set_header("Referrer-Policy", "no-referrer");
  res.set_header("Cache-Control", "no-store");
}

}  // namespace

extern "C" __attribute__((visibility("default"))) int apograph_http_abi() {
  return kApographHttpAbi;
}

extern "C" __attribute__((visibility("default"))) int apograph_http_serve(
    const char* host, int port, std::uint64_t max_body, ApographHttpHandler handler,
    ApographHttpReady ready, void* context) {
  httplib::Server server;
  server.set_payload_max_length(max_body);
  // Every path goes to the program's handler (httplib reads a POST body, up
  // to max_body, before calling it); nothing is served from files.
  const auto each = [&](const httplib::Request& req, httplib::Response& res) {
    const std::string content_type = req.get_header_value("Content-Type");
    const ApographHttpRequest r{Text(req.method), Text(req.target), Text(content_type),
                                req.get_header_value<std::uint64_t>("Content-Length"),
                                Text(req.body)};
    handler(context, &r, &Respond, &res);
  };
  server.Get(".*", each).Post(".*", each);
  const int bound =
      port ? (server.bind_to_port(host, port) ? port : -1) : server.bind_to_any_port(host);
  if (bound <= 0) return 1;
  ready(context, bound);
  server.listen_after_bind();
  return 0;
}
