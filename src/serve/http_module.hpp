#pragma once
/// The boundary between the program and its HTTP module (apograph-http.so,
/// built from http_module.cpp over Debian's cpp-httplib). The module is
/// loaded only by `apograph serve`, so that every other command starts
/// without the HTTP library and what it pulls in (OpenSSL, zlib, Brotli):
/// that is most of a plain start-up's cost (DEVELOPERS.md, "Start-up").
///
/// The boundary is plain C: the program links its C++ runtime statically,
/// the module its own, so no C++ object (string, function, exception)
/// crosses it. Strings are pointer and size; they stay valid for the call.

#include <cstddef>
#include <cstdint>

/// Raised when the boundary changes; the program refuses another module's.
inline constexpr int kApographHttpAbi = 1;

extern "C" {

struct ApographHttpText {
  const char* data;
  std::size_t size;
};

struct ApographHttpRequest {
  ApographHttpText method;  ///< "GET", "POST", ...
  ApographHttpText target;  ///< raw path and query, still percent-encoded
  ApographHttpText content_type;
  std::uint64_t content_length;  ///< as declared
  ApographHttpText body;
};

struct ApographHttpResponse {
  int status;
  ApographHttpText content_type;
  ApographHttpText body;
  ApographHttpText location;  ///< empty: no redirect
};

/// Gives the module the answer; the module copies what it needs.
typedef void (*ApographHttpRespond)(void* sink, const ApographHttpResponse* response);
/// Answers one request (on the server's threads); must call `respond`
/// exactly once and must not throw.
typedef void (*ApographHttpHandler)(void* context, const ApographHttpRequest* request,
                                    ApographHttpRespond respond, void* sink);
/// Called once the socket is bound, with its port.
typedef void (*ApographHttpReady)(void* context, int port);

/// The module's version of the boundary (kApographHttpAbi when it was built).
typedef int (*ApographHttpAbiFn)();
/// Listens on host:port (port 0: a free one) and answers until the process
/// stops. Returns nonzero without calling `ready` when the address cannot be
/// bound. Bodies above `max_body` bytes are refused by the module.
typedef int (*ApographHttpServeFn)(const char* host, int port, std::uint64_t max_body,
                                   ApographHttpHandler handler, ApographHttpReady ready,
                                   void* context);

}  // extern "C"

/// The exported names of the two functions above.
inline constexpr const char* kApographHttpAbiSymbol = "apograph_http_abi";
inline constexpr const char* kApographHttpServeSymbol = "apograph_http_serve";
/// The module's file name, beside the program (a build tree) or in
/// ../lib/apograph (an installed program).
inline constexpr const char* kApographHttpModule = "apograph-http.so";
