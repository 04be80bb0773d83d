#include "store/decision_store.hpp"

#include <map>

#include "store/cell_json.hpp"
#include "store/edition_store.hpp"

namespace apograph::store {
namespace {

constexpr const char* kColumns =
    "id, table_id, action, finding, siglum, revision, argument, column_name, reading, undoes, "
    "editor, decided_at, note";

DecisionRow ReadDecision(const Statement& s) {
  DecisionRow d;
  d.id = s.Int(0);
  d.table_id = s.Text(1);
  d.action = s.Text(2);
  if (!s.IsNull(3)) d.finding = s.Int(3);
  d.siglum = s.OptionalText(4).value_or("");
  if (!s.IsNull(5)) d.revision = static_cast<int>(s.Int(5));
  d.argument = s.OptionalText(6).value_or("");
  d.column_name = s.OptionalText(7).value_or("");
  d.reading = s.OptionalText(8).value_or("");
  if (!s.IsNull(9)) d.undoes = s.Int(9);
  d.editor = s.Text(10);
  d.decided_at = s.Text(11);
  d.note = s.Text(12);
  return d;
}

std::optional<std::string> NullIfEmpty(const std::string& s) {
  return s.empty() ? std::nullopt : std::optional<std::string>(s);
}

void InsertCells(Database& db, std::int64_t id, const std::vector<DecisionCellRow>& cells) {
  auto s = db.Prepare(
      "INSERT INTO decision_cell (decision_id, siglum, column_name, argument, reading, proposed) "
      "VALUES (?1, ?2, ?3, ?4, ?5, ?6)");
  for (const auto& c : cells) {
    s.Bind(1, id).Bind(2, c.siglum).Bind(3, c.column_name).Bind(4, c.argument);
    s.Bind(5, c.reading).Bind(6, c.proposed).Run();
  }
}

}  // namespace

DecisionRow InsertDecision(Database& db, const DecisionRow& row) {
  auto s = db.Prepare(
      "INSERT INTO decision (table_id, action, finding, siglum, revision, argument, column_name, "
      "reading, undoes, editor, note) VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11)");
  s.Bind(1, row.table_id).Bind(2, row.action).Bind(3, row.finding);
  s.Bind(4, NullIfEmpty(row.siglum)).Bind(5, row.revision).Bind(6, NullIfEmpty(row.argument));
  s.Bind(7, NullIfEmpty(row.column_name)).Bind(8, NullIfEmpty(row.reading)).Bind(9, row.undoes);
  s.Bind(10, row.editor).Bind(11, row.note).Run();
  const std::int64_t id = db.LastInsertId();
  InsertCells(db, id, row.cells);
  auto read = db.Prepare(std::string("SELECT ") + kColumns + " FROM decision WHERE id = ?1");
  read.Bind(1, id);
  read.Step();
  DecisionRow out = ReadDecision(read);
  out.cells = row.cells;
  return out;
}

std::vector<DecisionRow> LoadDecisions(Database& db, const std::string& table_id) {
  auto s = db.Prepare(std::string("SELECT ") + kColumns +
                      " FROM decision WHERE table_id = ?1 ORDER BY id");
  s.Bind(1, table_id);
  std::vector<DecisionRow> out;
  std::map<std::int64_t, std::size_t> index;
  while (s.Step()) {
    index[s.Int(0)] = out.size();
    out.push_back(ReadDecision(s));
  }
  auto cells = db.Prepare(
      "SELECT c.decision_id, c.siglum, c.column_name, c.argument, c.reading, c.proposed "
      "FROM decision_cell c JOIN decision d ON d.id = c.decision_id WHERE d.table_id = ?1 "
      "ORDER BY c.decision_id, c.siglum, c.column_name, c.argument");
  cells.Bind(1, table_id);
  while (cells.Step()) {
    out[index.at(cells.Int(0))].cells.push_back(
        {cells.Text(1), cells.Text(2), cells.Text(3), cells.Text(4), cells.Text(5)});
  }
  return out;
}

std::optional<std::string> LoadDecisionTable(Database& db, std::int64_t id) {
  auto s = db.Prepare("SELECT table_id FROM decision WHERE id = ?1");
  s.Bind(1, id);
  if (!s.Step()) return std::nullopt;
  return s.Text(0);
}

std::vector<std::string> TablesWithDecisions(Database& db) {
  auto s =
      db.Prepare("SELECT table_id FROM decision UNION SELECT table_id FROM emendation ORDER BY 1");
  std::vector<std::string> out;
  while (s.Step()) out.push_back(s.Text(0));
  return out;
}

void MirrorEmendationStatus(Database& db, std::int64_t emendation_id, const std::string& status,
                            const std::optional<std::string>& decided_at, const std::string& note) {
  auto s = db.Prepare(
      "UPDATE emendation SET status = ?2, decided_at = ?3, editor_note = ?4 WHERE id = ?1 AND "
      "(status <> ?2 OR decided_at IS NOT ?3 OR editor_note <> ?4)");
  s.Bind(1, emendation_id)
      .Bind(2, status)
      .Bind(3, status == "proposed" ? std::nullopt : decided_at);
  s.Bind(4, note).Run();
}

void RecordRowArguments(Database& db, std::int64_t revision_id, const Transcription& t) {
  std::string json;
  EncodeRowArguments(json, t);
  auto s = db.Prepare("UPDATE revision_cells SET arguments = ?2 WHERE revision_id = ?1");
  s.Bind(1, revision_id).Bind(2, json).Run();
}

void FillRowArguments(Database& db, const std::string& table_id) {
  auto s = db.Prepare(
      "SELECT r.id, t.siglum, r.number FROM revision r JOIN transcription t ON t.id = "
      "r.transcription_id WHERE t.table_id = ?1 AND r.id IN (SELECT revision_id FROM "
      "revision_cells WHERE arguments IS NULL)");
  s.Bind(1, table_id);
  struct Missing {
    std::int64_t id;
    std::string siglum;
    int number;
  };
  std::vector<Missing> missing;
  while (s.Step()) missing.push_back({s.Int(0), s.Text(1), static_cast<int>(s.Int(2))});
  for (const auto& m : missing)
    RecordRowArguments(db, m.id, Load(db, table_id, m.siglum, m.number));
}

}  // namespace apograph::store
