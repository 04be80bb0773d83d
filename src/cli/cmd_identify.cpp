// apograph identify: rank the models and computing practices that explain a
// column; --all runs over every table and witness of the database.
#include "cli/command.hpp"

#include <algorithm>
#include <cstddef>
#include <ostream>
#include <utility>
#include <vector>

#include "cli/batch_output.hpp"
#include "cli/estimate_options.hpp"
#include "estimate/derived_columns.hpp"
#include "estimate/identify.hpp"
#include "estimate/observations.hpp"
#include "estimate/report.hpp"
#include "store/edition_store.hpp"
#include "store/estimate_store.hpp"
#include "support/input_error.hpp"
#include "support/ordered_batch.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kIdentifyUsage[] =
    "usage: apograph identify --table ID --witness SIGLUM [--column NAME] [--top N]\n"
    "                         [--format text|json] [--db FILE]\n"
    "       apograph identify (--all | --work WORK) [--top N] [--threads N]\n"
    "                         [--format text|csv|json] [--db FILE]\n\n"
    "Tries every applicable built-in model and saved formula with rounding and truncation,\n"
    "a displacement constant, and interpolation grids that fit the argument range (the best\n"
    "also with its nodes rounded first); a column whose last place is nearly always 0 is\n"
    "taken as computed to one place fewer. Ranks them by\n"
    "  score = sum of log P(difference in units) - (free parameters / 2) ln(entries)\n"
    "(P: 98% author's values, 0.1^|d| per unit off; 2% copyist's slips spread over the\n"
    "column's range), and says when two explanations tie and what tells them apart.\n"
    "Estimates far outside a parameter's historical range are ranked last, with a note.\n"
    "Mean-motion columns also get the analysis of how the table was built, and columns\n"
    "computed from another column (differences, sums, 1/k of the difference) are named.\n"
    "In a table of several latitudes the obliquity most columns adopted is tried in the\n"
    "others, as check and errors --auto do. Results are\n"
    "stored in the database (view latest_identification). --all (or --work) goes through\n"
    "every transcription in one process on every core, prints each table as it is done\n"
    "(memory holds only the tables in hand) and shows a progress bar on a terminal.\n\n"
    "example:\n"
    "  apograph identify --table sun-eq --witness A --top 3\n"
    "  apograph identify --all --format csv > identifications.csv";

namespace {

struct Job {
  Transcription table;
  int revision = 1;
  int column = 0;
  estimate::Identification result;
};

/// Something to look at: no candidate, entries the best one flags, or a
/// mean motion with entries it does not explain.
bool HasFindings(const estimate::Identification& r) {
  return r.ranked.empty() || r.ranked[0].fit.flagged > 0 ||
         (r.mean_motion && r.mean_motion->unexplained > 0);
}

bool HasFindings(const std::vector<Job>& jobs) {
  return std::any_of(jobs.begin(), jobs.end(), [](const Job& j) { return HasFindings(j.result); });
}

std::vector<std::string> SummaryRow(const Transcription& t, int column,
                                    const estimate::Identification& r) {
  const std::string col = t.columns[static_cast<std::size_t>(column)].name;
  if (r.ranked.empty())
    return {t.table_id, t.witness.siglum, col, "-", "too few entries", "", "", ""};
  const auto& c = r.ranked[0];
  return {t.table_id,
          t.witness.siglum,
          col,
          c.model->name(),
          c.PracticeText(),
          std::to_string(c.fit.exact) + "/" + std::to_string(c.fit.n),
          std::to_string(c.fit.flagged),
          std::to_string(r.notes.size())};
}

/// One value for the table, as the reports adopt it: each column's best
/// explanation handed to estimate::ShareAdoptedValues, as
/// pipeline::ResolveReferences does (`results[k]` is column `columns[k]`).
void ShareInTable(const Transcription& t, const std::vector<int>& columns,
                  std::vector<estimate::Identification>& results,
                  const std::vector<estimate::CatalogEntry>* catalog) {
  std::vector<estimate::ColumnBest> bests;
  for (std::size_t k = 0; k < results.size(); ++k) {
    if (!results[k].ranked.empty()) bests.push_back({&t, columns[k], &results[k].ranked.front()});
  }
  estimate::ShareAdoptedValues(bests, catalog);
}

/// identify --all (or --work): one transcription at a time on the threads,
/// each stored (one transaction per window of tables) and printed as it is
/// done; memory holds only the tables in hand and the lines printed.
int RunBatch(store::Database& db, const BatchArgs& batch, const estimate::IdentifyOptions& options,
             const std::vector<estimate::CatalogEntry>& catalog, Format format, Io& io) {
  const std::vector<store::RevisionSummary> scope = BatchScope(db, batch);
  StreamingTable table(
      io, format == Format::kJson ? Format::kText : format,
      {"table", "witness", "column", "model", "practice", "exact", "flagged", "ties"},
      {false, false, false, false, false, true, true, true});
  bool findings = false, first_json = true;
  if (format == Format::kJson) io.out << "{\n  \"identifications\": [";
  std::vector<store::IdentifyRecord> pending;
  ProgressBar bar(io, "identify");
  using Done = std::vector<estimate::Identification>;
  support::RunInOrder<Transcription, Done>(
      scope.size(), {static_cast<unsigned>(batch.threads)},
      [&](std::size_t i) { return store::Load(db, scope[i].table_id, scope[i].siglum); },
      [&](const Transcription& t) {
        Done out;
        const auto cols = estimate::ResolveColumns(t, {});
        for (int c : cols) out.push_back(estimate::Identify(t, c, options));
        ShareInTable(t, cols, out, options.catalog);
        return out;
      },
      [&](std::size_t i, Transcription&& t, Done&& results) {
        const auto cols = estimate::ResolveColumns(t, {});
        for (std::size_t k = 0; k < results.size(); ++k) {
          const auto& r = results[k];
          findings = findings || HasFindings(r);
          if (format == Format::kJson) {
            std::string one = estimate::IdentificationJson(r, t, catalog).dump(2);
            for (std::size_t at = one.find('\n'); at != std::string::npos;
                 at = one.find('\n', at + 5))
              one.replace(at, 1, "\n    ");
            io.out << (first_json ? "\n    " : ",\n    ") << one;
            first_json = false;
          } else {
            table.Add(SummaryRow(t, cols[k], r));
          }
          pending.push_back({t.table_id, t.witness.siglum, scope[i].number,
                             t.columns[static_cast<std::size_t>(cols[k])].name, r});
        }
      },
      [&](std::size_t done, std::size_t total) {
        store::SaveIdentifications(db, pending);
        pending.clear();
        bar.Show(done, total);
      });
  if (format == Format::kJson)
    io.out << (first_json ? "]\n}\n" : "\n  ]\n}\n");
  else
    table.Finish();
  return findings ? kFindings : kOk;
}

/// The table, witness and column (empty: every column) of a one-table run.
struct OneTable {
  std::string table, witness, column;
};

/// Prints one table's identifications (and the columns made from others).
void PrintOne(const std::vector<Job>& jobs, const std::vector<estimate::DerivedColumn>& derived,
              const std::vector<estimate::CatalogEntry>& catalog, const std::string& format,
              Io& io) {
  if (format == "json") {
    nlohmann::json j = nlohmann::json::array();
    for (const auto& job : jobs) {
      auto one = estimate::IdentificationJson(job.result, job.table, catalog);
      one["derived"] = nullptr;
      for (const auto& d : derived) {
        if (d.column != job.column) continue;
        one["derived"] = {{"source", job.table.columns[static_cast<std::size_t>(d.source)].name},
                          {"relation", d.relation},
                          {"rows", d.rows},
                          {"matched_tabulated", d.matched_tabulated},
                          {"matched_precise", d.matched_precise},
                          {"basis", d.basis},
                          {"evidence", d.evidence}};
      }
      j.push_back(one);
    }
    io.out << nlohmann::json{{"identifications", j}}.dump(2) << "\n";  // one per column
  } else {
    for (const auto& job : jobs)
      io.out << estimate::IdentificationText(job.result, job.table, catalog) << "\n";
    for (const auto& d : derived) io.out << "derived column: " << d.evidence << "\n";
  }
}

/// identify --table --witness: every asked column identified, saved, printed.
int RunOne(store::Database& database, const OneTable& one, const estimate::IdentifyOptions& options,
           const std::vector<estimate::CatalogEntry>& catalog, const std::string& format, Io& io) {
  const std::string& table = one.table;
  const std::string& witness = one.witness;
  const std::string& column = one.column;
  const Transcription t = store::Load(database, table, witness);
  const int revision = store::CurrentRevision(database, table, witness);
  const auto cols = estimate::ResolveColumns(
      t, column.empty() ? std::vector<std::string>{} : std::vector<std::string>{column});
  std::vector<estimate::Identification> results;
  for (int c : cols) results.push_back(estimate::Identify(t, c, options));
  ShareInTable(t, cols, results, options.catalog);
  std::vector<Job> jobs;
  for (std::size_t k = 0; k < cols.size(); ++k)
    jobs.push_back({t, revision, cols[k], std::move(results[k])});
  std::vector<store::IdentifyRecord> records;
  for (const auto& j : jobs)
    records.push_back(
        {table, witness, revision, t.columns[static_cast<std::size_t>(j.column)].name, j.result});
  store::SaveIdentifications(database, records);
  // Columns made from other columns of the same table.
  const auto derived = jobs.empty() ? std::vector<estimate::DerivedColumn>{}
                                    : estimate::DetectDerivedColumns(jobs[0].table);
  PrintOne(jobs, derived, catalog, format, io);
  return HasFindings(jobs) ? kFindings : kOk;
}

}  // namespace

int RunIdentify(const std::vector<std::string>& args, Io& io) {
  const Command& cmd = FindCommand("identify");
  std::string table, witness, column, format, db;
  int top = 5;
  BatchArgs batch;
  po::options_description opts("options");
  opts.add_options()("table", po::value(&table), "table id")("witness", po::value(&witness),
                                                             "siglum of the witness")(
      "column", po::value(&column), "value column (default: every column)")(
      "top", po::value(&top)->default_value(5), "how many explanations to list");
  AddBatchOptions(opts, batch);
  AddDbOption(opts, db);
  AddFormatOption(opts, format, {"text", "csv", "json"});
  po::variables_map vm;
  if (ParseOptions(cmd, args, opts, vm, io)) return kOk;
  if (top < 1)
    throw InputError::ForOption("--top", ExpectedFound("a positive number", std::to_string(top)));
  CheckBatchOptions(batch, !table.empty() || !witness.empty(), "identify");
  if (!batch.Batch() && (table.empty() || witness.empty()))
    throw InputError::ForOption(table.empty() ? "--table" : "--witness",
                                ExpectedFound("--table and --witness together", "only one"));
  if (!batch.Batch() && format == "csv")
    throw InputError::ForOption("--format", ExpectedFound("text or json for one table", format));
  estimate::IdentifyOptions options;
  options.top = top;
  store::Database database = OpenEdition(db);
  const pipeline::ModelLibrary library = LoadModels(database, io);
  const auto& catalog = library.catalog;
  options.extra_models = library.FormulaPointers();
  options.catalog = &catalog;
  if (batch.Batch()) return RunBatch(database, batch, options, catalog, ParseFormat(format), io);
  return RunOne(database, {table, witness, column}, options, catalog, format, io);
}

}  // namespace apograph::cli
