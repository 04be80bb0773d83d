#include "serve/server.hpp"

#include <dlfcn.h>

#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <stdexcept>
#include <vector>

#include "serve/guard.hpp"
#include "serve/http_module.hpp"
#include "support/data_dir.hpp"
#include "support/input_error.hpp"

namespace apograph::serve {
namespace {

namespace fs = std::filesystem;

/// Where the module may be: beside the program (a build tree), then in
/// ../lib/apograph (an installed program); APOGRAPH_HTTP_MODULE first.
std::vector<fs::path> ModulePlaces() {
  std::vector<fs::path> places;
  if (const char* env = std::getenv("APOGRAPH_HTTP_MODULE"); env && *env) places.emplace_back(env);
  const fs::path dir = ProgramDir();
  if (!dir.empty()) {
    places.push_back(dir / kApographHttpModule);
    places.push_back((dir / ".." / "lib" / "apograph" / kApographHttpModule).lexically_normal());
  }
  return places;
}

/// Loads the module once (it stays loaded: the server runs until exit).
ApographHttpServeFn LoadModule() {
  std::string looked;
  for (const fs::path& place : ModulePlaces()) {
    looked += (looked.empty() ? "" : ", ") + place.string();
    std::error_code ec;
    if (!fs::exists(place, ec)) continue;
    void* module = dlopen(place.c_str(), RTLD_NOW | RTLD_LOCAL);
    if (!module) {
      throw InputError::ForOption(
          "apograph serve", "expected a loadable HTTP module, found " + std::string(dlerror()));
    }
    auto abi = reinterpret_cast<ApographHttpAbiFn>(dlsym(module, kApographHttpAbiSymbol));
    auto serve = reinterpret_cast<ApographHttpServeFn>(dlsym(module, kApographHttpServeSymbol));
    if (!abi || !serve || abi() != kApographHttpAbi)
      throw InputError::ForOption("apograph serve", "expected this program's HTTP module, found " +
                                                        place.string() + " (rebuild it)");
    return serve;
  }
  throw InputError::ForOption("apograph serve",
                              "expected the HTTP module " + std::string(kApographHttpModule) +
                                  ", found none (looked for " + looked +
                                  "; install libcpp-httplib-dev and build again, or set "
                                  "APOGRAPH_HTTP_MODULE)");
}

std::string String(const ApographHttpText& t) { return std::string(t.data, t.size); }
ApographHttpText Text(const std::string& s) { return {s.data(), s.size()}; }

struct Context {
  Site& site;
  const ServeOptions& options;
  const std::function<void(const std::string& url)>& ready;
};

HttpResponse Internal(const char* what) {
  std::fprintf(stderr, "apograph serve: internal error: %s\n", what);
  return {500, "text/plain; charset=utf-8", "internal error (see the server's log)\n", {}};
}

/// The module calls this on its threads; nothing may throw into it, so an
/// unexpected error becomes a 500 answer with its message in the log (what
/// the HTTP library itself did with a handler's exception).
void HandleOne(void* context, const ApographHttpRequest* r, ApographHttpRespond respond,
               void* sink) {
  auto& c = *static_cast<Context*>(context);
  HttpResponse a;
  try {
    a = Handle(c.site, {String(r->method), String(r->target), String(r->content_type),
                        static_cast<std::size_t>(r->content_length), String(r->body)});
  } catch (const std::exception& e) {
    a = Internal(e.what());
  } catch (...) {
    a = Internal("unknown exception");
  }
  const ApographHttpResponse out{a.status, Text(a.content_type), Text(a.body), Text(a.location)};
  respond(sink, &out);
}

void Ready(void* context, int port) {
  auto& c = *static_cast<Context*>(context);
  const std::string& h = c.options.host;
  const std::string host = h.find(':') == std::string::npos ? h : "[" + h + "]";
  c.ready("http://" + host + ":" + std::to_string(port) + "/?token=" + c.site.token);
}

}  // namespace

void Serve(Site& site, const ServeOptions& options,
           const std::function<void(const std::string& url)>& ready) {
  const ApographHttpServeFn serve = LoadModule();
  Context context{site, options, ready};
  if (serve(options.host.c_str(), options.port, kMaxBody, &HandleOne, &Ready, &context) != 0)
    throw std::runtime_error("cannot listen on " + options.host + ":" +
                             std::to_string(options.port));
}

}  // namespace apograph::serve
