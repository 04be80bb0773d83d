// The HTTP module boundary (src/serve/http_module.hpp): the program loads
// the HTTP library only for `serve`, and says clearly when the module it
// finds is not one it can use.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>

#include "../cli_runner.hpp"

using namespace apograph;

TEST_CASE("serve: a file that is no HTTP module is refused with its path, exit 2") {
  testing::ScratchDir dir("http-module");
  const auto fake = dir.path() / "not-a-module.so";
  std::ofstream(fake) << "plain text, not a shared object\n";
  const auto r = testing::RunBinary("init --db ed.sqlite", dir.path());
  REQUIRE(r.code == 0);
  const auto bad = testing::RunBinary("serve --db ed.sqlite", dir.path(),
                                      "APOGRAPH_HTTP_MODULE='" + fake.string() + "'");
  CHECK(bad.code == 2);
  CHECK(bad.err.find("apograph serve") != std::string::npos);
  CHECK(bad.err.find("expected a loadable HTTP module") != std::string::npos);
  CHECK(bad.err.find("not-a-module.so") != std::string::npos);
}
