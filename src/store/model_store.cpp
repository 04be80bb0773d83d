#include "store/model_store.hpp"

#include <cmath>

namespace apograph::store {
namespace {

std::int64_t InsertRun(Database& db, const model::CheckReport& r, std::optional<int> revision,
                       const std::optional<std::string>& formula_text) {
  const std::string column = r.entries.empty() ? "" : r.entries.front().column;
  auto s = db.Prepare(
      "INSERT INTO check_run (table_id, siglum, revision, column_name, model, formula_text, "
      "rounding, places, grid, grid_origin, round_nodes, displacement, tolerance, entries, "
      "compared, exact, within_one, flagged, blank, illegible, undefined, worst) "
      "VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9, ?10, ?11, ?12, ?13, ?14, ?15, ?16, ?17, ?18, "
      "?19, ?20, ?21, ?22)");
  const auto& p = r.practice;
  const auto& m = r.summary;
  s.Bind(1, r.table).Bind(2, r.witness).Bind(3, revision).Bind(4, column).Bind(5, r.model);
  s.Bind(6, formula_text).Bind(7, model::ToString(p.rounding)).Bind(8, r.places);
  s.Bind(9, p.grid).Bind(10, p.grid_origin).Bind(11, p.round_nodes ? 1 : 0);
  s.Bind(12, p.displacement).Bind(13, r.tolerance).Bind(14, m.entries).Bind(15, m.compared);
  s.Bind(16, m.exact).Bind(17, m.within_one).Bind(18, m.flagged).Bind(19, m.blank);
  s.Bind(20, m.illegible).Bind(21, m.undefined).Bind(22, m.worst);
  s.Run();
  return db.LastInsertId();
}

void InsertParams(Database& db, std::int64_t run, const model::CheckReport& r) {
  auto s =
      db.Prepare("INSERT INTO check_param (run_id, position, name, value) VALUES (?1, ?2, ?3, ?4)");
  for (std::size_t i = 0; i < r.params.size(); ++i) {
    s.Bind(1, run)
        .Bind(2, static_cast<int>(i))
        .Bind(3, r.params[i].first)
        .Bind(4, r.params[i].second);
    s.Run();
  }
}

void InsertEntries(Database& db, std::int64_t run, const model::CheckReport& r) {
  auto s = db.Prepare(
      "INSERT INTO check_entry (run_id, row_index, arg, tabulated, exact, computed, diff_units, "
      "flag, skipped) VALUES (?1, ?2, ?3, ?4, ?5, ?6, ?7, ?8, ?9)");
  for (const auto& e : r.entries) {
    s.Bind(1, run)
        .Bind(2, static_cast<std::int64_t>(e.row))
        .Bind(3, e.arg)
        .Bind(4, e.tabulated_raw);
    if (std::isfinite(e.exact))
      s.Bind(5, e.exact);
    else
      s.BindNull(5);
    if (e.computed)
      s.Bind(6, e.computed->ToString());
    else
      s.BindNull(6);
    s.Bind(7, e.diff_units).Bind(8, e.flag ? 1 : 0).Bind(9, e.skipped);
    s.Run();
  }
}

SavedFormula ReadFormula(Statement& s) { return {s.Text(0), s.Text(1), s.Text(2), s.Text(3)}; }

}  // namespace

void SaveFormula(Database& db, const SavedFormula& f) {
  Transaction t(db);
  auto s = db.Prepare(
      "INSERT INTO formula (name, text, description) VALUES (?1, ?2, ?3) "
      "ON CONFLICT(name) DO UPDATE SET text = excluded.text, description = excluded.description, "
      "updated_at = strftime('%Y-%m-%dT%H:%M:%SZ', 'now')");
  s.Bind(1, f.name).Bind(2, f.text).Bind(3, f.description);
  s.Run();
  t.Commit();
}

std::optional<SavedFormula> FindFormula(Database& db, const std::string& name) {
  auto s = db.Prepare("SELECT name, text, description, updated_at FROM formula WHERE name = ?1");
  s.Bind(1, name);
  if (!s.Step()) return std::nullopt;
  return ReadFormula(s);
}

std::vector<SavedFormula> ListFormulas(Database& db) {
  auto s = db.Prepare("SELECT name, text, description, updated_at FROM formula ORDER BY name");
  std::vector<SavedFormula> out;
  while (s.Step()) out.push_back(ReadFormula(s));
  return out;
}

std::int64_t SaveCheckRun(Database& db, const model::CheckReport& report,
                          std::optional<int> revision,
                          const std::optional<std::string>& formula_text) {
  Transaction t(db);
  const std::int64_t run = InsertRun(db, report, revision, formula_text);
  InsertParams(db, run, report);
  InsertEntries(db, run, report);
  t.Commit();
  return run;
}

int CountCheckRuns(Database& db, const std::string& table_id, const std::string& siglum) {
  auto s = db.Prepare("SELECT count(*) FROM check_run WHERE table_id = ?1 AND siglum = ?2");
  s.Bind(1, table_id).Bind(2, siglum);
  s.Step();
  return static_cast<int>(s.Int(0));
}

}  // namespace apograph::store
