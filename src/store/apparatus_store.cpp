#include "store/apparatus_store.hpp"

#include "support/input_error.hpp"

namespace apograph::store {

namespace {

void Insert(Database& db, const ApparatusDecision& d) {
  auto exists = db.Prepare("SELECT 1 FROM edition_table WHERE id = ?1");
  exists.Bind(1, d.table_id);
  if (!exists.Step()) {
    throw InputError::ForOption("--table",
                                ExpectedFound("a table in the database", "'" + d.table_id + "'"));
  }
  auto insert = db.Prepare(
      "INSERT INTO apparatus_decision (table_id, row_argument, column_name, reading, note) "
      "VALUES (?1, ?2, ?3, ?4, ?5)");
  insert.Bind(1, d.table_id).Bind(2, d.row_argument).Bind(3, d.column).Bind(5, d.note);
  if (d.reading.empty())
    insert.BindNull(4);
  else
    insert.Bind(4, d.reading);
  insert.Run();
}

}  // namespace

void SaveApparatusDecision(Database& db, const ApparatusDecision& d) {
  SaveApparatusDecisions(db, {d});
}

void SaveApparatusDecisions(Database& db, const std::vector<ApparatusDecision>& decisions) {
  Transaction t(db);
  for (const auto& d : decisions) Insert(db, d);
  t.Commit();
}

std::vector<ApparatusDecision> LoadApparatusOverrides(Database& db, const std::string& table_id) {
  auto s = db.Prepare(
      "SELECT row_argument, column_name, reading, note, decided_at FROM apparatus_override "
      "WHERE table_id = ?1 ORDER BY row_argument, column_name");
  s.Bind(1, table_id);
  std::vector<ApparatusDecision> out;
  while (s.Step()) out.push_back({table_id, s.Text(0), s.Text(1), s.Text(2), s.Text(3), s.Text(4)});
  return out;
}

}  // namespace apograph::store
