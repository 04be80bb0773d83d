// The review page's security checks and decisions, through Handle (no
// socket): token, request targets, body limit, stale pages, runs.
#include <doctest/doctest.h>

#include <set>

#include "../store/store_test_util.hpp"
#include "pipeline/decisions.hpp"
#include "serve/guard.hpp"
#include "serve/pages.hpp"
#include "store/edition_store.hpp"

using namespace apograph;

namespace {

using testing::SolarProposal;

struct Fixture {
  testing::TempDb file{"serve"};
  store::Database db{file.path()};
  Transcription t = testing::MakeTranscription("solar", "A");
  serve::Site site{db, "0123456789abcdef0123456789abcdef", "A. Editor", {}};
  Fixture() {
    store::Import(db, {t});
    pipeline::RecordProposals(db,
                              {SolarProposal(t, 3, "0;36,15"), SolarProposal(t, 5, "0;40,25", 1),
                               SolarProposal(t, 6, "0;42,30", 1)});
  }
  serve::HttpResponse Get(const std::string& target) {
    return serve::Handle(site, {"GET", target, "", 0, ""});
  }
  serve::HttpResponse Post(const std::string& body, const std::string& target = "/decide") {
    return serve::Handle(site,
                         {"POST", target, "application/x-www-form-urlencoded", body.size(), body});
  }
  std::string Token() const { return site.token; }
};

/// The finding `id` belongs to, as the CLI lists it.
pipeline::FindingState Finding(store::Database& db, std::int64_t id) {
  for (const auto& f : pipeline::ListFindings(db)) {
    for (const auto& c : f.cells)
      if (c.emendation == id) return f;
  }
  FAIL("no finding " << id);
  return {};
}

std::string StatusOf(store::Database& db, std::int64_t id) {
  return pipeline::ToString(Finding(db, id).status);
}

}  // namespace

TEST_CASE("tokens are random, 128 bits, and compared exactly") {
  std::set<std::string> seen;
  for (int i = 0; i < 20; ++i) seen.insert(serve::NewToken());
  CHECK(seen.size() == 20);
  CHECK(seen.begin()->size() == 32);
  const std::string t = *seen.begin();
  CHECK(serve::TokenMatches(t, t));
  CHECK_FALSE(serve::TokenMatches(t, t.substr(0, 31)));
  CHECK_FALSE(serve::TokenMatches(t, t + "0"));
  CHECK_FALSE(serve::TokenMatches(t, ""));
  CHECK_FALSE(serve::TokenMatches("", ""));
  std::string other = t;
  other.back() = other.back() == '0' ? '1' : '0';
  CHECK_FALSE(serve::TokenMatches(t, other));
}

TEST_CASE("request targets cannot leave the served pages") {
  for (const char* ok : {"/", "/report?table=sun-eq&token=ab", "/decide", "/?witness=A+B"})
    CHECK_MESSAGE(serve::SafeTarget(ok), ok);
  for (const char* bad :
       {"", "report", "/../etc/passwd", "/a/../b", "/%2e%2e/x", "/a%2Fb", "/a%2fb", "/a\\b",
        "/a%5cb", "/x?f=..%2F..%2Fetc", "/x?f=%00", "//etc", "/a.html", "/?t=%2e%2e"})
    CHECK_MESSAGE(!serve::SafeTarget(bad), bad);
}

TEST_CASE("forms decode, keeping invalid escapes as written") {
  const auto f = serve::ParseForm("a=1&b=x+y%21&c&d=%zz&a=2");
  CHECK(f.at("a") == "2");
  CHECK(f.at("b") == "x y!");
  CHECK(f.at("c") == "");
  CHECK(f.at("d") == "%zz");
  CHECK(serve::UrlDecode(serve::UrlEncode("0;14 & =?/")) == "0;14 & =?/");
  CHECK(serve::IsLoopback("127.0.0.1"));
  CHECK_FALSE(serve::IsLoopback("0.0.0.0"));
}

TEST_CASE("every request without the right token is refused") {
  Fixture f;
  CHECK(f.Get("/").status == 403);
  CHECK(f.Get("/?token=wrong").status == 403);
  CHECK(f.Get("/report?table=solar").status == 403);
  CHECK(f.Get("/?token=" + f.Token()).status == 200);
  // On POST the token must be in the form, not only in the URL.
  CHECK(f.Post("action=accept&id=1", "/decide?token=" + f.Token()).status == 403);
  CHECK(StatusOf(f.db, 1) == "proposed");
  CHECK(f.Get("/nothing?token=" + f.Token()).status == 404);
  CHECK(f.Get("/../solar?token=" + f.Token()).status == 400);
  CHECK(f.Post("token=" + f.Token(), "/").status == 405);
}

TEST_CASE("a body over the limit is refused before anything is decided") {
  Fixture f;
  const std::string body =
      "token=" + f.Token() + "&action=accept&id=1&note=" + std::string(serve::kMaxBody, 'x');
  CHECK(f.Post(body).status == 413);
  CHECK(StatusOf(f.db, 1) == "proposed");
  serve::HttpRequest declared{"POST", "/decide", "application/x-www-form-urlencoded",
                              serve::kMaxBody + 1, "token=" + f.Token()};
  CHECK(serve::Handle(f.site, declared).status == 413);
}

TEST_CASE("accepting a run decides every cell; a stale page is refused and writes nothing") {
  Fixture f;
  const std::string state = Finding(f.db, 2).state;
  CHECK(state == "proposed");
  const auto r = f.Post("token=" + f.Token() + "&action=accept&id=3&state=" + state + "&note=ok");
  CHECK(r.status == 303);
  CHECK(r.location.rfind("/?token=" + f.Token(), 0) == 0);
  CHECK(StatusOf(f.db, 2) == "accepted");
  CHECK(StatusOf(f.db, 3) == "accepted");
  CHECK(StatusOf(f.db, 1) == "proposed");
  // One decision for the run, with who and why in their own fields.
  const auto run = Finding(f.db, 2);
  REQUIRE(run.decision);
  CHECK(run.decision->cells.size() == 2);
  CHECK(run.decision->editor == "A. Editor");
  CHECK(run.decision->note == "ok");
  CHECK_FALSE(run.decision->decided_at.empty());
  // The other tab still shows "proposed" and rejects: refused.
  const auto stale = f.Post("token=" + f.Token() + "&action=reject&id=2&state=proposed");
  CHECK(stale.status == 409);
  CHECK(StatusOf(f.db, 2) == "accepted");
  CHECK(pipeline::DecisionLog(f.db, "solar").size() == 1);
  // Undo with the current state brings the run back to proposed.
  const auto undo =
      f.Post("token=" + f.Token() + "&action=undo&id=2&state=" + serve::UrlEncode(run.state));
  CHECK(undo.status == 303);
  CHECK(StatusOf(f.db, 3) == "proposed");
  f.Post("token=" + f.Token() + "&action=reject&id=1&note=B+agrees");
  const auto one = Finding(f.db, 1);
  REQUIRE(one.decision);
  CHECK(one.decision->editor == "A. Editor");
  CHECK(one.decision->note == "B agrees");
  // The list shows who decided.
  CHECK(f.Get("/?token=" + f.Token()).body.find("rejected by A. Editor") != std::string::npos);
}

TEST_CASE("an override of a cell is bound as data and checked for staleness") {
  Fixture f;
  const std::string sneaky = "0;44'); DROP TABLE emendation; --";
  const auto bad =
      f.Post("token=" + f.Token() + "&action=override&table=solar&arg=4&column=equation&reading=" +
             serve::UrlEncode(sneaky));
  CHECK(bad.status == 400);  // not a reading
  CHECK(pipeline::ListFindings(f.db).size() == 2);
  const std::string column = serve::UrlEncode("equation'; --");
  CHECK(f.Post("token=" + f.Token() + "&action=override&table=solar&arg=4&column=" + column +
               "&reading=0;44&state=none")
            .status == 400);  // no such column: nothing written
  CHECK(pipeline::DecisionLog(f.db, "solar").empty());
  CHECK(f.Post("token=" + f.Token() +
               "&action=override&table=solar&arg=4&column=equation&reading=0;36,15&state=none")
            .status == 303);
  const auto edited = pipeline::ListEditedCells(f.db, "solar");
  REQUIRE(edited.size() == 1);
  CHECK(edited[0].reading == "0;36,15");
  CHECK(edited[0].decision.editor == "A. Editor");
  // A second tab that saw no decision on the cell is refused.
  CHECK(f.Post("token=" + f.Token() +
               "&action=conjecture&table=solar&arg=4&column=equation&reading=0;36,16&state=none")
            .status == 409);
  CHECK(pipeline::ListEditedCells(f.db, "solar")[0].reading == "0;36,15");
  // Undo of the cell with the state the page showed.
  CHECK(f.Post("token=" + f.Token() + "&action=undo&table=solar&arg=4&column=equation&state=" +
               serve::UrlEncode(edited[0].state))
            .status == 303);
  CHECK(pipeline::ListEditedCells(f.db, "solar").empty());
}
