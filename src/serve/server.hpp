#pragma once
/// `apograph serve`'s HTTP server: every request goes to Handle
/// (pages.hpp); nothing is served from files. The HTTP library lives in a
/// module loaded here, at the first call (http_module.hpp), so that no other
/// command loads it.

#include <functional>
#include <string>

#include "serve/pages.hpp"

namespace apograph::serve {

struct ServeOptions {
  std::string host = "127.0.0.1";  ///< only loopback unless --listen says otherwise
  int port = 0;                    ///< 0: a free port
};

/// Listens and answers until the process is stopped. `ready` gets the
/// page's URL (with the token) once the socket is bound. Throws InputError
/// when the HTTP module is not found (named with the places looked in);
/// std::runtime_error when the address cannot be bound.
void Serve(Site& site, const ServeOptions& options,
           const std::function<void(const std::string& url)>& ready);

}  // namespace apograph::serve
