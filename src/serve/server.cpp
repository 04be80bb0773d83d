#include "serve/server.hpp"

#include <httplib.h>

#include <cstdint>
#include <stdexcept>

#include "serve/guard.hpp"

namespace apograph::serve {
namespace {

HttpRequest RequestOf(const httplib::Request& r) {
  HttpRequest out;
  out.method = r.method;
  out.target = r.target;
  out.content_type = r.get_header_value("Content-Type");
  out.content_length = r.get_header_value<std::uint64_t>("Content-Length");
  out.body = r.body;
  return out;
}

void Answer(const HttpResponse& a, httplib::Response& res) {
  res.status = a.status;
  res.set_content(a.body, a.content_type.c_str());
  if (!a.location.empty()) res.set_header("Location", a.location);
  // The pages never need another origin, a frame or a script.
  res.set_header("Content-Security-Policy",
                 "default-src 'none'; style-src 'unsafe-inline'; form-action 'self'");
  res.set_header("X-Frame-Options", "DENY");
  res.set_header("Referrer-Policy", "no-referrer");
  res.set_header("Cache-Control", "no-store");
}

}  // namespace

void Serve(Site& site, const ServeOptions& options,
           const std::function<void(const std::string& url)>& ready) {
  httplib::Server server;
  server.set_payload_max_length(kMaxBody);
  // Every path is answered by Handle (the library reads a POST body, up to
  // kMaxBody, before calling the handler); nothing is served from files.
  const auto handler = [&](const httplib::Request& req, httplib::Response& res) {
    Answer(Handle(site, RequestOf(req)), res);
  };
  server.Get(".*", handler).Post(".*", handler);
  const int port = options.port
                       ? (server.bind_to_port(options.host, options.port) ? options.port : -1)
                       : server.bind_to_any_port(options.host);
  if (port <= 0)
    throw std::runtime_error("cannot listen on " + options.host + ":" +
                             std::to_string(options.port));
  const std::string host =
      options.host.find(':') == std::string::npos ? options.host : "[" + options.host + "]";
  ready("http://" + host + ":" + std::to_string(port) + "/?token=" + site.token);
  server.listen_after_bind();
}

}  // namespace apograph::serve
