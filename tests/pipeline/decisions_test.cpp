// The decisions module as a web handler would call it: one call, one
// transaction; a stale state refused; a run decided as one; undo; decisions
// carried over to a new revision or put up for review.
#include "pipeline/decisions.hpp"

#include <doctest/doctest.h>

#include <cstdlib>

#include "../store/store_test_util.hpp"
#include "store/decision_store.hpp"
#include "store/deviation_store.hpp"
#include "store/edition_store.hpp"

namespace apograph {
namespace {

using pipeline::Action;
using pipeline::FindingStatus;

using testing::SolarProposal;

struct Fixture {
  testing::TempDb file{"decisions"};
  store::Database db{file.path()};
  Transcription t = testing::MakeTranscription("solar", "A");
  Fixture() {
    store::Import(db, {t});
    pipeline::RecordProposals(
        db, {SolarProposal(t, 6, "0;13,30"), SolarProposal(t, 8, "0;17,40", 1),
             SolarProposal(t, 9, "0;19,45", 1), SolarProposal(t, 10, "0;21,50", 1)});
  }
  pipeline::DecisionRequest Request(Action action, std::int64_t emendation) {
    pipeline::DecisionRequest r;
    r.action = action;
    r.target.emendation = emendation;
    r.editor = "A. Editor";
    return r;
  }
  pipeline::FindingState Finding(std::int64_t id) {
    for (const auto& f : pipeline::ListFindings(db, {})) {
      if (f.id == id) return f;
    }
    FAIL("no finding " << id);
    return {};
  }
};

}  // namespace

TEST_CASE("a run is decided as one, with who, when and why, and undone") {
  Fixture fx;
  const auto findings = pipeline::ListFindings(fx.db, {});
  REQUIRE(findings.size() == 2);
  const auto& run = findings[1];
  REQUIRE(run.cells.size() == 3);
  CHECK(run.state == "proposed");
  auto r = fx.Request(Action::kAccept, run.cells[1].emendation);  // a middle cell names the run
  r.note = "eye-skip";
  r.expected_state = "proposed";
  const auto d = pipeline::Decide(fx.db, r);
  CHECK(d.cells.size() == 3);
  CHECK(d.editor == "A. Editor");
  CHECK(d.note == "eye-skip");
  CHECK(d.decided_at.size() == 20);
  const auto after = fx.Finding(run.id);
  CHECK(after.status == FindingStatus::kAccepted);
  CHECK(after.state == "accepted:" + std::to_string(d.id));
  for (const auto& e : store::ListEmendations(fx.db, {})) {  // schema 004's copy follows
    if (e.finding.value_or(e.id) == run.id) CHECK(e.status == "accepted");
  }
  // Undo by the finding: back to proposed, and the undo is a decision too.
  auto u = fx.Request(Action::kUndo, run.id);
  u.expected_state = after.state;
  pipeline::Decide(fx.db, u);
  CHECK(fx.Finding(run.id).status == FindingStatus::kProposed);
  const auto log = pipeline::DecisionLog(fx.db, "solar");
  REQUIRE(log.size() == 2);
  CHECK(log[0].action == Action::kUndo);
  CHECK(log[1].withdrawn_by == log[0].id);
  CHECK_THROWS_AS(pipeline::Decide(fx.db, fx.Request(Action::kUndo, run.id)), InputError);
}

TEST_CASE("a stale decision is refused and nothing is written") {
  Fixture fx;
  const auto f = pipeline::ListFindings(fx.db, {})[0];
  pipeline::Decide(fx.db, fx.Request(Action::kReject, f.id));  // someone else, first
  auto late = fx.Request(Action::kAccept, f.id);
  late.expected_state = f.state;  // "proposed", as listed before
  CHECK_THROWS_AS(pipeline::Decide(fx.db, late), pipeline::StaleDecision);
  try {
    pipeline::Decide(fx.db, late);
  } catch (const pipeline::StaleDecision& e) {
    CHECK(std::string(e.what()).find("it changed meanwhile") != std::string::npos);
  }
  CHECK(pipeline::DecisionLog(fx.db, "solar").size() == 1);
  CHECK(fx.Finding(f.id).status == FindingStatus::kRejected);
  // No editor, no decision.
  auto nobody = fx.Request(Action::kAccept, f.id);
  nobody.editor.clear();
  CHECK_THROWS_AS(pipeline::Decide(fx.db, nobody), InputError);
}

TEST_CASE("several decisions in one transaction: all or none") {
  Fixture fx;
  pipeline::DecisionRequest good;
  good.action = Action::kOverride;
  good.target = {std::nullopt, "solar", "8", "equation"};
  good.reading = "0;14,40";
  good.editor = "A. Editor";
  pipeline::DecisionRequest bad = good;  // a conjecture a witness already reads
  bad.action = Action::kConjecture;
  bad.target.arg = "2";
  bad.reading = fx.t.rows[1].cells[0].raw;
  CHECK_THROWS_AS(pipeline::DecideAll(fx.db, {good, bad}), InputError);
  CHECK(pipeline::DecisionLog(fx.db, "solar").empty());
  pipeline::DecideAll(fx.db, {good});
  const auto edited = pipeline::ListEditedCells(fx.db, "solar");
  REQUIRE(edited.size() == 1);
  CHECK(edited[0].arg == "8");
  CHECK(edited[0].reading == "0;14,40");
  CHECK(edited[0].state == "override:" + std::to_string(edited[0].decision.id));
  pipeline::DecisionRequest nowhere = good;
  nowhere.target.arg = "99";
  CHECK_THROWS_AS(pipeline::Decide(fx.db, nowhere), InputError);
  nowhere.target = {std::nullopt, "solar", "8", "no-such-column"};
  CHECK_THROWS_AS(pipeline::Decide(fx.db, nowhere), InputError);
}

TEST_CASE("a new revision: decisions carry over where the reading holds, review where it changed") {
  Fixture fx;
  const auto findings = pipeline::ListFindings(fx.db, {});
  const auto single = findings[0], run = findings[1];
  pipeline::Decide(fx.db, fx.Request(Action::kReject, single.id));
  pipeline::Decide(fx.db, fx.Request(Action::kAccept, run.id));
  // Revision 2: the run's first cell retyped, another row corrected.
  Transcription t2 = fx.t;
  t2.rows[8].cells[0].raw = "0;16,41";
  t2.rows[8].cells[0].value = Sexagesimal::ParseOrThrow("0;16,41");
  t2.rows[1].cells[1].raw = "0;2,59";
  t2.rows[1].cells[1].value = Sexagesimal::ParseOrThrow("0;2,59");
  store::Import(fx.db, {t2});
  CHECK(fx.Finding(single.id).status == FindingStatus::kRejected);  // its reading holds
  const auto changed = fx.Finding(run.id);
  CHECK(changed.status == FindingStatus::kReview);
  CHECK(changed.review.find("revision 2 reads 0;16,41") != std::string::npos);
  // Deciding it again on the old readings is refused: decide the new
  // proposal, or undo.
  CHECK_THROWS_AS(pipeline::Decide(fx.db, fx.Request(Action::kReject, run.id)), InputError);
  const auto tables =
      pipeline::LoadTableDecisions(fx.db, "solar", store::LoadTable(fx.db, "solar"));
  int applying = 0, to_review = 0;
  for (const auto& w : tables.witness_cells) (w.applies ? applying : to_review)++;
  CHECK(applying == 3);  // the rejected cell and two cells of the run
  CHECK(to_review == 1);
  // The same proposals recorded for revision 2 carry the decisions; those
  // of revision 1 step back.
  auto again = SolarProposal(t2, 6, "0;13,30");
  again.revision = 2;
  pipeline::RecordProposals(fx.db, {again});
  int current = 0;
  for (const auto& f : pipeline::ListFindings(fx.db, {})) {
    if (f.revision == 2) {
      ++current;
      CHECK(f.status == FindingStatus::kRejected);
      CHECK(f.carried);
    }
  }
  CHECK(current == 1);
  CHECK(fx.Finding(run.id).status == FindingStatus::kReview);
  // An undecided proposal for a reading no longer there is superseded, and
  // cannot be decided.
  pipeline::Decide(fx.db, fx.Request(Action::kUndo, run.id));
  CHECK(pipeline::ListFindings(fx.db, {}).size() == 1);
  pipeline::FindingFilter old;
  old.status = FindingStatus::kSuperseded;
  CHECK(pipeline::ListFindings(fx.db, old).size() == 2);
  CHECK_THROWS_AS(pipeline::Decide(fx.db, fx.Request(Action::kAccept, run.id)), InputError);
}

TEST_CASE("the editor's name: the option, else APOGRAPH_EDITOR, else the login name") {
  CHECK(pipeline::DefaultEditor("Named") == "Named");
  ::setenv("APOGRAPH_EDITOR", "From Environment", 1);
  CHECK(pipeline::DefaultEditor() == "From Environment");
  ::unsetenv("APOGRAPH_EDITOR");
  CHECK_FALSE(pipeline::DefaultEditor().empty());
}

}  // namespace apograph
