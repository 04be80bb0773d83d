#include "store/review_store.hpp"

namespace apograph::store {
namespace {

std::int64_t FindingId(Database& db, std::int64_t id) {
  auto s = db.Prepare("SELECT coalesce(finding, id) FROM emendation WHERE id = ?1");
  s.Bind(1, id);
  if (!s.Step()) {
    throw InputError::ForOption(
        "id", ExpectedFound("the id of a proposed emendation", "'" + std::to_string(id) + "'"));
  }
  return s.Int(0);
}

void RefuseStale(const std::optional<std::string>& expected, const std::string& now) {
  if (expected && *expected != now) {
    throw StaleState(Diagnostic{Severity::kError,
                                {},
                                "this was decided since the page was loaded (expected " +
                                    *expected + ", now " + now +
                                    "): reload the page and decide again"});
  }
}

}  // namespace

std::string FindingState(Database& db, std::int64_t id) {
  auto s = db.Prepare("SELECT status, coalesce(decided_at, '') FROM emendation WHERE id = ?1");
  s.Bind(1, FindingId(db, id));
  s.Step();
  const std::string status = s.Text(0);
  return status == "proposed" ? status : status + "@" + s.Text(1);
}

int DecideFinding(Database& db, std::int64_t id, const std::string& status, const std::string& note,
                  const std::optional<std::string>& expected_state) {
  if (status != "accepted" && status != "rejected" && status != "proposed") {
    throw InputError::ForOption(
        "status", ExpectedFound("accepted, rejected or proposed", "'" + status + "'"));
  }
  Transaction t(db);
  const std::int64_t finding = FindingId(db, id);
  RefuseStale(expected_state, FindingState(db, finding));
  auto update = db.Prepare(
      "UPDATE emendation SET status = ?2, editor_note = ?3, decided_at = CASE WHEN ?2 = "
      "'proposed' THEN NULL ELSE strftime('%Y-%m-%dT%H:%M:%SZ', 'now') END "
      "WHERE id = ?1 OR finding = ?1");
  update.Bind(1, finding).Bind(2, status).Bind(3, note);
  update.Run();
  auto count = db.Prepare("SELECT count(*) FROM emendation WHERE id = ?1 OR finding = ?1");
  count.Bind(1, finding);
  count.Step();
  const int cells = static_cast<int>(count.Int(0));
  t.Commit();
  return cells;
}

std::string CellState(Database& db, const std::string& table_id, const std::string& row_argument,
                      const std::string& column) {
  auto s = db.Prepare(
      "SELECT max(id) FROM apparatus_decision WHERE table_id = ?1 AND row_argument = ?2 AND "
      "column_name = ?3");
  s.Bind(1, table_id).Bind(2, row_argument).Bind(3, column);
  s.Step();
  return s.IsNull(0) ? "cell:none" : "cell:" + std::to_string(s.Int(0));
}

void DecideCell(Database& db, const ApparatusDecision& d,
                const std::optional<std::string>& expected_state) {
  Transaction t(db);
  RefuseStale(expected_state, CellState(db, d.table_id, d.row_argument, d.column));
  auto insert = db.Prepare(
      "INSERT INTO apparatus_decision (table_id, row_argument, column_name, reading, note) "
      "VALUES (?1, ?2, ?3, ?4, ?5)");
  insert.Bind(1, d.table_id).Bind(2, d.row_argument).Bind(3, d.column);
  if (d.reading.empty()) {
    insert.BindNull(4);
  } else {
    insert.Bind(4, d.reading);
  }
  insert.Bind(5, d.note);
  insert.Run();
  t.Commit();
}

}  // namespace apograph::store
