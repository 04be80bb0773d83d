// apograph identify: rank the models and computing practices that explain a
// column; --all runs over every table and witness of the database.
#include "cli/command.hpp"

#include <algorithm>
#include <atomic>
#include <chrono>
#include <ostream>
#include <thread>

#include "cli/estimate_options.hpp"
#include "estimate/derived_columns.hpp"
#include "estimate/identify.hpp"
#include "estimate/observations.hpp"
#include "estimate/report.hpp"
#include "store/edition_store.hpp"
#include "store/estimate_store.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kIdentifyUsage[] =
    "usage: apograph identify --table ID --witness SIGLUM [--column NAME] [--top N]\n"
    "                         [--format text|json] [--db FILE]\n"
    "       apograph identify --all [--top N] [--threads N] [--format text|csv|json] [--db "
    "FILE]\n\n"
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
    "Results are\n"
    "stored in the database (view latest_identification). --all shows a progress bar on a\n"
    "terminal and uses every core.\n\n"
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

void Progress(Io& io, std::size_t done, std::size_t total) {
  const int width = 30;
  const int filled = total ? static_cast<int>(width * done / total) : width;
  io.err << "\ridentify [" << std::string(static_cast<std::size_t>(filled), '#')
         << std::string(static_cast<std::size_t>(width - filled), '.') << "] " << done << "/"
         << total << std::flush;
}

/// Runs every job on `threads` threads; progress on a terminal.
void RunJobs(std::vector<Job>& jobs, const estimate::IdentifyOptions& options, unsigned threads,
             Io& io) {
  std::atomic<std::size_t> next{0}, done{0};
  auto worker = [&] {
    for (std::size_t i = next++; i < jobs.size(); i = next++) {
      jobs[i].result = estimate::Identify(jobs[i].table, jobs[i].column, options);
      ++done;
    }
  };
  std::vector<std::thread> pool;
  for (unsigned k = 0; k < threads; ++k) pool.emplace_back(worker);
  if (io.err_is_terminal) {
    while (done.load() < jobs.size()) {
      Progress(io, done.load(), jobs.size());
      std::this_thread::sleep_for(std::chrono::milliseconds(100));
    }
    Progress(io, jobs.size(), jobs.size());
    io.err << "\n";
  }
  for (auto& t : pool) t.join();
}

std::vector<store::IdentifyRecord> Records(const std::vector<Job>& jobs) {
  std::vector<store::IdentifyRecord> out;
  for (const auto& j : jobs) {
    out.push_back({j.table.table_id, j.table.witness.siglum, j.revision,
                   j.table.columns[static_cast<std::size_t>(j.column)].name, j.result});
  }
  return out;
}

int RevisionOf(store::Database& db, const std::string& table, const std::string& siglum) {
  for (const auto& r : store::ListTranscriptions(db, table)) {
    if (r.siglum == siglum) return r.number;
  }
  return 1;
}

/// Something to look at: no candidate, entries the best one flags, or a
/// mean motion with entries it does not explain.
bool HasFindings(const std::vector<Job>& jobs) {
  for (const auto& job : jobs) {
    const auto& r = job.result;
    if (r.ranked.empty() || r.ranked[0].fit.flagged > 0 ||
        (r.mean_motion && r.mean_motion->unexplained > 0))
      return true;
  }
  return false;
}

int PrintAll(const std::vector<Job>& jobs, const std::vector<estimate::CatalogEntry>& catalog,
             Format format, Io& io) {
  if (format == Format::kJson) {
    nlohmann::json j = {{"identifications", nlohmann::json::array()}};
    for (const auto& job : jobs)
      j["identifications"].push_back(estimate::IdentificationJson(job.result, job.table, catalog));
    io.out << j.dump(2) << "\n";
    return HasFindings(jobs) ? kFindings : kOk;
  }
  Tabular tab;
  tab.headers = {"table", "witness", "column", "model", "practice", "exact", "flagged", "ties"};
  tab.right_aligned = {false, false, false, false, false, true, true, true};
  for (const auto& job : jobs) {
    const auto& r = job.result;
    const std::string col = job.table.columns[static_cast<std::size_t>(job.column)].name;
    if (r.ranked.empty()) {
      tab.Add(
          {job.table.table_id, job.table.witness.siglum, col, "-", "too few entries", "", "", ""});
      continue;
    }
    const auto& c = r.ranked[0];
    tab.Add({job.table.table_id, job.table.witness.siglum, col, c.model->name(), c.PracticeText(),
             std::to_string(c.fit.exact) + "/" + std::to_string(c.fit.n),
             std::to_string(c.fit.flagged), std::to_string(r.notes.size())});
  }
  io.out << (format == Format::kCsv ? tab.RenderCsv() : tab.RenderText());
  return HasFindings(jobs) ? kFindings : kOk;
}

}  // namespace

int RunIdentify(const std::vector<std::string>& args, Io& io) {
  const Command& cmd = FindCommand("identify");
  std::string table, witness, column, format, db;
  int top = 5;
  int threads = static_cast<int>(std::clamp(std::thread::hardware_concurrency(), 1u, 256u));
  po::options_description opts("options");
  opts.add_options()("table", po::value(&table), "table id")("witness", po::value(&witness),
                                                             "siglum of the witness")(
      "column", po::value(&column), "value column (default: every column)")(
      "top", po::value(&top)->default_value(5), "how many explanations to list")(
      "all", "every table and witness in the database")(
      "threads", po::value(&threads), "threads for --all, 1 to 256 (default: the number of cores)");
  AddDbOption(opts, db);
  AddFormatOption(opts, format, {"text", "csv", "json"});
  po::variables_map vm;
  if (ParseOptions(cmd, args, opts, vm, io)) return kOk;
  CheckChoice("--format", format, {"text", "csv", "json"});
  if (top < 1)
    throw InputError::ForOption("--top", ExpectedFound("a positive number", std::to_string(top)));
  CheckThreads(threads);
  const bool all = vm.count("all") > 0;
  if (!all && (table.empty() || witness.empty())) {
    throw InputError::ForOption("apograph identify",
                                ExpectedFound("--table and --witness, or --all", "neither"));
  }
  if (!all && format == "csv")
    throw InputError::ForOption("--format", ExpectedFound("text or json for one table", format));
  estimate::IdentifyOptions options;
  options.top = top;
  store::Database database = OpenEdition(db);
  const pipeline::ModelLibrary library = LoadModels(database, io);
  const auto& catalog = library.catalog;
  options.extra_models = library.FormulaPointers();
  options.catalog = &catalog;
  std::vector<Job> jobs;
  std::vector<store::RevisionSummary> which;
  if (all)
    which = store::ListTranscriptions(database);
  else
    which.push_back({table, witness, RevisionOf(database, table, witness)});
  for (const auto& r : which) {
    Transcription t = store::Load(database, r.table_id, r.siglum);
    const std::vector<int> cols = estimate::ResolveColumns(
        t, all || column.empty() ? std::vector<std::string>{} : std::vector<std::string>{column});
    for (int c : cols) jobs.push_back({t, r.number, c, {}});
  }
  RunJobs(jobs, options, all ? static_cast<unsigned>(threads) : 1u, io);
  store::SaveIdentifications(database, Records(jobs));
  if (all) return PrintAll(jobs, catalog, ParseFormat(format), io);
  // Columns made from other columns of the same table.
  const auto derived = jobs.empty() ? std::vector<estimate::DerivedColumn>{}
                                    : estimate::DetectDerivedColumns(jobs[0].table);
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
  return HasFindings(jobs) ? kFindings : kOk;
}

}  // namespace apograph::cli
