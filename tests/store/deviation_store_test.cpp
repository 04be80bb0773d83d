#include "store/deviation_store.hpp"

#include <doctest/doctest.h>

#include "store/decision_store.hpp"
#include "store/edition_store.hpp"
#include "store_test_util.hpp"

using namespace apograph;
using namespace apograph::store;

namespace {

EmendationRecord Proposal(int row, const std::string& proposed, int group = 0) {
  EmendationRecord r;
  r.table_id = "solar";
  r.siglum = "A";
  r.revision = 1;
  r.row = row;
  r.column = 0;
  r.column_name = "equation";
  r.arg = std::to_string(row + 1);
  r.tabulated = "0;14";
  r.proposed = proposed;
  r.cls = group ? "displaced-run" : "confusion";
  r.evidence = "tens of minutes: 4 read as 1";
  r.score = 0.54;
  r.model = "solar-eccentric e=2.5";
  r.group = group;
  return r;
}

}  // namespace

TEST_CASE("emendations are recorded once, listed, and decided by the editor") {
  testing::TempDb file("deviation");
  Database db(file.path());
  Import(db, {testing::MakeTranscription("solar", "A")});
  auto first =
      RecordEmendations(db, {Proposal(3, "0;44"), Proposal(5, "0;50", 1), Proposal(6, "0;52", 1)});
  CHECK(first.added == 3);
  auto again = RecordEmendations(db, {Proposal(3, "0;44")});
  CHECK(again.added == 0);
  CHECK(again.kept == 1);

  auto all = ListEmendations(db);
  REQUIRE(all.size() == 3);
  CHECK(all[0].status == "proposed");
  CHECK_FALSE(all[0].decided_at.has_value());
  CHECK_FALSE(all[0].finding.has_value());
  CHECK(all[1].finding == std::optional<std::int64_t>());  // the run's head
  CHECK(all[2].finding == all[1].id);                      // its second cell points at the head

  // The status copy pipeline/decisions.hpp keeps for schema 004's views.
  MirrorEmendationStatus(db, all[0].id, "accepted", "2024-01-02T03:04:05Z", "agrees with B");
  auto decided = *FindEmendation(db, all[0].id);
  CHECK(decided.status == "accepted");
  CHECK(decided.editor_note == "agrees with B");
  CHECK(decided.decided_at == std::optional<std::string>("2024-01-02T03:04:05Z"));
  CHECK(ListEmendations(db, {std::nullopt, std::nullopt, std::string("proposed")}).size() == 2);
  CHECK(ListEmendations(db, {std::string("solar"), std::string("B"), std::nullopt}).empty());
  // A decision survives recording the same proposal again.
  RecordEmendations(db, {Proposal(3, "0;44")});
  CHECK(ListEmendations(db, {std::nullopt, std::nullopt, std::string("accepted")}).size() == 1);
  CHECK_FALSE(FindEmendation(db, 999).has_value());
}

TEST_CASE("a proposal for a transcription that does not exist is refused, nothing written") {
  testing::TempDb file("deviation-fk");
  Database db(file.path());
  Import(db, {testing::MakeTranscription("solar", "A")});
  auto bad = Proposal(1, "0;1");
  bad.siglum = "Z";
  CHECK_THROWS_AS(RecordEmendations(db, {Proposal(2, "0;2"), bad}), StoreError);
  CHECK(ListEmendations(db).empty());
}
