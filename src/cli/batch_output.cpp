#include "cli/batch_output.hpp"

#include <algorithm>
#include <ostream>
#include <thread>

#include <nlohmann/json.hpp>

#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

void AddBatchOptions(boost::program_options::options_description& options, BatchArgs& args) {
  args.threads = static_cast<int>(std::clamp(std::thread::hardware_concurrency(), 1u, 256u));
  options.add_options()("all", po::bool_switch(&args.all),
                        "every table and witness in the database")(
      "work", po::value(&args.work), "every table and witness of this work")(
      "threads", po::value(&args.threads),
      "threads for --all and --work, 1 to 256 (default: the number of cores)");
}

void CheckBatchOptions(const BatchArgs& args, bool single_given, const std::string& command) {
  CheckThreads(args.threads);
  if (args.all && !args.work.empty())
    throw InputError::ForOption("--work", ExpectedFound("--all or --work, not both", "both"));
  if (args.Batch() && single_given) {
    throw InputError::ForOption(args.all ? "--all" : "--work",
                                ExpectedFound("either --table and --witness or " +
                                                  std::string(args.all ? "--all" : "--work"),
                                              "both"));
  }
  if (!args.Batch() && !single_given) {
    throw InputError::ForOption(
        "apograph " + command,
        ExpectedFound("--table and --witness, or --all, or --work WORK", "none of them"));
  }
}

std::vector<store::RevisionSummary> BatchScope(store::Database& db, const BatchArgs& args) {
  if (args.all) return store::ListTranscriptions(db);
  const std::vector<std::string> tables = store::TablesOfWork(db, args.work);
  if (tables.empty()) {
    std::string known;
    for (const auto& w : store::ListWorks(db)) known += (known.empty() ? "" : ", ") + w.work.id;
    throw InputError::ForOption(
        "--work", ExpectedFound("a work of the database (" + (known.empty() ? "none" : known) + ")",
                                "'" + args.work + "'"));
  }
  std::vector<store::RevisionSummary> out;
  for (const auto& t : tables) {
    auto some = store::ListTranscriptions(db, t);
    out.insert(out.end(), std::make_move_iterator(some.begin()),
               std::make_move_iterator(some.end()));
  }
  return out;
}

void ProgressBar::Show(std::size_t done, std::size_t total) {
  if (!io_.err_is_terminal) return;
  const std::size_t width = 30;
  const std::size_t filled = total ? width * done / total : width;
  io_.err << "\r" << label_ << " [" << std::string(filled, '#') << std::string(width - filled, '.')
          << "] " << done << "/" << total << std::flush;
  if (done == total) io_.err << "\n";
}

StreamingTable::StreamingTable(Io& io, Format format, std::vector<std::string> headers,
                               std::vector<bool> right_aligned)
    : io_(io),
      format_(format),
      headers_(std::move(headers)),
      right_aligned_(std::move(right_aligned)) {}

void StreamingTable::Add(const std::vector<std::string>& row) {
  if (format_ == Format::kText) {
    text_rows_.push_back(row);
    return;
  }
  if (format_ != Format::kCsv) return;
  auto line = [&](const std::vector<std::string>& fields) {
    for (std::size_t i = 0; i < fields.size(); ++i)
      io_.out << (i ? "," : "") << CsvField(fields[i]);
    io_.out << "\r\n";
  };
  if (!header_written_) line(headers_);
  header_written_ = true;
  line(row);
}

void StreamingTable::AddJson(const nlohmann::json& object) {
  if (format_ == Format::kJson) io_.out << object.dump() << "\n";
}

void StreamingTable::Finish() {
  if (format_ == Format::kCsv && !header_written_) {
    Tabular empty;
    empty.headers = headers_;
    io_.out << empty.RenderCsv();
  }
  if (format_ != Format::kText) return;
  Tabular tab;
  tab.headers = headers_;
  tab.right_aligned = right_aligned_;
  tab.rows = std::move(text_rows_);
  io_.out << tab.RenderText();
}

}  // namespace apograph::cli
