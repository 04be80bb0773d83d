#include "store/deviation_store.hpp"

#include <map>

namespace apograph::store {
namespace {

constexpr const char* kColumns =
    "id, table_id, siglum, revision, row_index, col, column_name, arg, tabulated, proposed, class, "
    "evidence, score, model, finding, status, proposed_at, decided_at, editor_note";

EmendationRecord Read(const Statement& s) {
  EmendationRecord r;
  r.id = s.Int(0);
  r.table_id = s.Text(1);
  r.siglum = s.Text(2);
  r.revision = static_cast<int>(s.Int(3));
  r.row = static_cast<int>(s.Int(4));
  r.column = static_cast<int>(s.Int(5));
  r.column_name = s.Text(6);
  r.arg = s.Text(7);
  r.tabulated = s.Text(8);
  r.proposed = s.Text(9);
  r.cls = s.Text(10);
  r.evidence = s.Text(11);
  r.score = s.Real(12);
  r.model = s.Text(13);
  if (!s.IsNull(14)) r.finding = s.Int(14);
  r.status = s.Text(15);
  r.proposed_at = s.Text(16);
  r.decided_at = s.OptionalText(17);
  r.editor_note = s.Text(18);
  return r;
}

}  // namespace

RecordResult RecordEmendations(Database& db, const std::vector<EmendationRecord>& proposals) {
  Transaction t(db);
  const RecordResult out = InsertEmendations(db, proposals);
  t.Commit();
  return out;
}

RecordResult InsertEmendations(Database& db, const std::vector<EmendationRecord>& proposals) {
  RecordResult out;
  auto find = db.Prepare(
      "SELECT id FROM emendation WHERE table_id = ?1 AND siglum = ?2 AND revision = ?3 AND "
      "row_index = ?4 AND col = ?5 AND proposed = ?6");
  auto insert = db.Prepare(
      "INSERT INTO emendation (table_id, siglum, revision, row_index, col, column_name, arg, "
      "tabulated, "
      "proposed, class, evidence, score, model, finding) "
      "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14)");
  std::map<int, std::int64_t> group_head;
  for (const auto& p : proposals) {
    find.Bind(1, p.table_id)
        .Bind(2, p.siglum)
        .Bind(3, p.revision)
        .Bind(4, p.row)
        .Bind(5, p.column)
        .Bind(6, p.proposed);
    const bool exists = find.Step();
    const std::int64_t existing = exists ? find.Int(0) : 0;
    find.Reset();
    if (exists) {
      ++out.kept;
      if (p.group != 0) group_head.emplace(p.group, existing);
      continue;
    }
    std::optional<std::int64_t> head;
    if (p.group != 0 && group_head.count(p.group)) head = group_head[p.group];
    insert.Bind(1, p.table_id)
        .Bind(2, p.siglum)
        .Bind(3, p.revision)
        .Bind(4, p.row)
        .Bind(5, p.column)
        .Bind(6, p.column_name)
        .Bind(7, p.arg)
        .Bind(8, p.tabulated)
        .Bind(9, p.proposed)
        .Bind(10, p.cls)
        .Bind(11, p.evidence)
        .Bind(12, p.score)
        .Bind(13, p.model)
        .Bind(14, head);
    insert.Run();
    if (p.group != 0) group_head.emplace(p.group, db.LastInsertId());
    ++out.added;
  }
  return out;
}

std::vector<EmendationRecord> ListEmendations(Database& db, const EmendationFilter& filter) {
  auto s = db.Prepare(
      std::string("SELECT ") + kColumns +
      " FROM emendation WHERE (?1 IS NULL OR table_id = ?1) AND (?2 IS NULL OR siglum = ?2) "
      "AND (?3 IS NULL OR status = ?3) ORDER BY table_id, siglum, revision, row_index, col, id");
  s.Bind(1, filter.table_id).Bind(2, filter.siglum).Bind(3, filter.status);
  std::vector<EmendationRecord> out;
  while (s.Step()) out.push_back(Read(s));
  return out;
}

std::optional<EmendationRecord> FindEmendation(Database& db, std::int64_t id) {
  auto read = db.Prepare(std::string("SELECT ") + kColumns + " FROM emendation WHERE id = ?1");
  read.Bind(1, id);
  if (!read.Step()) return std::nullopt;
  return Read(read);
}

}  // namespace apograph::store
