#include "store/estimate_store.hpp"

#include <nlohmann/json.hpp>

namespace apograph::store {

std::int64_t AddCatalogEntry(Database& db, const estimate::CatalogEntry& e) {
  Transaction t(db);
  db.Prepare(
        "INSERT INTO catalog_entry (kind, applies_to, value, value_real, tradition, source, "
        "from_memory) "
        "VALUES (?, ?, ?, ?, ?, ?, ?)")
      .Bind(1, e.kind)
      .Bind(2, e.AppliesToText())
      .Bind(3, e.value.ToString())
      .Bind(4, e.value.ToDouble())
      .Bind(5, e.tradition)
      .Bind(6, e.source)
      .Bind(7, e.from_memory ? 1 : 0)
      .Run();
  const std::int64_t id = db.LastInsertId();
  t.Commit();
  return id;
}

std::vector<estimate::CatalogEntry> CatalogEntries(Database& db) {
  std::vector<estimate::CatalogEntry> out;
  auto s = db.Prepare(
      "SELECT id, kind, applies_to, value, tradition, source, from_memory FROM catalog_entry ORDER "
      "BY id");
  while (s.Step()) {
    estimate::CatalogEntry e;
    e.kind = s.Text(1);
    e.applies_to = estimate::ParseAppliesTo(s.Text(2)).value_or(decltype(e.applies_to){});
    e.value = Sexagesimal::Parse(s.Text(3)).value_or(Sexagesimal());
    e.tradition = s.Text(4);
    e.source = s.Text(5);
    e.from_memory = s.Int(6) != 0;
    e.origin = "database #" + std::to_string(s.Int(0));
    out.push_back(std::move(e));
  }
  return out;
}

namespace {

std::string ParamsJson(const estimate::FitResult& fit) {
  nlohmann::json j = nlohmann::json::object();
  for (const auto& p : fit.params)
    j[p.name] = {{"value", p.value}, {"stderr", p.stderr_}, {"fixed", p.fixed}};
  if (fit.practice.displacement != 0)
    j["displacement"] = {{"value", fit.practice.displacement}, {"stderr", fit.displacement_stderr}};
  return j.dump();
}

}  // namespace

void SaveIdentifications(Database& db, const std::vector<IdentifyRecord>& records) {
  Transaction t(db);
  auto run = db.Prepare(
      "INSERT INTO identify_run (table_id, siglum, revision, column_name, candidates_tried, notes, "
      "mean_motion_verdict) VALUES (?, ?, ?, ?, ?, ?, ?)");
  auto cand = db.Prepare(
      "INSERT INTO identify_candidate (run_id, rank, model, params, practice, score, entries, "
      "exact, "
      "within1, flagged, robust_scale) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)");
  for (const auto& r : records) {
    const auto& id = r.identification;
    std::string notes;
    for (const auto& n : id.notes) notes += (notes.empty() ? "" : "\n") + n;
    run.Bind(1, r.table_id)
        .Bind(2, r.siglum)
        .Bind(3, r.revision)
        .Bind(4, r.column)
        .Bind(5, id.candidates_tried)
        .Bind(6, notes);
    if (id.mean_motion)
      run.Bind(7, id.mean_motion->verdict);
    else
      run.BindNull(7);
    run.Run();
    const std::int64_t run_id = db.LastInsertId();
    int rank = 0;
    for (const auto& c : id.ranked) {
      cand.Bind(1, run_id)
          .Bind(2, ++rank)
          .Bind(3, c.model->name())
          .Bind(4, ParamsJson(c.fit))
          .Bind(5, c.PracticeText())
          .Bind(6, c.score)
          .Bind(7, c.fit.n)
          .Bind(8, c.fit.exact)
          .Bind(9, c.fit.within1)
          .Bind(10, c.fit.flagged)
          .Bind(11, c.fit.robust_scale)
          .Run();
    }
  }
  t.Commit();
}

std::int64_t CountIdentifyRuns(Database& db) {
  auto s = db.Prepare("SELECT count(*) FROM identify_run");
  s.Step();
  return s.Int(0);
}

std::vector<estimate::CatalogEntry> LoadCatalog(Database& db) {
  auto all = estimate::ReadCatalogFile(estimate::DefaultCatalogPath());
  auto more = CatalogEntries(db);
  all.insert(all.end(), more.begin(), more.end());
  return all;
}

}  // namespace apograph::store
